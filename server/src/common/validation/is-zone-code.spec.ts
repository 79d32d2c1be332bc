import { validateSync } from 'class-validator';
import { IsZoneCode } from './is-zone-code';

class OneZone {
  @IsZoneCode() zone!: unknown;
}

class ManyZones {
  @IsZoneCode({ each: true }) zone!: unknown;
}

function messages(dto: object): string[] {
  return validateSync(dto).flatMap((e) => Object.values(e.constraints ?? {}));
}

describe('IsZoneCode', () => {
  it('accepts a zone code and refuses anything else with one message naming the field', () => {
    expect(messages(Object.assign(new OneZone(), { zone: 'MILLRACE' }))).toEqual([]);
    for (const bad of ['millrace', 'M', '1ZONE', 'MILL RACE', 7, null]) {
      expect(messages(Object.assign(new OneZone(), { zone: bad }))).toEqual(['zone must be a zone code such as MILLRACE']);
    }
  });

  it('checks every element of a list and says so in the plural', () => {
    expect(messages(Object.assign(new ManyZones(), { zone: ['MILLRACE', 'HARROW'] }))).toEqual([]);
    expect(messages(Object.assign(new ManyZones(), { zone: ['MILLRACE', 'harrow'] }))).toEqual(['zone must be zone codes such as MILLRACE']);
  });
});
