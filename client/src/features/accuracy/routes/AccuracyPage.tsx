import { Card, Center, Group, Loader, MultiSelect, SegmentedControl, Select, SimpleGrid, Stack, Text, Title } from '@mantine/core';
import { DatePickerInput } from '@mantine/dates';
import { formatHourEnding, type AccuracyZoneDto } from '@morrowline/shared';
import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useZones } from '../../zones';
import { useAccuracy } from '../api/use-accuracy';
import { AccuracySummary } from '../components/AccuracySummary';
import { ACCURACY_COLORS, BarChart } from '../components/BarChart';
import { DayTable } from '../components/DayTable';
import { ZoneTable } from '../components/ZoneTable';
import { chartChoices, dailyMapeData, hasValues, defaultRange, hourlyData, rangeProblem, signedMw, type HourMetric, type Range } from '../model/accuracy-data';

const SERIES = [
  { label: 'Model forecast', color: ACCURACY_COLORS.model },
  { label: 'Published schedule', color: ACCURACY_COLORS.schedule },
];

function Charts({ subject }: { subject: AccuracyZoneDto }) {
  const [metric, setMetric] = useState<HourMetric>('mae');
  const daily = useMemo(() => dailyMapeData(subject.days), [subject]);
  const hourly = useMemo(() => hourlyData(subject.byHour, metric), [subject, metric]);
  const dayLabel = useMemo(() => (x: number) => subject.days[x]?.operatingDay.slice(5) ?? '', [subject]);
  const he25 = hourly.he25;
  if (!hasValues(daily) && !hasValues(hourly.data)) {
    return (
      <Text size="sm" c="dimmed" data-testid="accuracy-no-charts">
        No day in this range was scored, so there are no charts yet.
      </Text>
    );
  }
  return (
    <SimpleGrid cols={{ base: 1, lg: 2 }} spacing="lg">
      <Card withBorder padding="md">
        <BarChart title="MAPE per operating day" data={daily} series={SERIES} xLabel={dayLabel} xName="Day" unit="%" testId="accuracy-daily-chart" caption={`A day without bars had no actuals, or no model forecast or published schedule for it (see the table below).${subject.daysReplayed > 0 ? ' The model bars of days marked “replayed” below are replayed forecasts, not ones the desk issued.' : ''}`} />
      </Card>
      <Card withBorder padding="md">
        <Group justify="space-between" mb={4}>
          <Text size="xs" c="dimmed">
            {metric === 'bias' ? 'Bias above zero: the forecast was too high at that hour.' : 'Mean absolute error at each hour ending.'}
          </Text>
          <SegmentedControl size="xs" value={metric} onChange={(v) => setMetric(v as HourMetric)} data={[{ value: 'mae', label: 'MAE' }, { value: 'bias', label: 'Bias' }]} aria-label="Hourly measure" />
        </Group>
        <BarChart
          title={metric === 'mae' ? 'MAE by hour ending' : 'Bias (forecast − actual) by hour ending'}
          data={hourly.data}
          series={SERIES}
          xLabel={formatHourEnding}
          xName="Hour ending"
          unit="MW"
          testId="accuracy-hourly-chart"
          caption={he25 ? `HE25 (the repeated hour of the autumn day, ${he25.days} day${he25.days === 1 ? '' : 's'}): model ${signedMw(he25.model[metric])}, schedule ${signedMw(he25.schedule[metric])}.` : 'HE25 occurs only on the autumn day the clocks go back; none in this range.'}
        />
      </Card>
    </SimpleGrid>
  );
}

export function AccuracyPage() {
  const zones = useZones();
  const active = useMemo(() => (zones.data ?? []).filter((z) => z.active), [zones.data]);
  // Zones and days live in the address (?zone=A,B&from=&to=), so a view can be shared.
  const [params, setParams] = useSearchParams();
  const picked = useMemo(() => (params.get('zone') ?? '').split(',').filter(Boolean), [params]);
  const timeZone = active[0]?.timeZone ?? 'UTC';
  const [range, setRange] = useState<Range | null>(() => (params.get('from') && params.get('to') ? [params.get('from'), params.get('to')] : null));
  const shown: Range = range ?? defaultRange(timeZone);
  const update = (zones: string[], r: Range) => {
    const next = new URLSearchParams();
    if (zones.length) next.set('zone', zones.join(','));
    if (r[0] && r[1]) {
      next.set('from', r[0]);
      next.set('to', r[1]);
    }
    setParams(next, { replace: true });
  };
  const setPicked = (zones: string[]) => update(zones, shown);
  const pickRange = (r: Range) => {
    setRange(r);
    if (r[0] && r[1]) update(picked, r);
  };
  const problem = rangeProblem(shown);
  const report = useAccuracy(picked, problem ? null : shown[0], problem ? null : shown[1]);
  const [chartFor, setChartFor] = useState<string | null>(null);
  const data = report.data;
  const subjects = data ? [...data.zones, data.system] : [];
  const choices = data ? chartChoices(data.zones, data.system) : [];
  const subject = subjects.find((s) => s.zone === chartFor) ?? (data ? (data.zones.length > 1 ? data.system : data.zones[0]) : undefined);
  const nothingScored = data && data.zones.every((z) => z.daysScored === 0 && z.schedule.hours === 0);

  return (
    <>
      <PageHeader
        title="Accuracy"
        description="How close the model forecast and the published schedule came to the actual load, once the actuals are in."
        actions={
          <Group gap="sm" align="flex-end">
            <MultiSelect
              label="Zones"
              aria-label="Zones"
              placeholder={picked.length ? undefined : 'All zones'}
              data={active.map((z) => ({ value: z.code, label: `${z.name} (${z.code})` }))}
              value={picked}
              onChange={setPicked}
              w={320}
              clearable
              searchable
              data-testid="accuracy-zones-picker"
            />
            <DatePickerInput type="range" label="Operating days" value={shown} onChange={(value) => pickRange(value as Range)} w={260} valueFormat="YYYY-MM-DD" allowSingleDateInRange data-testid="accuracy-range" />
          </Group>
        }
      />
      <Stack gap="lg">
        {zones.isError && <ErrorNotice title="Zones could not be loaded" error={zones.error} onRetry={() => void zones.refetch()} />}
        {problem && <Text c="dimmed">{problem}</Text>}
        {report.isFetching && !data && (
          <Center p="xl">
            <Loader aria-label="Loading accuracy" />
          </Center>
        )}
        {report.isError && <ErrorNotice title="Accuracy could not be worked out" error={report.error} onRetry={() => void report.refetch()} />}
        {data && (
          <>
            {nothingScored && (
              <Card withBorder padding="md" data-testid="accuracy-no-data">
                <Text fw={600}>Nothing to score in these days yet</Text>
                <Text size="sm" c="dimmed">
                  A day is scored once it has actuals and a forecast that was issued before its gate closure (or a published schedule). Days still running, days without readings and days without a forecast are listed below and never counted as zero error.
                </Text>
              </Card>
            )}
            <Group align="flex-end" gap="sm">
              <Title order={4}>Summary</Title>
              {choices.length > 1 && <Select aria-label="Show" data={choices} value={subject?.zone ?? null} onChange={setChartFor} allowDeselect={false} w={280} size="xs" />}
            </Group>
            {subject && <AccuracySummary subject={subject} />}
            {subject && <Charts subject={subject} />}
            <Title order={4}>Per zone</Title>
            <ZoneTable zones={data.zones} system={data.system} />
            {subject && (
              <>
                <Title order={4}>Per operating day · {subject.zone === 'SYSTEM' ? 'system total' : subject.zoneName}</Title>
                <DayTable subject={subject} />
              </>
            )}
            <Text size="xs" c="dimmed">
              Model forecast: the latest forecast run issued before each day&apos;s gate closure that covers the whole day; &ldquo;replayed&rdquo; marks a run worked out afterwards, at this installation&apos;s first start, not one the desk issued then. Published schedule: the latest published revision for the zone and day. Hours inside outage or bad-data windows are not scored. Latest reading {data.latestReadingHour ? data.latestReadingHour.replace('T', ' ').slice(0, 16) + ' UTC' : 'none'}.
            </Text>
          </>
        )}
      </Stack>
    </>
  );
}
