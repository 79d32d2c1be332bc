import { formatLocalTime, formatUtcTime, SCHEDULE_CAUTION, SCHEDULE_EXPORT_COLUMNS, type ScheduleExportJson, type ScheduleExportRow, type ScheduleRevisionDto } from '@morrowline/shared';

/** Rows of a published revision, one per hour of the operating day (23, 24 or 25). */
export function exportRows(revision: ScheduleRevisionDto, publishedByEmail: string): ScheduleExportRow[] {
  return revision.hours.map((h) => ({
    operating_day: revision.operatingDay,
    zone: revision.zone,
    hour_ending: h.hourEnding,
    interval_start_utc: h.intervalStartUtc,
    mw: h.adjustedMw ?? 0,
    revision: revision.revision,
    published_at: revision.publishedAt ?? '',
    published_by: publishedByEmail,
  }));
}

export function exportJson(revision: ScheduleRevisionDto, publishedByEmail: string): ScheduleExportJson {
  return {
    notice: SCHEDULE_CAUTION,
    zone: revision.zone,
    operatingDay: revision.operatingDay,
    revision: revision.revision,
    state: revision.state,
    columns: SCHEDULE_EXPORT_COLUMNS,
    rows: exportRows(revision, publishedByEmail),
  };
}

const cell = (v: string | number) => {
  const s = String(v);
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

/** Plain CSV: a header line and one line per hour, nothing else (the caution goes in the JSON and e-mail). */
export function exportCsv(revision: ScheduleRevisionDto, publishedByEmail: string): string {
  const rows = exportRows(revision, publishedByEmail);
  const lines = [SCHEDULE_EXPORT_COLUMNS.join(','), ...rows.map((r) => SCHEDULE_EXPORT_COLUMNS.map((c) => cell(r[c])).join(','))];
  return lines.join('\r\n') + '\r\n';
}

/**
 * The publication e-mail: subject, and a plain-text body with the hourly table and the caution.
 * Times follow the desk's clock rule: the zone's local time with its abbreviation, UTC labelled.
 */
export function publicationMail(revision: ScheduleRevisionDto, zone: { name: string; timeZone: string }, publisher: { name: string; email: string }): { subject: string; text: string } {
  const zoneName = zone.name;
  const publishedAt = `${formatLocalTime(revision.publishedAt, zone.timeZone)} (${formatUtcTime(revision.publishedAt)})`;
  const subject = `Day-ahead schedule ${revision.zone} ${revision.operatingDay} revision ${revision.revision} published`;
  const total = revision.hours.reduce((sum, h) => sum + (h.adjustedMw ?? 0), 0);
  const table = ['HE     MW', ...revision.hours.map((h) => `${h.hourEnding.padEnd(6)} ${(h.adjustedMw ?? 0).toFixed(1).padStart(8)}`)];
  const text = [
    `The day-ahead schedule for ${zoneName} (${revision.zone}), operating day ${revision.operatingDay}, revision ${revision.revision}, was published`,
    `by ${publisher.name} <${publisher.email}> at ${publishedAt}.`,
    ...(revision.correctionReason ? [`Correction: ${revision.correctionReason}`] : []),
    ...(revision.late ? ['It was submitted after gate closure.'] : []),
    '',
    `${revision.hours.length} hours, ${total.toFixed(1)} MWh in total:`,
    '',
    ...table,
    '',
    SCHEDULE_CAUTION,
    '',
  ].join('\n');
  return { subject, text };
}
