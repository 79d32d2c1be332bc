/**
 * The holiday and special-day calendar: days that run unlike their weekday. Load forecasters
 * keep public holidays, bridge days (a working day between a holiday and a weekend that many take
 * off) and local events apart because each moves load differently (common practice).
 */
export const SPECIAL_DAY_KINDS = ['public-holiday', 'bridge-day', 'local-event'] as const;
export type SpecialDayKind = (typeof SPECIAL_DAY_KINDS)[number];

export const SPECIAL_DAY_KIND_LABELS: Record<SpecialDayKind, string> = {
  'public-holiday': 'Public holiday',
  'bridge-day': 'Bridge day',
  'local-event': 'Local event',
};

export interface SpecialDayDto {
  id: number;
  /** Local calendar day, YYYY-MM-DD. */
  day: string;
  name: string;
  kind: SpecialDayKind;
  /** Zone codes the day applies to; empty for every zone. */
  zones: string[];
}

export interface SpecialDayRequest {
  day: string;
  name: string;
  kind: SpecialDayKind;
  zones?: string[];
}

export type SpecialDayPatch = Partial<SpecialDayRequest>;

export function isSpecialDayKind(value: unknown): value is SpecialDayKind {
  return typeof value === 'string' && (SPECIAL_DAY_KINDS as readonly string[]).includes(value);
}

/** Whether a day of this kind runs like a Sunday for load (holidays and bridge days do; local events do not). */
export function isRestDayKind(kind: SpecialDayKind): boolean {
  return kind !== 'local-event';
}
