import { IANAZone } from 'luxon';
import { DEFAULT_FORECAST_STALE_HOURS } from '@morrowline/shared';

/**
 * Configuration, read from the environment once at start-up and validated. Every variable has a
 * safe default for development; outside development a secret that is still its default value is
 * refused, so a forgotten setting cannot reach a control room.
 */
export const DEFAULT_JWT_SECRET = 'morrowline-development-secret-do-not-use';

export interface AppConfig {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  /** Origins allowed by CORS; empty means closed (the client is served from the same origin). */
  corsOrigins: string[];
  /** Folder of the built client, served at /. */
  clientDist: string;
  db: { host: string; port: number; name: string; user: string; password: string; debug: boolean };
  jwt: { secret: string; expiresInSeconds: number };
  /** Sign-in attempts allowed per minute before 429: for one e-mail from one address, and for one e-mail from anywhere. */
  loginAttemptsPerMinute: number;
  /** Sign-in attempts allowed per minute from one address, whatever the e-mail (a control room signs in behind one address). */
  loginAttemptsPerAddressPerMinute: number;
  /** Password checks (argon2id) run at once, and how many more may wait, before sign-in answers 503. */
  passwordChecks: { concurrency: number; queue: number };
  /**
   * Express's "trust proxy": which proxies' X-Forwarded-For is believed for the client address.
   * false (the default) believes none; a number is a count of proxy hops; otherwise addresses,
   * subnets or the names loopback, linklocal, uniquelocal, comma-separated.
   */
  trustProxy: false | number | string;
  /** The shift pattern: local start times in the desk's time zone. */
  shifts: { starts: string[]; timeZone: string };
  /** WEATHER_FORECAST_STALE_HOURS: a station with no temperature forecast issued for longer is flagged stale. */
  weather: { forecastStaleHours: number };
}

function int(env: NodeJS.ProcessEnv, key: string, fallback: number): number {
  const raw = env[key];
  if (raw === undefined || raw === '') return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 0) {
    throw new Error(`Configuration: ${key} must be a non-negative whole number, got "${raw}"`);
  }
  return value;
}

/** TRUST_PROXY: unset or "false" trusts no proxy; "true" (every proxy) is refused: name them. */
export function parseTrustProxy(raw: string | undefined): false | number | string {
  const value = (raw ?? '').trim();
  if (value === '' || value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  if (value === 'true') throw new Error('Configuration: TRUST_PROXY=true would believe any X-Forwarded-For; give the proxies\' addresses or a hop count');
  const parts = value.split(',').map((s) => s.trim());
  for (const part of parts) {
    if (!/^(loopback|linklocal|uniquelocal|[0-9a-fA-F.:]+(\/\d{1,3})?)$/.test(part)) {
      throw new Error(`Configuration: TRUST_PROXY has "${part}", which is not an address, subnet, loopback, linklocal or uniquelocal`);
    }
  }
  return parts.join(',');
}

function timeZone(env: NodeJS.ProcessEnv, key: string, fallback: string): string {
  const value = env[key] ?? fallback;
  if (!IANAZone.isValidZone(value)) throw new Error(`Configuration: ${key} must be an IANA time zone, got "${value}"`);
  return value;
}

/** The shift pattern's local start times ("06:00,14:00,22:00"), sorted. */
export function parseShiftStarts(raw: string): string[] {
  const starts = raw.split(',').map((s) => s.trim()).filter(Boolean);
  if (starts.length === 0) throw new Error('Configuration: SHIFT_STARTS needs at least one HH:mm time');
  for (const start of starts) {
    if (!/^([01]\d|2[0-3]):[0-5]\d$/.test(start)) throw new Error(`Configuration: SHIFT_STARTS has "${start}", which is not HH:mm`);
  }
  const sorted = [...starts].sort();
  if (new Set(sorted).size !== sorted.length) throw new Error('Configuration: SHIFT_STARTS repeats a time');
  return sorted;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const nodeEnv = env.NODE_ENV ?? 'development';
  if (!['development', 'test', 'production'].includes(nodeEnv)) {
    throw new Error(`Configuration: NODE_ENV must be development, test or production, got "${nodeEnv}"`);
  }
  const secret = env.JWT_SECRET ?? DEFAULT_JWT_SECRET;
  if (nodeEnv === 'production' && secret === DEFAULT_JWT_SECRET) {
    throw new Error('Configuration: JWT_SECRET is still the development default; set a secret of your own');
  }
  if (nodeEnv === 'production' && secret.length < 32) {
    throw new Error('Configuration: JWT_SECRET must be at least 32 characters in production');
  }
  return {
    env: nodeEnv as AppConfig['env'],
    host: env.HOST ?? '127.0.0.1',
    port: int(env, 'PORT', 3000),
    corsOrigins: (env.CORS_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean),
    clientDist: env.CLIENT_DIST ?? `${__dirname}/../../../client/dist`,
    db: {
      host: env.DB_HOST ?? '127.0.0.1',
      port: int(env, 'DB_PORT', 3307),
      name: env.DB_NAME ?? 'morrowline',
      user: env.DB_USER ?? 'morrowline',
      password: env.DB_PASSWORD ?? 'morrowline-local',
      debug: env.DB_DEBUG === 'true',
    },
    jwt: { secret, expiresInSeconds: int(env, 'JWT_EXPIRES_IN', 8 * 3600) },
    loginAttemptsPerMinute: int(env, 'LOGIN_ATTEMPTS_PER_MINUTE', 10),
    loginAttemptsPerAddressPerMinute: int(env, 'LOGIN_ATTEMPTS_PER_ADDRESS_PER_MINUTE', 60),
    passwordChecks: { concurrency: Math.max(1, int(env, 'PASSWORD_CHECK_CONCURRENCY', 2)), queue: int(env, 'PASSWORD_CHECK_QUEUE', 8) },
    trustProxy: parseTrustProxy(env.TRUST_PROXY),
    shifts: { starts: parseShiftStarts(env.SHIFT_STARTS ?? '06:00,14:00,22:00'), timeZone: timeZone(env, 'DESK_TIME_ZONE', 'America/Denver') },
    weather: { forecastStaleHours: Math.max(1, int(env, 'WEATHER_FORECAST_STALE_HOURS', DEFAULT_FORECAST_STALE_HOURS)) },
  };
}

/** For @nestjs/config: `ConfigModule.forRoot({ load: [configFactory] })`, read as `config.get('app')`. */
export const configFactory = () => ({ app: loadConfig() });
