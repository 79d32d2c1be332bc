import { Button, Group, Modal, NumberInput, Select, SimpleGrid, Stack, Switch, TextInput, Textarea } from '@mantine/core';
import { TimeInput } from '@mantine/dates';
import { useForm } from '@mantine/form';
import type { ZoneDto } from '@morrowline/shared';
import { useMemo } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useCreateZone, useUpdateZone } from '../api/use-save-zone';
import { useZones } from '../api/use-zones';
import {
  EMPTY_ZONE_FORM,
  formToCreateRequest,
  formToUpdateRequest,
  supportedTimeZones,
  validateZoneForm,
  zoneToForm,
  type ZoneFormValues,
} from '../zone-form';

interface ZoneDialogProps {
  /** The zone to edit, or null to add a new one. */
  zone: ZoneDto | null;
  onClose: () => void;
}

export function ZoneDialog({ zone, onClose }: ZoneDialogProps) {
  const creating = zone === null;
  const createZone = useCreateZone();
  const updateZone = useUpdateZone();
  const saving = creating ? createZone : updateZone;
  const zones = useZones();
  const otherZones = useMemo(() => (zones.data ?? []).filter((other) => other.id !== zone?.id), [zones.data, zone]);

  // A zone saved with a name the browser does not list (an alias such as "UTC") stays choosable.
  const timeZones = useMemo(() => {
    const known = supportedTimeZones();
    return zone && !known.includes(zone.timeZone) ? [zone.timeZone, ...known] : known;
  }, [zone]);

  const form = useForm<ZoneFormValues>({
    mode: 'uncontrolled',
    initialValues: zone ? zoneToForm(zone) : EMPTY_ZONE_FORM,
    validate: (values) => validateZoneForm(values, timeZones, creating, otherZones),
    transformValues: (values) => ({ ...values, code: values.code.trim().toUpperCase() }),
  });

  const submit = form.onSubmit((values) => {
    const done = (saved: ZoneDto) => {
      notifySuccess(`Zone ${saved.name} saved.`);
      onClose();
    };
    if (zone) updateZone.mutate({ id: zone.id, changes: formToUpdateRequest(values) }, { onSuccess: done });
    else createZone.mutate(formToCreateRequest(values), { onSuccess: done });
  });

  return (
    <Modal opened onClose={onClose} title={creating ? 'Add a zone' : `Edit ${zone.name}`} size="lg">
      <form onSubmit={submit} noValidate>
        <Stack gap="sm">
          {saving.isError && <ErrorNotice title="The zone was not saved" error={saving.error} />}
          <SimpleGrid cols={{ base: 1, xs: 2 }}>
            <TextInput
              label="Code"
              description={creating ? 'Used by meter feeds; cannot change later' : 'Fixed once the zone exists'}
              disabled={!creating}
              withAsterisk={creating}
              key={form.key('code')}
              {...form.getInputProps('code')}
            />
            <TextInput label="Name" withAsterisk key={form.key('name')} {...form.getInputProps('name')} />
          </SimpleGrid>
          <Select
            label="Time zone"
            description="Operating days and hour-ending labels follow it"
            withAsterisk
            searchable
            limit={50}
            nothingFoundMessage="No such time zone"
            data={timeZones}
            key={form.key('timeZone')}
            {...form.getInputProps('timeZone')}
          />
          <SimpleGrid cols={{ base: 1, xs: 3 }}>
            <NumberInput
              label="Alert threshold"
              suffix=" %"
              decimalScale={1}
              min={0.1}
              max={100}
              withAsterisk
              key={form.key('alertThresholdPct')}
              {...form.getInputProps('alertThresholdPct')}
            />
            <NumberInput
              label="For hours in a row"
              allowDecimal={false}
              min={1}
              max={48}
              withAsterisk
              key={form.key('alertConsecutiveHours')}
              {...form.getInputProps('alertConsecutiveHours')}
            />
            <TimeInput
              label="Gate closure"
              description="Local time, day before"
              withAsterisk
              key={form.key('gateClosure')}
              {...form.getInputProps('gateClosure')}
            />
          </SimpleGrid>
          <SimpleGrid cols={{ base: 1, xs: 2 }}>
            <NumberInput
              label="Lowest plausible load"
              suffix=" MW"
              min={0}
              withAsterisk
              key={form.key('minPlausibleMw')}
              {...form.getInputProps('minPlausibleMw')}
            />
            <NumberInput
              label="Highest plausible load"
              suffix=" MW"
              min={0}
              withAsterisk
              key={form.key('maxPlausibleMw')}
              {...form.getInputProps('maxPlausibleMw')}
            />
          </SimpleGrid>
          {!creating && (
            <>
              <Switch
                label="Active (receives readings and forecasts)"
                key={form.key('active')}
                {...form.getInputProps('active', { type: 'checkbox' })}
              />
              <Textarea
                label="Reason for the change"
                description="Written to the audit trail"
                autosize
                minRows={2}
                key={form.key('reason')}
                {...form.getInputProps('reason')}
              />
            </>
          )}
          <Group justify="flex-end" mt="sm">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" loading={saving.isPending}>
              {creating ? 'Add zone' : 'Save changes'}
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
