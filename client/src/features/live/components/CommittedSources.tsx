import { Text } from '@mantine/core';
import type { CommittedDayDto } from '@morrowline/shared';
import { DateTime } from 'luxon';
import type { LoadView } from '../model/zone-view';

/** "12-01 09:05 MST": a time in the zone's clock, with its abbreviation. */
export function zoneTime(iso: string, timeZone: string): string {
  return DateTime.fromISO(iso, { zone: timeZone }).toFormat('LL-dd HH:mm ZZZZ');
}

export function describeCommittedDay(day: CommittedDayDto, timeZone: string): string {
  const date = DateTime.fromISO(day.operatingDay, { zone: timeZone }).toFormat('ccc LL-dd');
  const dayAhead = day.dayAhead
    ? `${day.dayAhead.replayed ? 'replayed day-ahead forecast as of' : 'day-ahead forecast issued'} ${zoneTime(day.dayAhead.issuedAt, timeZone)}`
    : null;
  if (day.schedule) return `${date}: published schedule rev ${day.schedule.revision} (published ${zoneTime(day.schedule.publishedAt, timeZone)})${dayAhead ? `, day-ahead forecast where it has no value` : ''}`;
  if (dayAhead) return `${date}: ${dayAhead}`;
  return `${date}: nothing committed (no schedule published, no forecast issued by gate closure ${zoneTime(day.gateClosureAt, timeZone)})`;
}

/** Per operating day on the chart, what deviation is measured against. */
export function CommittedSources({ view }: { view: LoadView }) {
  const text = view.committed.days.length > 0
    ? view.committed.days.map((d) => describeCommittedDay(d, view.timeZone)).join(' · ')
    : 'the sum of the counted zones’ committed numbers, where every one of them has a value';
  return (
    <Text size="xs" c="dimmed" data-testid="committed-sources">
      Committed — {text}.
    </Text>
  );
}
