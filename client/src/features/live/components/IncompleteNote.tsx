import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Text } from '@mantine/core';
import type { LoadView } from '../model/zone-view';

/** Says in words why the system total has gaps: how many of the hours drawn, and which feeds are behind. */
export function IncompleteNote({ view, first }: { view: LoadView; first: number }) {
  const hours = view.incomplete.slice(first).filter(Boolean).length;
  if (hours === 0) return null;
  const stale = view.feed.kind === 'stale' && view.feed.staleZones?.length ? ` Feeds behind now: ${view.feed.staleZones.join(', ')}.` : '';
  return (
    <Text size="sm" c={ATTENTION_TEXT} mb="xs" data-testid="incomplete-note">
      {hours} {hours === 1 ? 'hour' : 'hours'} on the chart {hours === 1 ? 'is' : 'are'} shaded and not totalled because a counted zone did not report; the total is left empty there rather than added up from part of the system.{stale}
    </Text>
  );
}
