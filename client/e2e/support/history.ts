import { expect } from 'vitest';
import type { Role } from '@morrowline/shared';
import { BASE_URL, demoUser } from './browser';

/**
 * Readings history for browser tests: the test database has the demo zones but no readings, so
 * a test that needs history makes it here and uploads it through the API as a CSV.
 */
export const HOUR_MS = 3_600_000;

/** The shape of a zone's invented load: a daily swing, lower weekends, AR(1) noise from a seed. */
export interface LoadShape {
  seed: number;
  baseMw: number;
  /** MW added at a local hour of day (0–23). */
  daily: (hour: number) => number;
  /** MW added on Saturdays and Sundays, given that hour's daily swing. */
  weekend: (daily: number) => number;
  /** Standard deviation of the noise's innovations, MW. */
  noiseMw: number;
}

/** Millrace: morning and evening peaks of a residential old town. */
export const MILLRACE_LOAD: LoadShape = {
  seed: 424242,
  baseMw: 170,
  daily: (h) => 30 * Math.exp(-((h - 8) ** 2) / 6) + 45 * Math.exp(-((h - 19) ** 2) / 8) - 18 * Math.exp(-((h - 3) ** 2) / 10),
  weekend: (daily) => -30 - 0.4 * daily,
  noiseMw: 4,
};

/** Quarry Hill: an afternoon pumping peak of a rural zone. */
export const QUARRY_LOAD: LoadShape = {
  seed: 777001,
  baseMw: 95,
  daily: (h) => 25 * Math.exp(-((h - 15) ** 2) / 10) + 12 * Math.exp(-((h - 7) ** 2) / 4) - 10 * Math.exp(-((h - 3) ** 2) / 8),
  weekend: (daily) => -12 - 0.3 * daily,
  noiseMw: 2.5,
};

/** `hours` hourly rows up to the last complete hour, as `timestamp,load_mw` (local time = UTC−7). */
export function historyCsv(hours: number, shape: LoadShape): string {
  const last = Math.floor(Date.now() / HOUR_MS) * HOUR_MS - HOUR_MS;
  let seed = shape.seed;
  const uniform = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) + 1) / (2 ** 31 + 1);
  const gauss = () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  let noise = 0;
  const rows = ['timestamp,load_mw'];
  for (let i = 0; i < hours; i++) {
    const at = last - (hours - 1 - i) * HOUR_MS;
    const local = new Date(at - 7 * HOUR_MS);
    const daily = shape.daily(local.getUTCHours());
    const weekend = local.getUTCDay() === 0 || local.getUTCDay() === 6 ? shape.weekend(daily) : 0;
    noise = 0.7 * noise + shape.noiseMw * gauss();
    rows.push(`${new Date(at).toISOString()},${(shape.baseMw + daily + weekend + noise).toFixed(2)}`);
  }
  return rows.join('\n') + '\n';
}

/** Signs a demo user of `role` in through the API and answers the access token. */
export async function apiToken(role: Role): Promise<string> {
  const user = demoUser(role);
  const login = await fetch(`${BASE_URL}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: user.email, password: user.password }),
  });
  expect(login.status).toBe(200);
  return ((await login.json()) as { accessToken: string }).accessToken;
}

/** Uploads `csv` for `zone` as the holder of `token` and checks that every row was accepted. */
export async function uploadHistory(token: string, zone: string, csv: string, fileName: string): Promise<void> {
  const form = new FormData();
  form.append('file', new Blob([csv], { type: 'text/csv' }), fileName);
  const upload = await fetch(`${BASE_URL}/api/readings/upload?zone=${zone}`, { method: 'POST', headers: { Authorization: `Bearer ${token}` }, body: form });
  expect(upload.status).toBe(201);
  expect(((await upload.json()) as { rejectedCount: number }).rejectedCount).toBe(0);
}
