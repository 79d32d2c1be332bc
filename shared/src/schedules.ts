/**
 * Day-ahead schedules: the wire contract between the server (server/src/schedules) and the desks.
 *
 * OPERATING DAY AND HOURS
 * An operating day is the 23, 24 or 25 hours between two local midnights of the zone's time zone.
 * Hours are labelled hour-ending, the same way as client/src/lib/hour-ending.ts: the label is the
 * number of hours elapsed at the hour's end plus the hour the clock skips in spring. So a normal
 * day runs HE01..HE24, the 23-hour spring day runs HE01, HE03..HE24 (no HE02), and the 25-hour
 * autumn day runs HE01..HE25 (the repeated clock hour is HE02 and HE03, no label repeats).
 * In America/Denver: 2026-03-08 has 23 hours, 2026-11-01 has 25. The server sends each hour's
 * label and UTC start, so a desk never has to work them out itself; `index` (0-based position in
 * the day) is what adjustments name, because it is unambiguous on every day.
 *
 * WORKFLOW
 * draft → submitted (operator or supervisor) → published (approved by a supervisor who is not the
 * submitter; the zone/day's previous published revision becomes superseded) or → returned with a
 * comment (editable again, then submitted again). A published revision is immutable (409 on any
 * change); a correction is a new draft revision n+1 with a reason, on the published revision's
 * forecast run with its adjustments carried forward (each can be undone). After gate closure only a supervisor may submit, and the submission is marked late.
 * Viewers read and export; operators draft, adjust, submit; supervisors also approve, return and
 * keep the subscribers; admin takes no part (403).
 *
 * DRAFTS are started explicitly by POST /api/schedules/:day/:zone/draft (idempotent: it returns the
 * working revision when there is one). GET never writes, so viewers can read and desks can poll
 * without creating rows; the day view carries the latest forecast for the day (`forecast`) so the
 * screen shows the model before any draft exists.
 *
 * CAUTION: the screen MUST show SCHEDULE_CAUTION at the approve/publish step (next to the approve
 * button). The server puts it in the publication e-mail and in the JSON export (`notice`); the CSV
 * export carries no comment lines, it is plain columns only.
 *
 * Endpoints (all under /api/schedules):
 *   GET    /:day?zone=A,B                      DayScheduleDto            (any signed-in desk role)
 *   POST   /:day/:zone/draft                   ScheduleRevisionDto       (operator, supervisor)
 *   POST   /:day/adjustments                   AdjustmentResultDto       body CreateScheduleAdjustmentRequest
 *   DELETE /adjustments/:id                    ScheduleRevisionDto       undo (until submitted)
 *   POST   /revisions/:id/submit               ScheduleRevisionDto       body SubmitScheduleRequest
 *   POST   /revisions/:id/approve              ScheduleRevisionDto       (supervisor, not submitter) → published, e-mails sent
 *   POST   /revisions/:id/return               ScheduleRevisionDto       body ReturnScheduleRequest (supervisor)
 *   POST   /:day/:zone/corrections             ScheduleRevisionDto       body CreateScheduleCorrectionRequest
 *   POST   /revisions/:id/back-to-model        ScheduleRevisionDto       undoes every adjustment in force (draft or returned)
 *   POST   /revisions/:id/restart              ScheduleRevisionDto       start again from the latest forecast run, adjustments re-applied
 *   GET    /:day/:zone/revisions               ScheduleRevisionDto[]     history, newest first
 *   GET    /revisions/:id                      ScheduleRevisionDto
 *   GET    /revisions/:id/export?format=csv|json  file download (published or superseded revisions)
 *   GET    /subscribers                        ScheduleSubscriberDto[]   (supervisor)
 *   POST   /subscribers                        ScheduleSubscriberDto     body CreateScheduleSubscriberRequest (supervisor)
 *   DELETE /subscribers/:id                    ScheduleSubscriberDto     deactivates (supervisor)
 * `:day` is the operating day, yyyy-MM-dd; `:zone` a zone code. Every state change pushes
 * DESK_EVENTS.schedule (DeskScheduleEvent) to the desks.
 */

export const SCHEDULE_STATES = ['draft', 'submitted', 'returned', 'published', 'superseded'] as const;
export type ScheduleState = (typeof SCHEDULE_STATES)[number];

/** States in which operators may still change a revision (adjust, undo, submit). */
export const EDITABLE_SCHEDULE_STATES: readonly ScheduleState[] = ['draft', 'returned'];

/**
 * set: the hours become `value` MW. add: `value` MW is added (negative to take off).
 * scale: the hours change by `value` percent (+10 → ×1.10, −25 → ×0.75).
 */
export const SCHEDULE_ADJUSTMENT_KINDS = ['set', 'add', 'scale'] as const;
export type ScheduleAdjustmentKind = (typeof SCHEDULE_ADJUSTMENT_KINDS)[number];

/** Shown on the publish step, in the publication e-mail and in the JSON export. */
export const SCHEDULE_CAUTION =
  'Forecasts support, and never replace, the judgement of the responsible system operator. ' +
  "Operating decisions follow the control area's reliability standards, market rules and local regulations.";

/** Columns of the CSV export, in order; the JSON export's rows use the same keys. */
export const SCHEDULE_EXPORT_COLUMNS = [
  'operating_day',
  'zone',
  'hour_ending',
  'interval_start_utc',
  'mw',
  'revision',
  'published_at',
  'published_by',
] as const;

export interface ScheduleUserRef {
  id: number;
  name: string;
}

/** One hour of an operating day (the day's shape, no values). */
export interface ScheduleHourSlot {
  /** 0-based position in the operating day. */
  index: number;
  /** UTC hour start, ISO 8601 with Z. */
  intervalStartUtc: string;
  /** "HE01".."HE24", "HE25" on the autumn day; see the top of this file. */
  hourEnding: string;
}

export interface ScheduleHourDto extends ScheduleHourSlot {
  /** The model forecast's mean; null when the forecast run does not reach this hour. */
  modelMw: number | null;
  lower80: number | null;
  upper80: number | null;
  lower95: number | null;
  upper95: number | null;
  /**
   * What the adjustments start from: the model value of the revision's forecast run. A correction
   * keeps the run and the start values of the revision it corrects and carries that revision's
   * adjustments forward (corrections made before that started from the published values).
   */
  startMw: number | null;
  /** `startMw` after the active adjustments, in order; what gets published. */
  adjustedMw: number | null;
}

export interface ScheduleAdjustmentDto {
  id: number;
  revisionId: number;
  zone: string;
  kind: ScheduleAdjustmentKind;
  /** Hour indices (0-based, inclusive). */
  fromHour: number;
  toHour: number;
  /** MW for set/add, percent for scale. */
  value: number;
  reason: string;
  by: ScheduleUserRef;
  at: string;
  /** Set when undone; undone adjustments no longer count. */
  undoneAt: string | null;
  undoneBy: ScheduleUserRef | null;
  /** Carried forward by a correction from this earlier revision (reason, author and time as first made); null when made on this one. */
  carriedFromRevision: number | null;
  /** Added together with others from one weather what-if: the batch's id (its first adjustment's); undone together. Null otherwise. */
  batchId: number | null;
}

/** Turn the day's weather what-if into adjustments: exactly one of `shift` (°C) and `vintage` (issue time), and a reason. */
export interface WeatherWhatIfAdjustRequest {
  shift?: number;
  vintage?: string;
  reason: string;
}

export interface ScheduleMailOutcome {
  at: string;
  /** Subscribers the publication was sent to. */
  sent: string[];
  /** Null when every message went out; otherwise what the mail server said. */
  error: string | null;
}

export interface ScheduleRevisionDto {
  id: number;
  zone: string;
  operatingDay: string;
  /** 1, 2, … per zone and operating day. */
  revision: number;
  state: ScheduleState;
  forecastRunId: number | null;
  forecastIssuedAt: string | null;
  /** The model values came from a replayed forecast run (see FORECAST_ORIGINS), not an issued one. */
  forecastReplayed: boolean;
  hours: ScheduleHourDto[];
  /** Every adjustment, in the order made, undone ones included (undoneAt set). */
  adjustments: ScheduleAdjustmentDto[];
  createdBy: ScheduleUserRef;
  createdAt: string;
  submittedBy: ScheduleUserRef | null;
  submittedAt: string | null;
  submitComment: string | null;
  /** Submitted after gate closure (only a supervisor may do that). */
  late: boolean;
  returnedBy: ScheduleUserRef | null;
  returnedAt: string | null;
  returnComment: string | null;
  /** Approval and publication are one step. */
  publishedBy: ScheduleUserRef | null;
  publishedAt: string | null;
  supersededAt: string | null;
  /** Why a revision after the first was made. */
  correctionReason: string | null;
  /** Outcome of the publication e-mails; null before publication. */
  mail: ScheduleMailOutcome | null;
}

export interface ZoneScheduleDto {
  zone: string;
  zoneName: string;
  timeZone: string;
  operatingDay: string;
  /** The day's hours: 23, 24 or 25. */
  slots: ScheduleHourSlot[];
  /** Gate closure: the zone's gateClosure local time on the day before the operating day. */
  gateClosureAt: string;
  /** Seconds from serverTime to gate closure; negative once it has passed. */
  secondsToGateClosure: number;
  gateClosed: boolean;
  /** The latest forecast run's values for this day (modelMw etc.; adjustedMw = modelMw). */
  forecast: { runId: number | null; issuedAt: string; hours: ScheduleHourDto[] } | null;
  /**
   * A stored run issued after the one the working revision (or, with none, the published one)
   * started from: the model has moved since. Null when the revision is on the latest run.
   */
  newerForecast: { runId: number; issuedAt: string; revisionRunId: number | null; revisionIssuedAt: string | null } | null;
  /** The revision being worked on: draft, submitted or returned; null if none. */
  working: ScheduleRevisionDto | null;
  /** The revision in force; null before the first publication. */
  published: ScheduleRevisionDto | null;
}

export interface DayScheduleDto {
  operatingDay: string;
  serverTime: string;
  caution: string;
  zones: ZoneScheduleDto[];
}

export interface CreateScheduleAdjustmentRequest {
  /** Zone codes; each zone's draft (or returned) revision gets the adjustment; all or none. */
  zones: string[];
  kind: ScheduleAdjustmentKind;
  fromHour: number;
  toHour: number;
  value: number;
  reason: string;
}

export interface AdjustmentResultDto {
  adjustments: ScheduleAdjustmentDto[];
  revisions: ScheduleRevisionDto[];
}

export interface SubmitScheduleRequest {
  comment?: string;
}

export interface ReturnScheduleRequest {
  comment: string;
}

export interface CreateScheduleCorrectionRequest {
  reason: string;
}

export interface ScheduleSubscriberDto {
  id: number;
  email: string;
  name: string;
  /** Zone codes; null means every zone. */
  zones: string[] | null;
  active: boolean;
  addedBy: ScheduleUserRef | null;
  addedAt: string;
}

/** Adding an e-mail that is already kept updates it and makes it active again. */
export interface CreateScheduleSubscriberRequest {
  email: string;
  name: string;
  zones?: string[] | null;
}

export interface ScheduleExportRow {
  operating_day: string;
  zone: string;
  hour_ending: string;
  interval_start_utc: string;
  mw: number;
  revision: number;
  published_at: string;
  /** The publishing supervisor's e-mail. */
  published_by: string;
}

/** GET /revisions/:id/export?format=json */
export interface ScheduleExportJson {
  notice: string;
  zone: string;
  operatingDay: string;
  revision: number;
  state: ScheduleState;
  columns: readonly string[];
  rows: ScheduleExportRow[];
}

/** Pushed as DESK_EVENTS.schedule on every state change and adjustment. */
export interface DeskScheduleEvent {
  action: 'draft' | 'adjust' | 'adjust-undo' | 'back-to-model' | 'restart' | 'submit' | 'return' | 'publish' | 'correction' | 'mail';
  zone: string;
  operatingDay: string;
  revisionId: number;
  revision: number;
  state: ScheduleState;
}

export interface ScheduleAdjustmentInput {
  kind: ScheduleAdjustmentKind;
  fromHour: number;
  toHour: number;
  value: number;
}

export type ReplayResult = { ok: true; values: (number | null)[] } | { ok: false; hour: number; message: string };

/** MW values are kept to 0.1 MW. */
function roundMw(mw: number): number {
  return Math.round(mw * 10) / 10;
}

/**
 * The adjusted values: the start values (model, or published for a correction) with the adjustments applied in order (pure; the server
 * uses it and a desk may use it to preview). Refuses a range outside the day, an add or scale on
 * an hour without a value, and any result below 0 MW.
 */
export function replayAdjustments(
  start: readonly (number | null)[],
  adjustments: readonly ScheduleAdjustmentInput[],
  /** Hour-ending labels for the messages (else "hour <index>"). */
  labels?: readonly string[],
): ReplayResult {
  const values = start.map((v) => (v === null ? null : roundMw(v)));
  const name = (h: number) => labels?.[h] ?? `hour ${h}`;
  for (const a of adjustments) {
    if (!Number.isInteger(a.fromHour) || !Number.isInteger(a.toHour) || a.fromHour < 0 || a.toHour >= values.length || a.fromHour > a.toHour) {
      return { ok: false, hour: a.fromHour, message: `hours ${a.fromHour}..${a.toHour} are not within the day's ${values.length} hours` };
    }
    for (let h = a.fromHour; h <= a.toHour; h++) {
      const current = values[h];
      let next: number;
      if (a.kind === 'set') next = a.value;
      else if (current === null) return { ok: false, hour: h, message: `${name(h)} has no value to ${a.kind === 'add' ? 'add to' : 'scale'}; set it first` };
      else if (a.kind === 'add') next = current + a.value;
      else next = current * (1 + a.value / 100);
      next = roundMw(next);
      if (!Number.isFinite(next) || next < 0) return { ok: false, hour: h, message: `${name(h)} would be ${next} MW; a schedule is never below 0 MW` };
      values[h] = next;
    }
  }
  return { ok: true, values };
}
