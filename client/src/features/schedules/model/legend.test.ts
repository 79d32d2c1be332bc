import type { ZoneScheduleDto } from '@morrowline/shared';
import { describe, expect, it } from 'vitest';
import { adjustedLegend } from './legend';

const rev = {} as NonNullable<ZoneScheduleDto['working']>;
const none = { working: null, published: null };
const drafted = { working: rev, published: null };
const published = { working: null, published: rev };
const correcting = { working: rev, published: rev };

describe('the schedule chart legend', () => {
  it('never calls the line "published" when nothing is', () => {
    expect(adjustedLegend([none, none])).toBe('Schedule: the model forecast (nothing drafted yet)');
    expect(adjustedLegend([])).toBe('Schedule: the model forecast (nothing drafted yet)');
    expect(adjustedLegend([drafted, correcting])).toBe('Adjusted (not yet published)');
    expect(adjustedLegend([published, published])).toBe('Published schedule');
    expect(adjustedLegend([published, none])).toBe('Schedule as it stands per zone (drafted, published or the model forecast)');
  });
});
