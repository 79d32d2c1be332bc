import { Button, Group, Modal, Stack, Text, TextInput } from '@mantine/core';
import type { OutageDto } from '@morrowline/shared';
import { useEffect, useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useCloseOutage } from '../api/use-outages';
import { localToIso } from '../outage-form';

interface CloseOutageDialogProps {
  outage: OutageDto | null;
  timeZone: string;
  onClose: () => void;
}

/** Ends an open window: at the end of the current hour, or at a time given. */
export function CloseOutageDialog({ outage, timeZone, onClose }: CloseOutageDialogProps) {
  const close = useCloseOutage();
  const [end, setEnd] = useState('');
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    setEnd('');
    setReason('');
    setError(null);
    close.reset();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [outage?.id]);

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    if (!outage) return;
    let endIso: string | undefined;
    if (end) {
      const parsed = localToIso(end, timeZone);
      if (!parsed.iso) return setError(parsed.error);
      if (Date.parse(parsed.iso) <= Date.parse(outage.start)) return setError('The end must be after the start');
      endIso = parsed.iso;
    }
    setError(null);
    close.mutate({ id: outage.id, request: { end: endIso, reason: reason.trim() || undefined } }, { onSuccess: () => { notifySuccess('The window is closed.'); onClose(); } });
  };

  return (
    <Modal opened={outage !== null} onClose={onClose} title="Close the window">
      <form onSubmit={submit} noValidate>
        <Stack gap="sm">
          {close.isError && <ErrorNotice title="The window was not closed" error={close.error} />}
          <Text size="sm">Leave the end empty to close it at the end of the current hour.</Text>
          <TextInput label={`End (${timeZone})`} type="datetime-local" step={3600} value={end} onChange={(e) => setEnd(e.currentTarget.value)} error={error} />
          <TextInput label="Reason (optional)" value={reason} onChange={(e) => setReason(e.currentTarget.value)} />
          <Group justify="flex-end">
            <Button variant="default" onClick={onClose}>Cancel</Button>
            <Button type="submit" loading={close.isPending}>Close the window</Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
