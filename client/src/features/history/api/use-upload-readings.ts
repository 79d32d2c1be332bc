import type { CsvUploadReport } from '@morrowline/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { uploadFile } from '../../../lib/api-files';

/** POST /api/readings/upload?zone= (operator, supervisor): the file is validated row by row. */
export function useUploadReadings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, zone }: { file: File; zone: string | null }) =>
      uploadFile<CsvUploadReport>(`/readings/upload${zone ? `?zone=${encodeURIComponent(zone)}` : ''}`, file),
    // Readings changed: every cached series and the feed status are read again.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['readings'] }),
  });
}
