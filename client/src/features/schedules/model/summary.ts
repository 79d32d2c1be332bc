/** What the zone header says about a day's adjusted values: how many hours, how many blank, the energy. */
export interface ScheduleSummary {
  hours: number;
  /** Hours with no adjusted value: not in the energy or the peak. */
  blank: number;
  /** Sum of the adjusted MW over the hours that have one (1 h each, so MWh). */
  energyMwh: number;
  /** Highest adjusted MW, null when every hour is blank. */
  peakMw: number | null;
}

/** Over the rows of the table or the hours of a revision: anything with an adjusted MW per hour. */
export function scheduleSummary(rows: readonly { adjustedMw: number | null }[]): ScheduleSummary {
  const values = rows.map((row) => row.adjustedMw).filter((mw): mw is number => mw !== null);
  return {
    hours: rows.length,
    blank: rows.length - values.length,
    energyMwh: values.reduce((sum, mw) => sum + mw, 0),
    peakMw: values.length > 0 ? Math.max(...values) : null,
  };
}

/**
 * "24 hours · 3,086 MWh adjusted" when every hour has a value; "24 hours, 8 blank · 3,086 MWh
 * adjusted over 16 hours" otherwise, so a short total never passes for the day's energy.
 */
export function describeScheduleSummary(summary: ScheduleSummary): string {
  const mwh = `${Math.round(summary.energyMwh).toLocaleString('en-US')} MWh adjusted`;
  if (summary.blank === 0) return `${summary.hours} hours · ${mwh}`;
  if (summary.blank === summary.hours) return `${summary.hours} hours, all blank`;
  const filled = summary.hours - summary.blank;
  return `${summary.hours} hours, ${summary.blank} blank · ${mwh} over ${filled} hour${filled === 1 ? '' : 's'}`;
}
