import { countInWords } from './words';

describe('countInWords', () => {
  it('spells out counts up to ten and keeps larger ones, and anything not a count, in figures', () => {
    expect(countInWords(0)).toBe('zero');
    expect(countInWords(3)).toBe('three');
    expect(countInWords(10)).toBe('ten');
    expect(countInWords(11)).toBe('11');
    expect(countInWords(2.5)).toBe('2.5');
    expect(countInWords(-1)).toBe('-1');
  });
});
