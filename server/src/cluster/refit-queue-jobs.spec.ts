import { deduplicationIdFor, jobIdFor, jobNameFor, priorityFor, queuedRefitFrom } from './refit-queue-jobs';

describe('refit queue jobs', () => {
  it('names one de-duplication id per zone and purpose', () => {
    expect(deduplicationIdFor(7, 'full')).toBe('zone-7-refit');
    expect(deduplicationIdFor(7, 'update')).toBe('zone-7-forecast-update');
    expect(deduplicationIdFor(7, 'full')).not.toBe(deduplicationIdFor(8, 'full'));
  });

  it('gives job ids BullMQ accepts: no ":" and not a whole number', () => {
    const id = jobIdFor(42);
    expect(id).not.toContain(':');
    expect(Number.isNaN(Number(id))).toBe(true);
    expect(jobNameFor('full')).toBe('refit');
    expect(jobNameFor('update')).toBe('forecast-update');
  });

  it('puts an operator request ahead of scheduled work', () => {
    const base = { refitJobId: 1, zoneId: 1, mode: 'full' as const };
    expect(priorityFor({ ...base, trigger: 'operator' })).toBeLessThan(priorityFor({ ...base, trigger: 'schedule' }));
  });

  it('refuses job data that names no stored job', () => {
    expect(queuedRefitFrom({ refitJobId: 3, zoneId: 2 })).toEqual({ refitJobId: 3, zoneId: 2 });
    expect(() => queuedRefitFrom({ refitJobId: '3', zoneId: 2 })).toThrow(/not a refit job/);
    expect(() => queuedRefitFrom({ refitJobId: 0, zoneId: 2 })).toThrow(/not a refit job/);
    expect(() => queuedRefitFrom(null)).toThrow(/not a refit job/);
  });
});
