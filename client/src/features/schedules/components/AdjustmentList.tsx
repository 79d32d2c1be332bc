import { Badge, Button, Stack, Table, Text } from '@mantine/core';
import type { ScheduleAdjustmentDto, ScheduleHourSlot } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime } from '../../../lib/format';
import { useUndoAdjustment } from '../api/use-schedule-actions';
import { describeAdjustment } from '../model/adjustment-form';

interface AdjustmentListProps {
  adjustments: readonly ScheduleAdjustmentDto[];
  slots: readonly ScheduleHourSlot[];
  timeZone: string;
  mayUndo: boolean;
}

/** Every adjustment of the revision in the order made, with who, when and why; undone ones struck through. */
export function AdjustmentList({ adjustments, slots, timeZone, mayUndo }: AdjustmentListProps) {
  const undo = useUndoAdjustment();
  const label = (index: number) => slots.find((slot) => slot.index === index)?.hourEnding ?? `hour ${index + 1}`;
  if (adjustments.length === 0) return <Text size="sm" c="dimmed">No adjustments: the model forecast stands as it is.</Text>;
  return (
    <Stack gap="xs">
      {undo.isError && <ErrorNotice title="The adjustment was not undone" error={undo.error} />}
      <Table aria-label="Adjustments" fz="sm" withTableBorder>
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Change</Table.Th>
            <Table.Th>Hours</Table.Th>
            <Table.Th>Reason</Table.Th>
            <Table.Th>By</Table.Th>
            <Table.Th />
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {adjustments.map((a) => {
            const undone = a.undoneAt !== null;
            return (
              <Table.Tr key={a.id} data-testid={`adjustment-${a.id}`} style={undone ? { textDecoration: 'line-through', opacity: 0.6 } : undefined}>
                <Table.Td ff="monospace">{describeAdjustment(a.kind, a.value)}</Table.Td>
                <Table.Td ff="monospace">{a.fromHour === a.toHour ? label(a.fromHour) : `${label(a.fromHour)}–${label(a.toHour)}`}</Table.Td>
                <Table.Td>
                  {a.reason}
                  {a.carriedFromRevision !== null && (
                    <Text size="xs" c="dimmed" style={{ textDecoration: 'none' }}>
                      carried from revision {a.carriedFromRevision}
                    </Text>
                  )}
                </Table.Td>
                <Table.Td>
                  {a.by.name}, {formatDateTime(a.at, timeZone)}
                  {undone && (
                    <Text size="xs" c="dimmed" style={{ textDecoration: 'none' }}>
                      undone by {a.undoneBy?.name ?? '—'}, {formatDateTime(a.undoneAt, timeZone)}
                    </Text>
                  )}
                </Table.Td>
                <Table.Td>
                  {undone ? (
                    <Badge color="slate">Undone</Badge>
                  ) : (
                    mayUndo && (
                      <Button size="xs" variant="subtle" color="ember" loading={undo.isPending && undo.variables === a.id} onClick={() => undo.mutate(a.id)}>
                        Undo
                      </Button>
                    )
                  )}
                </Table.Td>
              </Table.Tr>
            );
          })}
        </Table.Tbody>
      </Table>
    </Stack>
  );
}
