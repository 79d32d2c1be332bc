import { validateForecast, validateObservation, type WeatherContext } from './weather-validation';

const now = Date.parse('2026-11-02T12:20:00Z');
const context: WeatherContext = { stations: new Map([['VALLEYFLOOR', { id: 7, code: 'VALLEYFLOOR' }]]), now };

describe('weather values at the edge', () => {
  it('accepts an observation for an hour that has begun, in °C', () => {
    expect(validateObservation({ station: 'VALLEYFLOOR', hour: '2026-11-02T05:00:00-07:00', tempC: -3.5 }, context)).toEqual({
      ok: true,
      value: { stationId: 7, station: 'VALLEYFLOOR', hourStart: Date.parse('2026-11-02T12:00:00Z'), tempC: -3.5 },
    });
  });

  it.each([
    [{ station: 'NOWHERE', hour: '2026-11-02T10:00:00Z', tempC: 1 }, 'unknown-station'],
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T10:00:00', tempC: 1 }, 'malformed'],
    [{ station: 'VALLEYFLOOR', hour: '2026-02-30T10:00:00Z', tempC: 1 }, 'malformed'],
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T10:30:00Z', tempC: 1 }, 'not-on-the-hour'],
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T10:00:00Z', tempC: '1' }, 'not-a-number'],
    // 75 reads as °F, 280 as kelvin: refused, never converted.
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T10:00:00Z', tempC: 75 }, 'implausible'],
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T10:00:00Z', tempC: 280 }, 'implausible'],
    [{ station: 'VALLEYFLOOR', hour: '2026-11-02T15:00:00Z', tempC: 1 }, 'too-far-in-future'],
    ['12', 'malformed'],
  ])('refuses %j as %s', (raw, reason) => {
    expect(validateObservation(raw, context)).toMatchObject({ ok: false, reason });
  });

  it('limits a station-scoped key to its station', () => {
    const scoped = { ...context, allowedStation: 'COPPERBENCH' };
    expect(validateObservation({ station: 'VALLEYFLOOR', hour: '2026-11-02T10:00:00Z', tempC: 1 }, scoped)).toMatchObject({ ok: false, reason: 'station-not-allowed' });
  });

  it('accepts a forecast value within 16 days of its issue time, with or without a member', () => {
    const value = { station: 'VALLEYFLOOR', issuedAt: '2026-11-02T04:30:00Z', hour: '2026-11-09T04:00:00Z', tempC: 2 };
    expect(validateForecast(value, context)).toMatchObject({ ok: true, value: { issuedAt: Date.parse('2026-11-02T04:30:00Z'), member: '' } });
    expect(validateForecast({ ...value, member: 'p90' }, context)).toMatchObject({ ok: true, value: { member: 'p90' } });
  });

  it.each([
    [{ issuedAt: '2026-11-02T14:30:00Z' }, 'too-far-in-future'],
    [{ hour: '2026-11-20T00:00:00Z' }, 'too-far-in-future'],
    [{ hour: '2026-10-31T00:00:00Z' }, 'malformed'],
    [{ member: 'member seven' }, 'malformed'],
    [{ issuedAt: '2026-11-02 04:30' }, 'malformed'],
  ])('refuses a forecast value with %j as %s', (change, reason) => {
    const value = { station: 'VALLEYFLOOR', issuedAt: '2026-11-02T04:30:00Z', hour: '2026-11-03T04:00:00Z', tempC: 2, ...change };
    expect(validateForecast(value, context)).toMatchObject({ ok: false, reason });
  });
});
