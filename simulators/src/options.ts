import { parseArgs } from 'node:util';
import { DEMO_ZONES, parseDay } from '@morrowline/shared';

export interface SimOptions {
  url: string;
  key: string | undefined;
  backfillWeeks: number;
  speed: number;
  lagHours: number;
  seed: number;
  zones: string[];
  once: boolean;
  batch: number;
  quiet: boolean;
  help: boolean;
  /** --export DIR: write one zone's data set to files instead of sending (see export.ts). */
  export: { dir: string; zone: string; weeks: number; from: string } | null;
}

export const HELP = `Morrowline meter-feed simulator: hourly load for the Tallowmere Valley Electric
Cooperative's zones, sent over the feed socket with a feed API key.

It backfills history first (fast, in batches), then runs live: a reading for each zone when its
hour ends. Time can run faster for demos; it never runs past the wall clock, so with a speed-up
the live part starts --lag-hours in the past and slows to real time once it has caught up.
Load follows each zone's daily and weekly cycle, a synthetic temperature path and the valley's
holidays, with noise, meter dropouts (missing hours), occasional outages (dips), and late,
repeated and corrected sends. The same --seed gives the same readings.

Usage: npm run simulate -- [options]

  --url URL             server address (default http://127.0.0.1:3000)
  --key KEY             feed API key (default: environment MORROWLINE_FEED_KEY)
  --backfill-weeks N    weeks of history to send first (default 4; 0 for none)
  --speed S             simulated seconds per real second (default 1 = real time;
                        3600 = one simulated hour per second)
  --lag-hours H         hours before now where the live part starts (default 0 at real time,
                        48 with a speed-up)
  --seed N              random seed (default 1)
  --zones A,B           zone codes (default every demo zone: ${DEMO_ZONES.map((z) => z.code).join(',')})
  --batch N             readings per batch during the backfill (default 1000)
  --once                send the backfill (and the live part up to now), then exit
  --quiet               leave out the hour-by-hour lines (the backfill's progress and end are still printed)

Weather: observed temperature of each demo station every hour, and temperature forecasts
issued at 04:30 and 16:30 UTC for the next 168 hours, with errors that grow with lead time
(mean absolute error about 1.0 °C over the first day ahead, 1.4 over the second, 3.5 over
the seventh), sometimes late (5 %) or missed (3 %). The zones' load answers their stations' weighted temperature.

Writing a data set instead of sending:
  --export DIR          write load.csv, temperature.csv and temperature-forecasts.csv for one
                        zone to DIR (the same options always give byte-identical files)
  --zone CODE           the zone (with --export)
  --weeks N             weeks of data (with --export; default 8)
  --from DAY            first local day, YYYY-MM-DD (with --export; default 2026-01-05)
  -h, --help            this text
`;

function number(name: string, raw: string | undefined, fallback: number, min: number): number {
  if (raw === undefined) return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value < min) throw new Error(`--${name} must be a number of at least ${min}, got "${raw}"`);
  return value;
}

export function parseOptions(argv: string[], env: NodeJS.ProcessEnv = process.env): SimOptions {
  const { values } = parseArgs({
    args: argv,
    options: {
      url: { type: 'string' },
      key: { type: 'string' },
      'backfill-weeks': { type: 'string' },
      speed: { type: 'string' },
      'lag-hours': { type: 'string' },
      seed: { type: 'string' },
      zones: { type: 'string' },
      batch: { type: 'string' },
      once: { type: 'boolean', default: false },
      quiet: { type: 'boolean', default: false },
      help: { type: 'boolean', short: 'h', default: false },
      export: { type: 'string' },
      zone: { type: 'string' },
      weeks: { type: 'string' },
      from: { type: 'string' },
    },
    strict: true,
    allowPositionals: false,
  });
  const speed = number('speed', values.speed, 1, 1);
  const known = new Set(DEMO_ZONES.map((z) => z.code));
  const zones = values.zones ? values.zones.split(',').map((z) => z.trim().toUpperCase()).filter(Boolean) : [...known];
  const unknown = zones.filter((z) => !known.has(z));
  if (unknown.length > 0) throw new Error(`--zones: not a demo zone: ${unknown.join(', ')} (known: ${[...known].join(', ')})`);
  let exportOptions: SimOptions['export'] = null;
  if (values.export !== undefined) {
    const zone = (values.zone ?? '').trim().toUpperCase();
    if (!known.has(zone)) throw new Error(`--export needs --zone with a demo zone (known: ${[...known].join(', ')})`);
    const from = values.from ?? '2026-01-05';
    if (!parseDay(from).ok) throw new Error(`--from: ${(parseDay(from) as { message: string }).message}`);
    exportOptions = { dir: values.export, zone, weeks: Math.floor(number('weeks', values.weeks, 8, 1)), from };
  } else if (values.zone !== undefined || values.weeks !== undefined || values.from !== undefined) {
    throw new Error('--zone, --weeks and --from go with --export');
  }
  return {
    export: exportOptions,
    url: values.url ?? 'http://127.0.0.1:3000',
    key: values.key ?? env.MORROWLINE_FEED_KEY,
    backfillWeeks: number('backfill-weeks', values['backfill-weeks'], 4, 0),
    speed,
    lagHours: Math.floor(number('lag-hours', values['lag-hours'], speed > 1 ? 48 : 0, 0)),
    seed: Math.floor(number('seed', values.seed, 1, 0)),
    zones,
    once: values.once ?? false,
    batch: Math.floor(number('batch', values.batch, 1000, 1)),
    quiet: values.quiet ?? false,
    help: values.help ?? false,
  };
}
