import { DEMO_STATIONS, DEMO_ZONE_STATIONS, HOUR_MS, type DemoStation } from '@morrowline/shared';
import { localTime, type LocalTime } from './calendar';
import { Random, subSeed } from './random';

/**
 * A synthetic temperature path for the valley floor: a seasonal curve (cold winters, hot summers),
 * a daily swing peaking mid-afternoon, and a slowly wandering anomaly (AR(1), a seeded random walk
 * pulled back towards the curve) for warm spells and cold snaps.
 */
export class WeatherPath {
  private anomaly = 0;
  private readonly random: Random;

  constructor(seed: number) {
    this.random = new Random(seed);
  }

  /** Seasonal daily-mean temperature in °C for a day of the year: about −4 in January, 25 in July. */
  static seasonalMean(dayOfYear: number): number {
    return 10.5 - 14.5 * Math.cos((2 * Math.PI * (dayOfYear - 20)) / 365);
  }

  /** Temperature for the next hour of the path (call once per hour, in order). */
  next(t: LocalTime): number {
    this.anomaly = 0.992 * this.anomaly + 0.32 * this.random.normal();
    const diurnal = 6 * Math.cos((2 * Math.PI * (t.hour - 15)) / 24);
    return WeatherPath.seasonalMean(t.dayOfYear) + diurnal + this.anomaly;
  }
}

/** Temperatures of every demo station for one hour, °C, rounded to 0.1 as stations report. */
export type StationTemperatures = ReadonlyMap<string, number>;

/**
 * Each station's hourly temperature: the valley-floor path, the station's mean offset (higher
 * ground is colder) and a small local wander of its own (AR(1), about 0.4 °C). Made hour by hour
 * in order but readable ahead (a forecast needs the hours it forecasts), deterministically for a
 * seed.
 */
export class StationWeather {
  private readonly path: WeatherPath;
  private readonly local: { station: DemoStation; random: Random; wander: number }[];
  private readonly hours = new Map<number, StationTemperatures>();
  private nextHour: number;

  constructor(
    seed: number,
    startHour: number,
    private readonly timeZone: string,
  ) {
    this.path = new WeatherPath(subSeed(seed, 'weather'));
    this.local = DEMO_STATIONS.map((station) => ({ station, random: new Random(subSeed(seed, `station-${station.code}`)), wander: 0 }));
    this.nextHour = startHour;
  }

  /** The stations' temperatures at an hour at or after the start (made on demand, kept until forgotten). */
  at(hour: number): StationTemperatures {
    while (this.nextHour <= hour) {
      const valley = this.path.next(localTime(this.nextHour, this.timeZone));
      const temps = new Map<string, number>();
      for (const s of this.local) {
        s.wander = 0.9 * s.wander + 0.17 * s.random.normal();
        temps.set(s.station.code, Math.round((valley + s.station.offsetC + s.wander) * 10) / 10);
      }
      this.hours.set(this.nextHour, temps);
      this.nextHour += HOUR_MS;
    }
    const found = this.hours.get(hour);
    if (!found) throw new Error(`weather for ${new Date(hour).toISOString()} was made and forgotten already`);
    return found;
  }

  /** Drops hours before `hour` (they are never read again). */
  forgetBefore(hour: number): void {
    for (const h of this.hours.keys()) if (h < hour) this.hours.delete(h);
  }
}

/** A zone's temperature: the weighted average of its stations (the valley floor for a zone without weights). */
export function zoneTemperature(zone: string, temps: StationTemperatures): number {
  const weights = DEMO_ZONE_STATIONS[zone] ?? [{ station: 'VALLEYFLOOR', weight: 1 }];
  let sum = 0;
  let total = 0;
  for (const w of weights) {
    sum += (temps.get(w.station) ?? 0) * w.weight;
    total += w.weight;
  }
  return sum / total;
}
