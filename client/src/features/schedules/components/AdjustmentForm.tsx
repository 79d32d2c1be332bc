import { Button, Group, MultiSelect, NumberInput, Paper, SegmentedControl, Select, SimpleGrid, Stack, Text, Textarea, Title } from '@mantine/core';
import { useForm } from '@mantine/form';
import { SCHEDULE_ADJUSTMENT_KINDS, type ScheduleHourSlot } from '@morrowline/shared';
import { useEffect, useMemo } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useAddAdjustment } from '../api/use-schedule-actions';
import {
  ADJUSTMENT_KIND_LABELS,
  describeAdjustment,
  formToAdjustmentRequest,
  initialAdjustmentForm,
  validateAdjustmentForm,
  type AdjustmentFormValues,
} from '../model/adjustment-form';

interface AdjustmentFormProps {
  day: string;
  /** Zones whose revision can take an adjustment now (draft or returned). */
  zones: { code: string; name: string }[];
  /** The day's hours (the same for every zone in one time zone). */
  slots: readonly ScheduleHourSlot[];
  /** Zone preselected: the one on screen. */
  preferredZone: string | null;
}

/** Set a value, add MW or scale by a percentage over an hour range, on one zone or several, with a reason. */
export function AdjustmentForm({ day, zones, slots, preferredZone }: AdjustmentFormProps) {
  const add = useAddAdjustment(day);
  const codes = zones.map((zone) => zone.code);
  const start = preferredZone && codes.includes(preferredZone) ? [preferredZone] : codes.slice(0, 1);
  const form = useForm<AdjustmentFormValues>({
    mode: 'controlled',
    initialValues: initialAdjustmentForm(start, slots.length),
    validate: validateAdjustmentForm,
  });
  const zoneKey = codes.join(',');
  useEffect(() => {
    // A zone leaving the editable set (submitted elsewhere) leaves the form too.
    const kept = form.getValues().zones.filter((code) => codes.includes(code));
    if (kept.length !== form.getValues().zones.length) form.setFieldValue('zones', kept);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [zoneKey]);

  const hourOptions = useMemo(() => slots.map((slot) => ({ value: String(slot.index), label: slot.hourEnding })), [slots]);
  const values = form.getValues();
  const unit = values.kind === 'scale' ? '%' : 'MW';

  return (
    <Paper withBorder p="md" radius="sm">
      <form
        aria-label="Adjust the schedule"
        noValidate
        onSubmit={form.onSubmit((submitted) =>
          add.mutate(formToAdjustmentRequest(submitted), {
            onSuccess: (result) => {
              const first = result.adjustments[0];
              notifySuccess(`${first ? describeAdjustment(first.kind, first.value) : 'Adjustment'} applied to ${result.revisions.length} zone${result.revisions.length === 1 ? '' : 's'}.`);
              form.setValues({ value: '', reason: '' });
              form.resetDirty();
            },
          }),
        )}
      >
        <Stack gap="sm">
          <Title order={4}>Adjust</Title>
          <SegmentedControl
            aria-label="Kind of adjustment"
            data={SCHEDULE_ADJUSTMENT_KINDS.map((kind) => ({ value: kind, label: ADJUSTMENT_KIND_LABELS[kind] }))}
            {...form.getInputProps('kind')}
          />
          <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
            <NumberInput
              label={values.kind === 'set' ? 'New value' : values.kind === 'add' ? 'MW to add (negative takes off)' : 'Percent (negative lowers)'}
              rightSection={<Text size="xs" c="dimmed">{unit}</Text>}
              decimalScale={1}
              withAsterisk
              {...form.getInputProps('value')}
            />
            <Select label="From hour" data={hourOptions} allowDeselect={false} withAsterisk {...form.getInputProps('fromHour')} />
            <Select label="To hour" data={hourOptions} allowDeselect={false} withAsterisk {...form.getInputProps('toHour')} />
          </SimpleGrid>
          <MultiSelect
            label="Zones"
            description="The same change on every zone chosen; all take it or none does."
            data={zones.map((zone) => ({ value: zone.code, label: zone.name }))}
            withAsterisk
            {...form.getInputProps('zones')}
          />
          <Textarea label="Reason" placeholder="Copperline smelter on one shift for maintenance" withAsterisk autosize minRows={2} maxLength={500} {...form.getInputProps('reason')} />
          {add.isError && <ErrorNotice title="The adjustment was not applied" error={add.error} />}
          <Group justify="flex-end">
            <Button type="submit" loading={add.isPending}>
              Apply adjustment
            </Button>
          </Group>
        </Stack>
      </form>
    </Paper>
  );
}
