import type { LocalTime } from './calendar';

/**
 * Hourly load of each demo zone as a fraction of its typical peak, from its character: when
 * people, shops, shifts and pumps use power, and how heating and air-conditioning answer the
 * temperature. Holidays run like Sundays.
 */
export interface ZoneConditions {
  t: LocalTime;
  holiday: boolean;
  tempC: number;
}

type Profile = (c: ZoneConditions) => number;

/** Smooth bump centred on `hour` with width `w` hours (wraps around midnight). */
function bump(hour: number, centre: number, width: number): number {
  const d = Math.min(Math.abs(hour - centre), 24 - Math.abs(hour - centre));
  return Math.exp(-(d * d) / (2 * width * width));
}

function restDay(c: ZoneConditions): boolean {
  return c.holiday || c.t.weekday === 0 || c.t.weekday === 6;
}

/** Heating below 14 °C and cooling above `coolFrom` °C, as fractions of peak per °C. */
function weather(tempC: number, heatPerC: number, coolPerC: number, coolFrom = 22): number {
  return heatPerC * Math.max(0, 14 - tempC) + coolPerC * Math.max(0, tempC - coolFrom);
}

const residential: Profile = (c) => {
  const h = c.t.hour;
  const rest = restDay(c);
  const morning = rest ? 0.14 * bump(h, 9.5, 2) : 0.18 * bump(h, 7.5, 1.3);
  return 0.42 + morning + 0.36 * bump(h, 19.5, 2.2) + 0.1 * bump(h, 13, 4) + (rest ? 0.04 : 0);
};

export const ZONE_PROFILES: Record<string, Profile> = {
  /** Old town, residential: morning and evening peaks, electric heating in old houses. */
  MILLRACE: (c) => residential(c) + weather(c.tempC, 0.014, 0.012),
  /** Industrial park with a two-shift smelter: potlines run day and night; shifts 06–14, 14–22. */
  COPPERLINE: (c) => {
    const h = c.t.hour;
    const shifts = h >= 6 && h < 22 ? (restDay(c) ? (h < 14 ? 0.12 : 0) : 0.24) : 0;
    const shiftChange = h === 14 ? -0.03 : 0;
    return 0.66 + shifts + shiftChange + weather(c.tempC, 0.002, 0.003);
  },
  /** Suburban, air-conditioning heavy: summer afternoons and evenings set the peak. */
  HARROW: (c) => 0.9 * residential(c) - 0.06 + weather(c.tempC, 0.006, 0.038 * (0.6 + 0.4 * bump(c.t.hour, 17, 4)), 19),
  /** Rural, irrigation pumps in summer: pumps run through the daylight hours of May to September. */
  QUARRY: (c) => {
    const h = c.t.hour;
    const season = c.t.month >= 5 && c.t.month <= 9 ? 1 : 0;
    const pumps = season * (h >= 6 && h < 21 ? 0.36 : 0.08) * (0.7 + 0.3 * Math.min(1, Math.max(0, (c.tempC - 18) / 12)));
    return 0.32 + 0.16 * bump(h, 19, 2.5) + 0.06 * bump(h, 7, 1.5) + pumps + weather(c.tempC, 0.01, 0.006);
  },
  /** Commercial centre: shop and office hours on weekdays, quieter weekends, closed on holidays. */
  LANTERN: (c) => {
    const h = c.t.hour;
    const open = h >= 8 && h < 18;
    const busy = c.holiday || c.t.weekday === 0 ? 0.06 : c.t.weekday === 6 ? (h >= 10 && h < 17 ? 0.24 : 0.05) : open ? 0.5 : h === 7 || h === 18 ? 0.28 : 0.04;
    return 0.3 + busy + weather(c.tempC, 0.008, 0.02 * (open ? 1 : 0.4));
  },
};

/** Load in MW before noise and outages; a zone without its own profile is residential. */
export function expectedLoadMw(zone: string, peakMw: number, c: ZoneConditions): number {
  const profile = ZONE_PROFILES[zone] ?? residential;
  return Math.max(0.02, profile(c)) * peakMw;
}
