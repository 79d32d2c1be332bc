import { MantineProvider } from '@mantine/core';
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { theme } from '../../../app/theme';
import { NoteText } from './NoteText';
import { parseInline, parseNoteText } from './parse-note-text';

function renderText(source: string) {
  return render(
    <MantineProvider theme={theme} env="test">
      <NoteText source={source} />
    </MantineProvider>,
  );
}

describe('handover text formatting', () => {
  it('splits paragraphs on blank lines and keeps single line breaks inside one', () => {
    expect(parseNoteText('Quiet morning.\nSmelter on two shifts.\n\n\nRain from 18:00.')).toEqual([
      {
        kind: 'paragraph',
        lines: [[{ text: 'Quiet morning.', bold: false }], [{ text: 'Smelter on two shifts.', bold: false }]],
      },
      { kind: 'paragraph', lines: [[{ text: 'Rain from 18:00.', bold: false }]] },
    ]);
  });

  it('makes a list of consecutive "- " lines, next to a paragraph without a blank line', () => {
    const blocks = parseNoteText('Watch:\n- Q-7 feeder\n- HE18 peak\nThat is all.');
    expect(blocks.map((b) => b.kind)).toEqual(['paragraph', 'list', 'paragraph']);
    expect(blocks[1]).toEqual({
      kind: 'list',
      items: [[{ text: 'Q-7 feeder', bold: false }], [{ text: 'HE18 peak', bold: false }]],
    });
  });

  it('reads **bold** and leaves an unpaired ** as typed', () => {
    expect(parseInline('crew **on site** at 09:40')).toEqual([
      { text: 'crew ', bold: false },
      { text: 'on site', bold: true },
      { text: ' at 09:40', bold: false },
    ]);
    expect(parseInline('2 ** 3 is not bold')).toEqual([{ text: '2 ** 3 is not bold', bold: false }]);
    expect(parseInline('****')).toEqual([{ text: '****', bold: false }]);
  });

  it('renders lists and bold as elements, and markup in the note as plain text', () => {
    const { container } = renderText('**Q-7** out\n\n- crew on site\n- <b>restore</b> <img src=x onerror=alert(1)>');
    expect(container.querySelector('strong')).toHaveTextContent('Q-7');
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(items[1]).toHaveTextContent('<b>restore</b> <img src=x onerror=alert(1)>');
    expect(container.querySelector('img')).toBeNull();
    expect(container.querySelector('b')).toBeNull();
  });

  it('says so when a note has no free text', () => {
    renderText('  \n ');
    expect(screen.getByText('No free text; see the items.')).toBeInTheDocument();
  });
});
