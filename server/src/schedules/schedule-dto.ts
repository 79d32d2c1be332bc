import type { ScheduleAdjustmentDto, ScheduleRevisionDto } from '@morrowline/shared';
import type { User } from '../users/entities/user.entity';
import type { ScheduleAdjustment } from './entities/schedule-adjustment.entity';
import type { ScheduleRevision } from './entities/schedule-revision.entity';

/** The relations a revision's DTO names (populate them before mapping). */
export const REVISION_RELATIONS = ['zone', 'createdBy', 'submittedBy', 'returnedBy', 'publishedBy'] as const;

const ref = (u: User | null) => (u ? { id: u.id, name: u.name } : null);
const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function toAdjustmentDto(a: ScheduleAdjustment): ScheduleAdjustmentDto {
  return {
    id: a.id,
    revisionId: a.revision.id,
    zone: a.zoneCode,
    kind: a.kind,
    fromHour: a.fromHour,
    toHour: a.toHour,
    value: a.value,
    reason: a.reason,
    by: { id: a.by.id, name: a.by.name },
    at: a.at.toISOString(),
    undoneAt: iso(a.undoneAt),
    undoneBy: ref(a.undoneBy),
    carriedFromRevision: a.carriedFromRevision,
    batchId: a.batchId,
  };
}

/** A revision with its adjustments (those of `adjustments` that belong to it). */
export function toRevisionDto(r: ScheduleRevision, adjustments: ScheduleAdjustment[]): ScheduleRevisionDto {
  return {
    id: r.id,
    zone: r.zone.code,
    operatingDay: r.operatingDay,
    revision: r.revision,
    state: r.state,
    forecastRunId: r.forecastRunId,
    forecastIssuedAt: iso(r.forecastIssuedAt),
    forecastReplayed: r.forecastReplayed,
    hours: r.hours,
    adjustments: adjustments.filter((a) => a.revision.id === r.id).map(toAdjustmentDto),
    createdBy: { id: r.createdBy.id, name: r.createdBy.name },
    createdAt: r.createdAt.toISOString(),
    submittedBy: ref(r.submittedBy),
    submittedAt: iso(r.submittedAt),
    submitComment: r.submitComment,
    late: r.late,
    returnedBy: ref(r.returnedBy),
    returnedAt: iso(r.returnedAt),
    returnComment: r.returnComment,
    publishedBy: ref(r.publishedBy),
    publishedAt: iso(r.publishedAt),
    supersededAt: iso(r.supersededAt),
    correctionReason: r.correctionReason,
    mail: r.mailOutcome,
  };
}
