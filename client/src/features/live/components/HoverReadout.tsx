import { Text } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { formatMw } from '../../../lib/format';
import type { LoadView } from '../model/zone-view';

/** The values under the cursor, in words: the hour, actual, forecast and its 80 % band. */
export function HoverReadout({ view, hours, index }: { view: LoadView; hours: readonly string[]; index: number | null }) {
  if (index === null || !hours[index]) {
    return <Text size="xs" c="dimmed">Point at the chart to read an hour.</Text>;
  }
  const hour = hours[index];
  const day = DateTime.fromISO(hour, { zone: view.timeZone }).toFormat('ccc yyyy-LL-dd');
  const f = view.forecast;
  const band = f.lower80[index] !== null && f.upper80[index] !== null ? ` (80 %: ${formatMw(f.lower80[index])} – ${formatMw(f.upper80[index])})` : '';
  const missing = view.incomplete[index] ? 'incomplete' : 'no reading';
  return (
    <Text size="xs" ff="monospace" data-testid="hover-readout">
      {day} {hourEndingLabel(hour, view.timeZone)} · actual {view.actual[index] === null ? missing : formatMw(view.actual[index])} · forecast {formatMw(f.mean[index])}
      {band}
    </Text>
  );
}
