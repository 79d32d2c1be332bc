import { Button, Card, Group, Select, Text, Title } from '@mantine/core';
import { DatePickerInput } from '@mantine/dates';
import { operatingDayStart, type ZoneDto } from '@morrowline/shared';
import { DateTime } from 'luxon';
import { useState } from 'react';
import { notifyFailure } from '../../../lib/notify';
import { downloadReadings } from '../api/download-readings';

type Range = [string | null, string | null];

function defaultRange(timeZone: string): Range {
  const today = DateTime.now().setZone(timeZone);
  return [today.minus({ days: 7 }).toISODate(), today.minus({ days: 1 }).toISODate()];
}

/** Readings of one zone over whole operating days (the zone's local midnights), as CSV. */
export function DownloadPanel({ zones }: { zones: readonly ZoneDto[] }) {
  const [zoneCode, setZoneCode] = useState<string | null>(zones[0]?.code ?? null);
  const zone = zones.find((z) => z.code === zoneCode) ?? null;
  const [range, setRange] = useState<Range>(() => defaultRange(zones[0]?.timeZone ?? 'UTC'));
  const [busy, setBusy] = useState(false);
  const [first, last] = range;

  const download = async () => {
    if (!zone || !first || !last) return;
    const from = new Date(operatingDayStart(first, zone.timeZone)).toISOString();
    const nextDay = DateTime.fromISO(last).plus({ days: 1 }).toISODate() as string;
    const to = new Date(operatingDayStart(nextDay, zone.timeZone)).toISOString();
    setBusy(true);
    try {
      await downloadReadings(zone.code, from, to, `readings-${zone.code.toLowerCase()}-${first}-to-${last}.csv`);
    } catch (error) {
      notifyFailure('The readings could not be downloaded', error);
    } finally {
      setBusy(false);
    }
  };

  return (
    <Card withBorder padding="md">
      <Title order={4} mb={4}>Download readings</Title>
      <Text size="sm" c="dimmed" mb="sm">
        Hourly readings of a zone as CSV, from the first operating day to the last (both included, local midnight to local midnight).
      </Text>
      <Group align="flex-end" wrap="wrap">
        <Select label="Zone" data={zones.map((z) => ({ value: z.code, label: `${z.name} (${z.code})` }))} value={zoneCode} onChange={setZoneCode} w={260} allowDeselect={false} />
        <DatePickerInput type="range" label="Operating days" value={range} onChange={(value) => setRange(value as Range)} w={280} valueFormat="YYYY-MM-DD" data-testid="download-range" />
        <Button variant="light" onClick={() => void download()} disabled={!zone || !first || !last} loading={busy}>
          Download CSV
        </Button>
      </Group>
    </Card>
  );
}
