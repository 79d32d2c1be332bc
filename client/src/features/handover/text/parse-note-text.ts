/**
 * The handover's simple formatting: blank lines separate paragraphs, lines starting with "- "
 * make a list, **text** is bold. Parsed into plain data so that rendering never needs HTML:
 * whatever a note says, it reaches the page as text nodes.
 */

export interface Span {
  text: string;
  bold: boolean;
}

/** One line of a paragraph or one list entry. */
export type Line = Span[];

export type Block = { kind: 'paragraph'; lines: Line[] } | { kind: 'list'; items: Line[] };

const LIST_MARKER = /^\s*[-*]\s+/;

/** "a **b** c" → a, **b**, c. A "**" without its partner stays as typed. */
export function parseInline(line: string): Line {
  const spans: Span[] = [];
  let rest = line;
  while (rest.length > 0) {
    const open = rest.indexOf('**');
    const close = open === -1 ? -1 : rest.indexOf('**', open + 2);
    if (open === -1 || close === -1) {
      spans.push({ text: rest, bold: false });
      break;
    }
    if (open > 0) spans.push({ text: rest.slice(0, open), bold: false });
    const inner = rest.slice(open + 2, close);
    // "****" is not bold nothing: keep it as typed.
    spans.push(inner ? { text: inner, bold: true } : { text: '****', bold: false });
    rest = rest.slice(close + 2);
  }
  return mergeAdjacent(spans);
}

function mergeAdjacent(spans: Span[]): Span[] {
  const merged: Span[] = [];
  for (const span of spans) {
    const last = merged[merged.length - 1];
    if (last && last.bold === span.bold) last.text += span.text;
    else merged.push({ ...span });
  }
  return merged;
}

export function parseNoteText(source: string): Block[] {
  const blocks: Block[] = [];
  let current: Block | null = null;
  for (const raw of source.replace(/\r\n?/g, '\n').split('\n')) {
    const line = raw.trimEnd();
    if (line.trim() === '') {
      current = null;
      continue;
    }
    if (LIST_MARKER.test(line)) {
      if (current?.kind !== 'list') {
        current = { kind: 'list', items: [] };
        blocks.push(current);
      }
      current.items.push(parseInline(line.replace(LIST_MARKER, '')));
    } else {
      if (current?.kind !== 'paragraph') {
        current = { kind: 'paragraph', lines: [] };
        blocks.push(current);
      }
      current.lines.push(parseInline(line.trim()));
    }
  }
  return blocks;
}
