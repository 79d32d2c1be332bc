import type { ZoneScheduleDto } from '@morrowline/shared';

/**
 * What the schedule chart's solid line is, in words that are true for the zones it sums: the model
 * forecast where nothing is drafted, the working revision's adjusted values before they are
 * published, the published values once they are. Calling it "what is published" before anything
 * was drafted or approved told the operator something that was not so.
 */
export function adjustedLegend(zones: ReadonlyArray<Pick<ZoneScheduleDto, 'working' | 'published'>>): string {
  const kinds = new Set(zones.map((z) => (z.working ? 'working' : z.published ? 'published' : 'none')));
  if (kinds.size === 0 || (kinds.size === 1 && kinds.has('none'))) return 'Schedule: the model forecast (nothing drafted yet)';
  if (kinds.size === 1 && kinds.has('published')) return 'Published schedule';
  if (kinds.size === 1 && kinds.has('working')) return 'Adjusted (not yet published)';
  return 'Schedule as it stands per zone (drafted, published or the model forecast)';
}
