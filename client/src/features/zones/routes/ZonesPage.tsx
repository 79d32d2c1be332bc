import { Button, Center, Loader, Paper, Text } from '@mantine/core';
import type { ZoneDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useZones } from '../api/use-zones';
import { ZoneDialog } from '../components/ZoneDialog';
import { ZonesTable } from '../components/ZonesTable';

/** The dialog is closed, adding a zone (null) or editing one. */
type Editing = { zone: ZoneDto | null } | undefined;

export function ZonesPage() {
  const zones = useZones();
  const [editing, setEditing] = useState<Editing>(undefined);

  return (
    <>
      <PageHeader
        title="Zones"
        description="Load zones, their local time, gate closure and when a deviation becomes an alert."
        actions={<Button onClick={() => setEditing({ zone: null })}>Add zone</Button>}
      />
      <Paper withBorder radius="md" p="xs">
        {zones.isPending && (
          <Center p="xl">
            <Loader aria-label="Loading zones" />
          </Center>
        )}
        {zones.isError && <ErrorNotice title="Zones could not be loaded" error={zones.error} onRetry={() => void zones.refetch()} />}
        {zones.data && zones.data.length === 0 && (
          <Text c="dimmed" ta="center" p="xl">
            No zones yet. Add the first one to start receiving readings.
          </Text>
        )}
        {zones.data && zones.data.length > 0 && <ZonesTable zones={zones.data} onEdit={(zone) => setEditing({ zone })} />}
      </Paper>
      {editing && <ZoneDialog zone={editing.zone} onClose={() => setEditing(undefined)} />}
    </>
  );
}
