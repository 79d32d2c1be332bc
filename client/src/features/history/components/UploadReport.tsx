import { Alert, Group, Stack, Table, Text } from '@mantine/core';
import type { CsvRejectionReason, CsvUploadReport } from '@morrowline/shared';

/** The server's rejection reasons in words. */
export const REASON_LABELS: Record<CsvRejectionReason, string> = {
  'unknown-zone': 'Unknown zone',
  'not-on-the-hour': 'Not on the hour',
  'not-a-number': 'Load is not a number',
  'empty-load': 'No load given',
  negative: 'Negative load',
  implausible: 'Outside the zone’s plausible range',
  'too-far-in-future': 'Too far in the future',
  malformed: 'Row cannot be read',
  'zone-not-allowed': 'Zone not allowed',
  duplicate: 'Hour given twice in the file',
};

function Figure({ label, value, testId }: { label: string; value: number; testId: string }) {
  return (
    <Stack gap={0}>
      <Text size="xs" c="dimmed">{label}</Text>
      <Text ff="monospace" fw={600} size="lg" data-testid={testId}>{value.toLocaleString('en-US')}</Text>
    </Stack>
  );
}

/** What an upload did: rows read, accepted, revised, and each rejected row with its line. */
export function UploadReport({ report }: { report: CsvUploadReport }) {
  const listed = report.rejected.length;
  return (
    <Stack gap="sm" data-testid="upload-report">
      <Text size="sm">
        Report for <strong>{report.fileName}</strong>
      </Text>
      <Group gap="xl">
        <Figure label="Rows read" value={report.rows} testId="report-rows" />
        <Figure label="Accepted" value={report.accepted} testId="report-accepted" />
        <Figure label="Of those, revised" value={report.revised} testId="report-revised" />
        <Figure label="Rejected" value={report.rejectedCount} testId="report-rejected" />
      </Group>
      {report.revised > 0 && <Text size="xs" c="dimmed">A revised row replaced a different stored value for its hour; the earlier value is kept as a revision.</Text>}
      {report.rejectedCount === 0 ? (
        <Alert color="tide" variant="light">Every row was accepted.</Alert>
      ) : (
        <>
          <Table aria-label="Rejected rows" data-testid="rejected-rows">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Line</Table.Th>
                <Table.Th>Reason</Table.Th>
                <Table.Th>Detail</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {report.rejected.map((row) => (
                <Table.Tr key={`${row.line}-${row.reason}`}>
                  <Table.Td ff="monospace">{row.line}</Table.Td>
                  <Table.Td>{REASON_LABELS[row.reason] ?? row.reason}</Table.Td>
                  <Table.Td>{row.message}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
          {report.rejectedCount > listed && (
            <Text size="xs" c="dimmed" data-testid="rejected-more">
              The first {listed} of {report.rejectedCount.toLocaleString('en-US')} rejected rows are listed.
            </Text>
          )}
        </>
      )}
    </Stack>
  );
}
