/**
 * Benchmark part (not a test): `npm run bench -- --weather-only [--seeds 1,2,3] [--data DIR]`.
 * The simulator's five demo zones, exported with each seed (`npm run simulate -- --export`,
 * 12 weeks: 8 of history and 4 scored) once starting 2025-11-10 (winter: scored 5 Jan – 1 Feb)
 * and once 2026-05-11 (summer: scored 6 Jul – 2 Aug); rolling day-ahead over the 28 scored days,
 * issued at 10:00 local the day before (gate closure; common practice for day-ahead markets) on the
 * temperature forecast known then, with 8 weeks of history per origin. Printed per zone and
 * season: MAPE of the pipeline with weather, of the same pipeline without weather, their ratio,
 * the 95 % coverage, the perfect-weather MAPE, and the time of the full choice with weather
 * (the days the terms and orders are chosen again, weekly).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { backtest, median, runWeatherPipeline, weatherBacktest } from '@morrowline/engine';
import { cutAt } from '@morrowline/engine';
import { parseLoadCsv } from './csv-series';
import { dayStartsIn, readWeatherInputs } from './weather-inputs';

const ZONES = ['MILLRACE', 'COPPERLINE', 'HARROW', 'QUARRY', 'LANTERN'];
const SEASONS = [
  { name: 'winter', from: '2025-11-10' },
  { name: 'summer', from: '2026-05-11' },
];
const TZ = 'America/Denver';
const ROOT = [join(__dirname, '../../..'), join(__dirname, '../../../..')].find((d) => existsSync(join(d, 'simulators'))) ?? '.';

export function runWeatherBench(seeds: number[], dataDir: string): void {
  console.log('Day-ahead with weather on the simulator: 8 weeks of history, 28 days scored, issued 10:00 local the day before on forecast weather');
  console.log('zone        season  seed  MAPE wx %  MAPE no-wx %  ratio  cov95 wx  perfect-wx %  naive %  choice ms (median/max)  timed ms (block/none)  terms');
  const all: Array<{ w: number; nw: number; cov: number; hours: number }> = [];
  const choiceMs: number[] = [];
  const timed: Array<{ block: number; noBlock: number }> = [];
  for (const season of SEASONS)
    for (const zone of ZONES)
      for (const seed of seeds) {
        const dir = join(dataDir, `${zone}-${season.name}-${seed}`);
        if (!existsSync(join(dir, 'special-days.csv'))) {
          const r = spawnSync('npm', ['run', '-s', 'simulate', '-w', 'simulators', '--', '--export', dir, '--zone', zone, '--weeks', '12', '--seed', String(seed), '--from', season.from], { cwd: ROOT, encoding: 'utf8' });
          if (r.status !== 0) throw new Error(`export failed: ${r.stderr}`);
        }
        const series = parseLoadCsv(readFileSync(join(dir, 'load.csv'), 'utf8'));
        const w = readWeatherInputs({ temperature: join(dir, 'temperature.csv'), 'temperature-forecasts': join(dir, 'temperature-forecasts.csv'), calendar: join(dir, 'special-days.csv'), 'time-zone': TZ }, series, 0)!;
        const dayStarts = dayStartsIn(series, TZ);
        const wx = weatherBacktest(series.values, { days: 28, issueHour: 10, dayStarts, temperature: w.temperature, vintages: w.vintages, calendar: w.calendar });
        const nw = backtest(series.values, { days: 28, issueHour: 10, dayStarts });
        const full = wx.days.filter((_, i) => i % 7 === 0).map((d) => d.fitMs);
        choiceMs.push(...full);
        // the full choice timed on its own (warm, median of 3): 8 weeks before the last scored day's issue time,
        // with the seasonal block as `npm run fit` and the server's refits run it, and without it
        const origin = wx.days[wx.days.length - 1].origin;
        const from = origin - 8 * 168;
        const known = cutAt(w.temperature, w.vintages, from, origin);
        const calendar = { hourOfDay: w.calendar.hourOfDay, holiday: w.calendar.holiday, bridge: w.calendar.bridge, weekday: w.calendar.weekday };
        const slice = (a: ArrayLike<number> | undefined) => Float64Array.from({ length: origin + 38 - from }, (_, i) => (a ? a[from + i] : 0));
        const cal = { hourOfDay: slice(calendar.hourOfDay), holiday: slice(calendar.holiday), bridge: slice(calendar.bridge), weekday: slice(calendar.weekday) };
        const time = (seasonalBlock: boolean) =>
          median(
            [0, 1, 2].map(() => {
              const t = performance.now();
              runWeatherPipeline({ history: series.values.subarray(from, origin), horizon: 38, temperature: known.temperature, vintages: known.vintages, calendar: cal, options: seasonalBlock ? {} : { pipeline: { seasonalBlock: false } } });
              return performance.now() - t;
            }),
          );
        timed.push({ block: time(true), noBlock: time(false) });
        all.push({ w: wx.mape, nw: nw.mape, cov: wx.coverage95, hours: wx.days.reduce((s, d) => s + d.accuracy.n, 0) });
        const terms = [...new Set(wx.days.map((d) => d.model.replace(/^.*?(\+ |, no)/, '$1')))].join(' | ');
        const f = (v: number, d = 2) => (Number.isFinite(v) ? v.toFixed(d) : 'n/a');
        console.log(
          `${zone.padEnd(11)} ${season.name.padEnd(7)} ${String(seed).padStart(4)} ${f(wx.mape).padStart(10)} ${f(nw.mape).padStart(13)} ${f(wx.mape / nw.mape).padStart(6)} ${f(100 * wx.coverage95, 1).padStart(9)} ${f(wx.perfectWeather.mape).padStart(13)} ${f(wx.baseline.mape).padStart(8)} ${`${f(median(full), 0)}/${f(Math.max(...full), 0)}`.padStart(24)} ${`${f(timed[timed.length - 1].block, 0)}/${f(timed[timed.length - 1].noBlock, 0)}`.padStart(22)}  ${terms.slice(0, 90)}`,
        );
      }
  const mean = (f: (x: (typeof all)[number]) => number) => all.reduce((s, x) => s + f(x), 0) / all.length;
  const hours = all.reduce((s, x) => s + x.hours, 0);
  console.log(
    `\nall: mean MAPE with weather ${mean((x) => x.w).toFixed(2)} %, without ${mean((x) => x.nw).toFixed(2)} %, ratio of the means ${(mean((x) => x.w) / mean((x) => x.nw)).toFixed(3)}; 95 % coverage ${((100 * all.reduce((s, x) => s + x.cov * x.hours, 0)) / hours).toFixed(1)} % of ${hours} hours; full choice with weather inside the backtests ${median(choiceMs).toFixed(0)} ms median, ${Math.max(...choiceMs).toFixed(0)} ms max; timed alone (warm, 8 weeks) ${median(timed.map((t) => t.block)).toFixed(0)} ms median, ${Math.max(...timed.map((t) => t.block)).toFixed(0)} ms max with the seasonal block, ${median(timed.map((t) => t.noBlock)).toFixed(0)} / ${Math.max(...timed.map((t) => t.noBlock)).toFixed(0)} ms without (as the server's refits ran until 5 December 2026)\n`,
  );
}
