import { replayAdjustments, type ScheduleAdjustmentInput } from '@morrowline/shared';

const model = [100, 110, 120, 130, 140];
const values = (adjustments: ScheduleAdjustmentInput[], start: (number | null)[] = model) => {
  const result = replayAdjustments(start, adjustments);
  if (!result.ok) throw new Error(result.message);
  return result.values;
};

describe('schedule adjustments', () => {
  it('set gives the hours in the range the value, and only those', () => {
    expect(values([{ kind: 'set', fromHour: 1, toHour: 3, value: 90 }])).toEqual([100, 90, 90, 90, 140]);
  });

  it('add adds MW over the range, negative takes off', () => {
    expect(values([{ kind: 'add', fromHour: 0, toHour: 1, value: 12.5 }])).toEqual([112.5, 122.5, 120, 130, 140]);
    expect(values([{ kind: 'add', fromHour: 4, toHour: 4, value: -40 }])).toEqual([100, 110, 120, 130, 100]);
  });

  it('scale changes by a percentage (+10 is x1.10), kept to 0.1 MW', () => {
    expect(values([{ kind: 'scale', fromHour: 2, toHour: 4, value: 10 }])).toEqual([100, 110, 132, 143, 154]);
    expect(values([{ kind: 'scale', fromHour: 0, toHour: 0, value: -33.33 }])).toEqual([66.7, 110, 120, 130, 140]);
  });

  it('applies adjustments in the order made (set then add differs from add then set)', () => {
    const set = { kind: 'set', fromHour: 0, toHour: 1, value: 200 } as const;
    const add = { kind: 'add', fromHour: 0, toHour: 0, value: 10 } as const;
    expect(values([set, add]).slice(0, 2)).toEqual([210, 200]);
    expect(values([add, set]).slice(0, 2)).toEqual([200, 200]);
  });

  it('undo is replaying without the undone adjustment, from the start values', () => {
    const a = { kind: 'add', fromHour: 0, toHour: 4, value: 10 } as const;
    const b = { kind: 'scale', fromHour: 0, toHour: 4, value: 50 } as const;
    expect(values([a, b])[0]).toBe(165);
    expect(values([b])[0]).toBe(150);
    expect(values([])).toEqual(model);
  });

  it('refuses anything that would go below 0 MW, naming the hour', () => {
    const result = replayAdjustments(model, [{ kind: 'add', fromHour: 3, toHour: 4, value: -135 }], ['HE01', 'HE02', 'HE03', 'HE04', 'HE05']);
    expect(result).toEqual({ ok: false, hour: 3, message: 'HE04 would be -5 MW; a schedule is never below 0 MW' });
    expect(replayAdjustments(model, [{ kind: 'scale', fromHour: 0, toHour: 0, value: -101 }]).ok).toBe(false);
    expect(replayAdjustments(model, [{ kind: 'set', fromHour: 0, toHour: 0, value: -1 }]).ok).toBe(false);
    expect(values([{ kind: 'scale', fromHour: 0, toHour: 0, value: -100 }])[0]).toBe(0);
  });

  it('refuses a range outside the day and add/scale on an hour with no value; set fills it', () => {
    expect(replayAdjustments(model, [{ kind: 'set', fromHour: 3, toHour: 5, value: 1 }]).ok).toBe(false);
    expect(replayAdjustments(model, [{ kind: 'set', fromHour: 3, toHour: 2, value: 1 }]).ok).toBe(false);
    const gap = [100, null, 120];
    expect(replayAdjustments(gap, [{ kind: 'add', fromHour: 0, toHour: 2, value: 5 }])).toMatchObject({ ok: false, hour: 1 });
    expect(values([{ kind: 'set', fromHour: 1, toHour: 1, value: 115 }, { kind: 'add', fromHour: 0, toHour: 2, value: 5 }], gap)).toEqual([105, 120, 125]);
  });

  it('works on the 23- and 25-hour days alike (ranges by position in the day)', () => {
    const spring = Array.from({ length: 23 }, () => 100);
    const autumn = Array.from({ length: 25 }, () => 100);
    expect(values([{ kind: 'add', fromHour: 20, toHour: 22, value: 5 }], spring).slice(20)).toEqual([105, 105, 105]);
    expect(replayAdjustments(spring, [{ kind: 'add', fromHour: 22, toHour: 23, value: 5 }]).ok).toBe(false);
    expect(values([{ kind: 'set', fromHour: 24, toHour: 24, value: 80 }], autumn)[24]).toBe(80);
  });
});
