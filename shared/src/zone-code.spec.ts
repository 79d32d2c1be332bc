import { isZoneCode } from './zone-code';

describe('zone codes', () => {
  it('accepts the demo codes and any 2 to 32 capitals, digits, - or _ after a capital letter', () => {
    for (const code of ['MILLRACE', 'COPPERLINE', 'HARROW', 'QUARRY', 'LANTERN', 'Z1', 'NORTH-2_B', `A${'B'.repeat(31)}`]) expect(isZoneCode(code)).toBe(true);
  });

  it('refuses lower case, a leading digit or dash, one character, 33 characters, spaces and non-strings', () => {
    for (const code of ['millrace', 'Millrace', '1ZONE', '-ZONE', 'M', `A${'B'.repeat(32)}`, 'MILL RACE', ' MILLRACE', '']) expect(isZoneCode(code)).toBe(false);
    expect(isZoneCode(42)).toBe(false);
    expect(isZoneCode(null)).toBe(false);
  });
});
