import { Paper, Stack, Text } from '@mantine/core';
import { hourEndingLabel } from '@morrowline/shared';
import { formatMw } from '../../../lib/format';
import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { deviationWords } from '../model/deviation-words';
import type { LoadView } from '../model/zone-view';
import { basisWord } from './ZoneCard';

interface WallZoneTileProps {
  view: LoadView;
  hours: readonly string[];
  thresholdPct: number | null;
}

/**
 * One zone (or the system total) in type that reads from across a control room: the latest load,
 * what was committed for that hour, and the deviation in figures, words and a mark (▲ ▼) when it
 * is beyond the zone's threshold, so colour never carries it alone.
 */
export function WallZoneTile({ view, hours, thresholdPct }: WallZoneTileProps) {
  const at = view.latestIndex === null ? null : hours[view.latestIndex];
  const deviation = deviationWords(view.deviationPct, thresholdPct);
  return (
    <Paper withBorder p="lg" radius="md" component="section" aria-labelledby={`wall-${view.key}`} data-testid={`wall-zone-${view.key}`}
      style={deviation.beyond ? { borderColor: 'var(--mantine-color-ember-text)', borderWidth: 3 } : undefined}>
      <Stack gap={6}>
        <Text component="h2" id={`wall-${view.key}`} fz={30} fw={700} lh={1.2} m={0}>
          {view.name}
        </Text>
        <Text fz={22} c="dimmed" ff="monospace">{at ? `Latest hour ${hourEndingLabel(at, view.timeZone)}` : 'No reading yet'}</Text>
        <Text fz={56} fw={700} ff="monospace" lh={1.1} data-testid="wall-current-mw">{formatMw(view.currentMw)}</Text>
        <Text fz={24} ff="monospace">
          {view.committedMw === null && at ? 'Nothing committed' : `${basisWord(view.committedBasis)} ${formatMw(view.committedMw)}`}
        </Text>
        <Text fz={30} fw={deviation.beyond ? 800 : 600} ff="monospace" c={deviation.beyond ? ATTENTION_TEXT : undefined} data-testid="wall-deviation">
          {deviation.mark && <span aria-hidden="true">{deviation.mark} </span>}
          {deviation.figure} <Text span fz={22} ff="body" inherit={false}>{deviation.direction}</Text>
        </Text>
        {deviation.beyond && (
          <Text fz={22} fw={700} c={ATTENTION_TEXT} data-testid="wall-beyond">
            Beyond the {thresholdPct} % threshold
          </Text>
        )}
      </Stack>
    </Paper>
  );
}
