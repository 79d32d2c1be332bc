import { Anchor, Box, Group, Loader, SimpleGrid, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import { formatLocalTime } from '@morrowline/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { Link } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { Wordmark } from '../../../components/Wordmark';
import { ConnectionBadge } from '../components/ConnectionBadge';
import { WallAlerts } from '../components/WallAlerts';
import { WallZoneTile } from '../components/WallZoneTile';
import { useLiveUpdates } from '../hooks/use-live-updates';
import { useLoadViews } from '../hooks/use-load-views';

/**
 * Besides the live channel, everything on the wall is read again this often: a wall display
 * runs unattended for a whole shift, and a socket that dropped without a word must not leave it
 * showing an old hour.
 */
const WALL_REFRESH_MS = 60_000;

/** The time of day in large type, moving on each half minute. */
function WallClock({ timeZone }: { timeZone: string }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(timer);
  }, []);
  return <Text fz={30} ff="monospace" fw={600} data-testid="wall-clock">{formatLocalTime(new Date(now).toISOString(), timeZone)}</Text>;
}

/**
 * Live load for the control room's wall: the system total and every zone, their deviation from
 * what was committed and the open alerts, in type that reads from a few metres, read-only and
 * refreshing itself (the live channel, and a full refresh each minute). It has no navigation of
 * its own to click through: a link back to the desk only.
 */
export function WallDisplayPage() {
  useDocumentTitle('Wall display · Morrowline');
  useLiveUpdates();
  const queryClient = useQueryClient();
  useEffect(() => {
    const timer = setInterval(() => void queryClient.refetchQueries({ type: 'active' }), WALL_REFRESH_MS);
    return () => clearInterval(timer);
  }, [queryClient]);
  const { zones, activeZones, timeZone, series, views, thresholds } = useLoadViews();

  return (
    <Box mih="100vh" p="xl" bg="var(--morrowline-page)">
      <Group component="header" justify="space-between" align="center" mb="lg" wrap="wrap">
        <Group gap="lg" wrap="nowrap">
          <Wordmark size={36} />
          <Title order={1} fz={40}>Live load</Title>
        </Group>
        <Group gap="lg" wrap="wrap">
          <WallClock timeZone={timeZone} />
          <ConnectionBadge />
          <Anchor component={Link} to="/live" fz="lg">Back to the desk</Anchor>
        </Group>
      </Group>
      <Stack component="main" gap="lg">
        {(zones.isError || series.isError) && <ErrorNotice error={zones.error ?? series.error} onRetry={() => void (zones.isError ? zones.refetch() : series.refetch())} />}
        {(zones.isPending || series.isPending) && !series.isError && <Loader size="lg" aria-label="Loading live load" />}
        {zones.data && activeZones.length === 0 && <Text fz={24}>No active zones.</Text>}
        {views.length > 0 && (
          <SimpleGrid cols={{ base: 1, sm: 2, lg: 3 }} spacing="lg" data-testid="wall-zones">
            {views.map((view) => (
              <WallZoneTile key={view.key} view={view} hours={series.data?.hours ?? []} thresholdPct={thresholds.get(view.key) ?? null} />
            ))}
          </SimpleGrid>
        )}
        {zones.data && <WallAlerts zones={zones.data} />}
      </Stack>
    </Box>
  );
}
