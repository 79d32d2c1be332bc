import { plainToInstance } from 'class-transformer';
import { validateSync } from 'class-validator';
import { ZoneCodeList } from './zone-code-list';

class Query {
  @ZoneCodeList('zones')
  zone?: string[];
}

const check = (zone: unknown) => {
  const q = plainToInstance(Query, zone === undefined ? {} : { zone });
  return { zone: q.zone, errors: validateSync(q).flatMap((e) => Object.values(e.constraints ?? {})) };
};

describe('ZoneCodeList', () => {
  it('takes repeated and comma-separated codes alike, and none at all', () => {
    expect(check('MILLRACE, HARROW')).toEqual({ zone: ['MILLRACE', 'HARROW'], errors: [] });
    expect(check(['MILLRACE', 'HARROW'])).toEqual({ zone: ['MILLRACE', 'HARROW'], errors: [] });
    expect(check(undefined)).toEqual({ zone: undefined, errors: [] });
  });

  it('refuses a code that is not one, and more than 50 zones', () => {
    expect(check('MILLRACE,no way').errors).toEqual(['zone must be zone codes such as MILLRACE']);
    const many = Array.from({ length: 51 }, (_, i) => `Z${String(i).padStart(2, '0')}`).join(',');
    expect(check(many).errors).toEqual(['zone must contain no more than 50 elements']);
  });
});
