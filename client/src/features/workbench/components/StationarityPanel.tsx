import { Group, Paper, SegmentedControl, SimpleGrid, Stack, Text, Title } from '@mantine/core';
import type { StationarityReportDto } from '@morrowline/shared';
import { useMemo, useState } from 'react';
import { CorrelogramChart } from './CorrelogramChart';
import { TestResultsTable } from './TestResultsTable';
import { TimeChart } from './TimeChart';
import { CHART_COLORS } from '../../../components/UplotChart';
import { VerdictSummary } from './VerdictSummary';

/** Is the load stationary, and which differencing makes it so? */
export function StationarityPanel({ report }: { report: StationarityReportDto }) {
  const differenced = report.checks.filter((c) => c.diff.length > 0);
  const suggested = report.verdict.recommended?.join('x');
  const [pick, setPick] = useState<string>(suggested && suggested.length > 0 ? suggested : (differenced[1]?.diff.join('x') ?? ''));
  const raw = report.checks[0];
  const after = differenced.find((c) => c.diff.join('x') === pick) ?? differenced[0];
  const seriesLines = useMemo(
    () => [
      { label: 'load', values: report.load, color: CHART_COLORS.load },
      { label: 'weekly mean', values: report.rolling.week.mean, color: CHART_COLORS.second, width: 2 },
    ],
    [report],
  );
  const meanLines = useMemo(
    () => [
      { label: '24 h mean', values: report.rolling.day.mean, color: CHART_COLORS.load },
      { label: '168 h mean', values: report.rolling.week.mean, color: CHART_COLORS.second, width: 2 },
    ],
    [report],
  );
  const varLines = useMemo(
    () => [
      { label: '24 h variance', values: report.rolling.day.variance, color: CHART_COLORS.third },
      { label: '168 h variance', values: report.rolling.week.variance, color: CHART_COLORS.second, width: 2 },
    ],
    [report],
  );
  return (
    <Paper withBorder radius="md" p="md" data-testid="stationarity-panel">
      <Stack gap="md">
        <Group justify="space-between" align="baseline">
          <Title order={3}>Is the load stationary?</Title>
          <Text size="xs" c="dimmed" ff="monospace">
            {report.usableHours} of {report.hours} hours with readings · {report.weeks} weeks · {report.timeZone}
          </Text>
        </Group>
        <VerdictSummary verdict={report.verdict} checks={report.checks} />
        <TimeChart title="Hourly load (MW) with its weekly mean" times={report.times} lines={seriesLines} unit="MW" timeZone={report.timeZone} height={240} testId="chart-series" />
        <SimpleGrid cols={{ base: 1, md: 2 }}>
          <TimeChart title="Rolling mean (MW)" times={report.times} lines={meanLines} unit="MW" timeZone={report.timeZone} height={180} testId="chart-rolling-mean" caption="A steady 168 h line means the level does not drift." />
          <TimeChart title="Rolling variance (MW²)" times={report.times} lines={varLines} unit="MW²" timeZone={report.timeZone} height={180} testId="chart-rolling-variance" caption="A steady 168 h line means the spread does not change." />
        </SimpleGrid>
        <TestResultsTable checks={report.checks} />
        <Group justify="space-between" align="center">
          <Title order={4}>Correlation with earlier hours</Title>
          <Group gap="xs">
            <Text size="sm">Compare with</Text>
            <SegmentedControl size="xs" value={after?.diff.join('x') ?? ''} onChange={setPick} data={differenced.map((c) => ({ value: c.diff.join('x'), label: c.label }))} aria-label="Differencing to compare" />
          </Group>
        </Group>
        <SimpleGrid cols={{ base: 1, md: 2 }}>
          <Stack gap="sm" data-testid="correlograms-raw">
            <Text size="sm" ff="monospace" fw={600}>
              as recorded
            </Text>
            <CorrelogramChart title="ACF, as recorded" correlogram={raw.acf} testId="chart-acf-raw" />
            <CorrelogramChart title="PACF, as recorded" correlogram={raw.pacf} testId="chart-pacf-raw" />
          </Stack>
          {after && (
            <Stack gap="sm" data-testid="correlograms-differenced">
              <Text size="sm" ff="monospace" fw={600}>
                after {after.label}
              </Text>
              <CorrelogramChart title={`ACF, after ${after.label}`} correlogram={after.acf} color={CHART_COLORS.third} testId="chart-acf-differenced" />
              <CorrelogramChart title={`PACF, after ${after.label}`} correlogram={after.pacf} color={CHART_COLORS.third} testId="chart-pacf-differenced" />
            </Stack>
          )}
        </SimpleGrid>
      </Stack>
    </Paper>
  );
}
