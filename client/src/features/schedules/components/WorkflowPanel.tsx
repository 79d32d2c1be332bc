import { Alert, Button, Group, Paper, Stack, Text } from '@mantine/core';
import { SCHEDULE_CAUTION, type UserDto, type ZoneScheduleDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useApproveRevision, useReturnRevision, useStartCorrection, useStartDraft, useSubmitRevision } from '../api/use-schedule-actions';
import { scheduleActions } from '../model/permissions';
import { ConfirmPublishDialog } from './ConfirmPublishDialog';
import { DownloadButtons } from './DownloadButtons';
import { ReasonDialog } from './ReasonDialog';
import { StateLine } from './StateLine';

type Dialog = 'submit' | 'approve' | 'return' | 'correct' | null;

/** Where one zone's schedule stands, and the next step the signed-in person may take. */
export function WorkflowPanel({ day, zone, user, caution }: { day: string; zone: ZoneScheduleDto; user: Pick<UserDto, 'id' | 'role'>; caution?: string }) {
  const actions = scheduleActions(user, zone);
  const [dialog, setDialog] = useState<Dialog>(null);
  const startDraft = useStartDraft(day);
  const submit = useSubmitRevision();
  const approve = useApproveRevision();
  const giveBack = useReturnRevision();
  const correct = useStartCorrection(day);
  const working = zone.working;
  const published = zone.published;
  const failed = startDraft.error ?? approve.error;

  return (
    <Paper withBorder p="md" radius="sm" data-testid={`workflow-${zone.zone}`}>
      <Stack gap="sm">
        {working && <StateLine revision={working} timeZone={zone.timeZone} />}
        {published && (
          <Group justify="space-between" align="flex-start" wrap="wrap">
            <StateLine revision={published} timeZone={zone.timeZone} />
            <Stack gap={4} align="flex-end">
              <Text size="xs" c="dimmed">Download the revision in force</Text>
              <DownloadButtons revision={published} size="sm" />
            </Stack>
          </Group>
        )}
        {published && !working && <Text size="sm" c="dimmed">A published revision is read-only; a change is a correction, which starts a new revision.</Text>}
        {!working && !published && (
          <Text size="sm" data-testid="no-revision">
            {zone.forecast ? 'Nothing drafted yet: the table shows the model forecast as it stands.' : 'No forecast reaches this operating day yet, and nothing is drafted.'}
          </Text>
        )}
        {actions.submitRefusal && <Alert color="ember" variant="light" data-testid="submit-refusal">{actions.submitRefusal}</Alert>}
        {actions.approveRefusal && <Text size="sm" c="dimmed">{actions.approveRefusal}</Text>}
        {(actions.approve || actions.returnToOperator) && (
          <Alert color="dusk" variant="light" title="Before you publish" data-testid="publish-caution">
            {caution ?? SCHEDULE_CAUTION}
          </Alert>
        )}
        {failed && <ErrorNotice error={failed} />}
        <Group gap="sm">
          {actions.startDraft && (
            <Button onClick={() => startDraft.mutate(zone.zone)} loading={startDraft.isPending} disabled={!zone.forecast}>
              Start the draft
            </Button>
          )}
          {actions.submit && working && (
            <Button onClick={() => setDialog('submit')} color={actions.submitIsLate ? 'ember' : undefined}>
              {actions.submitIsLate ? 'Submit late' : 'Submit for approval'}
            </Button>
          )}
          {actions.approve && working && (
            <Button loading={approve.isPending} onClick={() => setDialog('approve')}>
              Approve and publish
            </Button>
          )}
          {actions.returnToOperator && (
            <Button variant="default" onClick={() => setDialog('return')}>
              Return with a comment
            </Button>
          )}
          {actions.correct && (
            <Button variant="light" onClick={() => setDialog('correct')}>
              Correct
            </Button>
          )}
        </Group>
      </Stack>

      {dialog === 'submit' && working && (
        <ReasonDialog
          title={`Submit ${zone.zoneName}, revision ${working.revision}`}
          label="Comment for the supervisor (optional)"
          confirm={actions.submitIsLate ? 'Submit late' : 'Submit'}
          required={false}
          pending={submit.isPending}
          error={submit.error}
          onClose={() => setDialog(null)}
          onConfirm={(comment) => submit.mutate({ id: working.id, comment: comment || undefined }, { onSuccess: () => setDialog(null) })}
        >
          {actions.submitIsLate ? (
            <Alert color="ember" variant="light" data-testid="late-warning">
              Gate closure has passed. The submission is marked late, and the record shows it.
            </Alert>
          ) : (
            <Text size="sm">Adjustments cannot be undone after submission; a supervisor approves or returns it.</Text>
          )}
        </ReasonDialog>
      )}
      {dialog === 'approve' && working && (
        <ConfirmPublishDialog
          zoneName={zone.zoneName}
          revision={working}
          pending={approve.isPending}
          onClose={() => setDialog(null)}
          onConfirm={() =>
            approve.mutate(working.id, {
              onSuccess: (revision) => notifySuccess(`${zone.zoneName} revision ${revision.revision} published.`),
              onSettled: () => setDialog(null),
            })
          }
        />
      )}
      {dialog === 'return' && working && (
        <ReasonDialog
          title={`Return ${zone.zoneName}, revision ${working.revision}`}
          label="What needs changing"
          confirm="Return"
          required
          pending={giveBack.isPending}
          error={giveBack.error}
          onClose={() => setDialog(null)}
          onConfirm={(comment) => giveBack.mutate({ id: working.id, comment }, { onSuccess: () => setDialog(null) })}
        />
      )}
      {dialog === 'correct' && published && (
        <ReasonDialog
          title={`Correct ${zone.zoneName}: start revision ${published.revision + 1}`}
          label="Reason for the correction"
          confirm="Start the correction"
          required
          pending={correct.isPending}
          error={correct.error}
          onClose={() => setDialog(null)}
          onConfirm={(reason) => correct.mutate({ zone: zone.zone, reason }, { onSuccess: () => setDialog(null) })}
        >
          <Text size="sm">Revision {published.revision} stays in force until the correction is approved and published.</Text>
        </ReasonDialog>
      )}
    </Paper>
  );
}
