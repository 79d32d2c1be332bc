import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Alert, Badge, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import type { ModelCompareDto, ModelVersionDto, VersionIssueScoreDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';
import { compareRows, compareVerdict, ordersOf, type Better } from '../model/compare-rows';
import { weatherCandidateRows, weatherVerdict } from '../model/weather-rows';

function Mark({ side, better }: { side: Exclude<Better, null>; better: Better }) {
  if (better === null) return null;
  return better === side ? (
    <Badge size="xs" variant="light" color="tide" ml={6}>better</Badge>
  ) : (
    <Badge size="xs" variant="light" color="ember" ml={6}>worse</Badge>
  );
}

function Coefficients({ title, version }: { title: string; version: ModelVersionDto | null }) {
  return (
    <Stack gap={4}>
      <Text size="sm" fw={600}>{title}{version ? `: ${ordersOf(version)}` : ''}</Text>
      {!version && <Text size="sm" c="dimmed">None in service.</Text>}
      {version && (
        <Table aria-label={`Coefficients, ${title}`} withTableBorder verticalSpacing={4}>
          <Table.Thead>
            <Table.Tr><Table.Th>Term</Table.Th><Table.Th ta="right">Value</Table.Th><Table.Th ta="right">± s.e.</Table.Th></Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {version.coefficients.length === 0 && <Table.Tr><Table.Td colSpan={3}><Text size="sm" c="dimmed">none: white noise after differencing</Text></Table.Td></Table.Tr>}
            {version.coefficients.map((c) => (
              <Table.Tr key={c.name}>
                <Table.Td ff="monospace">{c.name}</Table.Td>
                <Table.Td ff="monospace" ta="right">{c.value.toFixed(4)}</Table.Td>
                <Table.Td ff="monospace" ta="right">{c.se === null ? '—' : c.se.toFixed(4)}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}

function dayMape(score: VersionIssueScoreDto | null, k: number): string {
  const d = score?.perDay[k];
  if (!d) return '—';
  if (d.source === null) return 'could not forecast';
  return `${d.mape === null ? '—' : `${d.mape.toFixed(2)} %`}${d.source === 'issued' ? ' (as issued)' : ''}`;
}

/** Each scored day: when it was forecast, and how each version did. */
function DayScores({ compare }: { compare: ModelCompareDto }) {
  const { candidate, inService } = compare.sameDays;
  if (!candidate || candidate.perDay.length === 0) return null;
  return (
    <Table aria-label="Scored days" withTableBorder verticalSpacing={4}>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Day</Table.Th>
          <Table.Th>Forecast at</Table.Th>
          <Table.Th ta="right">Version {compare.candidate.id}</Table.Th>
          <Table.Th ta="right">In service</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {candidate.perDay.map((d, k) => (
          <Table.Tr key={d.day} data-testid={`scored-day-${d.day}`}>
            <Table.Td ff="monospace">{d.day}</Table.Td>
            <Table.Td ff="monospace">{formatDateTime(d.issuedAt, compare.timeZone)}</Table.Td>
            <Table.Td ff="monospace" ta="right">{dayMape(candidate, k)}</Table.Td>
            <Table.Td ff="monospace" ta="right">{dayMape(inService, k)}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
}

/** With and without weather, side by side: what each version's refit tried and which terms it kept. */
function WeatherSideBySide({ compare }: { compare: ModelCompareDto }) {
  const { candidate, inService } = compare;
  if (!candidate.weather && !inService?.weather) return null;
  const rows = weatherCandidateRows(candidate, inService);
  return (
    <div data-testid="compare-weather">
      <Title order={5} mb={4}>With and without weather</Title>
      <SimpleGrid cols={{ base: 1, md: 2 }} mb={4}>
        <Text size="sm" data-testid="compare-weather-candidate">Version {candidate.id}: {weatherVerdict(candidate.weather)}</Text>
        <Text size="sm" data-testid="compare-weather-in-service">{inService ? `In service: ${weatherVerdict(inService.weather)}` : 'None in service.'}</Text>
      </SimpleGrid>
      {rows.length > 0 && (
        <Table aria-label="Weather terms, with and without" withTableBorder verticalSpacing={4}>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Terms (backtest MAPE on forecast weather, each version's own refit)</Table.Th>
              <Table.Th ta="right">Version {candidate.id}</Table.Th>
              <Table.Th ta="right">In service</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {rows.map((r) => (
              <Table.Tr key={r.label} data-testid={`weather-row-${r.label}`}>
                <Table.Td>{r.label}</Table.Td>
                <Table.Td ff="monospace" ta="right">{r.candidate}{r.chosenBy.includes('candidate') && <Badge size="xs" variant="light" color="tide" ml={6}>kept</Badge>}</Table.Td>
                <Table.Td ff="monospace" ta="right">{r.inService}{r.chosenBy.includes('in-service') && <Badge size="xs" variant="light" color="tide" ml={6}>kept</Badge>}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </div>
  );
}

/** A version beside the model in service: the same-days backtest decides, the rest explains. */
export function CompareView({ compare }: { compare: ModelCompareDto }) {
  const rows = compareRows(compare);
  const better = compare.candidateBetter;
  return (
    <Stack gap="md" data-testid="compare-view">
      <Alert color={better === null ? 'slate' : better ? 'tide' : 'ember'} variant="light" data-testid="compare-verdict">
        {compareVerdict(compare)}
      </Alert>
      <Table aria-label="Comparison" withTableBorder verticalSpacing="xs">
        <Table.Thead>
          <Table.Tr>
            <Table.Th />
            <Table.Th>Version {compare.candidate.id} ({compare.candidate.status})</Table.Th>
            <Table.Th>{compare.inService ? `In service: version ${compare.inService.id}` : 'In service'}</Table.Th>
            <Table.Th>Seasonal naive</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {rows.map((row) => (
            <Table.Tr key={row.label}>
              <Table.Td>
                <Text size="sm">{row.label}</Text>
                {row.note && <Text size="xs" c="dimmed">{row.note}</Text>}
              </Table.Td>
              <Table.Td ff="monospace" data-testid={`candidate-${row.label}`}>{row.candidate}<Mark side="candidate" better={row.better} /></Table.Td>
              <Table.Td ff="monospace" data-testid={`in-service-${row.label}`}>{row.inService}<Mark side="in-service" better={row.better} /></Table.Td>
              <Table.Td ff="monospace">{row.baseline ?? ''}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      <div>
        <Title order={5} mb={4}>Coefficients</Title>
        <SimpleGrid cols={{ base: 1, md: 2 }}>
          <Coefficients title={`Version ${compare.candidate.id}`} version={compare.candidate} />
          <Coefficients title="In service" version={compare.inService} />
        </SimpleGrid>
      </div>
      <WeatherSideBySide compare={compare} />
      <DayScores compare={compare} />
      {(compare.diagnostics.length > 0 || compare.candidate.warnings.length > 0) && (
        <Stack gap={2} data-testid="compare-diagnostics">
          <Title order={5}>What this means</Title>
          {compare.diagnostics.map((d) => <Text key={d} size="sm">{d}</Text>)}
          {compare.candidate.warnings.map((w) => <Text key={w} size="sm" c={ATTENTION_TEXT}>Note on version {compare.candidate.id}: {w}</Text>)}
        </Stack>
      )}
    </Stack>
  );
}
