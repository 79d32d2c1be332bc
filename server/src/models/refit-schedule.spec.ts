import { cronExpressions, loadRefitSchedule } from './refit-schedule';

describe('refit schedule configuration', () => {
  it('defaults to 01:30 nightly and minute 5, on outside tests', () => {
    const s = loadRefitSchedule({ NODE_ENV: 'production' });
    expect(s).toEqual({ enabled: true, nightly: { hour: 1, minute: 30, second: 0 }, updateMinute: 5 });
    expect(cronExpressions(s)).toEqual({ nightly: '0 30 1 * * *', update: '0 5 * * * *' });
  });

  it('is off under tests unless asked for, and reads the times given', () => {
    expect(loadRefitSchedule({ NODE_ENV: 'test' }).enabled).toBe(false);
    const s = loadRefitSchedule({ NODE_ENV: 'test', REFIT_SCHEDULE: 'on', REFIT_NIGHTLY_AT: '23:05', FORECAST_UPDATE_MINUTE: '0' });
    expect(s).toEqual({ enabled: true, nightly: { hour: 23, minute: 5, second: 0 }, updateMinute: 0 });
  });

  it('takes seconds too (the cluster test sets a nightly run a minute ahead)', () => {
    const s = loadRefitSchedule({ REFIT_NIGHTLY_AT: '07:04:45' });
    expect(cronExpressions(s).nightly).toBe('45 4 7 * * *');
  });

  it('refuses times that are not times', () => {
    expect(() => loadRefitSchedule({ REFIT_NIGHTLY_AT: '07:04:60' })).toThrow(/REFIT_NIGHTLY_AT/);
    expect(() => loadRefitSchedule({ REFIT_NIGHTLY_AT: '1:30' })).toThrow(/REFIT_NIGHTLY_AT/);
    expect(() => loadRefitSchedule({ FORECAST_UPDATE_MINUTE: '60' })).toThrow(/FORECAST_UPDATE_MINUTE/);
    expect(() => loadRefitSchedule({ REFIT_SCHEDULE: 'yes' })).toThrow(/REFIT_SCHEDULE/);
  });
});
