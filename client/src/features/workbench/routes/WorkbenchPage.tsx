import { Center, Group, Loader, SegmentedControl, Select, Stack, Text } from '@mantine/core';
import { DEMO_TIME_ZONE, may, WORKBENCH_DEFAULT_WEEKS } from '@morrowline/shared';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { api } from '../../../lib/api-client';
import { useQuery } from '@tanstack/react-query';
import type { ZoneDto } from '@morrowline/shared';
import { useSignedInUser } from '../../auth';
import { useModelReport, useStationarity } from '../api/use-workbench';
import { LoadTemperaturePanel } from '../components/LoadTemperaturePanel';
import { BacktestPanel } from '../components/BacktestPanel';
import { ModelPanel } from '../components/ModelPanel';
import { StationarityPanel } from '../components/StationarityPanel';

/** GET /api/zones (the zones feature keeps its hooks to itself). */
function useZoneList() {
  return useQuery({ queryKey: ['zones'], queryFn: ({ signal }) => api.get<ZoneDto[]>('/zones', { signal }), staleTime: 5 * 60_000 });
}

function Loading({ what }: { what: string }) {
  return (
    <Center p="xl">
      <Stack align="center" gap="xs">
        <Loader aria-label={`Loading ${what}`} />
        <Text size="sm" c="dimmed">
          Working out {what}…
        </Text>
      </Stack>
    </Center>
  );
}

export function WorkbenchPage() {
  const me = useSignedInUser();
  const zones = useZoneList();
  const [params, setParams] = useSearchParams();
  const [weeks, setWeeks] = useState(String(WORKBENCH_DEFAULT_WEEKS));
  const zone = params.get('zone');
  const stationarity = useStationarity(zone, Number(weeks));
  const model = useModelReport(zone, Number(weeks));
  const canRun = may(me.role, 'forecast');
  const active = (zones.data ?? []).filter((z) => z.active);

  return (
    <>
      <PageHeader
        title="Model workbench"
        description="Why a zone's load is or is not stationary, the model the desk would fit to it, and how that model would have done."
        actions={
          <Group gap="sm">
            <Select
              aria-label="Zone"
              placeholder="Choose a zone"
              data={active.map((z) => ({ value: z.code, label: `${z.name} (${z.code})` }))}
              value={zone}
              onChange={(code) => setParams(code ? { zone: code } : {})}
              w={260}
              allowDeselect={false}
              searchable
            />
            <SegmentedControl value={weeks} onChange={setWeeks} data={['4', '8', '12'].map((w) => ({ value: w, label: `${w} weeks` }))} aria-label="Weeks of history" />
          </Group>
        }
      />
      {zones.isError && <ErrorNotice title="Zones could not be loaded" error={zones.error} onRetry={() => void zones.refetch()} />}
      {!zone && (
        <Text c="dimmed" data-testid="workbench-choose-zone">
          Choose a zone to analyse its hourly load.
        </Text>
      )}
      {zone && (
        <Stack gap="lg">
          {stationarity.isPending && <Loading what="the stationarity checks" />}
          {stationarity.isError && <ErrorNotice title="The stationarity checks could not be made" error={stationarity.error} onRetry={() => void stationarity.refetch()} />}
          {stationarity.data && <StationarityPanel key={`${zone}-${weeks}`} report={stationarity.data} />}
          {model.isPending && <Loading what="the model" />}
          {model.isError && !stationarity.isError && <ErrorNotice title="The model could not be fitted" error={model.error} onRetry={() => void model.refetch()} />}
          {model.data && <ModelPanel report={model.data} />}
          {stationarity.data && <BacktestPanel key={zone} zone={zone} canRun={canRun} />}
          <LoadTemperaturePanel zone={zone} weeks={Number(weeks)} timeZone={active.find((z) => z.code === zone)?.timeZone ?? DEMO_TIME_ZONE} />
        </Stack>
      )}
    </>
  );
}
