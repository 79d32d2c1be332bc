import { VersionClock } from '@morrowline/shared';
import { planBatch, readingKey, type VersionedReading } from './readings.repository';

const HOUR = Date.UTC(2026, 2, 8, 9);
const NOW = Date.UTC(2026, 2, 8, 12);
const reading = (mw: number, version: number | null, hourStart = HOUR): VersionedReading => ({ zoneId: 1, zone: 'MILLRACE', hourStart, mw, quality: 'good', version });
const held = (mw: number, version: number) => ({ mw, quality: 'good' as const, source: 'feed:a', receivedAt: NOW - 1000, version });
const key = readingKey(1, HOUR);
/** A clock fixed at NOW, so stamped versions are known: NOW µs, then +1 each. */
const clock = () => new VersionClock(() => NOW);

describe('planBatch (which value each hour ends with)', () => {
  it('applies a higher version over the stored one and keeps the stored one as a revision', () => {
    const current = new Map([[key, held(10, 500)]]);
    const plan = planBatch([reading(11, 600)], current, 'feed:b', NOW, clock());
    expect(plan.finals.get(key)).toMatchObject({ version: 600, reading: { mw: 11 } });
    expect(plan).toMatchObject({ revised: 1, superseded: 0 });
    // zone, hour, mw, quality, source, received, replaced at, replaced by, version
    expect(plan.revisions).toEqual([1, '2026-03-08 09:00:00', 10, 'good', 'feed:a', '2026-03-08 11:59:59.000', '2026-03-08 12:00:00.000', 'feed:b', '500']);
    expect(current.get(key)?.mw).toBe(11);
  });

  it('keeps a lower version out of the store, as a revision only', () => {
    const current = new Map([[key, held(10, 500)]]);
    const plan = planBatch([reading(9, 400)], current, 'feed:b', NOW, clock());
    expect(plan.finals.size).toBe(0);
    expect(plan).toMatchObject({ revised: 0, superseded: 1 });
    expect(plan.revisions.slice(2, 5)).toEqual([9, 'good', 'feed:b']);
    expect(plan.revisions[8]).toBe('400');
    expect(plan.changed.size).toBe(0);
  });

  it('does nothing for a resend of the stored version', () => {
    const plan = planBatch([reading(10, 500)], new Map([[key, held(10, 500)]]), 'feed:a', NOW, clock());
    expect(plan).toMatchObject({ revised: 0, superseded: 0, revisions: [] });
    expect(plan.finals.size).toBe(0);
  });

  it('moves the version on without a revision when a later version repeats the value', () => {
    const plan = planBatch([reading(10, 700)], new Map([[key, held(10, 500)]]), 'feed:a', NOW, clock());
    expect(plan.finals.get(key)?.version).toBe(700);
    expect(plan).toMatchObject({ revised: 0, revisions: [] });
    expect(plan.changed.size).toBe(0);
  });

  it('gives a reading without a version one above the stored version, even one ahead of the clock', () => {
    const ahead = NOW * 1000 + 60_000_000;
    const plan = planBatch([reading(12, null)], new Map([[key, held(10, ahead)]]), 'csv:x', NOW, clock());
    expect(plan.finals.get(key)).toMatchObject({ version: ahead + 1, reading: { mw: 12 } });
    expect(plan.revised).toBe(1);
  });

  it('walks a batch in order: the highest version of an hour wins, the rest are revisions', () => {
    const plan = planBatch([reading(1, 300), reading(3, 900), reading(2, 600)], new Map(), 'feed:a', NOW, clock());
    expect(plan.finals.get(key)).toMatchObject({ version: 900, reading: { mw: 3 } });
    expect(plan).toMatchObject({ revised: 1, superseded: 1 });
    expect([...plan.changed.values()].map((r) => r.mw)).toEqual([3]);
  });

  it('orders readings without versions by their place in the batch', () => {
    const plan = planBatch([reading(1, null), reading(2, null)], new Map(), 'csv:x', NOW, clock());
    expect(plan.finals.get(key)).toMatchObject({ version: NOW * 1000 + 1, reading: { mw: 2 } });
  });
});

describe('readingKey (one number per zone and hour)', () => {
  it('tells neighbouring zones and hours apart, up to the last hour of the time window', () => {
    // The window ends with 2100 (shared/src/instant.ts); zone ids are INT keys below 2^31.
    const last = Date.UTC(2100, 11, 31, 23);
    const keys = [readingKey(1, HOUR), readingKey(2, HOUR), readingKey(1, HOUR + 3_600_000), readingKey(2 ** 31 - 1, last), readingKey(2 ** 31 - 2, last), readingKey(1, last)];
    expect(new Set(keys).size).toBe(keys.length);
    for (const key of keys) expect(Number.isSafeInteger(key)).toBe(true);
  });
});
