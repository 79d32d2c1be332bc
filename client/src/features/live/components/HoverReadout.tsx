import { Text } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { formatMw } from '../../../lib/format';
import type { LoadView } from '../model/zone-view';

/** The values under the cursor, in words: the hour, actual, schedule, day-ahead and latest run. */
export function HoverReadout({ view, hours, index }: { view: LoadView; hours: readonly string[]; index: number | null }) {
  if (index === null || !hours[index]) {
    return <Text size="xs" c="dimmed">Point at the chart to read an hour.</Text>;
  }
  const hour = hours[index];
  const day = DateTime.fromISO(hour, { zone: view.timeZone }).toFormat('ccc yyyy-LL-dd');
  const c = view.committed;
  const missing = view.incomplete[index] ? 'incomplete' : 'no reading';
  const run = view.latestRun.mean[index];
  return (
    <Text size="xs" ff="monospace" data-testid="hover-readout">
      {day} {hourEndingLabel(hour, view.timeZone)} · actual {view.actual[index] === null ? missing : formatMw(view.actual[index])} · schedule {formatMw(c.schedule[index])} · day-ahead {formatMw(c.dayAhead[index])}
      {run !== null ? ` · latest run ${formatMw(run)}` : ''}
    </Text>
  );
}
