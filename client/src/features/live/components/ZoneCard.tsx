import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Group, Stack, Text, UnstyledButton } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { formatMw, formatPercent } from '../../../lib/format';
import { formatTemperature } from '../../weather';
import type { LineBasis } from '../model/committed-line';
import type { LoadView } from '../model/zone-view';
import { deviationWords } from '../model/deviation-words';
import { FeedStateBadge } from './FeedStateBadge';

interface ZoneCardProps {
  view: LoadView;
  hours: readonly string[];
  selected: boolean;
  thresholdPct: number | null;
  onSelect: () => void;
  /** The zone's latest observed temperature; undefined leaves the line out (the system total). */
  temperatureC?: number | null;
}

/** The card's word for what the latest hour was measured against. */
export function basisWord(basis: LineBasis | null): string {
  if (basis === 'schedule') return 'Schedule';
  if (basis === 'day-ahead') return 'Day-ahead';
  if (basis === 'mixed') return 'Committed';
  return 'Committed';
}

/**
 * One zone (or the system) at a glance: latest load, what was committed for that hour (the
 * published schedule or the day-ahead forecast, named), the deviation from it, the latest run's
 * value for the next hour as a line of its own, and the feed.
 */
export function ZoneCard({ view, hours, selected, thresholdPct, onSelect, temperatureC }: ZoneCardProps) {
  const at = view.latestIndex === null ? null : hours[view.latestIndex];
  const deviation = deviationWords(view.deviationPct, thresholdPct);
  const beyond = deviation.beyond;
  return (
    <UnstyledButton
      onClick={onSelect}
      aria-pressed={selected}
      data-testid={`zone-card-${view.key}`}
      p="sm"
      style={{
        borderRadius: 'var(--mantine-radius-sm)',
        border: `1px solid ${selected ? 'var(--mantine-color-tide-6)' : 'var(--mantine-color-default-border)'}`,
        background: selected ? 'var(--mantine-color-tide-light)' : undefined,
        minWidth: 170,
        flex: '1 1 170px',
      }}
    >
      <Stack gap={4}>
        <Group justify="space-between" gap={4} wrap="nowrap">
          <Text fw={600} size="sm">{view.name}</Text>
          <Text size="xs" c="dimmed" ff="monospace">{at ? hourEndingLabel(at, view.timeZone) : '—'}</Text>
        </Group>
        <Text ff="monospace" fw={600} size="lg" data-testid="current-mw">{formatMw(view.currentMw)}</Text>
        <Group gap="xs" wrap="nowrap" justify="space-between">
          <Text size="xs" c="dimmed" data-testid="committed-basis">{view.committedMw === null && at ? 'Nothing committed' : basisWord(view.committedBasis)}</Text>
          <Text size="xs" ff="monospace" data-testid="committed-mw">{formatMw(view.committedMw)}</Text>
        </Group>
        <Group gap="xs" wrap="nowrap" justify="space-between">
          <Text size="xs" c="dimmed">Deviation</Text>
          <Text size="xs" ff="monospace" fw={beyond ? 700 : 400} c={beyond ? ATTENTION_TEXT : undefined} data-testid="deviation">
            {deviation.figure}
          </Text>
        </Group>
        {beyond && (
          <Text size="xs" fw={700} c={ATTENTION_TEXT} data-testid="deviation-beyond">
            <span aria-hidden="true">{deviation.mark} </span>Beyond the {formatPercent(thresholdPct, 0)} threshold
          </Text>
        )}
        <Group gap="xs" wrap="nowrap" justify="space-between">
          <Text size="xs" c="dimmed" title="The latest run’s forecast for the hour after the latest reading">Run, next hour</Text>
          <Text size="xs" ff="monospace" data-testid="next-run">{formatMw(view.nextRunMw)}</Text>
        </Group>
        {temperatureC !== undefined && (
          <Group gap="xs" wrap="nowrap" justify="space-between">
            <Text size="xs" c="dimmed" title="The latest observed temperature of the zone's weather stations">Temperature</Text>
            <Text size="xs" ff="monospace" data-testid="zone-temperature">{formatTemperature(temperatureC)}</Text>
          </Group>
        )}
        {view.leftOut.length > 0 && (
          <Text size="xs" c="dimmed" data-testid="left-out-count">
            {view.leftOut.length} {view.leftOut.length === 1 ? 'zone' : 'zones'} left out
          </Text>
        )}
        <FeedStateBadge feed={view.feed} />
      </Stack>
    </UnstyledButton>
  );
}
