import { BadRequestException } from '@nestjs/common';
import { pickActiveZones } from './active-zones';

const active = [
  { code: 'NORTH', id: 1 },
  { code: 'SOUTH', id: 2 },
];

describe('pickActiveZones', () => {
  it('answers every active zone when no codes are given', () => {
    expect(pickActiveZones(active, undefined).map((z) => z.id)).toEqual([1, 2]);
    expect(pickActiveZones(active, []).map((z) => z.id)).toEqual([1, 2]);
  });

  it('answers the zones in the order asked', () => {
    expect(pickActiveZones(active, ['SOUTH', 'NORTH']).map((z) => z.id)).toEqual([2, 1]);
  });

  it('refuses a code that names no active zone with a 400 naming it', () => {
    expect(() => pickActiveZones(active, ['NORTH', 'WEST'])).toThrow(BadRequestException);
    expect(() => pickActiveZones(active, ['WEST'])).toThrow('No active zone with code WEST');
  });
});
