import { Button, Card, Group, Loader, MultiSelect, Paper, Stack, Tabs, Text, TextInput, Title } from '@mantine/core';
import { DEMO_TIME_ZONE, DESK_EVENTS, may } from '@morrowline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useDeskEvent } from '../../../lib/desk-socket';
import { useSignedInUser } from '../../auth';
import { useZones } from '../../zones';
import { useDaySchedule } from '../api/use-day-schedule';
import { schedulesKey } from '../api/schedule-keys';
import { AdjustmentForm } from '../components/AdjustmentForm';
import { ScheduleChart } from '../components/ScheduleChart';
import { adjustedLegend } from '../model/legend';
import { ScheduleTable } from '../components/ScheduleTable';
import { SubscribersDialog } from '../components/SubscribersDialog';
import { ZoneSchedulePanel } from '../components/ZoneSchedulePanel';
import { isEditable, isForecaster } from '../model/permissions';
import { systemRows } from '../model/rows';
import { STATE_LABELS } from '../model/states';
import { tomorrowIn } from '../model/tomorrow';

const SYSTEM = 'system';

/**
 * The day-ahead schedule: for an operating day (tomorrow by default, in the desk's time zone) and
 * the zones chosen, the model forecast, the operator's adjustments, the gate-closure countdown and
 * the way to submission, approval and publication. The address keeps the day, zones and tab
 * (?day=2026-05-13&zones=MILLRACE,HARROW&tab=MILLRACE).
 */
export function SchedulesPage() {
  const user = useSignedInUser();
  const zones = useZones();
  const queryClient = useQueryClient();
  const [params, setParams] = useSearchParams();
  const [subscribersOpen, setSubscribersOpen] = useState(false);

  const activeZones = useMemo(() => (zones.data ?? []).filter((zone) => zone.active), [zones.data]);
  const timeZone = activeZones[0]?.timeZone ?? DEMO_TIME_ZONE;
  const day = params.get('day') ?? tomorrowIn(timeZone);
  const chosen = useMemo(() => {
    const asked = params.get('zones')?.split(',').filter(Boolean);
    const codes = activeZones.map((zone) => zone.code);
    return asked ? asked.filter((code) => codes.includes(code)) : codes;
  }, [params, activeZones]);
  const schedule = useDaySchedule(day, chosen);

  useDeskEvent(DESK_EVENTS.schedule, (event) => {
    if (event.operatingDay === day) void queryClient.invalidateQueries({ queryKey: schedulesKey });
  });

  const update = (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(params);
    for (const [key, value] of Object.entries(changes)) {
      if (value === null) next.delete(key);
      else next.set(key, value);
    }
    setParams(next, { replace: true });
  };

  const data = schedule.data;
  const clockOffsetMs = data ? Date.parse(data.serverTime) - schedule.dataUpdatedAt : 0;
  const dayZones = useMemo(() => data?.zones ?? [], [data]);
  const system = useMemo(() => systemRows(dayZones), [dayZones]);
  const tabs = dayZones.length > 1 ? [SYSTEM, ...dayZones.map((z) => z.zone)] : dayZones.map((z) => z.zone);
  const tab = tabs.includes(params.get('tab') ?? '') ? (params.get('tab') as string) : tabs[0];
  const editableZones = isForecaster(user) ? dayZones.filter((z) => isEditable(z.working)).map((z) => ({ code: z.zone, name: z.zoneName })) : [];

  return (
    <>
      <PageHeader
        title="Day-ahead schedule"
        description="The model forecast for an operating day, the operator's adjustments, and the way to approval and publication before gate closure."
        actions={
          may(user.role, 'supervise') && (
            <Button variant="default" onClick={() => setSubscribersOpen(true)}>
              Subscribers
            </Button>
          )
        }
      />
      <Stack gap="md">
        <Paper withBorder p="sm" radius="sm">
          <Group align="flex-end" wrap="wrap">
            <TextInput
              type="date"
              label="Operating day"
              value={day}
              onChange={(event) => event.currentTarget.value && update({ day: event.currentTarget.value })}
              w={180}
            />
            <MultiSelect
              label="Zones"
              placeholder="Choose zones"
              data={activeZones.map((zone) => ({ value: zone.code, label: zone.name }))}
              value={chosen}
              onChange={(codes) => update({ zones: codes.length === activeZones.length ? null : codes.join(',') || '-' })}
              style={{ flex: '1 1 320px' }}
            />
            <Button variant="subtle" onClick={() => update({ zones: null })} disabled={chosen.length === activeZones.length}>
              All zones
            </Button>
          </Group>
        </Paper>

        {(zones.isError || schedule.isError) && <ErrorNotice error={zones.error ?? schedule.error} onRetry={() => void schedule.refetch()} />}
        {zones.data && activeZones.length === 0 && <Text c="dimmed">No active zones: an administrator adds them under Zones.</Text>}
        {chosen.length === 0 && activeZones.length > 0 && <Text c="dimmed">Choose at least one zone.</Text>}
        {schedule.isFetching && !data && <Loader />}

        {data && dayZones.length > 0 && (
          <>
            {editableZones.length > 0 && (
              <AdjustmentForm
                key={`${day}-${editableZones.map((z) => z.code).join(',')}`}
                day={day}
                zones={editableZones}
                slots={dayZones.find((z) => z.zone === editableZones[0].code)?.slots ?? []}
                preferredZone={tab === SYSTEM ? null : tab}
              />
            )}
            <Tabs value={tab} onChange={(value) => update({ tab: value })} keepMounted={false}>
              <Tabs.List>
                {tabs.map((key) => {
                  const zone = dayZones.find((z) => z.zone === key);
                  const state = zone?.working?.state ?? zone?.published?.state;
                  return (
                    <Tabs.Tab key={key} value={key}>
                      {zone ? zone.zoneName : 'System total'}
                      {zone && <Text span size="xs" c="dimmed" ml={6}>{state ? STATE_LABELS[state].split(',')[0] : 'not drafted'}</Text>}
                    </Tabs.Tab>
                  );
                })}
              </Tabs.List>
              <Tabs.Panel value={SYSTEM} pt="md">
                <Card withBorder padding="md">
                  <Stack gap="md">
                    <Title order={3}>System total</Title>
                    <Text size="sm" c="dimmed">
                      Sum of {dayZones.map((z) => z.zoneName).join(', ')}. An hour with no value in any one zone is left blank rather than summed short; bands do not add up, so none are drawn.
                    </Text>
                    <ScheduleChart rows={system} title="System total" lineLabel={adjustedLegend(dayZones)} />
                    <ScheduleTable rows={system} label="Hours of the system total" showBand={false} />
                  </Stack>
                </Card>
              </Tabs.Panel>
              {dayZones.map((zone) => (
                <Tabs.Panel key={zone.zone} value={zone.zone} pt="md">
                  <Card withBorder padding="md">
                    <ZoneSchedulePanel day={day} zone={zone} user={user} caution={data.caution} clockOffsetMs={clockOffsetMs} />
                  </Card>
                </Tabs.Panel>
              ))}
            </Tabs>
          </>
        )}
      </Stack>
      {subscribersOpen && <SubscribersDialog zones={activeZones.map((z) => ({ code: z.code, name: z.name }))} onClose={() => setSubscribersOpen(false)} />}
    </>
  );
}
