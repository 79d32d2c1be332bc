import { Button, Group } from '@mantine/core';
import type { ScheduleRevisionDto } from '@morrowline/shared';
import { useState } from 'react';
import { notifyFailure } from '../../../lib/notify';
import { downloadRevision, type ExportFormat } from '../api/download-revision';

/** CSV and JSON of a published (or superseded) revision; viewers too. */
export function DownloadButtons({ revision, size = 'xs' }: { revision: ScheduleRevisionDto; size?: 'xs' | 'sm' }) {
  const [busy, setBusy] = useState<ExportFormat | null>(null);
  const download = (format: ExportFormat) => {
    setBusy(format);
    downloadRevision(revision, format)
      .catch((error: unknown) => notifyFailure('The download did not work', error))
      .finally(() => setBusy(null));
  };
  return (
    <Group gap="xs">
      <Button size={size} variant="light" loading={busy === 'csv'} onClick={() => download('csv')} aria-label={`Download revision ${revision.revision} as CSV`}>
        CSV
      </Button>
      <Button size={size} variant="light" loading={busy === 'json'} onClick={() => download('json')} aria-label={`Download revision ${revision.revision} as JSON`}>
        JSON
      </Button>
    </Group>
  );
}
