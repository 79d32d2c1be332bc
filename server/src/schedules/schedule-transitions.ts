import { EDITABLE_SCHEDULE_STATES, type ScheduleState } from '@morrowline/shared';

/**
 * The schedule workflow as a table: which states each action may start from and which state it
 * leaves the revision in. Adjusting and undoing keep the state; a correction is no transition
 * but a new draft revision started from the published one (the published one is superseded when
 * the correction is approved).
 *
 *   draft ──submit──▶ submitted ──approve──▶ published ──supersede──▶ superseded
 *     ▲                  │
 *     └──── returned ◀─return (submit again from returned)
 */
export const SCHEDULE_TRANSITIONS = {
  adjust: { from: EDITABLE_SCHEDULE_STATES, to: null, verb: 'adjust' },
  undo: { from: EDITABLE_SCHEDULE_STATES, to: null, verb: 'undo an adjustment of' },
  submit: { from: EDITABLE_SCHEDULE_STATES, to: 'submitted', verb: 'submit' },
  return: { from: ['submitted'], to: 'returned', verb: 'return' },
  approve: { from: ['submitted'], to: 'published', verb: 'approve' },
  supersede: { from: ['published'], to: 'superseded', verb: 'supersede' },
} as const satisfies Record<string, { from: readonly ScheduleState[]; to: ScheduleState | null; verb: string }>;

export type ScheduleAction = keyof typeof SCHEDULE_TRANSITIONS;

/** What the refusal names: the revision, its zone and day, and its state. */
export interface RevisionAt {
  state: ScheduleState;
  revision: number;
  zone: string;
  operatingDay: string;
}

/** Why `action` may not be taken on the revision (a conflict to tell the user), or null when it may. */
export function transitionRefusal(action: ScheduleAction, r: RevisionAt): string | null {
  const rule = SCHEDULE_TRANSITIONS[action];
  if ((rule.from as readonly ScheduleState[]).includes(r.state)) return null;
  switch (action) {
    case 'return':
      return `Only a submitted schedule can be returned; revision ${r.revision} of ${r.zone} ${r.operatingDay} is ${r.state}`;
    case 'approve':
      return r.state === 'published' || r.state === 'superseded'
        ? `Revision ${r.revision} of ${r.zone} ${r.operatingDay} is already ${r.state}; it cannot be changed`
        : `Revision ${r.revision} of ${r.zone} ${r.operatingDay} is ${r.state}; it must be submitted before it is approved`;
    case 'supersede':
      return `Revision ${r.revision} of ${r.zone} ${r.operatingDay} is ${r.state}; only the published revision is superseded`;
    default: {
      const where = `revision ${r.revision} of ${r.zone} ${r.operatingDay}`;
      if (r.state === 'submitted') return `Cannot ${rule.verb} ${where}: it is submitted; a supervisor must return it first`;
      return `Cannot ${rule.verb} ${where}: it is ${r.state} and cannot be changed; a change is a correction (a new revision)`;
    }
  }
}

/** The state the revision is in after `action` (the same state for adjust and undo). */
export function stateAfter(action: ScheduleAction, from: ScheduleState): ScheduleState {
  return SCHEDULE_TRANSITIONS[action].to ?? from;
}
