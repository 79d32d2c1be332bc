import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Table, Text } from '@mantine/core';
import type { SeriesCheckDto } from '@morrowline/shared';
import { fmtNum, fmtP } from '../chart-data';

/** ADF and KPSS on every version of the series: the plain reading with the numbers beside it. */
export function TestResultsTable({ checks }: { checks: SeriesCheckDto[] }) {
  return (
    <Table aria-label="Unit-root and level tests" fz="sm" withTableBorder>
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Series</Table.Th>
          <Table.Th>Test</Table.Th>
          <Table.Th>What it says</Table.Th>
          <Table.Th ta="right">Statistic</Table.Th>
          <Table.Th ta="right">5 % value</Table.Th>
          <Table.Th ta="right">p</Table.Th>
          <Table.Th ta="right">Lags</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {checks.flatMap((c) => {
          const rows = [
            ...c.adf.map((a) => ({ key: `adf-${a.regression}`, test: a.regression === 'ct' ? 'ADF, constant + trend' : 'ADF, constant', reading: a.reading, stat: a.statistic, crit: a.criticalValue5, p: a.pValue, lags: a.lags, ok: a.rejectsUnitRoot })),
            { key: 'kpss', test: 'KPSS, level', reading: c.kpss.reading, stat: c.kpss.statistic, crit: c.kpss.criticalValue5, p: c.kpss.pValue, lags: c.kpss.lags, ok: !c.kpss.rejectsStableLevel },
          ];
          return rows.map((r, i) => (
            <Table.Tr key={`${c.label}-${r.key}`}>
              {i === 0 && (
                <Table.Td rowSpan={rows.length} ff="monospace" fw={600} style={{ verticalAlign: 'top' }}>
                  {c.label}
                </Table.Td>
              )}
              <Table.Td style={{ whiteSpace: 'nowrap' }}>{r.test}</Table.Td>
              <Table.Td>
                <Text size="sm" c={r.ok ? undefined : ATTENTION_TEXT}>
                  {r.reading.replace(/^(ADF|KPSS): /, '')}
                </Text>
              </Table.Td>
              <Table.Td ta="right" ff="monospace" style={{ whiteSpace: 'nowrap' }}>{fmtNum(r.stat, 3)}</Table.Td>
              <Table.Td ta="right" ff="monospace" style={{ whiteSpace: 'nowrap' }}>{fmtNum(r.crit, 3)}</Table.Td>
              <Table.Td ta="right" ff="monospace" style={{ whiteSpace: 'nowrap' }}>{r.key === 'kpss' && r.p !== null && r.p >= 0.1 ? '≥ 0.100' : r.key === 'kpss' && r.p !== null && r.p <= 0.01 ? '≤ 0.010' : fmtP(r.p)}</Table.Td>
              <Table.Td ta="right" ff="monospace" style={{ whiteSpace: 'nowrap' }}>{r.lags}</Table.Td>
            </Table.Tr>
          ));
        })}
      </Table.Tbody>
    </Table>
  );
}
