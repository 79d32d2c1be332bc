import { Box, Table, Text } from '@mantine/core';
import { useState, type ReactNode } from 'react';

export interface ChartNumbersProps {
  /** The chart's title: the table is captioned "Numbers behind: <title>". */
  title: string;
  columns: readonly string[];
  /** One row per point of the chart, already formatted (a dash for a gap). */
  rows: () => readonly (readonly ReactNode[])[];
  testId?: string;
}

/**
 * A chart's text alternative: what it draws as a table a screen reader reads (and anyone may
 * open), folded under the chart in a disclosure so it takes no room until asked for. The rows
 * are built only when it is opened: a workbench chart can have eight weeks of hours.
 */
export function ChartNumbers({ title, columns, rows, testId }: ChartNumbersProps) {
  const [open, setOpen] = useState(false);
  return (
    <Box component="details" mt={4} data-testid={testId ?? 'chart-numbers'} onToggle={(event) => setOpen((event.currentTarget as HTMLDetailsElement).open)}>
      <Text component="summary" size="xs" c="dimmed" style={{ cursor: 'pointer', width: 'fit-content' }}>
        Show the numbers behind this chart as a table
      </Text>
      {open && (
        // A region of its own that takes the focus, so the keyboard can scroll it (WCAG 2.1.1).
        <Box tabIndex={0} role="region" aria-label={`Numbers behind: ${title}`} mah={320} style={{ overflow: 'auto' }}>
          <Table striped withTableBorder fz="xs" captionSide="top" stickyHeader>
            <Table.Caption>Numbers behind: {title}</Table.Caption>
            <Table.Thead>
              <Table.Tr>
                {columns.map((column) => (
                  <Table.Th key={column} scope="col">{column}</Table.Th>
                ))}
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {rows().map((row, r) => (
                <Table.Tr key={r}>
                  {row.map((cell, c) =>
                    c === 0 ? <Table.Th key={c} scope="row" fw={400}>{cell}</Table.Th> : <Table.Td key={c} className="numeric">{cell}</Table.Td>,
                  )}
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Box>
      )}
    </Box>
  );
}
