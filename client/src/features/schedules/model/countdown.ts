import { HOUR_MS } from '@morrowline/shared';

const MINUTE_MS = 60_000;

export interface GateCountdown {
  /** "5 h 12 min to gate closure", "42 min to gate closure", "Gate closed". */
  text: string;
  /** Inside the last hour before gate closure. */
  urgent: boolean;
  closed: boolean;
}

/**
 * How long until gate closure, in whole minutes rounded down (so "0 min" never shows while time
 * is left: the last minute reads "under 1 min"). Urgent in the last hour; "Gate closed" after.
 */
export function gateCountdown(gateClosureAt: number, now: number): GateCountdown {
  const left = gateClosureAt - now;
  if (left <= 0) return { text: 'Gate closed', urgent: false, closed: true };
  const urgent = left <= HOUR_MS;
  const minutes = Math.floor(left / MINUTE_MS);
  if (minutes < 1) return { text: 'Under 1 min to gate closure', urgent, closed: false };
  const days = Math.floor(minutes / (24 * 60));
  const hours = Math.floor((minutes % (24 * 60)) / 60);
  const rest = minutes % 60;
  const parts: string[] = [];
  if (days > 0) parts.push(`${days} d`);
  if (days > 0 || hours > 0) parts.push(`${hours} h`);
  parts.push(`${rest} min`);
  return { text: `${parts.join(' ')} to gate closure`, urgent, closed: false };
}
