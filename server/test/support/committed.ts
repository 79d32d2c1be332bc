import { MikroORM } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { gateClosureAt, HOUR_MS, operatingDayOf, operatingDayStart } from '@morrowline/shared';
import { ForecastRun } from '../../src/forecasts/entities/forecast-run.entity';
import { Zone } from '../../src/zones/entities/zone.entity';

/**
 * Stores a model run as the day-ahead forecast of a test zone: issued an hour before the gate
 * closure of the operating day `at` falls on, starting at that day's local midnight, `hours` long,
 * every hour `mw(hourStart)`. No API issues a run at a past time, so it is written directly.
 */
export async function storeDayAheadRun(app: NestExpressApplication, code: string, at: number, hours: number, mw: (hourStart: number) => number, issuedOffsetMs = -HOUR_MS): Promise<ForecastRun> {
  const em = app.get(MikroORM).em.fork();
  const zone = await em.findOneOrFail(Zone, { code });
  const day = operatingDayOf(at, zone.timeZone);
  const first = operatingDayStart(day, zone.timeZone);
  const mean = Array.from({ length: hours }, (_, i) => mw(first + i * HOUR_MS));
  const run = em.create(ForecastRun, {
    zone,
    issuedAt: new Date(gateClosureAt(day, zone.timeZone, zone.gateClosure) + issuedOffsetMs),
    origin: 'issued',
    basedOnHour: new Date(first - HOUR_MS),
    method: 'arima',
    fallbackReason: null,
    modelVersionId: null,
    firstHour: new Date(first),
    mean,
    lower80: mean.map((v) => v * 0.97),
    upper80: mean.map((v) => v * 1.03),
    lower95: mean.map((v) => v * 0.95),
    upper95: mean.map((v) => v * 1.05),
  });
  await em.flush();
  return run;
}
