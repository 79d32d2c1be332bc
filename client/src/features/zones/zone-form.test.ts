import { describe, expect, it } from 'vitest';
import { EMPTY_ZONE_FORM, formToUpdateRequest, validateZoneForm, type ZoneFormValues } from './zone-form';

const TIME_ZONES = ['America/Denver', 'Europe/Oslo'];
const valid: ZoneFormValues = { ...EMPTY_ZONE_FORM, code: 'MILLRACE', name: 'Millrace', timeZone: 'America/Denver' };

describe('zone form rules', () => {
  it('accepts a complete zone', () => {
    expect(validateZoneForm(valid, TIME_ZONES, true)).toEqual({});
  });

  it('names each field that is wrong', () => {
    const errors = validateZoneForm(
      {
        ...valid,
        code: '9lives',
        timeZone: 'Mountain Time',
        alertThresholdPct: 0,
        alertConsecutiveHours: 1.5,
        gateClosure: '24:00',
        minPlausibleMw: 300,
        maxPlausibleMw: 200,
      },
      TIME_ZONES,
      true,
    );
    expect(Object.keys(errors).sort()).toEqual(
      ['alertConsecutiveHours', 'alertThresholdPct', 'code', 'gateClosure', 'maxPlausibleMw', 'timeZone'].sort(),
    );
  });

  it('does not check the code when editing, since it cannot change', () => {
    expect(validateZoneForm({ ...valid, code: '' }, TIME_ZONES, false)).toEqual({});
  });

  it('sends no code in an update, and the reason only when given', () => {
    const update = formToUpdateRequest({ ...valid, reason: '  ' });
    expect(update).not.toHaveProperty('code');
    expect(update).not.toHaveProperty('reason');
    expect(formToUpdateRequest({ ...valid, reason: 'New substation' }).reason).toBe('New substation');
  });

  it('refuses a name another zone already has, in any case, but not the zone’s own', () => {
    const others = [{ code: 'MILLRACE', name: 'Millrace' }];
    expect(validateZoneForm({ ...valid, name: ' millrace ' }, TIME_ZONES, true, others).name).toBe('Zone MILLRACE is already called "Millrace"; choose another name');
    expect(validateZoneForm({ ...valid, name: 'Millrace Flats' }, TIME_ZONES, true, others)).toEqual({});
  });
});
