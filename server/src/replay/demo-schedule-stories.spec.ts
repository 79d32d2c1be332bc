import { DEMO_USERS, DEMO_ZONES } from '@morrowline/shared';
import { adjustmentValue, DEMO_SCHEDULE_STORIES } from './demo-schedule-stories';

describe('the demo scenario’s schedules', () => {
  it('are made by demo operators and approved by another demo user who is a supervisor, in demo zones', () => {
    const role = (email: string) => DEMO_USERS.find((u) => u.email === email)?.role;
    for (const story of DEMO_SCHEDULE_STORIES) {
      expect(DEMO_ZONES.map((z) => z.code)).toContain(story.zone);
      expect(role(story.operator)).toBe('operator');
      expect(role(story.approver)).toBe('supervisor');
      expect(story.daysAgo).toBeGreaterThanOrEqual(1);
    }
    expect(new Set(DEMO_SCHEDULE_STORIES.map((s) => s.zone)).size).toBeGreaterThanOrEqual(3);
  });

  it('publish every demo zone on each of the last three days (so the system total compares too), one schedule each', () => {
    for (const daysAgo of [1, 2, 3]) {
      const zones = DEMO_SCHEDULE_STORIES.filter((s) => s.daysAgo === daysAgo).map((s) => s.zone);
      expect([...zones].sort()).toEqual(DEMO_ZONES.map((z) => z.code).sort());
    }
    expect(DEMO_SCHEDULE_STORIES).toHaveLength(15);
    // adjusted on some days, with fixed and with weather-led changes
    const adjusted = DEMO_SCHEDULE_STORIES.filter((s) => s.adjustments.length > 0);
    expect(adjusted.length).toBeGreaterThanOrEqual(4);
    expect(adjusted.some((s) => s.adjustments.some((a) => 'mw' in a.change))).toBe(true);
    expect(adjusted.some((s) => s.adjustments.some((a) => 'toward' in a.change))).toBe(true);
  });

  it('happen in order within the 55 minutes between the 09:05 forecast update and the 10:00 gate closure', () => {
    for (const story of DEMO_SCHEDULE_STORIES) {
      const times = [story.draftMinute, ...story.adjustments.map((a) => a.minute), story.submit.minute, story.approveMinute];
      expect([...times].sort((a, b) => a - b)).toEqual(times);
      expect(story.approveMinute).toBeLessThan(55);
      for (const a of story.adjustments) expect(Number(a.from.slice(2))).toBeLessThanOrEqual(Number(a.to.slice(2)));
    }
  });

  it('give every adjustment a reason that says which way it goes', () => {
    const weather = DEMO_SCHEDULE_STORIES[0].adjustments[0].reason;
    expect(weather(true, 12)).toMatch(/colder/);
    expect(weather(false, 12)).toMatch(/milder/);
    expect(weather(true, 7)).toMatch(/hotter/);
    expect(weather(false, 7)).toMatch(/cooler/);
  });
});

describe('the value of a demo adjustment', () => {
  const model = [100, 200, null, 150];
  const actual = [110, 190, 300, null];

  it('keeps a fixed change as it is', () => {
    expect(adjustmentValue({ kind: 'add', mw: -32 }, model, actual)).toEqual({ kind: 'add', value: -32 });
  });

  it('moves part of the way to what the load did, on the hours that have both', () => {
    // gaps +10 and −10 MW: mean 0, never a zero change
    expect(adjustmentValue({ kind: 'add', toward: 0.8 }, model, actual)).toEqual({ kind: 'add', value: 1 });
    // gaps +30 and +10 MW: mean 20, 80 % of it
    expect(adjustmentValue({ kind: 'add', toward: 0.8 }, [100, 200], [130, 210])).toEqual({ kind: 'add', value: 16 });
    // +10 % and +5 %: mean 7.5 %, 70 % of it = 5.25 → 5.3 %
    expect(adjustmentValue({ kind: 'scale', toward: 0.7 }, [100, 200], [110, 210])).toEqual({ kind: 'scale', value: 5.3 });
    expect(adjustmentValue({ kind: 'scale', toward: 0.7 }, [100, 200], [90, 180])).toEqual({ kind: 'scale', value: -7 });
  });

  it('has none when no hour has both a model value and an actual', () => {
    expect(adjustmentValue({ kind: 'add', toward: 0.8 }, [null, 100], [100, null])).toBeNull();
  });
});
