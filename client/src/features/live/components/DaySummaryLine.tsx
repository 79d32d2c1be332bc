import { Group, Text } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { formatMw, formatSignedPercent } from '../../../lib/format';
import type { DaySummary } from '../model/day-summary';

const mwh = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

function basisWords(basis: DaySummary['basis']): string {
  if (basis === 'schedule') return 'the published schedule';
  if (basis === 'day-ahead') return 'the day-ahead forecast';
  return 'what was committed';
}

/** Today so far in two figures an operator reads at a glance: energy against what was committed, and the peak. */
export function DaySummaryLine({ summary, hours, timeZone }: { summary: DaySummary; hours: readonly string[]; timeZone: string }) {
  const energy = summary.actualMwh !== null && summary.committedMwh !== null
    ? `${mwh.format(summary.actualMwh)} MWh against ${mwh.format(summary.committedMwh)} MWh of ${basisWords(summary.basis)} (${formatSignedPercent(summary.differencePct)}) over ${summary.hoursCompared} of ${summary.hoursOver} hours`
    : summary.hoursOver === 0 ? 'no hour of today is over yet' : 'nothing committed to compare with';
  const peak = summary.peakMw !== null && summary.peakIndex !== null ? `${formatMw(summary.peakMw)} at ${hourEndingLabel(hours[summary.peakIndex], timeZone)}` : '—';
  return (
    <Group gap="lg" mb="xs" wrap="wrap">
      <Text size="sm" data-testid="energy-today">
        <Text span c="dimmed" size="sm">Energy so far today: </Text>
        {energy}
      </Text>
      <Text size="sm" data-testid="peak-today">
        <Text span c="dimmed" size="sm">Peak today: </Text>
        {peak}
      </Text>
    </Group>
  );
}
