import { List, Text } from '@mantine/core';
import { Fragment } from 'react';
import { parseNoteText, type Line } from './parse-note-text';

function LineText({ line }: { line: Line }) {
  return (
    <>
      {line.map((span, index) => (span.bold ? <strong key={index}>{span.text}</strong> : <Fragment key={index}>{span.text}</Fragment>))}
    </>
  );
}

/** A handover's free text with its paragraphs, "- " lists and **bold**, as React elements. */
export function NoteText({ source }: { source: string }) {
  const blocks = parseNoteText(source);
  if (blocks.length === 0) {
    return (
      <Text size="sm" c="dimmed" fs="italic">
        No free text; see the items.
      </Text>
    );
  }
  return (
    <div data-testid="note-text">
      {blocks.map((block, index) =>
        block.kind === 'list' ? (
          <List key={index} size="sm" mb="xs" withPadding>
            {block.items.map((item, i) => (
              <List.Item key={i}>
                <LineText line={item} />
              </List.Item>
            ))}
          </List>
        ) : (
          <Text key={index} component="p" size="sm" mt={0} mb="xs">
            {block.lines.map((line, i) => (
              <Fragment key={i}>
                {i > 0 && <br />}
                <LineText line={line} />
              </Fragment>
            ))}
          </Text>
        ),
      )}
    </div>
  );
}
