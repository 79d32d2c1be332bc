import { createConnection } from 'mariadb';

/**
 * Direct access to the browser tests' own MariaDB (`npm test` starts it and passes DB_PORT,
 * DB_NAME, DB_USER and DB_PASSWORD). Only for what no API can make: a forecast run issued on an
 * earlier day, which the server, issuing at the present time, never writes (nor replays, outside
 * the first start's `manage.js demo-replay`).
 */
function connect() {
  return createConnection({
    host: '127.0.0.1',
    port: Number(process.env.DB_PORT ?? 3308),
    database: process.env.DB_NAME ?? 'morrowline_test',
    user: process.env.DB_USER ?? 'morrowline',
    password: process.env.DB_PASSWORD ?? 'morrowline-test',
  });
}

export interface PastForecastRun {
  zone: string;
  issuedAt: Date;
  firstHour: Date;
  mean: number[];
  /** issued (default) or replayed: worked out afterwards as of issuedAt. */
  origin?: 'issued' | 'replayed';
}

/** Stores a model forecast run as if it had been issued at `issuedAt` (bands ±3 % and ±5 %). */
export async function insertPastForecastRun(run: PastForecastRun): Promise<void> {
  const db = await connect();
  try {
    const [zone] = (await db.query('select id from zones where code = ?', [run.zone])) as { id: number }[];
    if (!zone) throw new Error(`no zone ${run.zone} in the test database`);
    const band = (f: number) => JSON.stringify(run.mean.map((v) => Math.round(v * f * 1000) / 1000));
    await db.query(
      'insert into forecast_runs (zone_id, issued_at, origin, based_on_hour, method, fallback_reason, model_version_id, first_hour, mean, lower80, upper80, lower95, upper95) values (?, ?, ?, ?, ?, null, null, ?, ?, ?, ?, ?, ?)',
      [zone.id, run.issuedAt, run.origin ?? 'issued', new Date(run.firstHour.getTime() - 3_600_000), 'arima', run.firstHour, JSON.stringify(run.mean), band(0.97), band(1.03), band(0.95), band(1.05)],
    );
  } finally {
    await db.end();
  }
}

export interface PastPublishedSchedule {
  zone: string;
  /** yyyy-MM-dd in the zone's time zone. */
  operatingDay: string;
  /** The day's hours as a schedule lays them out, each with the MW published for it (null for none). */
  hours: { index: number; intervalStartUtc: string; hourEnding: string; mw: number | null }[];
  publishedAt: Date;
  /** E-mail of the supervisor who published it. */
  publishedBy: string;
}

/**
 * Stores revision 1 of a zone's schedule as published at `publishedAt` (before the day's gate
 * closure, so a day already under way can have one; the API publishes only at the present time).
 */
export async function insertPublishedSchedule(schedule: PastPublishedSchedule): Promise<void> {
  const db = await connect();
  try {
    const [zone] = (await db.query('select id from zones where code = ?', [schedule.zone])) as { id: number }[];
    const [user] = (await db.query('select id from users where email = ?', [schedule.publishedBy])) as { id: number }[];
    if (!zone || !user) throw new Error(`no zone ${schedule.zone} or user ${schedule.publishedBy} in the test database`);
    const hours = schedule.hours.map((h) => ({ index: h.index, intervalStartUtc: h.intervalStartUtc, hourEnding: h.hourEnding, modelMw: null, lower80: null, upper80: null, lower95: null, upper95: null, startMw: h.mw, adjustedMw: h.mw }));
    await db.query(
      "insert into schedule_revisions (zone_id, operating_day, revision, state, working_key, published_key, hours, created_by_id, created_at, submitted_by_id, submitted_at, published_by_id, published_at) values (?, ?, 1, 'published', null, ?, ?, ?, ?, ?, ?, ?, ?)",
      [zone.id, schedule.operatingDay, `${zone.id}:${schedule.operatingDay}`, JSON.stringify(hours), user.id, schedule.publishedAt, user.id, schedule.publishedAt, user.id, schedule.publishedAt],
    );
  } finally {
    await db.end();
  }
}
