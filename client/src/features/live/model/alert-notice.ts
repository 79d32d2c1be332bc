import { committedBasisLabel, HOUR_MS, type AlertDto } from '@morrowline/shared';
import { formatPercent } from '../../../lib/format';

/** The one notice that carries every deviation alert raised while it is up (id for Mantine's store). */
export const ALERT_NOTICE_ID = 'deviation-alerts';
/** Alerts spelt out in the notice; the rest are counted (they are all in the alert list). */
export const ALERT_NOTICE_LISTED = 3;

export interface NoticeAlert {
  alert: AlertDto;
  /** raised again with a longer or larger deviation */
  widened: boolean;
}

function line(alert: AlertDto): string {
  const hours = Math.round((Date.parse(alert.end) - Date.parse(alert.start)) / HOUR_MS);
  return `load ${alert.peakDeviationPct >= 0 ? 'above' : 'below'} the ${committedBasisLabel(alert.comparedWith)} by up to ${formatPercent(Math.abs(alert.peakDeviationPct))} for ${hours} h (threshold ${formatPercent(alert.thresholdPct, 0)})`;
}

/**
 * The words of the deviation-alert notice. One alert reads as before; several (a fresh demo raises
 * four at once) share one notice instead of a stack of four over the top of the page: a title
 * counting the zones, the first few spelt out newest first, the rest counted.
 */
export function alertNotice(entries: readonly NoticeAlert[], zoneName: (code: string) => string): { title: string; message: string } {
  const list = [...entries].reverse();
  if (list.length === 1) {
    const { alert, widened } = list[0];
    const text = line(alert);
    return { title: `${widened ? 'Deviation alert widened' : 'Deviation alert'}: ${zoneName(alert.zone)}`, message: `${text[0].toUpperCase()}${text.slice(1)}.` };
  }
  const zones = new Set(list.map((e) => e.alert.zone));
  const shown = list.slice(0, ALERT_NOTICE_LISTED).map((e) => `${zoneName(e.alert.zone)}${e.widened ? ' (widened)' : ''}: ${line(e.alert)}.`);
  const more = list.length - shown.length;
  return {
    title: `${list.length} deviation alerts in ${zones.size} zone${zones.size === 1 ? '' : 's'}`,
    message: [...shown, ...(more > 0 ? [`And ${more} more in the alert list.`] : [])].join(' '),
  };
}
