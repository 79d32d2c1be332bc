import { Group, Stack, Text, UnstyledButton } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { formatMw, formatPercent } from '../../../lib/format';
import type { LoadView } from '../model/zone-view';
import { FeedStateBadge } from './FeedStateBadge';

interface ZoneCardProps {
  view: LoadView;
  hours: readonly string[];
  selected: boolean;
  thresholdPct: number | null;
  onSelect: () => void;
}

/** One zone (or the system) at a glance: latest load, its forecast, the deviation, the feed. */
export function ZoneCard({ view, hours, selected, thresholdPct, onSelect }: ZoneCardProps) {
  const at = view.latestIndex === null ? null : hours[view.latestIndex];
  const beyond = view.deviationPct !== null && thresholdPct !== null && Math.abs(view.deviationPct) > thresholdPct;
  const sign = view.deviationPct !== null && view.deviationPct > 0 ? '+' : '';
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
        minWidth: 140,
        flex: '1 1 140px',
      }}
    >
      <Stack gap={4}>
        <Group justify="space-between" gap={4} wrap="nowrap">
          <Text fw={600} size="sm">{view.name}</Text>
          <Text size="xs" c="dimmed" ff="monospace">{at ? hourEndingLabel(at, view.timeZone) : '—'}</Text>
        </Group>
        <Text ff="monospace" fw={600} size="lg" data-testid="current-mw">{formatMw(view.currentMw)}</Text>
        <Group gap="xs" wrap="nowrap">
          <Text size="xs" c="dimmed">Forecast</Text>
          <Text size="xs" ff="monospace">{formatMw(view.forecastMw)}</Text>
        </Group>
        <Group gap="xs" wrap="nowrap">
          <Text size="xs" c="dimmed">Deviation</Text>
          <Text size="xs" ff="monospace" fw={beyond ? 700 : 400} c={beyond ? 'ember.7' : undefined} data-testid="deviation">
            {view.deviationPct === null ? '—' : `${sign}${formatPercent(view.deviationPct)}`}
          </Text>
        </Group>
        <FeedStateBadge feed={view.feed} />
      </Stack>
    </UnstyledButton>
  );
}
