import { downloadFile } from '../../../lib/api-files';

/** GET /api/readings/export for a zone and [from, to), saved as a CSV file. */
export function downloadReadings(zone: string, from: string, to: string, fileName: string): Promise<void> {
  const query = new URLSearchParams({ zone, from, to });
  return downloadFile(`/readings/export?${query.toString()}`, fileName);
}
