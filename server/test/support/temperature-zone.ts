import { plainCalendar } from '@morrowline/engine';
import type { RefitWeather } from '../../src/models/analysis/refit';

/**
 * Six weeks of a synthetic zone whose load answers the temperature, for the specs of refits with
 * weather terms: 400 MW with a daily swing of ±60 MW and 40 MW less at weekends, plus 12 MW per °C
 * below 14 °C and ±4 MW of noise. The temperature swings ±6 °C a day about 5 °C and wanders (an
 * AR(1) drift per hour), so the load's own past cannot foresee it. Hours count from 0
 * (firstHourMs 0); a temperature forecast of one member for 72 hours, its error growing with the
 * lead time, is issued daily at hour 5 (05:00); the refit is issued half an hour before the last
 * hour ends. `seed` starts the noise's linear congruential generator: each spec keeps its own.
 */
export function temperatureZone(seed: number): { values: Float64Array; weather: RefitWeather } {
  const n = 6 * 168;
  const horizon = 48;
  let s = seed;
  const rnd = () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 2;
  const path = new Float64Array(n + 96);
  let drift = 0;
  for (let t = 0; t < path.length; t++) {
    drift = 0.99 * drift + 0.6 * rnd();
    path[t] = 5 + 6 * Math.sin((2 * Math.PI * ((t % 24) - 15)) / 24) + 3 * drift;
  }
  const values = Float64Array.from({ length: n }, (_, t) => 400 + 60 * Math.sin((2 * Math.PI * ((t % 24) - 9)) / 24) + (Math.floor(t / 24) % 7 >= 5 ? -40 : 0) + 12 * Math.max(0, 14 - path[t]) + 4 * rnd());
  const vintages = [];
  for (let issued = 5; issued < n; issued += 24) vintages.push({ issued, first: issued + 1, members: [Float64Array.from({ length: 72 }, (_, k) => path[issued + 1 + k] + 0.05 * k * rnd())] });
  return { values, weather: { firstHourMs: 0, temperature: path.slice(0, n), vintages, calendar: plainCalendar(n + horizon), issuedAt: n - 0.5 } };
}
