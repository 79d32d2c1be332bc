import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Alert, Badge, Group, Paper, SimpleGrid, Stack, Table, Text, Title } from '@mantine/core';
import type { ModelReportDto } from '@morrowline/shared';
import { formatArmaOrders } from '../../../lib/format';
import { fmtNum, fmtP } from '../chart-data';
import { CorrelogramChart } from './CorrelogramChart';

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <Stack gap={0}>
      <Text size="xs" c="dimmed">
        {label}
      </Text>
      <Text ff="monospace" fw={600}>
        {value}
      </Text>
    </Stack>
  );
}

/** The model the pipeline would use on this history: orders, coefficients, criteria, checks. */
export function ModelPanel({ report }: { report: ModelReportDto }) {
  const m = report.model;
  return (
    <Paper withBorder radius="md" p="md" data-testid="model-panel">
      <Stack gap="md">
        <Group justify="space-between" align="baseline">
          <Title order={3}>The model</Title>
          <Text size="xs" c="dimmed" ff="monospace">
            fitted on {report.usableHours} hours · {report.computeMs} ms
          </Text>
        </Group>
        <Text size="sm">{report.summary}</Text>
        {report.method === 'seasonal-naive' && (
          <Alert color="ember" variant="light" title="The desk would use the same hour last week" data-testid="model-fallback">
            {report.fallbackReason}
          </Alert>
        )}
        {report.warnings.length > 0 && (
          <Alert color="slate" variant="light" title="Worth knowing">
            {report.warnings.join('; ')}
          </Alert>
        )}
        {m && (
          <>
            <Group gap="xl" data-testid="model-orders">
              <Figure label="Differencing" value={m.label} />
              <Figure label="ARMA orders (p, q)" value={`ARMA(${m.p},${m.q})`} />
              {(m.P > 0 || m.Q > 0) && <Figure label={`Seasonal block at ${m.period} h`} value={`(${m.P},${m.Q})`} />}
              <Figure label="Mean term" value={m.includeMean ? 'yes' : 'no'} />
            </Group>
            <SimpleGrid cols={{ base: 1, md: 2 }} spacing="lg">
              <Stack gap="xs">
                <Text size="sm" fw={600}>
                  Coefficients
                </Text>
                <Table aria-label="Coefficients" fz="sm" withTableBorder>
                  <Table.Thead>
                    <Table.Tr>
                      <Table.Th>Term</Table.Th>
                      <Table.Th ta="right">Estimate</Table.Th>
                      <Table.Th ta="right">± s.e.</Table.Th>
                      <Table.Th ta="right">Estimate / s.e.</Table.Th>
                    </Table.Tr>
                  </Table.Thead>
                  <Table.Tbody>
                    {m.coefficients.length === 0 && (
                      <Table.Tr>
                        <Table.Td colSpan={4}>No coefficients: white noise after differencing.</Table.Td>
                      </Table.Tr>
                    )}
                    {m.coefficients.map((c) => (
                      <Table.Tr key={c.name}>
                        <Table.Td ff="monospace">{c.name}</Table.Td>
                        <Table.Td ta="right" ff="monospace">{fmtNum(c.value, 4)}</Table.Td>
                        <Table.Td ta="right" ff="monospace">{fmtNum(c.se, 4)}</Table.Td>
                        <Table.Td ta="right" ff="monospace">{c.se ? fmtNum(c.value / c.se, 1) : '—'}</Table.Td>
                      </Table.Tr>
                    ))}
                  </Table.Tbody>
                </Table>
                <Group gap="lg" data-testid="model-criteria">
                  <Figure label="σ² (MW²)" value={fmtNum(m.sigma2, 2)} />
                  <Figure label="log-likelihood" value={fmtNum(m.loglik, 1)} />
                  <Figure label="AIC" value={fmtNum(m.aic, 1)} />
                  <Figure label="AICc" value={fmtNum(m.aicc, 1)} />
                  <Figure label="BIC" value={fmtNum(m.bic, 1)} />
                </Group>
              </Stack>
              <Stack gap="xs">
                <Text size="sm" fw={600}>
                  What the model leaves over
                </Text>
                <Text size="sm" c={m.residualsLookWhite ? undefined : ATTENTION_TEXT} data-testid="residual-verdict">
                  {m.residualVerdict}
                </Text>
                <Table aria-label="Ljung–Box" fz="sm" withTableBorder>
                  <Table.Thead>
                    <Table.Tr>
                      <Table.Th>Ljung–Box up to lag</Table.Th>
                      <Table.Th ta="right">Q</Table.Th>
                      <Table.Th ta="right">df</Table.Th>
                      <Table.Th ta="right">p</Table.Th>
                    </Table.Tr>
                  </Table.Thead>
                  <Table.Tbody>
                    {m.ljungBox.map((l) => (
                      <Table.Tr key={l.lag}>
                        <Table.Td ff="monospace">{l.lag} h</Table.Td>
                        <Table.Td ta="right" ff="monospace">{fmtNum(l.statistic, 2)}</Table.Td>
                        <Table.Td ta="right" ff="monospace">{l.df}</Table.Td>
                        <Table.Td ta="right" ff="monospace">{fmtP(l.pValue)}</Table.Td>
                      </Table.Tr>
                    ))}
                  </Table.Tbody>
                </Table>
                <CorrelogramChart title="Residual ACF" correlogram={m.residualAcf} testId="chart-residual-acf" height={160} />
              </Stack>
            </SimpleGrid>
          </>
        )}
        <Stack gap="xs">
          <Text size="sm" fw={600}>
            Differencings tried (day-ahead error over the last {report.selectionDays} days; the choice weighs recent days more)
          </Text>
          <Table aria-label="Candidates" fz="sm" withTableBorder>
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Differencing</Table.Th>
                <Table.Th>Orders kept (lowest AICc, then day-ahead error)</Table.Th>
                <Table.Th ta="right">AICc</Table.Th>
                <Table.Th ta="right" title={`Each day's MAPE weighted by its age, the weights halving every ${report.halfLifeDays} days back: what the choice goes by`}>
                  Recent MAPE
                </Table.Th>
                <Table.Th ta="right">MAPE</Table.Th>
                <Table.Th />
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {report.candidates.map((c) => (
                <Table.Tr key={c.label}>
                  <Table.Td ff="monospace">{c.label}</Table.Td>
                  <Table.Td ff="monospace">{c.p === null ? (c.error ?? '—') : formatArmaOrders(c.p, c.q ?? 0, c.seasonal)}</Table.Td>
                  <Table.Td ta="right" ff="monospace">{fmtNum(c.aicc, 1)}</Table.Td>
                  <Table.Td ta="right" ff="monospace">{c.recentMape == null ? '—' : `${fmtNum(c.recentMape, 2)} %`}</Table.Td>
                  <Table.Td ta="right" ff="monospace">{c.mape === null ? '—' : `${fmtNum(c.mape, 2)} %`}</Table.Td>
                  <Table.Td>{c.chosen && <Badge color="tide">chosen</Badge>}</Table.Td>
                </Table.Tr>
              ))}
              <Table.Tr>
                <Table.Td>same hour last week</Table.Td>
                <Table.Td c="dimmed">baseline</Table.Td>
                <Table.Td />
                <Table.Td />
                <Table.Td ta="right" ff="monospace">{report.baselineMape === null ? '—' : `${fmtNum(report.baselineMape, 2)} %`}</Table.Td>
                <Table.Td />
              </Table.Tr>
            </Table.Tbody>
          </Table>
        </Stack>
      </Stack>
    </Paper>
  );
}
