import { Alert, Button, Card, FileInput, Group, Select, Stack, Text, Title } from '@mantine/core';
import { CSV_MAX_BYTES, type ZoneDto } from '@morrowline/shared';
import { useEffect, useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useUploadReadings } from '../api/use-upload-readings';
import { fileHasZoneColumn } from '../csv-header';
import { UploadReport } from './UploadReport';

const MAX_MB = CSV_MAX_BYTES / (1024 * 1024);

/**
 * Upload a CSV of past readings: `timestamp,load_mw[,zone]`. When the file has no zone column
 * the zone is chosen here; the report lists what was accepted and each row refused, by line.
 */
export function UploadPanel({ zones }: { zones: readonly ZoneDto[] }) {
  const [file, setFile] = useState<File | null>(null);
  const [hasZone, setHasZone] = useState<boolean | null>(null);
  const [zone, setZone] = useState<string | null>(null);
  const upload = useUploadReadings();

  useEffect(() => {
    let current = true;
    setHasZone(null);
    if (file) void fileHasZoneColumn(file).then((answer) => current && setHasZone(answer));
    return () => {
      current = false;
    };
  }, [file]);

  const tooLarge = file !== null && file.size > CSV_MAX_BYTES;
  const needsZone = hasZone === false;
  const ready = file !== null && !tooLarge && hasZone !== null && (!needsZone || zone !== null);

  return (
    <Card withBorder padding="md">
      <Title order={4} mb={4}>Upload history</Title>
      <Text size="sm" c="dimmed" mb="sm">
        A CSV with the columns <code>timestamp,load_mw</code> and optionally <code>zone</code>; timestamps are hour starts in ISO 8601 with an offset or Z. Up to {MAX_MB} MB. Good rows are stored even when others are refused; a later value for an hour replaces the stored one and keeps it as a revision.
      </Text>
      <Stack gap="sm">
        <Group align="flex-end" wrap="wrap">
          <FileInput
            label="CSV file"
            placeholder="Choose a file"
            accept=".csv,text/csv"
            value={file}
            onChange={(next) => {
              setFile(next);
              upload.reset();
            }}
            clearable
            w={320}
            error={tooLarge ? `The file is larger than ${MAX_MB} MB` : undefined}
          />
          <Select
            label={needsZone ? 'Zone for every row' : 'Zone'}
            description={hasZone ? 'The file names the zone on each row' : needsZone ? 'The file has no zone column' : undefined}
            placeholder="Choose a zone"
            data={zones.map((z) => ({ value: z.code, label: `${z.name} (${z.code})` }))}
            value={zone}
            onChange={setZone}
            disabled={hasZone === true}
            w={260}
          />
          <Button onClick={() => file && upload.mutate({ file, zone: needsZone ? zone : null })} disabled={!ready} loading={upload.isPending}>
            Upload and check
          </Button>
        </Group>
        {needsZone && zone === null && <Alert color="slate" variant="light" p="xs"><Text size="xs">Choose the zone these readings belong to.</Text></Alert>}
        {upload.isError && <ErrorNotice title="The file was not stored" error={upload.error} />}
        {upload.data && <UploadReport report={upload.data} />}
      </Stack>
    </Card>
  );
}
