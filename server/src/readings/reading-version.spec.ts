import { checkVersion } from './reading-version';

const NOW = Date.UTC(2026, 11, 2, 22, 0);

describe('checkVersion', () => {
  it('takes a missing version as "the latest at storing"', () => {
    expect(checkVersion({ zone: 'MILLRACE' }, NOW)).toEqual({ ok: true, version: null });
    expect(checkVersion({ zone: 'MILLRACE', version: undefined }, NOW)).toEqual({ ok: true, version: null });
  });

  it('accepts whole microseconds from 2000-01-01 up to a day past the server clock', () => {
    expect(checkVersion({ version: 946_684_800_000_000 }, NOW)).toEqual({ ok: true, version: 946_684_800_000_000 });
    expect(checkVersion({ version: NOW * 1000 + 86_400_000_000 }, NOW)).toEqual({ ok: true, version: NOW * 1000 + 86_400_000_000 });
  });

  it.each([
    ['a counter', 7],
    ['milliseconds', NOW],
    ['before 2000', 946_684_799_999_999],
    ['more than a day ahead', NOW * 1000 + 86_400_000_001],
    ['a fraction', 1_700_000_000_000_000.5],
    ['a string', '1700000000000000'],
    ['null', null],
    ['beyond exact doubles', 2 ** 53 + 2],
  ])('refuses %s', (_, version) => {
    const result = checkVersion({ version }, NOW);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toMatch(/version/);
  });
});
