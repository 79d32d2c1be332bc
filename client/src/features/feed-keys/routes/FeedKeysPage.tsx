import { Button, Center, Loader, Paper, Text } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import type { FeedKeyDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useDeskTimeZone } from '../../../lib/use-desk-time-zone';
import { useZones } from '../../zones';
import { useFeedKeys } from '../api/use-feed-keys';
import { CreateFeedKeyDialog } from '../components/CreateFeedKeyDialog';
import { FeedKeysTable } from '../components/FeedKeysTable';
import { RevokeFeedKeyDialog } from '../components/RevokeFeedKeyDialog';

/** The meter feeds' API keys: create one (its secret shown once), see which are used, revoke. */
export function FeedKeysPage() {
  const keys = useFeedKeys();
  const zones = useZones();
  const timeZone = useDeskTimeZone();
  const [creating, { open: openCreate, close: closeCreate }] = useDisclosure(false);
  const [revoking, setRevoking] = useState<FeedKeyDto | null>(null);

  return (
    <>
      <PageHeader
        title="Feed keys"
        description="The keys meter feeds connect with. A key is shown once when it is created; only its hash is kept."
        actions={<Button onClick={openCreate}>Create key</Button>}
      />
      <Paper withBorder radius="md" p="xs">
        {keys.isPending && (
          <Center p="xl">
            <Loader aria-label="Loading feed keys" />
          </Center>
        )}
        {keys.isError && <ErrorNotice title="Feed keys could not be loaded" error={keys.error} onRetry={() => void keys.refetch()} />}
        {keys.data && keys.data.length === 0 && (
          <Text c="dimmed" p="md">
            No feed keys yet. Create one for each meter feed.
          </Text>
        )}
        {keys.data && keys.data.length > 0 && <FeedKeysTable keys={keys.data} zones={zones.data ?? []} timeZone={timeZone} onRevoke={setRevoking} />}
      </Paper>
      <CreateFeedKeyDialog opened={creating} onClose={closeCreate} zones={zones.data ?? []} />
      {revoking && <RevokeFeedKeyDialog feedKey={revoking} onClose={() => setRevoking(null)} />}
    </>
  );
}
