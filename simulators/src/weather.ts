import type { LocalTime } from './calendar';
import { Random } from './random';

/**
 * A synthetic temperature path for the valley: a seasonal curve (cold winters, hot summers), a
 * daily swing peaking mid-afternoon, and a slowly wandering anomaly (AR(1), a seeded random walk
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
