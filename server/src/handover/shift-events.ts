import type { AuditEntryDto, ShiftEventDto } from '@morrowline/shared';

/**
 * Which audit actions belong in a shift's handover: what happened to the load, the models and
 * the schedules. Sign-ins and administration stay in the audit trail only.
 */
export const SHIFT_EVENT_PREFIXES = ['alert.', 'outage.', 'exclusion.', 'refit.', 'model.', 'forecast.', 'schedule.', 'readings.', 'history.', 'feed-key.'] as const;

const PHRASES: Record<string, string> = {
  'alert.raise': 'Deviation alert raised',
  'alert.raised': 'Deviation alert raised',
  'alert.acknowledge': 'Deviation alert acknowledged',
  'alert.acknowledged': 'Deviation alert acknowledged',
  'outage.create': 'Outage window marked',
  'outage.update': 'Outage window changed',
  'outage.close': 'Outage window closed',
  'refit.start': 'Refit started',
  'refit.finish': 'Refit finished',
  'refit.fail': 'Refit failed',
  'model.promote': 'Model promoted into service',
  'model.rollback': 'Model rolled back',
  'forecast.replay': 'Forecasts replayed over the stored history (marked replayed, not issued)',
  'schedule.submit': 'Schedule submitted',
  'schedule.approve': 'Schedule approved',
  'schedule.publish': 'Schedule published',
  'schedule.return': 'Schedule returned',
  'schedule.draft': 'Schedule draft started',
  'schedule.adjust': 'Schedule adjusted',
  'schedule.adjust-undo': 'Schedule adjustment undone',
  'schedule.adjust-batch': 'Schedule adjusted hour by hour from a weather what-if',
  'schedule.adjust-batch-undo': 'Weather what-if adjustments undone',
  'schedule.correction': 'Schedule correction started',
  'schedule.mail-failed': 'Publication e-mail failed',
  'readings.upload': 'History uploaded',
};

/** A zone's name by its code; the code itself for a zone no longer known. */
export type ZoneNames = ReadonlyMap<string, string>;

const signed = (value: number, unit: string) => `${value >= 0 ? '+' : '−'}${Math.abs(value).toFixed(1)} ${unit}`;

function field(record: unknown, key: string): unknown {
  return record !== null && typeof record === 'object' ? (record as Record<string, unknown>)[key] : undefined;
}

/**
 * What the event is about, in the words of the desk: the zone by name and, for an alert, how far
 * the load was off ("Lanternside +12.3 MW", or in percent where the alert carries no MW); a
 * schedule by zone, day and revision. Falls back to the audit subject ("model 12") when the entry
 * names no zone.
 */
function describeSubject(entry: AuditEntryDto, zoneNames: ZoneNames): string {
  const facts = entry.after ?? entry.before;
  const code = field(facts, 'zone');
  if (typeof code !== 'string') return entry.subjectId ? `${entry.subjectType} ${entry.subjectId}` : '';
  const parts = [zoneNames.get(code) ?? code];
  if (entry.action.startsWith('alert.')) {
    const mw = field(facts, 'peakDeviationMw');
    const pct = field(facts, 'peakDeviationPct');
    if (typeof mw === 'number') parts.push(signed(mw, 'MW'));
    else if (typeof pct === 'number') parts.push(signed(pct, '%'));
  }
  const day = field(facts, 'operatingDay');
  const revision = field(facts, 'revision');
  if (typeof day === 'string') parts.push(day);
  if (typeof revision === 'number') parts.push(`revision ${revision}`);
  return parts.join(' ');
}

/** "Deviation alert raised · Lanternside +12.3 MW" — a plain line for the handover, whatever the action. */
export function toShiftEvent(entry: AuditEntryDto, zoneNames: ZoneNames = new Map()): ShiftEventDto {
  const phrase = PHRASES[entry.action] ?? entry.action.replace(/[.-]/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
  const about = describeSubject(entry, zoneNames);
  const subject = about ? ` · ${about}` : '';
  return {
    at: entry.at,
    action: entry.action,
    actorEmail: entry.actorEmail,
    subjectType: entry.subjectType,
    subjectId: entry.subjectId,
    reason: entry.reason,
    summary: `${phrase}${subject}`,
  };
}
