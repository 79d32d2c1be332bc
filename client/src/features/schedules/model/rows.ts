import type { ScheduleHourDto, ScheduleRevisionDto, ZoneScheduleDto } from '@morrowline/shared';

/** One line of the schedule table: an hour ending with the model, its 80 % band and the adjusted MW. */
export interface ScheduleRow {
  index: number;
  hourEnding: string;
  intervalStartUtc: string;
  modelMw: number | null;
  lower80: number | null;
  upper80: number | null;
  lower95: number | null;
  upper95: number | null;
  adjustedMw: number | null;
  /** adjusted − model; null when either is missing. */
  differenceMw: number | null;
}

const round1 = (mw: number) => Math.round(mw * 10) / 10;

/**
 * The revision the zone's screen shows: the one being worked on, else the one in force, else none
 * (the model forecast alone).
 */
export function shownRevision(zone: ZoneScheduleDto): ScheduleRevisionDto | null {
  return zone.working ?? zone.published;
}

/**
 * One row per hour of the operating day, in the server's order and with its labels (23 rows on the
 * spring day without HE02, 25 on the autumn day up to HE25). Values come from the shown revision,
 * else from the latest forecast; an hour neither covers shows dashes.
 */
export function zoneRows(zone: ZoneScheduleDto): ScheduleRow[] {
  const revision = shownRevision(zone);
  const source: readonly ScheduleHourDto[] = revision?.hours ?? zone.forecast?.hours ?? [];
  const byIndex = new Map(source.map((hour) => [hour.index, hour]));
  return zone.slots.map((slot) => {
    const hour = byIndex.get(slot.index);
    const modelMw = hour?.modelMw ?? null;
    const adjustedMw = hour?.adjustedMw ?? null;
    return {
      index: slot.index,
      hourEnding: slot.hourEnding,
      intervalStartUtc: slot.intervalStartUtc,
      modelMw,
      lower80: hour?.lower80 ?? null,
      upper80: hour?.upper80 ?? null,
      lower95: hour?.lower95 ?? null,
      upper95: hour?.upper95 ?? null,
      adjustedMw,
      differenceMw: modelMw === null || adjustedMw === null ? null : round1(adjustedMw - modelMw),
    };
  });
}

/**
 * The system total over the zones shown, hour by hour (matched on the UTC hour start, so zones in
 * other time zones still add up right). An hour is null when any zone has no value for it: a
 * partial sum would read as a dip. Bands are not added up (they do not add), so they stay null.
 */
export function systemRows(zones: readonly ZoneScheduleDto[]): ScheduleRow[] {
  if (zones.length === 0) return [];
  const perZone = zones.map((zone) => new Map(zoneRows(zone).map((row) => [row.intervalStartUtc, row])));
  return zoneRows(zones[0]).map((first) => {
    const rows = perZone.map((map) => map.get(first.intervalStartUtc));
    const sum = (pick: (row: ScheduleRow) => number | null): number | null => {
      let total = 0;
      for (const row of rows) {
        const value = row ? pick(row) : null;
        if (value === null) return null;
        total += value;
      }
      return round1(total);
    };
    const modelMw = sum((row) => row.modelMw);
    const adjustedMw = sum((row) => row.adjustedMw);
    return {
      ...first,
      modelMw,
      adjustedMw,
      lower80: null,
      upper80: null,
      lower95: null,
      upper95: null,
      differenceMw: modelMw === null || adjustedMw === null ? null : round1(adjustedMw - modelMw),
    };
  });
}
