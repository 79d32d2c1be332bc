/**
 * Small counts in words for the desk's sentences ("of the three orders…"), as written English
 * spells out numbers up to ten; larger counts stay in figures.
 */
const WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten'];

export function countInWords(n: number): string {
  return Number.isInteger(n) && n >= 0 && n < WORDS.length ? WORDS[n] : String(n);
}
