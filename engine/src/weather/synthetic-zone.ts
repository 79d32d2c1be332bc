/**
 * A small synthetic zone for the weather specs: hourly temperature (a daily swing and a slowly
 * wandering anomaly), its forecast vintages (issued every 12 hours at half past, 168 hours ahead,
 * erring by (1 + 0.5·L/24)·z °C at lead L with z an AR(1) over the lead hours), and a load that
 * answers it through known degree terms (12 MW per °C below 14 °C, 15 MW per °C above 22 °C) on a
 * daily and weekly shape, with holidays that run like Sundays and AR(1) noise. Deterministic for a
 * seed (mulberry32). Built so expected responses are known by construction.
 */
import { TemperatureVintage } from './vintages';

export interface SyntheticZone {
  load: Float64Array;
  temperature: Float64Array;
  vintages: TemperatureVintage[];
  holiday: Uint8Array;
  hourOfDay: Uint8Array;
}

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const SYNTHETIC_HEAT_PER_C = 12;
export const SYNTHETIC_COOL_PER_C = 15;

export function syntheticZone(hours: number, seed: number, o: { meanC?: number; weatherScale?: number; holidays?: number[] } = {}): SyntheticZone {
  const u = mulberry32(seed);
  const normal = () => Math.sqrt(-2 * Math.log(u() + 1e-12)) * Math.cos(2 * Math.PI * u());
  const extra = 168;
  const temperature = new Float64Array(hours + extra);
  let anomaly = 0;
  for (let t = 0; t < hours + extra; t++) {
    anomaly = 0.995 * anomaly + Math.sqrt(1 - 0.995 * 0.995) * 5 * normal();
    temperature[t] = Math.round(((o.meanC ?? 8) + 5 * Math.sin((2 * Math.PI * (t % 24 - 9)) / 24) + anomaly) * 10) / 10;
  }
  const holiday = new Uint8Array(hours + extra);
  for (const d of o.holidays ?? []) for (let h = 0; h < 24; h++) if (d * 24 + h < holiday.length) holiday[d * 24 + h] = 1;
  const hourOfDay = new Uint8Array(hours + extra);
  for (let t = 0; t < hours + extra; t++) hourOfDay[t] = t % 24;
  const load = new Float64Array(hours);
  let noise = 0;
  const k = o.weatherScale ?? 1;
  for (let t = 0; t < hours; t++) {
    const h = t % 24;
    const weekday = Math.floor(t / 24) % 7; // 0 = Monday
    const rest = weekday >= 5 || holiday[t] === 1;
    const shape = 400 + 150 * Math.exp(-((h - 18) ** 2) / 8) + (rest ? 20 : 120) * Math.exp(-((h - 11) ** 2) / 18);
    const T = temperature[t];
    const weather = k * (SYNTHETIC_HEAT_PER_C * Math.max(0, 14 - T) + SYNTHETIC_COOL_PER_C * Math.max(0, T - 22));
    noise = 0.75 * noise + 4 * normal();
    load[t] = shape + weather + noise;
  }
  const vintages: TemperatureVintage[] = [];
  for (let issued = 4.5; issued < hours; issued += 12) {
    const first = Math.floor(issued) + 1;
    const path = new Float64Array(168);
    let z = normal();
    for (let j = 0; j < 168; j++) {
      if (j > 0) z = 0.97 * z + Math.sqrt(1 - 0.97 * 0.97) * normal();
      const lead = first + j - issued;
      path[j] = Math.round((temperature[first + j] + (1 + (0.5 * lead) / 24) * z) * 10) / 10;
    }
    vintages.push({ issued, first, members: [path] });
  }
  return { load, temperature: temperature.subarray(0, hours), vintages, holiday, hourOfDay };
}
