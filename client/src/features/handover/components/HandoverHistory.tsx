import { Button, Center, Group, Loader, Pagination, Paper, Select, Stack, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { useMemo, useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useZones } from '../../zones';
import { useHandoverSearch } from '../api/use-handover-search';
import { HandoverNoteCard } from './HandoverNoteCard';

const PAGE_SIZE = 10;

/** Past notes, searchable by shift date range, zone and words in the text, items or reply. */
export function HandoverHistory({ onOpen }: { onOpen: (id: number) => void }) {
  const zones = useZones();
  const [text, setText] = useState('');
  const [q] = useDebouncedValue(text, 300);
  const [zone, setZone] = useState<string | null>(null);
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [page, setPage] = useState(1);
  const search = { q, zone: zone ?? undefined, from, to, limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE };
  const notes = useHandoverSearch(search);
  const zoneOptions = useMemo(() => (zones.data ?? []).map((z) => ({ value: z.code, label: `${z.name} (${z.code})` })), [zones.data]);
  const pages = notes.data ? Math.max(1, Math.ceil(notes.data.total / PAGE_SIZE)) : 1;

  // Any change of filter starts again at the first page.
  const refine = <T,>(set: (value: T) => void) => (value: T) => {
    set(value);
    setPage(1);
  };

  return (
    <Stack gap="md">
      <Paper withBorder radius="md" p="sm" data-print-hide>
        <Group align="flex-end" wrap="wrap">
          <TextInput
            label="Words"
            placeholder="in the note, its items or the reply"
            value={text}
            onChange={(event) => refine(setText)(event.currentTarget.value)}
            w={260}
          />
          <Select label="Zone" placeholder="Any zone" data={zoneOptions} value={zone} onChange={refine(setZone)} clearable w={220} />
          <TextInput label="Shift from" type="date" value={from} onChange={(event) => refine(setFrom)(event.currentTarget.value)} w={160} />
          <TextInput label="Shift to" type="date" value={to} onChange={(event) => refine(setTo)(event.currentTarget.value)} w={160} />
          <Button
            variant="subtle"
            color="slate"
            disabled={!text && !zone && !from && !to}
            onClick={() => {
              setText('');
              setZone(null);
              setFrom('');
              setTo('');
              setPage(1);
            }}
          >
            Clear
          </Button>
        </Group>
      </Paper>

      {notes.isPending && (
        <Center p="xl">
          <Loader aria-label="Loading past notes" />
        </Center>
      )}
      {notes.isError && <ErrorNotice title="Past notes could not be loaded" error={notes.error} onRetry={() => void notes.refetch()} />}
      {notes.data && (
        <Stack gap="sm" aria-label="Past notes" component="section" data-testid="handover-history">
          <Text size="sm" c="dimmed">
            {notes.data.total === 0 ? 'No note matches.' : `${notes.data.total} note${notes.data.total === 1 ? '' : 's'}, newest first`}
          </Text>
          {notes.data.items.map((note) => (
            <HandoverNoteCard
              key={note.id}
              note={note}
              actions={
                <Button size="xs" variant="light" onClick={() => onOpen(note.id)} aria-label={`Open the note for ${note.shift.label}`}>
                  Open
                </Button>
              }
            />
          ))}
          {pages > 1 && <Pagination total={pages} value={page} onChange={setPage} />}
        </Stack>
      )}
    </Stack>
  );
}
