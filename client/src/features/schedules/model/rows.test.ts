import { describe, expect, it } from 'vitest';
import { hoursOf, revisionFixture, zoneFixture } from '../test-data';
import { systemRows, zoneRows } from './rows';

describe('schedule rows', () => {
  it('has 24 rows HE01..HE24 on an ordinary day', () => {
    const rows = zoneRows(zoneFixture('MILLRACE', '2026-05-13'));
    expect(rows.map((r) => r.hourEnding)).toEqual(Array.from({ length: 24 }, (_, i) => `HE${String(i + 1).padStart(2, '0')}`));
  });

  it('has 23 rows on the spring day, with no HE02', () => {
    const rows = zoneRows(zoneFixture('MILLRACE', '2026-03-08'));
    expect(rows).toHaveLength(23);
    expect(rows.map((r) => r.hourEnding).slice(0, 3)).toEqual(['HE01', 'HE03', 'HE04']);
    expect(rows.at(-1)?.hourEnding).toBe('HE24');
  });

  it('has 25 rows on the autumn day, up to HE25, each label once', () => {
    const rows = zoneRows(zoneFixture('MILLRACE', '2026-11-01'));
    expect(rows).toHaveLength(25);
    expect(new Set(rows.map((r) => r.hourEnding)).size).toBe(25);
    expect(rows.at(-1)?.hourEnding).toBe('HE25');
    expect(rows.map((r) => r.index)).toEqual(Array.from({ length: 25 }, (_, i) => i));
  });

  it('shows the working revision: adjusted MW and the difference from the model', () => {
    const day = '2026-05-13';
    const working = revisionFixture('MILLRACE', day, 'draft', { hours: hoursOf(day, (i) => 200 + i, (i, mw) => (i >= 16 && i <= 19 ? mw + 25 : mw)) });
    const rows = zoneRows(zoneFixture('MILLRACE', day, { working }));
    expect(rows[16]).toMatchObject({ hourEnding: 'HE17', modelMw: 216, adjustedMw: 241, differenceMw: 25, lower80: 206, upper80: 226 });
    expect(rows[15].differenceMw).toBe(0);
  });

  it('shows dashes where the forecast does not reach', () => {
    const day = '2026-05-13';
    const zone = zoneFixture('MILLRACE', day, { forecast: { runId: 1, issuedAt: 'x', hours: hoursOf(day).slice(0, 20) } });
    const rows = zoneRows(zone);
    expect(rows).toHaveLength(24);
    expect(rows[21]).toMatchObject({ hourEnding: 'HE22', modelMw: null, adjustedMw: null, differenceMw: null });
  });

  it('adds the zones up hour by hour, leaving an hour blank when one zone has no value', () => {
    const day = '2026-11-01';
    const harrow = zoneFixture('HARROW', day, { forecast: { runId: 2, issuedAt: 'x', hours: hoursOf(day, (i) => (i === 24 ? null : 100)) } });
    const rows = systemRows([zoneFixture('MILLRACE', day), harrow]);
    expect(rows).toHaveLength(25);
    expect(rows[0]).toMatchObject({ hourEnding: 'HE01', modelMw: 250, adjustedMw: 250, lower80: null });
    expect(rows[24].modelMw).toBeNull();
  });
});
