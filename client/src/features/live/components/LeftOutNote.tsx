import { Text } from '@mantine/core';
import { formatDateTime } from '../../../lib/format';
import { SILENT_AFTER_HOURS, type LeftOutZone, type LoadView } from '../model/zone-view';

function why(zone: LeftOutZone, timeZone: string): string {
  if (zone.reason === 'switched-off') return 'switched off';
  if (zone.reason === 'never-reported') return 'has never reported';
  return `no reading in the last ${SILENT_AFTER_HOURS} hours; last hour stored ${formatDateTime(zone.lastHour, timeZone)}`;
}

/** Names the zones the system total leaves out and why, so that a smaller total is not read as less load. */
export function LeftOutNote({ view }: { view: LoadView }) {
  if (view.leftOut.length === 0) return null;
  return (
    <Text size="sm" c="dimmed" mb="xs" data-testid="left-out-note">
      Left out of the total: {view.leftOut.map((z) => `${z.name} (${why(z, view.timeZone)})`).join('; ')}.
    </Text>
  );
}
