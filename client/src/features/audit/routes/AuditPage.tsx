import { Center, Group, Loader, Pagination, Paper, Text, TextInput } from '@mantine/core';
import { useDebouncedValue } from '@mantine/hooks';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useAuditEntries } from '../api/use-audit-entries';
import { AuditTable } from '../components/AuditTable';

const PAGE_SIZE = 50;

export function AuditPage() {
  const [page, setPage] = useState(1);
  const [action, setAction] = useState('');
  const [subjectType, setSubjectType] = useState('');
  // Wait for typing to pause before asking the server again.
  const [actionFilter] = useDebouncedValue(action.trim(), 300);
  const [subjectTypeFilter] = useDebouncedValue(subjectType.trim(), 300);

  const audit = useAuditEntries({
    limit: PAGE_SIZE,
    offset: (page - 1) * PAGE_SIZE,
    action: actionFilter,
    subjectType: subjectTypeFilter,
  });
  const total = audit.data?.total ?? 0;
  const pages = Math.max(1, Math.ceil(total / PAGE_SIZE));

  return (
    <>
      <PageHeader title="Audit trail" description="Every change of consequence: who made it, when, and why. Entries are never edited." />
      <Group mb="sm" gap="sm" align="flex-end">
        <TextInput
          label="Action"
          placeholder="e.g. user.role, zone.update"
          value={action}
          onChange={(event) => {
            setAction(event.currentTarget.value);
            setPage(1);
          }}
        />
        <TextInput
          label="Subject type"
          placeholder="e.g. user, zone"
          value={subjectType}
          onChange={(event) => {
            setSubjectType(event.currentTarget.value);
            setPage(1);
          }}
        />
      </Group>
      <Paper withBorder radius="md" p="xs">
        {audit.isPending && (
          <Center p="xl">
            <Loader aria-label="Loading the audit trail" />
          </Center>
        )}
        {audit.isError && <ErrorNotice title="The audit trail could not be loaded" error={audit.error} onRetry={() => void audit.refetch()} />}
        {audit.data && audit.data.items.length === 0 && (
          <Text c="dimmed" ta="center" p="xl">
            No entries match.
          </Text>
        )}
        {audit.data && audit.data.items.length > 0 && <AuditTable entries={audit.data.items} />}
      </Paper>
      {total > PAGE_SIZE && (
        <Group justify="space-between" mt="sm">
          <Text size="sm" c="dimmed">
            {total} entries
          </Text>
          <Pagination value={page} onChange={setPage} total={pages} size="sm" />
        </Group>
      )}
    </>
  );
}
