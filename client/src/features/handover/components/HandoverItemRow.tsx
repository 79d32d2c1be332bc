import { ActionIcon, Badge, Group, Paper, SegmentedControl, Select, Stack, Text, TextInput } from '@mantine/core';
import type { UseFormReturnType } from '@mantine/form';
import { HANDOVER_ITEM_KINDS, type HandoverItemStatus } from '@morrowline/shared';
import type { HandoverFormValues } from '../handover-form';
import { ITEM_KIND_LABELS } from '../handover-labels';

const KIND_OPTIONS = HANDOVER_ITEM_KINDS.map((kind) => ({ value: kind, label: ITEM_KIND_LABELS[kind] }));
const STATUS_OPTIONS: { value: HandoverItemStatus; label: string }[] = [
  { value: 'open', label: 'Still open' },
  { value: 'closed', label: 'Closed' },
];

interface HandoverItemRowProps {
  form: UseFormReturnType<HandoverFormValues>;
  index: number;
  zoneOptions: { value: string; label: string }[];
}

/**
 * One structured item. An item carried on from an earlier note keeps its kind and zone; the
 * writer updates its text and says whether it is still open. It cannot be dropped: leaving it
 * out would not close it, so "Closed" is the way to end it.
 */
export function HandoverItemRow({ form, index, zoneOptions }: HandoverItemRowProps) {
  const item = form.getValues().items[index];
  const carried = item.carriedFromItemId !== null;
  const number = index + 1;
  return (
    <Paper withBorder radius="sm" p="sm" data-testid={`item-row-${index}`} data-carried={carried || undefined}>
      <Stack gap="xs">
        <Group justify="space-between" wrap="nowrap">
          <Group gap="xs">
            <Text size="sm" fw={600}>
              Item {number}
            </Text>
            {carried && (
              <Badge color="dusk" size="sm">
                Carried on from an earlier note
              </Badge>
            )}
          </Group>
          {!carried && (
            <ActionIcon
              variant="subtle"
              color="slate"
              aria-label={`Remove item ${number}`}
              onClick={() => form.removeListItem('items', index)}
            >
              ✕
            </ActionIcon>
          )}
        </Group>
        <Group grow align="flex-start" wrap="wrap">
          <Select
            label="Kind"
            data={KIND_OPTIONS}
            allowDeselect={false}
            disabled={carried}
            aria-label={`Kind of item ${number}`}
            {...form.getInputProps(`items.${index}.kind`)}
          />
          <Select
            label="Zone"
            placeholder="No particular zone"
            data={zoneOptions}
            clearable
            disabled={carried}
            aria-label={`Zone of item ${number}`}
            {...form.getInputProps(`items.${index}.zoneCode`)}
            value={item.zoneCode || null}
            onChange={(value) => form.setFieldValue(`items.${index}.zoneCode`, value ?? '')}
          />
        </Group>
        <TextInput
          label="What the next shift needs to know"
          aria-label={`Text of item ${number}`}
          placeholder="e.g. Feeder Q-7 out since 09:40, crew on site"
          maxLength={2000}
          {...form.getInputProps(`items.${index}.text`)}
        />
        <SegmentedControl
          aria-label={`Status of item ${number}`}
          data={STATUS_OPTIONS}
          w="fit-content"
          color={item.status === 'open' ? 'ember' : 'slate'}
          {...form.getInputProps(`items.${index}.status`)}
        />
      </Stack>
    </Paper>
  );
}
