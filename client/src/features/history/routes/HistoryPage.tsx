import { Loader, Stack } from '@mantine/core';
import { may } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { useZones } from '../../zones';
import { DownloadPanel } from '../components/DownloadPanel';
import { UploadPanel } from '../components/UploadPanel';

/** Past readings in and out: CSV upload (operators, supervisors) and CSV download (everyone). */
export function HistoryPage() {
  const user = useSignedInUser();
  const zones = useZones();
  const mayUpload = may(user.role, 'forecast');
  const active = (zones.data ?? []).filter((z) => z.active);
  return (
    <>
      <PageHeader title="History" description={mayUpload ? 'Load past readings from CSV files and download stored readings.' : 'Download stored readings as CSV. Operators and supervisors upload history.'} />
      {zones.isPending && <Loader />}
      {zones.isError && <ErrorNotice error={zones.error} onRetry={() => void zones.refetch()} />}
      {zones.data && (
        <Stack gap="md">
          {mayUpload && <UploadPanel zones={active} />}
          <DownloadPanel zones={active} />
        </Stack>
      )}
    </>
  );
}
