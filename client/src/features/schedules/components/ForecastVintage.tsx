import { Alert, Button, Group, Loader, Stack, Table, Text } from '@mantine/core';
import type { UserDto, ZoneScheduleDto } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime } from '../../../lib/format';
import { notifySuccess } from '../../../lib/notify';
import { useForecastDiff } from '../api/use-forecast-diff';
import { useRestartFromLatest } from '../api/use-schedule-actions';
import { isEditable, isForecaster } from '../model/permissions';
import { dayRange, vintageLine } from '../model/vintage';

const signed = (mw: number | null) => (mw === null ? '—' : `${mw > 0 ? '+' : ''}${mw.toFixed(1)}`);

/**
 * Which forecast run the revision started from (its own issue time, not the latest run's) and,
 * when a newer run has been issued since, how the forecast moved hour by hour, with the offer to
 * start the draft again from the newer run.
 */
export function ForecastVintage({ zone, user }: { zone: ZoneScheduleDto; user: Pick<UserDto, 'id' | 'role'> }) {
  const revision = zone.working ?? zone.published;
  const newer = zone.newerForecast;
  const diff = useForecastDiff(newer?.revisionRunId ?? null, newer?.runId ?? null, dayRange(zone.slots));
  const restart = useRestartFromLatest();
  if (!revision) return null;
  const mayRestart = isForecaster(user) && isEditable(zone.working);
  const label = (iso: string) => zone.slots.find((s) => Date.parse(s.intervalStartUtc) === Date.parse(iso))?.hourEnding ?? iso;
  return (
    <Stack gap="xs">
      <Text size="sm" c="dimmed" data-testid="revision-forecast">
        {vintageLine(revision, zone.timeZone)}
      </Text>
      {newer && (
        <Alert color="ember" variant="light" title="The model has moved since this revision started" data-testid="newer-forecast">
          <Stack gap="xs">
            <Text size="sm">
              A newer forecast was issued {formatDateTime(newer.issuedAt, zone.timeZone)} ({zone.timeZone}), run {newer.runId}.
              {diff.data?.largestChangeMw != null && ` The largest change is ${signed(diff.data.largestChangeMw)} MW at ${label(diff.data.largestChangeHour as string)}.`}
              {newer.revisionRunId === null && ' This revision started from the week-earlier stand-in, so there is no earlier run to compare with.'}
            </Text>
            {diff.isPending && newer.revisionRunId !== null && <Loader size="xs" />}
            {diff.isError && <ErrorNotice title="The change could not be loaded" error={diff.error} />}
            {diff.data && (
              <Table.ScrollContainer minWidth={420} mah={260}>
                <Table aria-label="Forecast change by hour" fz="xs" verticalSpacing={2} withTableBorder>
                  <Table.Thead>
                    <Table.Tr>
                      <Table.Th>Hour</Table.Th>
                      <Table.Th ta="right">Run {diff.data.from.id} (MW)</Table.Th>
                      <Table.Th ta="right">Run {diff.data.to.id} (MW)</Table.Th>
                      <Table.Th ta="right">Change (MW)</Table.Th>
                    </Table.Tr>
                  </Table.Thead>
                  <Table.Tbody>
                    {diff.data.hours.map((h) => (
                      <Table.Tr key={h.hour} data-testid={`forecast-change-${label(h.hour)}`}>
                        <Table.Td ff="monospace">{label(h.hour)}</Table.Td>
                        <Table.Td ff="monospace" ta="right">{h.fromMw?.toFixed(1) ?? '—'}</Table.Td>
                        <Table.Td ff="monospace" ta="right">{h.toMw?.toFixed(1) ?? '—'}</Table.Td>
                        <Table.Td ff="monospace" ta="right">{signed(h.changeMw)}</Table.Td>
                      </Table.Tr>
                    ))}
                  </Table.Tbody>
                </Table>
              </Table.ScrollContainer>
            )}
            {restart.isError && <ErrorNotice title="The draft did not start again" error={restart.error} />}
            {mayRestart && zone.working && (
              <Group>
                <Button
                  size="sm"
                  variant="light"
                  loading={restart.isPending}
                  onClick={() => restart.mutate(zone.working!.id, { onSuccess: (r) => notifySuccess(`${zone.zoneName} revision ${r.revision} now starts from run ${r.forecastRunId}; its adjustments were applied again.`) })}
                >
                  Start again from the latest run
                </Button>
                <Text size="xs" c="dimmed">The adjustments in force are applied again to the new values.</Text>
              </Group>
            )}
            {!zone.working && isForecaster(user) && <Text size="xs">To use it, start a correction of the published revision.</Text>}
          </Stack>
        </Alert>
      )}
    </Stack>
  );
}
