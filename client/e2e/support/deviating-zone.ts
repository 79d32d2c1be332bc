import { DEMO_TIME_ZONE } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { apiToken, historyCsv, HOUR_MS, uploadHistory, type LoadShape } from './history';
import { insertPastForecastRun } from './test-database';
import { ownZone } from './zones';

/**
 * A zone of the test's own with eight weeks of history and a day-ahead forecast, issued before
 * yesterday's gate closure for yesterday, today and tomorrow, 12 % under the load a week earlier:
 * the live view shows deviations beyond the 8 % threshold, the upload raises alerts, and the
 * schedule has a forecast for tomorrow. The gate closes at 23:59, so an operator may still submit.
 */
export async function zoneWithDeviatingLoad(code: string, name: string, shape: LoadShape): Promise<void> {
  await ownZone(code, name, '23:59');
  const csv = historyCsv(8 * 168, shape);
  const loads = new Map(csv.trim().split('\n').slice(1).map((row) => [Date.parse(row.split(',')[0]), Number(row.split(',')[1])]));
  const today = DateTime.now().setZone(DEMO_TIME_ZONE).startOf('day');
  const first = today.minus({ days: 1 }).toMillis();
  const mean = Array.from({ length: 72 }, (_, i) => Math.round((loads.get(first + i * HOUR_MS - 7 * 24 * HOUR_MS) ?? shape.baseMw) * 0.88 * 10) / 10);
  await insertPastForecastRun({ zone: code, issuedAt: new Date(today.minus({ days: 2 }).toMillis()), firstHour: new Date(first), mean });
  await uploadHistory(await apiToken('operator'), code, csv, `${code.toLowerCase()}-history.csv`);
}
