import type { ForecastRunDto, ScheduleHourDto, ScheduleHourSlot } from '@morrowline/shared';

export interface LaidForecast {
  runId: number | null;
  issuedAt: string;
  /** The run is a replay (src/replay), not one the desk issued at the time. */
  replayed: boolean;
  hours: ScheduleHourDto[];
}

/**
 * A forecast run laid onto an operating day's hour slots, matched by UTC hour start and rounded to
 * 0.1 MW; a slot the run does not cover gets nulls. The start and adjusted values begin as the
 * model's.
 */
export function layForecast(run: Pick<ForecastRunDto, 'id' | 'issuedAt' | 'origin' | 'hours' | 'mean' | 'lower80' | 'upper80' | 'lower95' | 'upper95'>, slots: ScheduleHourSlot[]): LaidForecast {
  const at = new Map(run.hours.map((h, i) => [Date.parse(h), i]));
  const hours = slots.map((s) => {
    const i = at.get(Date.parse(s.intervalStartUtc));
    const v = (a: number[]) => (i === undefined ? null : Math.round(a[i] * 10) / 10);
    const modelMw = v(run.mean);
    return { ...s, modelMw, lower80: v(run.lower80), upper80: v(run.upper80), lower95: v(run.lower95), upper95: v(run.upper95), startMw: modelMw, adjustedMw: modelMw };
  });
  return { runId: run.id, issuedAt: run.issuedAt, replayed: run.origin === 'replayed', hours };
}
