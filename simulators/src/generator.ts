import { DEMO_STATIONS, floorHour, HOUR_MS } from '@morrowline/shared';
import { isRestDay, localTime } from './calendar';
import { expectedLoadMw } from './load-model';
import { Random, subSeed } from './random';
import { DEFAULT_FORECAST_MISHAPS, ForecastIssuer, type ForecastMishaps, type SimForecastValue } from './temperature-forecasts';
import { StationWeather, zoneTemperature } from './weather';

export interface SimZone {
  code: string;
  peakMw: number;
}

export interface SimReading {
  zone: string;
  hour: string;
  mw: number;
  quality?: 'good' | 'estimated' | 'suspect';
}

/** How often things go wrong, per zone and hour. */
export interface Mishaps {
  /** Start of a meter dropout (hours never sent). */
  dropout: number;
  /** Start of an outage (load dips to a fraction for a few hours). */
  outage: number;
  /** A reading sent hours late. */
  late: number;
  /** A reading sent again later, the same value. */
  repeat: number;
  /** A reading sent again later with a corrected value (becomes a revision). */
  correction: number;
}

export const DEFAULT_MISHAPS: Mishaps = { dropout: 0.002, outage: 0.0006, late: 0.01, repeat: 0.01, correction: 0.002 };

/** Observed temperature of a station for an hour, as the simulator sends it. */
export interface SimObservation {
  station: string;
  hour: string;
  tempC: number;
}

/** Weather due to be sent at the end of an hour. */
export interface SimWeather {
  observations: SimObservation[];
  forecasts: SimForecastValue[];
}

interface ZoneState {
  zone: SimZone;
  random: Random;
  noise: number;
  dropoutLeft: number;
  outageLeft: number;
  outageDepth: number;
}

/**
 * Makes the readings of every zone hour by hour, deterministically for a seed, and says when each
 * is sent: normally when its hour has ended, sometimes late, twice, or not at all.
 */
export class FeedGenerator {
  readonly weather: StationWeather;
  private readonly issuer: ForecastIssuer;
  private readonly zones: ZoneState[];
  /** Readings waiting to be sent, by the hour (ms) at whose end they go out. */
  private readonly due = new Map<number, SimReading[]>();
  /** Forecasts waiting for their (late) issue time, by the hour at whose end they go out. */
  private readonly forecastsDue = new Map<number, SimForecastValue[]>();
  private weatherOut: SimWeather = { observations: [], forecasts: [] };
  /** The last hour made: the zones' temperatures and load before noise (the exporter reads them). */
  lastZoneTemperatures = new Map<string, number>();
  private nextHour: number;

  constructor(
    zones: readonly SimZone[],
    startHour: number,
    seed: number,
    private readonly timeZone: string,
    private readonly mishaps: Mishaps = DEFAULT_MISHAPS,
    forecastMishaps: ForecastMishaps = DEFAULT_FORECAST_MISHAPS,
  ) {
    this.weather = new StationWeather(seed, floorHour(startHour), timeZone);
    this.issuer = new ForecastIssuer(seed, this.weather, forecastMishaps);
    this.zones = zones.map((zone) => ({ zone, random: new Random(subSeed(seed, zone.code)), noise: 0, dropoutLeft: 0, outageLeft: 0, outageDepth: 1 }));
    this.nextHour = floorHour(startHour);
  }

  /** The hour the next call to step() makes. */
  get hour(): number {
    return this.nextHour;
  }

  /** Makes one more hour and answers every reading due to be sent at its end. */
  step(): SimReading[] {
    const hour = this.nextHour;
    this.nextHour += HOUR_MS;
    const t = localTime(hour, this.timeZone);
    const temps = this.weather.at(hour);
    // Observed at the end of the hour, like the meters; a forecast issued in this hour goes out at
    // the end of the hour of its (maybe late) issue time.
    for (const station of DEMO_STATIONS) this.weatherOut.observations.push({ station: station.code, hour: new Date(hour).toISOString(), tempC: temps.get(station.code)! });
    for (const forecast of this.issuer.issuedIn(hour)) {
      const sendAt = floorHour(forecast.issuedAt);
      (this.forecastsDue.get(sendAt) ?? this.forecastsDue.set(sendAt, []).get(sendAt)!).push(...forecast.values);
    }
    this.weatherOut.forecasts.push(...(this.forecastsDue.get(hour) ?? []));
    this.forecastsDue.delete(hour);
    this.weather.forgetBefore(hour);
    for (const s of this.zones) {
      const tempC = zoneTemperature(s.zone.code, temps);
      const holiday = isRestDay(t, s.zone.code);
      this.lastZoneTemperatures.set(s.zone.code, tempC);
      const r = s.random;
      // Noise: AR(1), about 1.2 % of load, so neighbouring hours err together as real ones do.
      s.noise = 0.75 * s.noise + 0.008 * r.normal();
      if (s.outageLeft === 0 && r.chance(this.mishaps.outage)) {
        s.outageLeft = r.int(2, 8);
        s.outageDepth = r.between(0.3, 0.7);
      }
      let mw = expectedLoadMw(s.zone.code, s.zone.peakMw, { t, tempC, holiday }) * (1 + s.noise);
      if (s.outageLeft > 0) {
        mw *= s.outageDepth;
        s.outageLeft--;
      }
      mw = Math.round(Math.max(0, mw) * 1000) / 1000;
      if (s.dropoutLeft === 0 && r.chance(this.mishaps.dropout)) s.dropoutLeft = r.int(1, 6);
      if (s.dropoutLeft > 0) {
        s.dropoutLeft--;
        continue;
      }
      const reading: SimReading = { zone: s.zone.code, hour: new Date(hour).toISOString(), mw };
      const late = r.chance(this.mishaps.late) ? r.int(1, 5) : 0;
      this.schedule(hour + late * HOUR_MS, reading);
      if (r.chance(this.mishaps.repeat)) this.schedule(hour + r.int(1, 12) * HOUR_MS, { ...reading });
      if (r.chance(this.mishaps.correction)) {
        this.schedule(hour + r.int(2, 24) * HOUR_MS, { ...reading, mw: Math.round(mw * r.between(0.97, 1.03) * 1000) / 1000, quality: 'estimated' });
      }
    }
    const out = this.due.get(hour) ?? [];
    this.due.delete(hour);
    return out;
  }

  private schedule(sendAfterHour: number, reading: SimReading): void {
    let list = this.due.get(sendAfterHour);
    if (!list) this.due.set(sendAfterHour, (list = []));
    list.push(reading);
  }

  /** The weather made since the last call: every station's observations, and forecasts issued. */
  takeWeather(): SimWeather {
    const out = this.weatherOut;
    this.weatherOut = { observations: [], forecasts: [] };
    return out;
  }

  /** Everything still held back (late, repeats), e.g. at the end of a --once run. */
  flush(): SimReading[] {
    const out = [...this.due.entries()].sort((a, b) => a[0] - b[0]).flatMap(([, list]) => list);
    this.due.clear();
    return out;
  }
}
