import { Button, Group, Paper, Stack, Text, Textarea, Title } from '@mantine/core';
import { useForm } from '@mantine/form';
import type { HandoverDraftDto, HandoverNoteDto } from '@morrowline/shared';
import { useMemo } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useZones } from '../../zones';
import { useWriteHandover } from '../api/use-write-handover';
import { formToHandoverRequest, initialHandoverForm, newItem, validateHandoverForm, type HandoverFormValues } from '../handover-form';
import { NoteText } from '../text/NoteText';
import { HandoverItemRow } from './HandoverItemRow';

interface WriteHandoverFormProps {
  draft: HandoverDraftDto;
  onWritten: (note: HandoverNoteDto) => void;
}

/** The outgoing shift's note: free text and structured items, open items carried on. */
export function WriteHandoverForm({ draft, onWritten }: WriteHandoverFormProps) {
  const zones = useZones();
  const write = useWriteHandover();
  const form = useForm<HandoverFormValues>({
    mode: 'controlled',
    initialValues: initialHandoverForm(draft.openItems),
    validate: validateHandoverForm,
  });

  const zoneOptions = useMemo(
    () => (zones.data ?? []).map((zone) => ({ value: zone.code, label: `${zone.name} (${zone.code})` })),
    [zones.data],
  );
  const values = form.getValues();
  const carriedCount = values.items.filter((item) => item.carriedFromItemId !== null).length;

  return (
    <form
      aria-label="Write handover"
      noValidate
      onSubmit={form.onSubmit((submitted) =>
        write.mutate(formToHandoverRequest(submitted), {
          onSuccess: (note) => {
            notifySuccess('Handover written. The next shift will see it until they acknowledge it.');
            onWritten(note);
          },
        }),
      )}
    >
      <Stack gap="md">
        <Textarea
          label="Handover note"
          description="A blank line starts a new paragraph, a line starting with “- ” is a list entry, **like this** is bold."
          placeholder={'How the shift went, what to watch.\n\n- Copperline smelter back on two shifts from Monday\n- **Rain** expected from 18:00'}
          autosize
          minRows={5}
          maxRows={16}
          maxLength={20000}
          {...form.getInputProps('body')}
        />
        {values.body.trim() !== '' && (
          <Paper withBorder radius="sm" p="sm" bg="var(--mantine-color-body)" data-testid="note-preview">
            <Text size="xs" c="dimmed" tt="uppercase" fw={600} mb={4}>
              As the next shift will read it
            </Text>
            <NoteText source={values.body} />
          </Paper>
        )}

        <Stack gap="xs">
          <Group justify="space-between" align="flex-end">
            <Stack gap={0}>
              <Title order={4}>Items</Title>
              <Text size="sm" c="dimmed">
                {carriedCount > 0
                  ? `${carriedCount} item${carriedCount === 1 ? '' : 's'} still open from earlier notes: keep open or close each.`
                  : 'Outages in progress, refits pending, schedules not yet published, anything left open.'}
              </Text>
            </Stack>
          </Group>
          {values.items.map((item, index) => (
            <HandoverItemRow key={item.key} form={form} index={index} zoneOptions={zoneOptions} />
          ))}
          <Group>
            <Button variant="light" onClick={() => form.insertListItem('items', newItem())}>
              Add item
            </Button>
          </Group>
        </Stack>

        {write.isError && <ErrorNotice title="The handover was not saved" error={write.error} />}
        <Group justify="flex-end">
          <Button type="submit" size="md" loading={write.isPending}>
            Hand over
          </Button>
        </Group>
      </Stack>
    </form>
  );
}
