import { refitZone, type RefitPayload, type RefitResult } from '../models/analysis/refit';
import { TRAINING_HOURS } from '../history/zone-history.loader';
import { ReadingsTimeline, type HourlyReading } from './history-cut';
import { replaySteps, type ReplayRoutine, type ReplayStep } from './replay-timeline';
import { replayZone, type ReplayedForecast } from './zone-replay';

jest.setTimeout(180_000);

const HOUR = 3_600_000;
const TZ = 'America/Denver';
const routine: ReplayRoutine = { updateMinute: 5, nightly: { hour: 1, minute: 30 }, deskTimeZone: TZ };
/** Local midnight of 4 May 2026 (MDT, UTC−6): 32 days of readings from here. */
const START = Date.parse('2026-05-04T06:00:00Z');
const MIN_HOURS = 21 * 24;

/** Hourly load with a daily swing, quieter weekends and AR(1) noise from a fixed seed. */
function readings(days = 32): HourlyReading[] {
  let seed = 12345;
  const uniform = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) + 1) / (2 ** 31 + 1);
  let noise = 0;
  return Array.from({ length: days * 24 }, (_, i) => {
    const t = START + i * HOUR;
    const hour = (i + 24) % 24;
    const weekend = Math.floor(i / 24) % 7 >= 5 ? -25 : 0;
    noise = 0.7 * noise + 3 * (uniform() - 0.5);
    return { hourStart: t, mw: Math.round((200 + 60 * Math.sin((2 * Math.PI * (hour - 9)) / 24) + weekend + noise) * 1000) / 1000 };
  });
}

const steps = replaySteps(START, START + 32 * 24 * HOUR, TZ, '10:00', routine);
/** The first day with three weeks of readings by its forecast update: 26 May, updated 25 May 09:05 MDT. */
const first = steps.find((s) => s.day === '2026-05-26')!;
const direct = async (payload: RefitPayload) => refitZone(payload);

async function replayOne(timeline: ReadingsTimeline, step: ReplayStep): Promise<ReplayedForecast | null> {
  let out: ReplayedForecast | null = null;
  await replayZone({ timeline, timeZone: TZ, steps: [step], minHours: MIN_HOURS }, direct, async (_s, f) => {
    out = f;
  });
  return out;
}

describe('a replayed day sees only the readings that had arrived by its forecast update', () => {
  it('stands as the 09:05 update before the 10:00 gate closure, from the hour that ended at 09:00, and covers the whole day', async () => {
    expect(new Date(first.issuedAt).toISOString()).toBe('2026-05-25T15:05:00.000Z');
    expect(new Date(first.gateClosureAt).toISOString()).toBe('2026-05-25T16:00:00.000Z');
    const f = (await replayOne(new ReadingsTimeline(readings(), new Set()), first))!;
    expect(f.method).toBe('arima');
    expect(f.issuedAt).toBe(first.issuedAt);
    expect(new Date(f.basedOnHour).toISOString()).toBe('2026-05-25T14:00:00.000Z');
    expect(new Date(f.firstHour).toISOString()).toBe('2026-05-25T15:00:00.000Z');
    // to the end of 26 May, local midnight = 27 May 06:00Z
    expect(f.firstHour + f.forecast.mean.length * HOUR).toBe(Date.parse('2026-05-27T06:00:00Z'));
  });

  it('is unchanged by readings at or after the gate closure, or of the hour still running at the update', async () => {
    const base = readings();
    const later = base.map((r) => (r.hourStart + HOUR > first.issuedAt ? { ...r, mw: r.mw * 3 } : r));
    const a = await replayOne(new ReadingsTimeline(base, new Set()), first);
    const b = await replayOne(new ReadingsTimeline(later, new Set()), first);
    expect(b).toEqual(a);
    // whereas the reading of the hour that had just ended does change it
    const lastKnown = base.map((r) => (r.hourStart === first.issuedAt - 5 * 60_000 - HOUR ? { ...r, mw: r.mw * 3 } : r));
    const c = await replayOne(new ReadingsTimeline(lastKnown, new Set()), first);
    expect(c!.forecast.mean).not.toEqual(a!.forecast.mean);
  });

  it('leaves out outage and bad-data hours as the refit jobs do', async () => {
    // a six-hour dip on 20 May, marked as an outage
    const from = Date.parse('2026-05-20T16:00:00Z');
    const outage = new Set(Array.from({ length: 6 }, (_, i) => from + i * HOUR));
    const base = readings();
    const dipped = base.map((r) => (outage.has(r.hourStart) ? { ...r, mw: r.mw * 0.2 } : r));
    const marked = new ReadingsTimeline(dipped, outage);
    const history = marked.historyAt(first.issuedAt)!;
    const i = (from - history.firstHourMs) / HOUR;
    expect(history.values.length).toBe(TRAINING_HOURS);
    expect(history.excluded).toEqual([i, i + 1, i + 2, i + 3, i + 4, i + 5]);
    expect(Number.isNaN(history.values[i])).toBe(true);
    const clean = await replayOne(new ReadingsTimeline(base, outage), first);
    expect(await replayOne(marked, first)).toEqual(clean);
    // unmarked, the dip does move the forecast
    const unmarked = await replayOne(new ReadingsTimeline(dipped, new Set()), first);
    expect(unmarked!.forecast.mean).not.toEqual(clean!.forecast.mean);
  });
});

describe('the replayed routine of a zone', () => {
  /** A stand-in for the refit task: a model with the given backtest MAPEs, or a failed fit. */
  function fake(results: { mape?: number; served?: number; fail?: boolean; p: number }[]) {
    const payloads: RefitPayload[] = [];
    const run = async (payload: RefitPayload): Promise<RefitResult> => {
      payloads.push(payload);
      const r = results[payloads.length - 1];
      const forecast = { mean: Array<number>(payload.horizon).fill(r.p), se: [], lower80: [], upper80: [], lower95: [], upper95: [] };
      if (r.fail) return { method: 'seasonal-naive', fallbackReason: 'the fit failed', model: null, stored: null, forecast, candidates: [], warnings: [], score: null, inServiceScore: null, fitMs: 0, totalMs: 0 };
      const stored = { diff: [168], p: r.p, q: 1, ar: Array(r.p).fill(0.1), ma: [0.2], sigma2: 1, mean: 0 };
      const model = { diff: [168], p: r.p, q: 1 } as unknown as RefitResult['model'];
      const score = (mape: number | undefined) => (mape === undefined ? null : { mape, baselineMape: 9, coverage80: null, coverage95: null, days: 7, from: 0, to: 0, onForecastWeather: false });
      return { method: 'arima', fallbackReason: null, model, stored, forecast, candidates: [], warnings: [], score: score(r.mape), inServiceScore: score(r.served), fitMs: 0, totalMs: 0 };
    };
    return { payloads, run };
  }

  async function walk(results: Parameters<typeof fake>[0], days: ReplayStep[]) {
    const { payloads, run } = fake(results);
    const out: (ReplayedForecast | null)[] = [];
    await replayZone({ timeline: new ReadingsTimeline(readings(), new Set()), timeZone: TZ, steps: days, minHours: MIN_HOURS }, run, async (_s, f) => {
      out.push(f);
    });
    return { payloads, out };
  }

  const i = steps.indexOf(first);

  it('fits nothing before the zone has three weeks of readings', async () => {
    const { payloads, out } = await walk([], steps.slice(i - 2, i));
    expect(payloads).toHaveLength(0);
    expect(out).toEqual([null, null]);
  });

  it('selects orders each night, keeps a candidate only when it beats the model in service, and updates the coefficients before the gate', async () => {
    const { payloads, out } = await walk(
      [
        { p: 1 }, // night 1: the first model (no model in service yet), p = 1
        { p: 1 }, // update 1: orders kept
        { p: 2, mape: 5, served: 4 }, // night 2: candidate p = 2 loses (5 % against 4 %)
        { p: 1 }, // update 2
        { p: 3, mape: 3, served: 4 }, // night 3: candidate p = 3 wins
        { p: 3 }, // update 3
      ],
      steps.slice(i, i + 3),
    );
    expect(payloads.map((p) => [p.fixed?.p ?? 'select', p.inService?.p ?? null])).toEqual([
      ['select', null],
      [1, null],
      ['select', 1],
      [1, null],
      ['select', 1],
      [3, null],
    ]);
    expect(out.map((f) => f?.model?.p)).toEqual([1, 1, 3]);
    expect(out.map((f) => f?.issuedAt)).toEqual(steps.slice(i, i + 3).map((s) => s.issuedAt));
  });

  it('stores seasonal naive when the first fit fails, and nothing when an update fails (the model stays in service)', async () => {
    const { payloads, out } = await walk([{ p: 1, fail: true }, { p: 1, fail: true }, { p: 2 }, { p: 2, fail: true }, { p: 2, mape: 9, served: 1 }, { p: 2 }], steps.slice(i, i + 3));
    expect(out[0]).toMatchObject({ method: 'seasonal-naive', fallbackReason: 'the fit failed', model: null });
    expect(out[1]).toBeNull();
    expect(out[2]).toMatchObject({ method: 'arima', model: { p: 2 } });
    expect(payloads[5].fixed?.p).toBe(2);
  });
});
