import { describe, expect, it } from 'vitest';
import { formatArmaOrders, formatSignedPercent } from './format';

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

describe('formatArmaOrders', () => {
  it('writes the orders, with the seasonal block and its period when there is one', () => {
    expect(formatArmaOrders(2, 1)).toBe('ARMA(2,1)');
    expect(formatArmaOrders(2, 1, null)).toBe('ARMA(2,1)');
    expect(formatArmaOrders(0, 3, { P: 1, Q: 1 })).toBe('ARMA(0,3)×(1,1)_24');
    expect(formatArmaOrders(3, 0, { P: 0, Q: 1, period: 168 })).toBe('ARMA(3,0)×(0,1)_168');
  });
});
