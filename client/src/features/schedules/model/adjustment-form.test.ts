import { describe, expect, it } from 'vitest';
import { ADJUSTMENT_FORM_MESSAGES as M, describeAdjustment, formToAdjustmentRequest, initialAdjustmentForm, validateAdjustmentForm, type AdjustmentFormValues } from './adjustment-form';

const valid: AdjustmentFormValues = { zones: ['MILLRACE'], kind: 'add', value: 25, fromHour: '16', toHour: '19', reason: 'Harvest festival in the old town' };

describe('adjustment form', () => {
  it('accepts a complete adjustment and sends numbers and a trimmed reason', () => {
    expect(validateAdjustmentForm(valid)).toEqual({});
    expect(formToAdjustmentRequest({ ...valid, reason: '  Festival  ' })).toEqual({ zones: ['MILLRACE'], kind: 'add', fromHour: 16, toHour: 19, value: 25, reason: 'Festival' });
  });

  it('starts over the whole day with no value and no reason, and refuses it as it is', () => {
    const start = initialAdjustmentForm(['HARROW'], 25);
    expect(start.toHour).toBe('24');
    expect(validateAdjustmentForm(start)).toEqual({ value: M.value, reason: M.reason });
  });

  it('requires a reason that is more than spaces', () => {
    expect(validateAdjustmentForm({ ...valid, reason: '   ' })).toEqual({ reason: M.reason });
  });

  it('requires at least one zone', () => {
    expect(validateAdjustmentForm({ ...valid, zones: [] })).toEqual({ zones: M.zones });
  });

  it('refuses a range whose last hour comes before its first', () => {
    expect(validateAdjustmentForm({ ...valid, fromHour: '19', toHour: '16' })).toEqual({ toHour: M.order });
    expect(validateAdjustmentForm({ ...valid, fromHour: '', toHour: '3' })).toEqual({ fromHour: M.fromHour });
  });

  it('knows each kind: no negative set value, no zero change, no scale to nothing', () => {
    expect(validateAdjustmentForm({ ...valid, kind: 'set', value: -1 })).toEqual({ value: M.setNegative });
    expect(validateAdjustmentForm({ ...valid, kind: 'set', value: 0 })).toEqual({});
    expect(validateAdjustmentForm({ ...valid, kind: 'add', value: 0 })).toEqual({ value: M.zero });
    expect(validateAdjustmentForm({ ...valid, kind: 'add', value: -40 })).toEqual({});
    expect(validateAdjustmentForm({ ...valid, kind: 'scale', value: -100 })).toEqual({ value: M.scaleFloor });
    expect(validateAdjustmentForm({ ...valid, kind: 'scale', value: -25 })).toEqual({});
    expect(validateAdjustmentForm({ ...valid, value: 'abc' })).toEqual({ value: M.value });
  });

  it('describes adjustments in words', () => {
    expect(describeAdjustment('add', 25)).toBe('Add 25 MW');
    expect(describeAdjustment('add', -12.5)).toBe('Take off 12.5 MW');
    expect(describeAdjustment('set', 180)).toBe('Set to 180 MW');
    expect(describeAdjustment('scale', -5)).toBe('Scale by −5 %');
    expect(describeAdjustment('scale', 10)).toBe('Scale by +10 %');
  });
});
