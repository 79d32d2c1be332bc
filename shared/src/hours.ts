/**
 * Hour arithmetic. Every series in Morrowline is hourly and keyed by the UTC start of the hour
 * (epoch ms): these are the only constants and roundings the server, the desk and the simulator
 * use for it. (The engine keeps its own, being a package that depends on nothing of ours.)
 */

/** One hour in milliseconds. */
export const HOUR_MS = 3_600_000;

/** Hours in a week: the weekly season of hourly load. */
export const WEEK_HOURS = 168;

/** The start of the UTC hour `ms` falls in. */
export function floorHour(ms: number): number {
  return Math.floor(ms / HOUR_MS) * HOUR_MS;
}

/** `ms` itself when it is an hour start, else the start of the next hour. */
export function ceilHour(ms: number): number {
  return Math.ceil(ms / HOUR_MS) * HOUR_MS;
}
