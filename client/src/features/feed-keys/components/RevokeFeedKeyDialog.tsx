import { Button, Group, Modal, Stack, Text, Textarea } from '@mantine/core';
import type { FeedKeyDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useRevokeFeedKey } from '../api/use-feed-keys';

/** Revoking cuts the feed off at its next connection; the reason goes to the audit trail. */
export function RevokeFeedKeyDialog({ feedKey, onClose }: { feedKey: FeedKeyDto; onClose: () => void }) {
  const revoke = useRevokeFeedKey();
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);

  const confirm = () => {
    if (!reason.trim()) return setError('Say why, for the audit trail');
    revoke.mutate({ id: feedKey.id, reason: reason.trim() }, { onSuccess: () => { notifySuccess(`${feedKey.name} can no longer send readings.`); onClose(); } });
  };

  return (
    <Modal opened onClose={onClose} title={`Revoke ${feedKey.name}`}>
      <Stack gap="sm">
        {revoke.isError && <ErrorNotice title="The key was not revoked" error={revoke.error} />}
        <Text size="sm">
          The feed using key <Text span ff="monospace">{feedKey.prefix}…</Text> is refused from now on. This cannot be undone; a new key can be created.
        </Text>
        <Textarea label="Reason" withAsterisk value={reason} onChange={(e) => { setReason(e.currentTarget.value); setError(null); }} error={error} />
        <Group justify="flex-end">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button color="ember" loading={revoke.isPending} onClick={confirm}>
            Revoke key
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}
