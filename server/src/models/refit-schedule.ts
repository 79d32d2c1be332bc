/**
 * When the scheduled refits run, from the environment (documented in the README):
 *   REFIT_NIGHTLY_AT        "HH:mm" (or "HH:mm:ss") desk time of the nightly full refit (default 01:30)
 *   FORECAST_UPDATE_MINUTE  minute past each hour of the forecast update (default 5)
 *   REFIT_SCHEDULE          "on" or "off" (default on; off under NODE_ENV=test)
 */
export interface RefitSchedule {
  enabled: boolean;
  nightly: { hour: number; minute: number; second: number };
  updateMinute: number;
}

export function loadRefitSchedule(env: NodeJS.ProcessEnv = process.env): RefitSchedule {
  const at = env.REFIT_NIGHTLY_AT || '01:30';
  const m = /^([01]\d|2[0-3]):([0-5]\d)(?::([0-5]\d))?$/.exec(at);
  if (!m) throw new Error(`Configuration: REFIT_NIGHTLY_AT must be a time HH:mm or HH:mm:ss, got "${at}"`);
  const rawMinute = env.FORECAST_UPDATE_MINUTE ?? '';
  const updateMinute = rawMinute === '' ? 5 : Number(rawMinute);
  if (!Number.isInteger(updateMinute) || updateMinute < 0 || updateMinute > 59) {
    throw new Error(`Configuration: FORECAST_UPDATE_MINUTE must be a whole minute 0–59, got "${rawMinute}"`);
  }
  const flag = env.REFIT_SCHEDULE ?? (env.NODE_ENV === 'test' ? 'off' : 'on');
  if (flag !== 'on' && flag !== 'off') throw new Error(`Configuration: REFIT_SCHEDULE must be on or off, got "${flag}"`);
  return { enabled: flag === 'on', nightly: { hour: Number(m[1]), minute: Number(m[2]), second: Number(m[3] ?? 0) }, updateMinute };
}

/** Cron expressions (seconds first, as the cron package reads them). */
export function cronExpressions(s: RefitSchedule): { nightly: string; update: string } {
  return { nightly: `${s.nightly.second} ${s.nightly.minute} ${s.nightly.hour} * * *`, update: `0 ${s.updateMinute} * * * *` };
}
