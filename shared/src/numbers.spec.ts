import { parseDecimal, parseId } from './numbers';

describe('parseDecimal', () => {
  it.each([
    ['412.5', 412.5],
    ['0', 0],
    ['0.25', 0.25],
    ['-3', -3],
    ['1200', 1200],
  ])('reads %s as %d', (text, value) => {
    expect(parseDecimal(text, 'mw')).toEqual({ ok: true, value });
  });

  it.each(['0x10', '0b101', '0o17', '1e3', '1E3', '+5', '012', '.5', '5.', '1,5', 'Infinity', 'NaN', '12 MW', ' 12', '12 ', '١٢'])('refuses %j', (text) => {
    const result = parseDecimal(text, 'mw');
    expect(result).toEqual({ ok: false, message: expect.stringMatching(/^mw ".*" is not a plain decimal number/) });
  });

  it.each(['', undefined, null, 12])('refuses %j as empty or not text', (value) => {
    expect(parseDecimal(value, 'mw')).toEqual({ ok: false, message: 'mw is empty; a number such as 412.5 is needed' });
  });
});

describe('parseId', () => {
  it('reads positive decimal ids up to the safe integer range', () => {
    expect(parseId('1')).toBe(1);
    expect(parseId('42')).toBe(42);
    expect(parseId('9007199254740991')).toBe(9_007_199_254_740_991);
  });

  it.each([' 1', '1 ', '0x10', '1e3', '0', '01', '-1', '+1', '1.0', '', '9007199254740992', '99999999999999999', '%31', 'abc'])('refuses %j', (text) => {
    expect(parseId(text)).toBeNull();
  });
});
