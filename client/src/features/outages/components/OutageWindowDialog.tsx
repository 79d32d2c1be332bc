import { Button, Checkbox, Group, Modal, SegmentedControl, Stack, Text, TextInput, Textarea } from '@mantine/core';
import { useForm } from '@mantine/form';
import { formatLocalTime, formatUtcTime, type OutageDto, type OutageKind } from '@morrowline/shared';
import { useEffect } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useCreateOutage, useUpdateOutage } from '../api/use-outages';
import { formValuesOf, KIND_LABELS, localToIso, toCreateRequest, toUpdateRequest, validateOutageForm, type OutageFormValues } from '../outage-form';

interface OutageWindowDialogProps {
  opened: boolean;
  onClose: () => void;
  zone: string;
  zoneName: string;
  timeZone: string;
  /** The window to edit; null to mark a new one. */
  editing: OutageDto | null;
}

/** How a typed time will be stored, or why it cannot be. */
function TimeHint({ local, timeZone }: { local: string; timeZone: string }) {
  if (!local) return null;
  const parsed = localToIso(local, timeZone);
  if (!parsed.iso) return null;
  return (
    <Text size="xs" c="dimmed" ff="monospace" data-testid="outage-time-hint">
      {formatLocalTime(parsed.iso, timeZone)} ({formatUtcTime(parsed.iso)})
      {parsed.ambiguous ? ' — this clock time happens twice tonight; the first one is taken' : ''}
    </Text>
  );
}

export function OutageWindowDialog({ opened, onClose, zone, zoneName, timeZone, editing }: OutageWindowDialogProps) {
  const create = useCreateOutage();
  const update = useUpdateOutage();
  const mutation = editing ? update : create;
  const form = useForm<OutageFormValues>({
    mode: 'controlled',
    initialValues: formValuesOf(editing, timeZone),
    validate: (values) => validateOutageForm(values, timeZone, editing !== null),
  });

  useEffect(() => {
    if (!opened) return;
    form.setValues(formValuesOf(editing, timeZone));
    form.resetDirty();
    form.clearErrors();
    create.reset();
    update.reset();
    // Only when it opens, for the window it opens with.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [opened, editing?.id]);

  const submit = form.onSubmit((values) => {
    if (editing) {
      update.mutate({ id: editing.id, changes: toUpdateRequest(values, timeZone) }, { onSuccess: () => { notifySuccess('The window is changed.'); onClose(); } });
    } else {
      create.mutate(toCreateRequest(zone, values, timeZone), { onSuccess: () => { notifySuccess(`${KIND_LABELS[values.kind]} window marked on ${zoneName}.`); onClose(); } });
    }
  });

  return (
    <Modal opened={opened} onClose={onClose} title={editing ? `Change the window on ${zoneName}` : `Mark a window on ${zoneName}`} size="lg">
      <form onSubmit={submit} noValidate>
        <Stack gap="sm">
          {mutation.isError && <ErrorNotice title="The window was not saved" error={mutation.error} />}
          <SegmentedControl
            aria-label="Kind"
            data={(['outage', 'bad-data'] as OutageKind[]).map((kind) => ({ value: kind, label: KIND_LABELS[kind] }))}
            {...form.getInputProps('kind')}
          />
          <Text size="xs" c="dimmed">
            Times are the zone’s local time ({timeZone}), whole hours: a window that starts or ends within an hour covers that whole hour.
          </Text>
          <Group grow align="flex-start">
            <Stack gap={2}>
              <TextInput label="Start" type="datetime-local" step={3600} withAsterisk {...form.getInputProps('start')} />
              <TimeHint local={form.values.start} timeZone={timeZone} />
            </Stack>
            <Stack gap={2}>
              <TextInput label="End" type="datetime-local" step={3600} disabled={form.values.stillOpen} withAsterisk={!form.values.stillOpen} {...form.getInputProps('end')} />
              {!form.values.stillOpen && <TimeHint local={form.values.end} timeZone={timeZone} />}
            </Stack>
          </Group>
          <Checkbox label="Still open: the end is not known yet" {...form.getInputProps('stillOpen', { type: 'checkbox' })} />
          <Textarea label="Note" description="What happened, e.g. which feeder or meter" withAsterisk autosize minRows={2} {...form.getInputProps('note')} />
          {editing && <TextInput label="Reason for the change" withAsterisk {...form.getInputProps('reason')} />}
          <Group justify="flex-end" mt="sm">
            <Button variant="default" onClick={onClose}>Cancel</Button>
            <Button type="submit" loading={mutation.isPending}>{editing ? 'Save the change' : 'Mark the window'}</Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
