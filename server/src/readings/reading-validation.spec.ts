import { validateBatch, validateReading, type ValidationContext } from './reading-validation';

const now = Date.parse('2026-03-08T12:20:00Z');
const context: ValidationContext = {
  now,
  zones: new Map([['MILLRACE', { id: 1, code: 'MILLRACE', minPlausibleMw: 0, maxPlausibleMw: 400 }]]),
};
const good = { zone: 'MILLRACE', hour: '2026-03-08T09:00:00Z', mw: 180.5 };

describe('validateReading', () => {
  it('accepts a good reading and normalises an offset to the UTC hour start', () => {
    const result = validateReading({ ...good, hour: '2026-03-08T02:00:00-07:00', quality: 'estimated' }, context);
    expect(result).toEqual({ ok: true, reading: { zoneId: 1, zone: 'MILLRACE', hourStart: Date.parse('2026-03-08T09:00:00Z'), mw: 180.5, quality: 'estimated' } });
  });

  it.each([
    [{ ...good, zone: 'NOWHERE' }, 'unknown-zone'],
    [{ ...good, hour: '2026-03-08T09:30:00Z' }, 'not-on-the-hour'],
    [{ ...good, mw: 'lots' }, 'not-a-number'],
    [{ ...good, mw: null }, 'not-a-number'],
    [{ ...good, mw: -3 }, 'negative'],
    [{ ...good, mw: 4000 }, 'implausible'],
    [{ ...good, hour: '2026-03-08T14:00:00Z' }, 'too-far-in-future'],
    [{ ...good, hour: '2026-03-08T09:00:00' }, 'malformed'],
    [{ ...good, hour: 'yesterday' }, 'malformed'],
    [{ ...good, hour: '2023-02-30T00:00:00Z' }, 'malformed'],
    [{ ...good, hour: '2024-02-29T24:00:00Z' }, 'malformed'],
    [{ ...good, hour: '0999-03-08T09:00:00Z' }, 'malformed'],
    [{ ...good, hour: 1772960400000 }, 'malformed'],
    [{ ...good, quality: 'great' }, 'malformed'],
    ['MILLRACE,180', 'malformed'],
  ])('rejects %j as %s', (raw, reason) => {
    const result = validateReading(raw, context);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.reason).toBe(reason);
  });

  it('accepts the current and the next hour but not the one after', () => {
    expect(validateReading({ ...good, hour: '2026-03-08T13:00:00Z' }, context).ok).toBe(true);
    expect(validateReading({ ...good, hour: '2026-03-08T14:00:00Z' }, context).ok).toBe(false);
  });

  it('names the impossible date in its message rather than storing it on the next real hour', () => {
    const result = validateReading({ ...good, hour: '2023-02-30T00:00:00Z' }, context);
    expect(result).toEqual({ ok: false, reason: 'malformed', message: 'hour "2023-02-30T00:00:00Z" is not a real date: 2023-02 has no day 30' });
  });

  it('refuses a zone a scoped key may not send for', () => {
    const scoped = { ...context, allowedZone: 'HARROW' };
    const result = validateReading(good, scoped);
    expect(result.ok === false && result.reason).toBe('zone-not-allowed');
  });

  it('reports rejections by their index in the batch', () => {
    const result = validateBatch([good, { ...good, mw: -1 }, good], context);
    expect(result.indexes).toEqual([0, 2]);
    expect(result.rejected).toEqual([expect.objectContaining({ index: 1, reason: 'negative' })]);
  });
});
