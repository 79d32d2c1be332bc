import { Accordion, Badge, Group, Stack, Text, Title } from '@mantine/core';
import type { UserDto, ZoneScheduleDto } from '@morrowline/shared';
import { useMemo } from 'react';
import { formatDateTime, formatMw } from '../../../lib/format';
import { isEditable, isForecaster } from '../model/permissions';
import { shownRevision, zoneRows } from '../model/rows';
import { describeScheduleSummary, scheduleSummary } from '../model/summary';
import { AdjustmentList } from './AdjustmentList';
import { BackToModelButton } from './BackToModelButton';
import { ForecastVintage } from './ForecastVintage';
import { GateCountdownBadge } from './GateCountdownBadge';
import { RevisionHistory } from './RevisionHistory';
import { ScheduleChart } from './ScheduleChart';
import { adjustedLegend } from '../model/legend';
import { ScheduleTable } from './ScheduleTable';
import { useScheduleTemperatures } from '../api/use-schedule-temperatures';
import { WeatherWhatIfPanel } from './WeatherWhatIfPanel';
import { WorkflowPanel } from './WorkflowPanel';

interface ZoneSchedulePanelProps {
  day: string;
  zone: ZoneScheduleDto;
  user: Pick<UserDto, 'id' | 'role'>;
  caution: string;
  clockOffsetMs: number;
}

/** One zone's day: where the schedule stands, the chart, the hours, the adjustments and the revisions. */
export function ZoneSchedulePanel({ day, zone, user, caution, clockOffsetMs }: ZoneSchedulePanelProps) {
  const rows = useMemo(() => zoneRows(zone), [zone]);
  const revision = shownRevision(zone);
  const summary = scheduleSummary(rows);
  const mayUndo = isForecaster(user) && isEditable(zone.working);
  const temperatures = useScheduleTemperatures(zone, rows);
  return (
    <Stack gap="md" data-testid={`zone-schedule-${zone.zone}`}>
      <Group justify="space-between" align="center" wrap="wrap">
        <Stack gap={0}>
          <Title order={3}>{zone.zoneName}</Title>
          <Text size="sm" c="dimmed" data-testid="schedule-summary">
            {describeScheduleSummary(summary)} · peak {formatMw(summary.peakMw)} · {zone.timeZone}
            {(revision?.forecastIssuedAt ?? zone.forecast?.issuedAt) && ` · forecast issued ${formatDateTime((revision?.forecastIssuedAt ?? zone.forecast!.issuedAt), zone.timeZone)}`}
          </Text>
          {revision?.forecastReplayed && (
            <Group gap={6} mt={4}>
              <Badge size="sm" variant="light" color="grape" data-testid="schedule-replayed-forecast">
                replayed forecast
              </Badge>
              <Text size="xs" c="dimmed">
                Its model values come from a forecast replayed at this installation&apos;s first start (as of {revision.forecastIssuedAt?.slice(0, 16).replace('T', ' ')} UTC), not one the desk issued then.
              </Text>
            </Group>
          )}
        </Stack>
        <GateCountdownBadge gateClosureAt={zone.gateClosureAt} timeZone={zone.timeZone} clockOffsetMs={clockOffsetMs} />
      </Group>
      <WorkflowPanel day={day} zone={zone} user={user} caution={caution} />
      <ForecastVintage zone={zone} user={user} />
      <ScheduleChart rows={rows} title={zone.zoneName} lineLabel={adjustedLegend([zone])} />
      {isForecaster(user) && zone.forecast && <WeatherWhatIfPanel day={day} zone={zone} user={user} />}
      <Accordion multiple defaultValue={['hours', 'adjustments']} variant="separated">
        <Accordion.Item value="hours">
          <Accordion.Control>Hours ({rows.length})</Accordion.Control>
          <Accordion.Panel>
            {temperatures.note && (
              <Text size="xs" c="dimmed" mb={4} data-testid="schedule-temperature-note">
                {temperatures.note}
              </Text>
            )}
            <ScheduleTable rows={rows} label={`Hours of ${zone.zoneName}`} temperatures={temperatures.hours} formatIssued={(iso) => formatDateTime(iso, zone.timeZone)} />
          </Accordion.Panel>
        </Accordion.Item>
        <Accordion.Item value="adjustments">
          <Accordion.Control>Adjustments ({revision?.adjustments.filter((a) => a.undoneAt === null).length ?? 0})</Accordion.Control>
          <Accordion.Panel>
            {mayUndo && zone.working && <BackToModelButton revision={zone.working} />}
            <AdjustmentList adjustments={revision?.adjustments ?? []} slots={zone.slots} timeZone={zone.timeZone} mayUndo={mayUndo} />
          </Accordion.Panel>
        </Accordion.Item>
        <Accordion.Item value="revisions">
          <Accordion.Control>Revision history</Accordion.Control>
          <Accordion.Panel>
            <RevisionHistory day={day} zone={zone.zone} timeZone={zone.timeZone} />
          </Accordion.Panel>
        </Accordion.Item>
      </Accordion>
    </Stack>
  );
}
