/**
 * `npm run simulate -- --export DIR --zone CODE --weeks N --seed S [--from DAY]`: one zone's
 * simulated data set as files, in the CSV forms the command line and the desk's uploads read:
 *   load.csv                    timestamp,load_mw                    (every hour, no meter mishaps)
 *   temperature.csv             timestamp,temp_c                     (the zone's weighted stations)
 *   temperature-forecasts.csv   issued_at,timestamp,temp_c           (every vintage issued in the span,
 *                                                                      the zone's weighted stations)
 *   special-days.csv            day,kind                             (the valley's calendar days in the span
 *                                                                      that apply to the zone, local dates)
 * Nothing depends on the wall clock: the same options give byte-identical files.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO_TIME_ZONE, DEMO_ZONES, HOUR_MS, WEEK_HOURS, demoSpecialDays, operatingDayStart } from '@morrowline/shared';
import { FeedGenerator, type Mishaps } from './generator';
import { zoneTemperature } from './weather';

const NO_METER_MISHAPS: Mishaps = { dropout: 0, outage: 0, late: 0, repeat: 0, correction: 0 };

export interface ExportOptions {
  dir: string;
  zone: string;
  weeks: number;
  seed: number;
  /** First local day (YYYY-MM-DD) in the demo time zone. */
  from: string;
}

export interface ExportSummary {
  hours: number;
  vintages: number;
  files: string[];
}

function iso(ms: number): string {
  return new Date(ms).toISOString().replace('.000Z', 'Z');
}

/** Writes the three files; answers what it wrote. */
export function exportDataSet(options: ExportOptions): ExportSummary {
  const demo = DEMO_ZONES.find((z) => z.code === options.zone);
  if (!demo) throw new Error(`--zone: not a demo zone: ${options.zone}`);
  const start = operatingDayStart(options.from, DEMO_TIME_ZONE);
  const hours = options.weeks * WEEK_HOURS;
  const end = start + hours * HOUR_MS;
  const generator = new FeedGenerator([{ code: demo.code, peakMw: demo.peakMw }], start, options.seed, DEMO_TIME_ZONE, NO_METER_MISHAPS);
  const load = ['timestamp,load_mw'];
  const temperature = ['timestamp,temp_c'];
  const forecasts = ['issued_at,timestamp,temp_c'];
  let vintages = 0;
  for (let i = 0; i < hours; i++) {
    const hour = generator.hour;
    const readings = generator.step();
    for (const r of readings) load.push(`${iso(Date.parse(r.hour))},${r.mw}`);
    temperature.push(`${iso(hour)},${generator.lastZoneTemperatures.get(demo.code)!.toFixed(1)}`);
    // Each vintage: the zone's weighted value of its stations' forecasts, hour by hour.
    const byVintage = new Map<string, Map<string, Map<string, number>>>();
    for (const v of generator.takeWeather().forecasts) {
      const hoursOf = byVintage.get(v.issuedAt) ?? byVintage.set(v.issuedAt, new Map()).get(v.issuedAt)!;
      (hoursOf.get(v.hour) ?? hoursOf.set(v.hour, new Map()).get(v.hour)!).set(v.station, v.tempC);
    }
    for (const [issuedAt, hoursOf] of byVintage) {
      vintages++;
      for (const [h, stations] of hoursOf) {
        if (Date.parse(h) >= end) continue;
        forecasts.push(`${iso(Date.parse(issuedAt))},${iso(Date.parse(h))},${zoneTemperature(demo.code, stations).toFixed(1)}`);
      }
    }
  }
  // the calendar of the span, local dates, as the desk's calendar holds it for the zone
  const firstDay = options.from;
  const lastDay = new Date(Date.parse(`${options.from}T00:00:00Z`) + (options.weeks * 7 - 1) * 24 * HOUR_MS).toISOString().slice(0, 10);
  const special = ['day,kind'];
  for (let year = Number(firstDay.slice(0, 4)); year <= Number(lastDay.slice(0, 4)); year++) {
    for (const d of demoSpecialDays(year).sort((x, y) => x.day.localeCompare(y.day))) {
      if (d.day < firstDay || d.day > lastDay) continue;
      if (d.zones.length && !d.zones.includes(demo.code)) continue;
      special.push(`${d.day},${d.kind}`);
    }
  }
  mkdirSync(options.dir, { recursive: true });
  const files = [
    ['load.csv', load],
    ['temperature.csv', temperature],
    ['temperature-forecasts.csv', forecasts],
    ['special-days.csv', special],
  ] as const;
  for (const [name, lines] of files) writeFileSync(join(options.dir, name), `${lines.join('\n')}\n`);
  return { hours, vintages, files: files.map(([name]) => join(options.dir, name)) };
}
