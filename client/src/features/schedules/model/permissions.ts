import { EDITABLE_SCHEDULE_STATES, may, type ScheduleRevisionDto, type UserDto, type ZoneScheduleDto } from '@morrowline/shared';

type Viewer = Pick<UserDto, 'id' | 'role'>;

/** What the screen offers one person for one zone's schedule. The server applies the same rules and has the last word. */
export interface ScheduleActions {
  /** "Start the draft": nothing is being worked on and nothing is published yet. */
  startDraft: boolean;
  /** Add and undo adjustments. */
  adjust: boolean;
  submit: boolean;
  /** The submission will be after gate closure: say so before the button is pressed. */
  submitIsLate: boolean;
  /** Why an operator cannot submit right now (gate closed), to say in words. */
  submitRefusal: string | null;
  approve: boolean;
  returnToOperator: boolean;
  /** Why a supervisor is not offered approval (own submission). */
  approveRefusal: string | null;
  /** Start a new revision of the published one. */
  correct: boolean;
  manageSubscribers: boolean;
}

export function isForecaster(user: Viewer): boolean {
  return may(user.role, 'forecast');
}

export function isEditable(revision: ScheduleRevisionDto | null): revision is ScheduleRevisionDto {
  return revision !== null && EDITABLE_SCHEDULE_STATES.includes(revision.state);
}

export function scheduleActions(user: Viewer, zone: Pick<ZoneScheduleDto, 'working' | 'published' | 'gateClosed'>): ScheduleActions {
  const forecaster = isForecaster(user);
  const supervisor = may(user.role, 'supervise');
  const working = zone.working;
  const editable = forecaster && isEditable(working);
  const submitted = working?.state === 'submitted';
  const ownSubmission = submitted && working.submittedBy?.id === user.id;
  const mayReview = supervisor && submitted && !ownSubmission;
  return {
    startDraft: forecaster && working === null && zone.published === null,
    adjust: editable,
    submit: editable && (!zone.gateClosed || supervisor),
    submitIsLate: editable && zone.gateClosed && supervisor,
    submitRefusal: editable && zone.gateClosed && !supervisor ? 'Gate closed: only a supervisor may submit now, and the submission is marked late.' : null,
    approve: mayReview,
    returnToOperator: mayReview,
    approveRefusal: supervisor && ownSubmission ? 'You submitted this revision: another supervisor approves it.' : null,
    correct: forecaster && working === null && zone.published !== null,
    manageSubscribers: supervisor,
  };
}

/** Published and superseded revisions can be downloaded, by viewers too. */
export function mayDownload(revision: Pick<ScheduleRevisionDto, 'state'> | null): boolean {
  return revision !== null && (revision.state === 'published' || revision.state === 'superseded');
}
