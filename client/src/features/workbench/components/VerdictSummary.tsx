import { Badge, Group, List, Paper, Stack, Text, ThemeIcon } from '@mantine/core';
import type { NonConstancy, SeriesCheckDto, StationarityVerdictDto } from '@morrowline/shared';

export const PROBLEM_LABELS: Record<NonConstancy, string> = {
  'unit-root': 'wandering level',
  mean: 'moving average level',
  variance: 'changing spread',
  daily: 'daily pattern',
  weekly: 'weekly pattern',
};

interface VerdictSummaryProps {
  verdict: StationarityVerdictDto;
  checks: SeriesCheckDto[];
}

/** The headline verdict and, per version of the series, what is left that is not constant. */
export function VerdictSummary({ verdict, checks }: VerdictSummaryProps) {
  const rec = verdict.recommended;
  return (
    <Paper withBorder radius="md" p="md" data-testid="stationarity-verdict">
      <Stack gap="sm">
        <Text fw={600}>{verdict.headline}</Text>
        <List spacing={6} size="sm" listStyleType="none" pl={0}>
          {checks.map((c) => {
            const chosen = rec !== null && rec.length === c.diff.length && rec.every((v, i) => v === c.diff[i]);
            return (
              <List.Item key={c.label} data-testid={`verdict-${c.diff.join('x') || 'raw'}`}>
                <Group gap="xs" wrap="nowrap" align="flex-start">
                  <ThemeIcon size={18} radius="xl" color={c.problems.length === 0 ? 'tide' : 'ember'} variant="light" aria-hidden>
                    <Text size="xs">{c.problems.length === 0 ? '✓' : '!'}</Text>
                  </ThemeIcon>
                  <Stack gap={2}>
                    <Group gap={6}>
                      <Text size="sm" ff="monospace" fw={600}>
                        {c.label}
                      </Text>
                      {chosen && c.diff.length > 0 && <Badge color="tide">suggested</Badge>}
                      {chosen && verdict.inUse && <Badge color="tide" variant="light">in use by version {verdict.inUse.versionId}</Badge>}
                      {c.problems.map((p) => (
                        <Badge key={p} color="ember">
                          {PROBLEM_LABELS[p]}
                        </Badge>
                      ))}
                    </Group>
                    <Text size="sm" c="dimmed">
                      {c.summary}
                    </Text>
                  </Stack>
                </Group>
              </List.Item>
            );
          })}
        </List>
      </Stack>
    </Paper>
  );
}
