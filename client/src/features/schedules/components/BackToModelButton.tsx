import { Button, Group, Text } from '@mantine/core';
import type { ScheduleRevisionDto } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useBackToModel } from '../api/use-schedule-actions';
import { offModel } from '../model/vintage';

/** Undoes every adjustment in force at once (each stays in the list, struck through). */
export function BackToModelButton({ revision }: { revision: ScheduleRevisionDto }) {
  const back = useBackToModel();
  if (!offModel(revision)) return null;
  return (
    <Group gap="xs" mb="xs">
      <Button size="xs" variant="default" loading={back.isPending} onClick={() => back.mutate(revision.id)}>
        Back to the model
      </Button>
      <Text size="xs" c="dimmed">Undoes every adjustment in force; each stays listed with who undid it.</Text>
      {back.isError && <ErrorNotice title="The values did not go back to the model" error={back.error} />}
    </Group>
  );
}
