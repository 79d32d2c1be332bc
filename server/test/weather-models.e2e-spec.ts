import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { operatingDayOf, responseBandBasis, temperatureResponseCurve, type ModelVersionDto, type RefitJobDto, type AdjustmentResultDto, type ScheduleRevisionDto, type WeatherVintagesDto, type WeatherWhatIfDto } from '@morrowline/shared';
import { refitZone, scoreChoice, REFIT_BACKTEST_DAYS } from '../src/models/analysis/refit';
import { scoreWeatherChoice } from '../src/models/analysis/weather-score';
import { AuditEntry } from '../src/audit/entities/audit-entry.entity';
import { ModelVersion } from '../src/models/entities/model-version.entity';
import { forecastHorizon } from '../src/forecasts/forecast-horizon';
import { ZoneHistoryLoader } from '../src/history/zone-history.loader';
import { RefitsService } from '../src/models/refits.service';
import { ZoneWeatherLoader } from '../src/models/zone-weather.loader';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { ReadingsService } from '../src/readings/readings.service';
import { WeatherRepository } from '../src/weather/weather.repository';
import { Zone } from '../src/zones/entities/zone.entity';
import { createZone, unique } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(300_000);

const H = 3_600_000;
const HISTORY_HOURS = 8 * 168;
/** MW per °C of heating below 14 °C in the constructed zone: the slope the fitted response must find. */
const HEAT_MW_PER_C = 25;
const HEAT_BELOW = 14;

/** A deterministic pseudo-random stream (linear congruential), so the data are the same every run. */
function stream(seed: number): () => number {
  let s = seed;
  return () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 2;
}

/** Winter temperature of hour t (UTC ms): a daily swing and a slow swing of a few days, °C. */
function temperatureAt(t: number): number {
  const hourOfDay = Math.floor(t / H) % 24;
  const day = t / (24 * H);
  return 4 + 6 * Math.sin((2 * Math.PI * (hourOfDay - 15)) / 24) + 7 * Math.sin((2 * Math.PI * day) / 5.3) + 3 * Math.sin((2 * Math.PI * day) / 2.1);
}

/** Load that answers the temperature: HEAT_MW_PER_C for each degree below HEAT_BELOW, on daily and weekly cycles. */
function loadAt(t: number, noise: number): number {
  const hourOfWeek = Math.floor(t / H) % 168;
  const hourOfDay = hourOfWeek % 24;
  const day = Math.floor(hourOfWeek / 24);
  const heat = Math.max(0, HEAT_BELOW - temperatureAt(t)) * HEAT_MW_PER_C;
  return 500 + 90 * Math.sin((2 * Math.PI * (hourOfDay - 9)) / 24) + (day === 2 || day === 3 ? -70 : 0) + heat + noise;
}

describe('refits with weather: temperature response and forecasts on the vintage known at the issue time (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });
  const last = Math.floor(Date.now() / H) * H - H;
  const first = last - (HISTORY_HOURS - 1) * H;
  let zone: string;
  let stationId: number;
  let station: string;

  beforeAll(async () => {
    app = await startTestApp();
    [admin, operator] = await Promise.all([tokenFor(app, 'admin'), tokenFor(app, 'operator')]);
    zone = await createZone(app, admin, { maxPlausibleMw: 3000 });
    station = `W${unique()}`.slice(0, 32);
    await api().post('/api/weather/stations').set(as(admin)).send({ code: station, name: `Station ${station}`, timeZone: 'America/Denver' }).expect(201);
    await api().put(`/api/weather/zone-stations/${zone}`).set(as(admin)).send({ stations: [{ station, weight: 1 }] }).expect(200);
    stationId = (await app.get(WeatherRepository).stationByCode(station))!.id;
    const z = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: zone });

    const noise = stream(7);
    const readings = Array.from({ length: HISTORY_HOURS }, (_, i) => {
      const t = first + i * H;
      return { zoneId: z.id, zone, hourStart: t, mw: Math.round(loadAt(t, 6 * noise()) * 10) / 10, quality: 'good' as const };
    });
    await app.get(ReadingsRepository).store(readings, 'test:history');
    await app.get(ReadingsService).zones(true);

    // observed temperature of every history hour; a vintage issued each day at 05:00 UTC for the
    // next 96 hours, its error growing with the lead (about 0.04 °C per hour ahead)
    const observed = readings.map((r) => ({ stationId, station, hourStart: r.hourStart, tempC: Math.round(temperatureAt(r.hourStart) * 100) / 100 }));
    const err = stream(19);
    const forecasts = [];
    for (let issued = Math.floor(first / (24 * H)) * 24 * H + 5 * H; issued <= Date.now() - 10 * 60_000; issued += 24 * H) {
      if (issued < first) continue;
      for (let k = 1; k <= 96; k++) {
        const hourStart = issued - 5 * H + (5 + k) * H;
        forecasts.push({ stationId, station, issuedAt: issued, hourStart, member: '', tempC: Math.round((temperatureAt(hourStart) + 0.04 * k * err()) * 100) / 100 });
      }
    }
    await app.get(WeatherRepository).storeBatch(observed, forecasts, 'test:weather');
  });
  afterAll(async () => {
    await app?.close();
  });

  it('gives the zone whose load answers the temperature a model with a temperature response of the slope it was built with', async () => {
    const res = await api().post('/api/models/refits').set(as(operator)).send({ zone, reason: 'weather model' }).expect(202);
    await app.get(RefitsService).settled();
    const jobs = (await api().get(`/api/models/refits?zone=${zone}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    const job = jobs.find((j) => j.id === (res.body as RefitJobDto[])[0].id)!;
    expect(job.state).toBe('done');
    const version = (await api().get(`/api/models/${job.modelVersionId}`).set(as(operator)).expect(200)).body as ModelVersionDto;
    expect(version.weather).not.toBeNull();
    expect(version.weather!.used).toBe(true);
    expect(version.weather!.terms.temperature).toBe(true);
    expect(version.weather!.response.some((c) => c.name.startsWith('hdd_'))).toBe(true);
    // the steady-temperature response falls by HEAT_MW_PER_C per °C below the heating threshold (by construction)
    const curve = temperatureResponseCurve(version.weather!, -6, 2, 2);
    const slope = (curve[0].mw - curve[curve.length - 1].mw) / 8;
    expect(slope).toBeGreaterThan(0.8 * HEAT_MW_PER_C);
    expect(slope).toBeLessThan(1.2 * HEAT_MW_PER_C);
    // the band on that sum of block coefficients uses their joint covariance, stored with the version
    expect(responseBandBasis(version.weather!)).toBe('covariance');
    // the term choice was scored against the model without weather, which lost on these days
    const withoutWeather = version.weather!.candidates.find((c) => c.label === 'no weather or calendar terms');
    expect(withoutWeather?.mape).toBeGreaterThan(0);
    // its first forecast used the newest vintage issued by the refit's time (05:00 UTC today or yesterday)
    const newest = Math.floor((Date.now() - 10 * 60_000 - 5 * H) / (24 * H)) * 24 * H + 5 * H;
    expect(version.weather!.vintageIssuedAt).toBe(new Date(newest).toISOString());
  });

  it('scores a version with weather on its weather backtest, and the nightly refit weighs both versions so', async () => {
    const em = app.get(EntityManager).fork();
    const z = await em.findOneOrFail(Zone, { code: zone });
    const inService = await em.findOneOrFail(ModelVersion, { zone: z.id, status: 'in-service' });
    const dto = (await api().get(`/api/models/${inService.id}`).set(as(operator)).expect(200)).body as ModelVersionDto;
    expect(dto.weather!.used).toBe(true);
    expect(dto.backtestOnForecastWeather).toBe(true);
    // the stored score is the version's terms on forecast weather over the same days as the model
    // without weather; on this zone (25 MW/°C, weather swinging over days) the terms win clearly
    const history = (await app.get(ZoneHistoryLoader).load(z))!;
    const weather = (await app.get(ZoneWeatherLoader).forRefit(z, history, forecastHorizon(history.lastHourMs, z.timeZone), Date.now()))!;
    const plain = scoreChoice(history.values, history.excluded, { diff: dto.differencing, p: dto.p, q: dto.q }, REFIT_BACKTEST_DAYS);
    const again = scoreWeatherChoice(history.values, history.excluded, weather, inService.weather!.choice!, REFIT_BACKTEST_DAYS);
    expect(dto.backtestDays).toBe(plain.days);
    expect(dto.backtestMape!).toBeCloseTo(again.mape!, 1);
    expect(dto.baselineMape!).toBeCloseTo(plain.baselineMape!, 6);
    expect(dto.backtestMape!).toBeLessThan(0.8 * plain.mape!);

    // the nightly refit: candidate and version in service both scored on forecast weather
    const jobs = await app.get(RefitsService).request(null, zone, 'nightly refit', 'schedule', 'full');
    await app.get(RefitsService).settled();
    const done = (await api().get(`/api/models/refits?zone=${zone}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    const job = done.find((j) => j.id === jobs[0].id)!;
    expect(job.state).toBe('done');
    expect(job.message).toMatch(/MAPE [\d.]+ % on forecast weather\)? (beat|did not beat it \()[\d.]+ % on forecast weather/);
    const audit = await em.fork().findOneOrFail(AuditEntry, { action: 'refit.finish', subjectId: String(job.id) } as never);
    expect(audit.reason).toBe(job.message);
  });

  it('forecasts at an issue time T from the vintages issued by T only: a later vintage with absurd values changes nothing', async () => {
    const z = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: zone });
    const history = (await app.get(ZoneHistoryLoader).load(z))!;
    const horizon = forecastHorizon(history.lastHourMs, z.timeZone);
    const loader = app.get(ZoneWeatherLoader);
    const issuedAt = Date.now();
    const run = async (at: number) => {
      const weather = await loader.forRefit(z, history, horizon, at);
      expect(weather).toBeDefined();
      return refitZone({ values: history.values, excluded: history.excluded, horizon, backtestDays: REFIT_BACKTEST_DAYS, weather });
    };
    const before = await run(issuedAt);
    expect(before.weather?.used).toBe(true);

    // a vintage issued one minute after T, 60 °C for every hour of the forecast
    const later = issuedAt + 60_000;
    const absurd = Array.from({ length: horizon }, (_, j) => ({ stationId, station, issuedAt: later, hourStart: history.lastHourMs + (j + 1) * H, member: '', tempC: 60 }));
    await app.get(WeatherRepository).storeBatch([], absurd, 'test:later-vintage');

    const after = await run(issuedAt);
    expect(after.forecast.mean).toEqual(before.forecast.mean);
    expect(after.forecast.upper95).toEqual(before.forecast.upper95);
    expect(after.weather?.vintageIssuedAt).toBe(before.weather?.vintageIssuedAt);

    // the control: issued after that vintage, the forecast does read it. 60 °C leaves no heating
    // (25 MW/°C on this zone), so the night and morning hours fall by hundreds of MW; a cooling
    // slope the fit may have found on the warmer hours is taken far past anything it saw, so
    // those can rise instead (with the engine's default choices, a cooling term of 0.1–3 MW/°C
    // on hours 10–18 did)
    const informed = await run(later + 1000);
    expect(informed.weather?.vintageIssuedAt).toBe(new Date(later).toISOString());
    const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
    const change = informed.forecast.mean.map((v, j) => v - before.forecast.mean[j]);
    expect(Math.min(...change)).toBeLessThan(-200);
    expect(mean(change.map(Math.abs))).toBeGreaterThan(80);
  });

  it('answers a weather what-if for the next day beside the model forecast: 2 °C colder means HEAT_MW_PER_C × 2 more on heating hours', async () => {
    const day = operatingDayOf(last + 24 * H, 'America/Denver');
    const before = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(operator)).expect(200)).body;
    const res = await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ shift: '-2' }).set(as(operator)).expect(200);
    const w = res.body as WeatherWhatIfDto;
    expect(w.shiftC).toBe(-2);
    expect(w.hours.length).toBeGreaterThanOrEqual(23);
    const heating = w.hours.filter((h) => h.changeMw !== null && h.temperatureC !== null && h.temperatureC <= 11);
    expect(heating.length).toBeGreaterThan(3);
    for (const h of heating) expect(h.whatIfTemperatureC).toBeCloseTo(h.temperatureC! - 2, 6);
    const mean = heating.reduce((a, h) => a + h.changeMw!, 0) / heating.length;
    expect(mean).toBeGreaterThan(0.7 * 2 * HEAT_MW_PER_C);
    expect(mean).toBeLessThan(1.3 * 2 * HEAT_MW_PER_C);
    // warm hours above the heating threshold answer less (nothing above 16 °C after the shift)
    for (const h of w.hours.filter((x) => x.changeMw !== null && x.whatIfTemperatureC !== null && x.whatIfTemperatureC > 16)) expect(Math.abs(h.changeMw!)).toBeLessThan(0.5 * 2 * HEAT_MW_PER_C);
    // the what-if changes nothing stored
    expect((await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(operator)).expect(200)).body).toEqual(before);

    // the vintages known for the day, newest first, the forecast's own marked: each day's 05:00 UTC
    // issue that covers some hour of the day (96 hours ahead), as built above
    const list = (await api().get(`/api/schedules/${day}/${zone}/weather-vintages`).set(as(operator)).expect(200)).body as WeatherVintagesDto;
    const issues = list.vintages.map((x) => Date.parse(x.issuedAt));
    expect(issues).toEqual([...issues].sort((a, b) => b - a));
    expect(issues.length).toBeGreaterThanOrEqual(3);
    for (const t of issues) expect(new Date(t).getUTCHours()).toBe(5);
    expect(list.vintages.filter((x) => x.usedByForecast).map((x) => x.issuedAt)).toEqual([w.baseVintageIssuedAt]);
    expect(list.forecastVintageIssuedAt).toBe(w.baseVintageIssuedAt);
    await api().get(`/api/schedules/${day}/${zone}/weather-vintages`).set(as(await tokenFor(app, 'viewer'))).expect(403);
    await api().get(`/api/schedules/${day}/NOSUCHZONE/weather-vintages`).set(as(operator)).expect(404);

    // another vintage: the one issued a day before the newest, as known then
    const older = new Date(Date.parse(w.baseVintageIssuedAt!) - 24 * H).toISOString();
    expect(list.vintages.map((x) => x.issuedAt)).toContain(older);
    // an instant that is no vintage's issue time: 404 naming where the known ones are
    const notIssued = await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ vintage: new Date(Date.parse(older) + 60_000).toISOString() }).set(as(operator)).expect(404);
    expect(notIssued.body.message).toMatch(/No temperature forecast for .* was issued at .*weather-vintages/);
    const v = (await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ vintage: older }).set(as(operator)).expect(200)).body as WeatherWhatIfDto;
    expect(v.shiftC).toBeNull();
    expect(v.whatIfVintageIssuedAt).toBe(older);
    await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ shift: '2' }).set(as((await tokenFor(app, 'viewer')))).expect(403);
    const future = new Date(Date.now() + 3600_000).toISOString();
    await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ vintage: future }).set(as(operator)).expect(400);
  });

  it('turns a what-if into one add per hour on the draft in one transaction, audited once, undone together; refused without a draft or once submitted', async () => {
    const day = operatingDayOf(last + 24 * H, 'America/Denver');
    const em = () => app.get(EntityManager).fork();
    const path = `/api/schedules/${day}/${zone}/weather-what-if/adjustments`;
    const body = { shift: -2, reason: 'colder than the forecast says' };
    // no draft yet
    const none = await api().post(path).set(as(operator)).send(body).expect(409);
    expect(none.body.message).toMatch(/no .* draft .* start one first/i);
    const draft = (await api().post(`/api/schedules/${day}/${zone}/draft`).set(as(operator)).expect(201)).body as ScheduleRevisionDto;
    // exactly one of shift and vintage; a reason
    await api().post(path).set(as(operator)).send({ reason: 'no what-if named' }).expect(400);
    await api().post(path).set(as(operator)).send({ shift: 1, vintage: '2026-11-01T05:00:00Z', reason: 'both' }).expect(400);
    await api().post(path).set(as(operator)).send({ shift: 10.5, reason: 'too far' }).expect(400);
    await api().post(path).set(as(await tokenFor(app, 'viewer'))).send(body).expect(403);

    // all or none: a 1 MW hour set by hand cannot take a 2 °C warmer what-if's drop in heating
    const what = (await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ shift: '2' }).set(as(operator)).expect(200)).body as WeatherWhatIfDto;
    const dropAt = what.hours.findIndex((h) => h.changeMw !== null && h.changeMw < -5);
    expect(dropAt).toBeGreaterThanOrEqual(0);
    const set = (await api().post(`/api/schedules/${day}/adjustments`).set(as(operator)).send({ zones: [zone], kind: 'set', fromHour: dropAt, toHour: dropAt, value: 1, reason: 'hour held low' }).expect(201)).body as AdjustmentResultDto;
    const refused = await api().post(path).set(as(operator)).send({ shift: 2, reason: 'warmer' }).expect(400);
    expect(refused.body.message).toMatch(/never below 0 MW/);
    const afterRefusal = (await api().get(`/api/schedules/${day}?zone=${zone}`).set(as(operator)).expect(200)).body;
    expect(afterRefusal.zones[0].working.adjustments.filter((a: { undoneAt: string | null }) => a.undoneAt === null)).toHaveLength(1);
    await api().delete(`/api/schedules/adjustments/${set.adjustments[0].id}`).set(as(operator)).expect(200);

    // the 2 °C colder what-if: one add per hour whose change is 0.1 MW or more, the GET's values rounded to 0.1 MW
    const colder = (await api().get(`/api/schedules/${day}/${zone}/weather-what-if`).query({ shift: '-2' }).set(as(operator)).expect(200)).body as WeatherWhatIfDto;
    const expected = colder.hours.map((h, i) => ({ hour: i, value: h.changeMw === null ? 0 : Math.round(h.changeMw * 10) / 10 })).filter((x) => x.value !== 0);
    expect(expected.length).toBeGreaterThan(3);
    const added = (await api().post(path).set(as(operator)).send(body).expect(201)).body as AdjustmentResultDto;
    expect(added.adjustments.map((a) => [a.fromHour, a.toHour, a.kind, a.value])).toEqual(expected.map((x) => [x.hour, x.hour, 'add', x.value]));
    const batchId = added.adjustments[0].id;
    expect(added.adjustments.every((a) => a.batchId === batchId)).toBe(true);
    expect(added.adjustments[0].reason).toBe('colder than the forecast says (weather what-if: −2 °C)');
    const working = added.revisions[0];
    for (const x of expected) expect(working.hours[x.hour].adjustedMw).toBeCloseTo(working.hours[x.hour].startMw! + x.value, 6);
    const audits = await em().find(AuditEntry, { subjectType: 'schedule', subjectId: String(draft.id), action: { $in: ['schedule.adjust', 'schedule.adjust-batch'] } } as never);
    expect(audits.map((a) => a.action)).toEqual(['schedule.adjust', 'schedule.adjust-batch']); // the hand-set hour, then the batch once
    expect(audits[1].after).toMatchObject({ batchId, adjustments: expected.length, shiftC: -2, source: 'weather-what-if' });

    // undone together, audited once; a second undo and an unknown batch are refused
    const undone = (await api().delete(`/api/schedules/adjustment-batches/${batchId}`).set(as(operator)).expect(200)).body as ScheduleRevisionDto;
    expect(undone.adjustments.filter((a) => a.batchId === batchId).every((a) => a.undoneAt !== null)).toBe(true);
    for (const x of expected) expect(undone.hours[x.hour].adjustedMw).toBeCloseTo(undone.hours[x.hour].startMw!, 6);
    expect(await em().count(AuditEntry, { action: 'schedule.adjust-batch-undo', subjectId: String(draft.id) } as never)).toBe(1);
    await api().delete(`/api/schedules/adjustment-batches/${batchId}`).set(as(operator)).expect(409);
    await api().delete(`/api/schedules/adjustment-batches/${set.adjustments[0].id}`).set(as(operator)).expect(404);

    // submitted: refused
    const supervisor = await tokenFor(app, 'supervisor');
    await api().post(`/api/schedules/revisions/${draft.id}/submit`).set(as(supervisor)).send({}).expect(201);
    const late = await api().post(path).set(as(operator)).send(body).expect(409);
    expect(late.body.message).toMatch(/submitted/i);
  });
});
