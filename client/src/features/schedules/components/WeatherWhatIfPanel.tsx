import { Button, Group, Paper, SegmentedControl, Select, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import { SCHEDULE_CAUTION, WHAT_IF_MAX_SHIFT_C, type UserDto, type ZoneScheduleDto } from '@morrowline/shared';
import { useMemo, useState } from 'react';
import type uPlot from 'uplot';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { axis, CHART_COLORS, UplotChart } from '../../../components/UplotChart';
import { formatDateTime } from '../../../lib/format';
import { notifySuccess } from '../../../lib/notify';
import { useUndoAdjustmentBatch, useWhatIfAdjustments } from '../api/use-schedule-actions';
import { useWeatherVintages, useWeatherWhatIf, type WhatIfAsk } from '../api/use-weather-what-if';
import { isEditable, isForecaster } from '../model/permissions';
import { checkShift, vintageOptions } from '../model/what-if';

/**
 * The day's weather what-if: the load a temperature forecast N °C warmer or colder (or another
 * vintage) would mean, beside the model forecast, without changing it. A forecaster with a draft
 * may turn it into adjustments with a reason.
 */
export function WeatherWhatIfPanel({ day, zone, user }: { day: string; zone: ZoneScheduleDto; user: Pick<UserDto, 'id' | 'role'> }) {
  const [mode, setMode] = useState<'shift' | 'vintage'>('shift');
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [ask, setAsk] = useState<WhatIfAsk | null>(null);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);
  const whatIf = useWeatherWhatIf(day, zone.zone, ask);
  const vintages = useWeatherVintages(day, zone.zone, mode === 'vintage');
  const options = useMemo(() => (vintages.data ? vintageOptions(vintages.data, zone.timeZone) : []), [vintages.data, zone.timeZone]);
  const add = useWhatIfAdjustments(day);
  const undoBatch = useUndoAdjustmentBatch();
  // the batch this desk added last, while any of it is still in force on the working revision
  const [batch, setBatch] = useState<{ id: number; label: string } | null>(null);
  const batchInForce = batch !== null && (zone.working?.adjustments ?? []).some((a) => a.batchId === batch.id && a.undoneAt === null);
  const canApply = isForecaster(user) && isEditable(zone.working);

  const label = ask && 'shift' in ask ? `${Number(ask.shift) > 0 ? '+' : ''}${ask.shift} °C` : ask ? `vintage issued ${formatDateTime(ask.vintage, zone.timeZone)}` : '';
  const show = (event: React.FormEvent) => {
    event.preventDefault();
    const value = text.trim();
    if (mode === 'shift') {
      const message = checkShift(value);
      setError(message);
      if (!message) setAsk({ shift: value });
    } else {
      if (!value) return setError('Choose a temperature forecast vintage');
      setError(null);
      setAsk({ vintage: value });
    }
  };

  const apply = () => {
    if (!whatIf.data || !ask) return;
    if (!reason.trim()) return setReasonError('Say why the schedule should follow this what-if');
    setReasonError(null);
    const request = 'shift' in ask ? { shift: Number(ask.shift), reason: reason.trim() } : { vintage: ask.vintage, reason: reason.trim() };
    add.mutate({ zone: zone.zone, request }, {
      onSuccess: (result) => {
        const n = result.adjustments.length;
        notifySuccess(`${n} hourly adjustment${n === 1 ? '' : 's'} added from the what-if (${label}), together`);
        setBatch(result.adjustments[0]?.batchId ? { id: result.adjustments[0].batchId, label } : null);
        setReason('');
      },
    });
  };

  const undo = () => {
    if (!batch) return;
    undoBatch.mutate(batch.id, {
      onSuccess: () => {
        notifySuccess(`The what-if adjustments (${batch.label}) were undone`);
        setBatch(null);
      },
    });
  };

  const data = useMemo<uPlot.AlignedData | null>(() => {
    const w = whatIf.data;
    if (!w) return null;
    return [w.hours.map((h) => Date.parse(h.hourStart) / 1000 + 3600), w.hours.map((h) => h.modelMw), w.hours.map((h) => h.whatIfMw)];
  }, [whatIf.data]);
  const chartOptions = useMemo<Omit<uPlot.Options, 'width' | 'height'>>(
    () => ({
      scales: { x: { time: true } },
      cursor: { drag: { x: false, y: false } },
      series: [
        {},
        { label: 'Model forecast (MW)', stroke: CHART_COLORS.load, width: 2 },
        { label: 'What-if (MW)', stroke: CHART_COLORS.second, width: 2, dash: [6, 4] },
      ],
      axes: [axis({ size: 40 }), axis({ label: 'MW', size: 60 })],
    }),
    [],
  );

  return (
    <Paper withBorder p="md" data-testid="weather-what-if">
      <Stack gap="sm">
        <Title order={4}>Weather what-if</Title>
        <Text size="sm" c="dimmed">
          The load the model would forecast on another temperature forecast, beside its own forecast. Nothing changes unless you turn it into adjustments.
        </Text>
        <form onSubmit={show} noValidate>
          <Group align="flex-end" gap="sm">
            <SegmentedControl value={mode} onChange={(v) => { setMode(v as 'shift' | 'vintage'); setText(''); setError(null); }} data={[{ value: 'shift', label: 'Shift the temperature' }, { value: 'vintage', label: 'Another vintage' }]} />
            {mode === 'shift' ? (
              <TextInput
                label={`Shift, °C (−${WHAT_IF_MAX_SHIFT_C} to ${WHAT_IF_MAX_SHIFT_C})`}
                placeholder="-2.5"
                value={text}
                onChange={(e) => setText(e.currentTarget.value)}
                error={error}
                w={200}
                data-testid="what-if-input"
              />
            ) : (
              <Select
                label="Temperature forecast vintage (newest first)"
                placeholder={vintages.isPending ? 'Loading the vintages…' : options.length ? 'Choose a vintage' : 'No vintage known for the day'}
                data={options}
                value={text || null}
                onChange={(v) => setText(v ?? '')}
                error={error ?? (vintages.isError ? (vintages.error as Error).message : null)}
                disabled={!options.length}
                allowDeselect={false}
                w={420}
                comboboxProps={{ withinPortal: true }}
                data-testid="what-if-vintage"
              />
            )}
            <Button type="submit" variant="light" loading={whatIf.isFetching}>Show the what-if</Button>
          </Group>
        </form>
        {batchInForce && canApply && (
          <Group gap="sm" data-testid="what-if-batch">
            <Text size="sm">The what-if ({batch.label}) is in the draft as hourly adjustments.</Text>
            <Button size="compact-sm" variant="light" color="ember" onClick={undo} loading={undoBatch.isPending}>Undo the what-if adjustments</Button>
          </Group>
        )}
        {undoBatch.isError && <ErrorNotice title="The what-if adjustments were not undone" error={undoBatch.error} />}
        {whatIf.isError && <ErrorNotice title="The what-if could not be made" error={whatIf.error} />}
        {whatIf.data && data && (
          <Stack gap="xs" data-testid="what-if-result">
            <Text size="sm" data-testid="what-if-summary">
              {label}: {summaryOf(whatIf.data.hours)}.{' '}
              {whatIf.data.baseVintageIssuedAt && `Model forecast on the temperature forecast issued ${formatDateTime(whatIf.data.baseVintageIssuedAt, zone.timeZone)}`}
              {whatIf.data.whatIfVintageIssuedAt && whatIf.data.shiftC === null && `; what-if on the one issued ${formatDateTime(whatIf.data.whatIfVintageIssuedAt, zone.timeZone)}`}.
            </Text>
            <UplotChart title="Model forecast and the what-if" options={chartOptions} data={data} height={200} testId="what-if-chart" seriesKey caption={whatIf.data.method} />
            <Table aria-label="What-if by hour" withTableBorder verticalSpacing={2} data-testid="what-if-table">
              <Table.Thead>
                <Table.Tr><Table.Th>Hour starting</Table.Th><Table.Th ta="right">°C</Table.Th><Table.Th ta="right">What-if °C</Table.Th><Table.Th ta="right">Model MW</Table.Th><Table.Th ta="right">What-if MW</Table.Th><Table.Th ta="right">Change MW</Table.Th></Table.Tr>
              </Table.Thead>
              <Table.Tbody>
                {whatIf.data.hours.map((h) => (
                  <Table.Tr key={h.hourStart}>
                    <Table.Td ff="monospace">{formatDateTime(h.hourStart, zone.timeZone)}</Table.Td>
                    <Table.Td ff="monospace" ta="right">{h.temperatureC?.toFixed(1) ?? '—'}</Table.Td>
                    <Table.Td ff="monospace" ta="right">{h.whatIfTemperatureC?.toFixed(1) ?? '—'}</Table.Td>
                    <Table.Td ff="monospace" ta="right">{h.modelMw?.toFixed(1) ?? '—'}</Table.Td>
                    <Table.Td ff="monospace" ta="right">{h.whatIfMw?.toFixed(1) ?? '—'}</Table.Td>
                    <Table.Td ff="monospace" ta="right">{h.changeMw === null ? '—' : `${h.changeMw > 0 ? '+' : ''}${h.changeMw.toFixed(1)}`}</Table.Td>
                  </Table.Tr>
                ))}
              </Table.Tbody>
            </Table>
            {canApply ? (
              <Stack gap={4}>
                <Group align="flex-end" gap="sm">
                  <TextInput label="Reason for following the what-if" withAsterisk value={reason} onChange={(e) => setReason(e.currentTarget.value)} error={reasonError} w={420} data-testid="what-if-reason" />
                  <Button onClick={apply} loading={add.isPending}>Turn into adjustments</Button>
                </Group>
                {add.isError && <ErrorNotice title="The what-if was not added (no hour of it was)" error={add.error} />}
                <Text size="xs" c="dimmed">One added adjustment per hour, worked out again on the server and added together or not at all; undone together. {SCHEDULE_CAUTION}</Text>
              </Stack>
            ) : (
              <Text size="xs" c="dimmed">{isForecaster(user) ? 'Start the draft to turn the what-if into adjustments.' : ''}</Text>
            )}
          </Stack>
        )}
      </Stack>
    </Paper>
  );
}

function summaryOf(hours: ReadonlyArray<{ changeMw: number | null }>): string {
  const changes = hours.map((h) => h.changeMw).filter((c): c is number => c !== null);
  if (!changes.length) return 'no hour could be worked out';
  const mean = changes.reduce((a, b) => a + b, 0) / changes.length;
  const peak = changes.reduce((a, b) => (Math.abs(b) > Math.abs(a) ? b : a), 0);
  const signed = (v: number) => `${v > 0 ? '+' : v < 0 ? '−' : ''}${Math.abs(v).toFixed(1)} MW`;
  return `${signed(mean)} on average over ${changes.length} hours, largest ${signed(peak)}`;
}
