import { Badge, Divider, Group, Paper, Stack, Text } from '@mantine/core';
import type { HandoverNoteDto } from '@morrowline/shared';
import type { ReactNode } from 'react';
import { NoteText } from '../text/NoteText';
import { HandoverItemsList } from './HandoverItemsList';
import { formatDayClock } from './shift-time';

interface HandoverNoteCardProps {
  note: HandoverNoteDto;
  /** Draws the eye: used for notes still waiting to be acknowledged. */
  highlighted?: boolean;
  /** Buttons beside the heading, e.g. "Open". */
  actions?: ReactNode;
  /** Below the note: the acknowledgement form, or the shift events. */
  children?: ReactNode;
}

/** One handover: whose shift, who wrote it, the text, the items, and who took the desk. */
export function HandoverNoteCard({ note, highlighted = false, actions, children }: HandoverNoteCardProps) {
  const zone = note.shift.timeZone;
  return (
    <Paper
      withBorder
      radius="md"
      p="md"
      data-testid={`handover-note-${note.id}`}
      style={highlighted ? { borderColor: 'var(--mantine-color-ember-6)', borderWidth: 2 } : undefined}
    >
      <Stack gap="sm">
        <Group justify="space-between" align="flex-start" wrap="wrap">
          <Stack gap={0}>
            <Text fw={600}>{note.shift.label}</Text>
            <Text size="sm" c="dimmed">
              Written by {note.author.name} at {formatDayClock(note.createdAt, zone)}
            </Text>
          </Stack>
          <Group gap="xs">
            {note.acknowledgedBy ? (
              <Badge color="tide" data-testid="acknowledged-badge">
                Acknowledged
              </Badge>
            ) : (
              <Badge color="ember" variant="filled" data-testid="waiting-badge">
                Waiting to be acknowledged
              </Badge>
            )}
            {actions}
          </Group>
        </Group>
        <NoteText source={note.body} />
        <HandoverItemsList items={note.items} />
        {note.acknowledgedBy && (
          <>
            <Divider />
            <Text size="sm" data-testid="acknowledgement">
              Acknowledged by <strong>{note.acknowledgedBy.name}</strong>
              {note.acknowledgedAt ? ` at ${formatDayClock(note.acknowledgedAt, zone)}` : ''}
              {note.reply ? (
                <>
                  {' '}
                  — reply: <em>{note.reply}</em>
                </>
              ) : (
                ' — no reply'
              )}
            </Text>
          </>
        )}
        {children}
      </Stack>
    </Paper>
  );
}
