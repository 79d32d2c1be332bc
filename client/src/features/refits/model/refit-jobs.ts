import type { RefitJobDto } from '@morrowline/shared';

/** How many jobs the screen lists. */
export const RECENT_JOBS = 25;

/**
 * The job list after one progress event: the job replaces its earlier self or joins the list,
 * newest first. An event older than what the list holds (same job, less progress or an earlier
 * state, arriving late) is ignored, so a bar never runs backwards.
 */
export function mergeJobs(list: readonly RefitJobDto[], job: RefitJobDto): RefitJobDto[] {
  const known = list.find((j) => j.id === job.id);
  if (known && isBehind(job, known)) return list as RefitJobDto[];
  const next = [job, ...list.filter((j) => j.id !== job.id)];
  next.sort((a, b) => b.id - a.id);
  return next.slice(0, RECENT_JOBS);
}

const ORDER = { queued: 0, running: 1, done: 2, failed: 2 } as const;

function isBehind(event: RefitJobDto, known: RefitJobDto): boolean {
  if (ORDER[event.state] !== ORDER[known.state]) return ORDER[event.state] < ORDER[known.state];
  return event.state === 'running' && event.progress < known.progress;
}

/** Whether a job still has something to show happening. */
export function isActive(job: RefitJobDto): boolean {
  return job.state === 'queued' || job.state === 'running';
}
