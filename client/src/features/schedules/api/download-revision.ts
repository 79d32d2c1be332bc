import type { ScheduleRevisionDto } from '@morrowline/shared';
import { downloadFile } from '../../../lib/api-files';

export type ExportFormat = 'csv' | 'json';

/** "schedule-millrace-2026-05-13-r2.csv" */
export function exportFileName(revision: Pick<ScheduleRevisionDto, 'zone' | 'operatingDay' | 'revision'>, format: ExportFormat): string {
  return `schedule-${revision.zone.toLowerCase()}-${revision.operatingDay}-r${revision.revision}.${format}`;
}

/** GET /api/schedules/revisions/:id/export?format=csv|json, handed to the browser as a file. */
export function downloadRevision(revision: ScheduleRevisionDto, format: ExportFormat): Promise<void> {
  return downloadFile(`/schedules/revisions/${revision.id}/export?format=${format}`, exportFileName(revision, format));
}
