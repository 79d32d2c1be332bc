import { Select, Stack, Text } from '@mantine/core';
import { DEMO_TIME_ZONE, may } from '@morrowline/shared';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { OutageWindowsPanel } from '../../outages';
import { useZones } from '../../zones';
import { ModelVersionsPanel } from '../components/ModelVersionsPanel';
import { WeatherResponsePanel } from '../components/WeatherResponsePanel';
import { RefitPanel } from '../components/RefitPanel';
import { useRefitProgress } from '../hooks/use-refit-progress';

/**
 * Refits: a zone's outage and bad-data windows, refits started by hand with their live progress,
 * and the zone's model versions with the comparison and promotion. The address keeps the zone.
 */
export function RefitsPage() {
  const me = useSignedInUser();
  const zones = useZones();
  const [params, setParams] = useSearchParams();
  useRefitProgress();
  const active = useMemo(() => (zones.data ?? []).filter((z) => z.active), [zones.data]);
  const names = useMemo(() => new Map((zones.data ?? []).map((z) => [z.code, z.name])), [zones.data]);
  const code = params.get('zone');
  const zone = active.find((z) => z.code === code) ?? null;
  const canAct = may(me.role, 'forecast');

  return (
    <>
      <PageHeader
        title="Refits"
        description="Mark the hours that are not normal load, refit a zone without them, and choose which model forecasts it."
        actions={
          <Select
            aria-label="Zone"
            placeholder="Choose a zone"
            data={active.map((z) => ({ value: z.code, label: `${z.name} (${z.code})` }))}
            value={zone?.code ?? null}
            onChange={(next) => setParams(next ? { zone: next } : {})}
            w={260}
            allowDeselect={false}
            searchable
          />
        }
      />
      {zones.isError && <ErrorNotice title="Zones could not be loaded" error={zones.error} onRetry={() => void zones.refetch()} />}
      {!zone && (
        <Text c="dimmed" data-testid="refits-choose-zone" mb="md">
          Choose a zone to see its windows and model versions.
        </Text>
      )}
      <Stack gap="lg">
        {zone && <OutageWindowsPanel zone={zone.code} zoneName={zone.name} timeZone={zone.timeZone ?? DEMO_TIME_ZONE} canEdit={canAct} />}
        {zone && <RefitPanel zone={zone.code} zoneName={zone.name} zoneNames={names} timeZone={zone.timeZone ?? DEMO_TIME_ZONE} canRefit={canAct} />}
        {zone && <ModelVersionsPanel zone={zone.code} zoneName={zone.name} timeZone={zone.timeZone ?? DEMO_TIME_ZONE} canPromote={canAct} />}
        {zone && <WeatherResponsePanel zone={zone.code} zoneName={zone.name} timeZone={zone.timeZone ?? DEMO_TIME_ZONE} />}
      </Stack>
    </>
  );
}
