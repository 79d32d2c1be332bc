import { ATTENTION_TEXT } from '../../../lib/text-colors';
import { Badge, Button, Card, Group, Modal, Progress, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import type { RefitJobDto, RefitJobState } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime } from '../../../lib/format';
import { notifySuccess } from '../../../lib/notify';
import { useRefitJobs, useStartRefit } from '../api/use-refits';

const STATE_COLORS: Record<RefitJobState, string> = { queued: 'slate', running: 'tide', done: 'tide', failed: 'ember' };
const TRIGGER_LABELS = { schedule: 'nightly', operator: 'by hand', update: 'hourly update', 'first-model': 'first model' } as const;

interface RefitPanelProps {
  zone: string;
  zoneName: string;
  zoneNames: ReadonlyMap<string, string>;
  timeZone: string;
  canRefit: boolean;
}

/** Starting a refit (this zone or all), and the latest jobs with their progress. */
export function RefitPanel({ zone, zoneName, zoneNames, timeZone, canRefit }: RefitPanelProps) {
  const jobs = useRefitJobs();
  const start = useStartRefit();
  const [scope, setScope] = useState<'zone' | 'all' | null>(null);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);

  const open = (next: 'zone' | 'all') => {
    setScope(next);
    setReason('');
    setReasonError(null);
    start.reset();
  };
  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    if (!reason.trim()) return setReasonError('Say why, e.g. “after the Quarry Hill feeder outage”');
    start.mutate(
      { zone: scope === 'zone' ? zone : undefined, reason: reason.trim() },
      {
        onSuccess: (started) => {
          notifySuccess(started.length === 1 ? `Refit of ${zoneNames.get(started[0].zone) ?? started[0].zone} is ${started[0].state}.` : `${started.length} zones queued for a refit.`);
          setScope(null);
        },
      },
    );
  };

  return (
    <Card withBorder padding="md" data-testid="refit-panel">
      <Group justify="space-between" mb="xs">
        <Title order={4}>Refits</Title>
        {canRefit && (
          <Group gap="xs">
            <Button size="sm" onClick={() => open('zone')}>Refit this zone</Button>
            <Button size="sm" variant="default" onClick={() => open('all')}>Refit all zones</Button>
          </Group>
        )}
      </Group>
      <Text size="sm" c="dimmed" mb="sm">
        A refit chooses the differencing and ARMA orders again on the zone’s latest weeks, without the hours of its windows. The
        first model of a zone goes into service at once; later ones wait below as candidates.
      </Text>
      {jobs.isError && <ErrorNotice title="The refit jobs could not be loaded" error={jobs.error} onRetry={() => void jobs.refetch()} />}
      {jobs.data && jobs.data.length === 0 && <Text size="sm">No refits yet.</Text>}
      {jobs.data && jobs.data.length > 0 && (
        <Table.ScrollContainer minWidth={760}>
          <Table aria-label="Refit jobs" verticalSpacing="xs">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Zone</Table.Th>
                <Table.Th>Started</Table.Th>
                <Table.Th>How</Table.Th>
                <Table.Th>State</Table.Th>
                <Table.Th w={260}>Progress</Table.Th>
                <Table.Th>Reason</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {jobs.data.map((job) => (
                <JobRow key={job.id} job={job} zoneName={zoneNames.get(job.zone) ?? job.zone} current={job.zone === zone} timeZone={timeZone} />
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
      <Modal opened={scope !== null} onClose={() => setScope(null)} title={scope === 'all' ? 'Refit all zones' : `Refit ${zoneName}`}>
        <form onSubmit={submit} noValidate>
          <Stack gap="sm">
            {start.isError && <ErrorNotice title="The refit was not started" error={start.error} />}
            <TextInput
              label="Reason"
              description="Kept with the job and in the audit trail"
              placeholder="after the Quarry Hill feeder outage"
              withAsterisk
              value={reason}
              onChange={(e) => setReason(e.currentTarget.value)}
              error={reasonError}
              data-autofocus
            />
            <Group justify="flex-end">
              <Button variant="default" onClick={() => setScope(null)}>Cancel</Button>
              <Button type="submit" loading={start.isPending}>Start the refit</Button>
            </Group>
          </Stack>
        </form>
      </Modal>
    </Card>
  );
}

function JobRow({ job, zoneName, current, timeZone }: { job: RefitJobDto; zoneName: string; current: boolean; timeZone: string }) {
  return (
    <Table.Tr data-testid={`refit-job-${job.id}`} data-state={job.state} bg={current ? 'var(--mantine-color-tide-light)' : undefined}>
      <Table.Td fw={current ? 600 : 400}>{zoneName}</Table.Td>
      <Table.Td ff="monospace">{formatDateTime(job.startedAt ?? job.createdAt, timeZone)}</Table.Td>
      <Table.Td>
        <Text size="sm">{TRIGGER_LABELS[job.trigger]}</Text>
        {job.requestedBy && <Text size="xs" c="dimmed">{job.requestedBy}</Text>}
      </Table.Td>
      <Table.Td>
        <Badge variant={job.state === 'done' ? 'light' : 'filled'} color={STATE_COLORS[job.state]}>{job.state}</Badge>
      </Table.Td>
      <Table.Td>
        <Progress value={job.progress} color={job.state === 'failed' ? 'ember' : 'tide'} animated={job.state === 'running'} aria-label={`Progress of the ${zoneName} refit`} />
        <Text size="xs" mt={2} c={job.state === 'failed' ? ATTENTION_TEXT : 'dimmed'} data-testid="refit-stage">
          {job.progress} % · {job.state === 'failed' || job.state === 'done' ? job.message ?? job.state : job.stage}
          {job.state === 'done' && job.message === null && job.modelVersionId !== null && (job.promoted ? ' · the new version is in service' : ' · the new version waits as a candidate')}
        </Text>
      </Table.Td>
      <Table.Td>
        <Text size="sm">{job.reason ?? '—'}</Text>
      </Table.Td>
    </Table.Tr>
  );
}
