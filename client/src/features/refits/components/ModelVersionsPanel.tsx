import { Badge, Button, Card, Group, Loader, Modal, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import type { ModelStatus, ModelVersionDto } from '@morrowline/shared';
import { useEffect, useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { formatDateTime, formatPercent } from '../../../lib/format';
import { notifySuccess } from '../../../lib/notify';
import { useModelCompare, useModelVersions, usePromoteModel } from '../api/use-refits';
import { ordersOf } from '../model/compare-rows';
import { CompareView } from './CompareView';

const STATUS_LABELS: Record<ModelStatus, string> = { 'in-service': 'in service', candidate: 'candidate', retired: 'retired' };
const STATUS_COLORS: Record<ModelStatus, string> = { 'in-service': 'tide', candidate: 'dusk', retired: 'slate' };
const TRIGGER_LABELS = { schedule: 'nightly refit', operator: 'refit by hand', update: 'hourly update', 'first-model': 'first model (start-up)' } as const;

interface ModelVersionsPanelProps {
  zone: string;
  zoneName: string;
  timeZone: string;
  canPromote: boolean;
}

/** A zone's model versions: the one in service first, then candidates and retired ones. */
export function ModelVersionsPanel({ zone, zoneName, timeZone, canPromote }: ModelVersionsPanelProps) {
  const versions = useModelVersions(zone);
  const [comparing, setComparing] = useState<ModelVersionDto | null>(null);
  const order: Record<ModelStatus, number> = { 'in-service': 0, candidate: 1, retired: 2 };
  const list = [...(versions.data ?? [])].sort((a, b) => order[a.status] - order[b.status] || b.id - a.id);

  return (
    <Card withBorder padding="md" data-testid="model-versions">
      <Title order={4} mb="xs">Model versions of {zoneName}</Title>
      <Text size="sm" c="dimmed" mb="sm">
        Backtest: day-ahead forecasts over the last days with the orders fixed, against the same hour one week earlier. A version
        with weather terms is scored with them, each day on the temperature forecast known when that day was forecast.
      </Text>
      {versions.isPending && <Loader size="sm" />}
      {versions.isError && <ErrorNotice title="The versions could not be loaded" error={versions.error} onRetry={() => void versions.refetch()} />}
      {versions.data && list.length === 0 && <Text size="sm">No model fitted for {zoneName} yet: refit the zone to make the first one.</Text>}
      {list.length > 0 && (
        <Table.ScrollContainer minWidth={860}>
          <Table aria-label="Model versions" verticalSpacing="xs">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Version</Table.Th>
                <Table.Th>Status</Table.Th>
                <Table.Th>Made</Table.Th>
                <Table.Th>Model</Table.Th>
                <Table.Th ta="right">Backtest MAPE</Table.Th>
                <Table.Th ta="right">Week-earlier MAPE</Table.Th>
                <Table.Th ta="right" title="Share of the backtest's hours inside the 80 % / 95 % bands: near 80 / 95 means the bands can be trusted">Bands held 80 / 95</Table.Th>
                <Table.Th />
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {list.map((v) => (
                <Table.Tr key={v.id} data-testid={`model-version-${v.id}`} data-status={v.status}>
                  <Table.Td ff="monospace">{v.id}</Table.Td>
                  <Table.Td><Badge variant={v.status === 'in-service' ? 'filled' : 'light'} color={STATUS_COLORS[v.status]}>{STATUS_LABELS[v.status]}</Badge></Table.Td>
                  <Table.Td>
                    <Text size="sm" ff="monospace">{formatDateTime(v.createdAt, timeZone)}</Text>
                    <Text size="xs" c="dimmed">{TRIGGER_LABELS[v.trigger]}{v.createdBy ? `, ${v.createdBy}` : ''}</Text>
                  </Table.Td>
                  <Table.Td>
                    <Text size="sm" ff="monospace">{ordersOf(v)}</Text>
                    <Text size="xs" c="dimmed">{v.trainingHours} h trained, {v.excludedHours} h left out</Text>
                  </Table.Td>
                  <Table.Td ff="monospace" ta="right">
                    {formatPercent(v.backtestMape, 2)}
                    {v.backtestOnForecastWeather && <Text size="xs" c="dimmed" ff="body" style={{ whiteSpace: 'nowrap' }} data-testid="scored-on-weather">on forecast weather</Text>}
                  </Table.Td>
                  <Table.Td ff="monospace" ta="right">{formatPercent(v.baselineMape, 2)}</Table.Td>
                  <Table.Td ff="monospace" ta="right">{formatPercent(v.backtestCoverage80, 0)} / {formatPercent(v.backtestCoverage95, 0)}</Table.Td>
                  <Table.Td>
                    <Group gap={4} justify="flex-end" wrap="nowrap">
                      {v.status !== 'in-service' && (
                        <Button size="compact-sm" variant="light" onClick={() => setComparing(v)}>
                          {v.status === 'retired' ? 'Compare / roll back' : 'Compare'}
                        </Button>
                      )}
                    </Group>
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Table.ScrollContainer>
      )}
      <CompareDialog version={comparing} zoneName={zoneName} canPromote={canPromote} onClose={() => setComparing(null)} />
    </Card>
  );
}

function CompareDialog({ version, zoneName, canPromote, onClose }: { version: ModelVersionDto | null; zoneName: string; canPromote: boolean; onClose: () => void }) {
  const compare = useModelCompare(version?.id ?? null);
  const promote = usePromoteModel();
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | null>(null);
  const rollback = version?.status === 'retired';

  useEffect(() => {
    setReason('');
    setReasonError(null);
    promote.reset();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [version?.id]);

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    if (!version) return;
    if (!reason.trim()) return setReasonError('Say why this version should forecast the zone');
    promote.mutate({ id: version.id, request: { reason: reason.trim() } }, {
      onSuccess: (promoted) => {
        notifySuccess(`Version ${promoted.id} is in service for ${zoneName}; its forecast goes to the live view.`);
        onClose();
      },
    });
  };

  return (
    <Modal opened={version !== null} onClose={onClose} title={version ? `Version ${version.id} beside the model in service` : ''} size="xl">
      <Stack gap="md">
        {compare.isPending && (
          <Group gap="xs"><Loader size="sm" /><Text size="sm">Scoring both on the same days…</Text></Group>
        )}
        {compare.isError && <ErrorNotice title="The comparison could not be made" error={compare.error} onRetry={() => void compare.refetch()} />}
        {compare.data && <CompareView compare={compare.data} />}
        {canPromote && version && (
          <form onSubmit={submit} noValidate>
            <Stack gap="xs">
              {promote.isError && <ErrorNotice title="The version was not put into service" error={promote.error} />}
              <TextInput
                label={rollback ? 'Reason for going back to this version' : 'Reason for putting it into service'}
                withAsterisk
                value={reason}
                onChange={(e) => setReason(e.currentTarget.value)}
                error={reasonError}
              />
              <Group justify="flex-end">
                <Button variant="default" onClick={onClose}>Close</Button>
                <Button type="submit" color={rollback ? 'ember' : undefined} loading={promote.isPending}>
                  {rollback ? 'Roll back to this version' : 'Promote'}
                </Button>
              </Group>
            </Stack>
          </form>
        )}
      </Stack>
    </Modal>
  );
}
