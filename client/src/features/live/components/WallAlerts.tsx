import { Paper, Stack, Text } from '@mantine/core';
import type { ZoneDto } from '@morrowline/shared';
import { formatPercent } from '../../../lib/format';
import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { useOpenAlerts } from '../api/use-open-alerts';
import { alertHours } from './alert-hours';

/** The open deviation alerts in large type: zone, hours and peak deviation, newest first. */
export function WallAlerts({ zones }: { zones: readonly ZoneDto[] }) {
  const alerts = useOpenAlerts();
  const open = alerts.data ?? [];
  return (
    <Paper withBorder p="lg" radius="md" component="section" aria-labelledby="wall-alerts" data-testid="wall-alerts">
      <Text component="h2" id="wall-alerts" fz={30} fw={700} m={0} mb="sm">
        Open deviation alerts: {alerts.data ? open.length : '…'}
      </Text>
      {alerts.data && open.length === 0 && <Text fz={24}>None: every zone is within its threshold.</Text>}
      <Stack gap="xs" component="ul" p={0} m={0} style={{ listStyle: 'none' }}>
        {open.map((alert) => {
          const zone = zones.find((z) => z.code === alert.zone);
          return (
            <Text component="li" key={alert.id} fz={26} data-testid={`wall-alert-${alert.id}`}>
              <Text span inherit fw={700}>{zone?.name ?? alert.zone}</Text>{' '}
              <Text span inherit ff="monospace">{alertHours(alert, zone?.timeZone ?? 'UTC')}</Text>{' '}
              <Text span inherit ff="monospace" fw={700} c={ATTENTION_TEXT}>
                {alert.peakDeviationPct > 0 ? '▲ +' : '▼ '}
                {formatPercent(alert.peakDeviationPct)}
              </Text>{' '}
              {alert.peakDeviationPct > 0 ? 'above' : 'below'} committed
            </Text>
          );
        })}
      </Stack>
    </Paper>
  );
}
