import { describe, expect, it } from 'vitest';
import { formatSignedPercent } from './format';

describe('formatSignedPercent', () => {
  it('puts a plus before a rise, keeps the minus of a fall, and shows no sign for zero', () => {
    expect(formatSignedPercent(7.06)).toBe('+7.1 %');
    expect(formatSignedPercent(-3.84)).toBe('-3.8 %');
    expect(formatSignedPercent(0)).toBe('0.0 %');
    expect(formatSignedPercent(12.5, 0)).toBe('+13 %');
  });

  it('says "—" when there is no figure', () => {
    expect(formatSignedPercent(null)).toBe('—');
    expect(formatSignedPercent(Number.NaN)).toBe('—');
  });
});
