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
  'schedule.correction': 'Schedule correction started',
  'schedule.mail-failed': 'Publication e-mail failed',
  'readings.upload': 'History uploaded',
};

/** "Deviation alert raised · zone HARROW" — a plain line for the handover, whatever the action. */
export function toShiftEvent(entry: AuditEntryDto): ShiftEventDto {
  const phrase = PHRASES[entry.action] ?? entry.action.replace(/[.-]/g, ' ').replace(/^\w/, (c) => c.toUpperCase());
  const subject = entry.subjectId ? ` · ${entry.subjectType} ${entry.subjectId}` : '';
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
