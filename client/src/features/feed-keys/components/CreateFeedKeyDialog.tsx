import { Alert, Button, Code, CopyButton, Group, Modal, Select, Stack, Text, TextInput } from '@mantine/core';
import { isNotEmpty, useForm } from '@mantine/form';
import type { CreatedFeedKey, ZoneDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useCreateFeedKey } from '../api/use-feed-keys';

/** The scope value meaning "any zone" (the API's null). */
export const ANY_ZONE = '';

interface CreateFeedKeyDialogProps {
  opened: boolean;
  onClose: () => void;
  zones: readonly ZoneDto[];
}

interface CreateFeedKeyValues {
  name: string;
  zone: string;
}

/**
 * Creates a meter-feed key limited to one zone or open to every zone. The server answers the
 * secret once and keeps only its hash, so the dialog shows it until the admin closes it and
 * never again.
 */
export function CreateFeedKeyDialog({ opened, onClose, zones }: CreateFeedKeyDialogProps) {
  const create = useCreateFeedKey();
  const [created, setCreated] = useState<CreatedFeedKey | null>(null);
  const form = useForm<CreateFeedKeyValues>({
    mode: 'controlled',
    initialValues: { name: '', zone: ANY_ZONE },
    validate: { name: isNotEmpty('Name the feed, e.g. the substation or RTU it runs on') },
  });

  const close = () => {
    form.reset();
    create.reset();
    setCreated(null);
    onClose();
  };

  const submit = form.onSubmit((values) => {
    create.mutate({ name: values.name.trim(), zone: values.zone === ANY_ZONE ? null : values.zone }, { onSuccess: setCreated });
  });

  const scopeOptions = [{ value: ANY_ZONE, label: 'Any zone' }, ...zones.map((zone) => ({ value: zone.code, label: `${zone.name} (${zone.code})` }))];

  return (
    <Modal opened={opened} onClose={close} title={created ? 'Feed key created' : 'Create a feed key'} closeOnClickOutside={!created}>
      {created ? (
        <Stack gap="sm" data-testid="feed-key-secret">
          <Alert color="ember" variant="light" title="Copy the key now">
            This is the only time the key is shown. Only its hash is kept: if it is lost, revoke it and create another.
          </Alert>
          <Text size="sm">
            {created.feedKey.name} · {created.feedKey.zone ? zones.find((z) => z.code === created.feedKey.zone)?.name ?? created.feedKey.zone : 'any zone'}
          </Text>
          <Code block aria-label="Feed key secret" style={{ wordBreak: 'break-all' }}>
            {created.apiKey}
          </Code>
          <Group justify="flex-end">
            <CopyButton value={created.apiKey}>{({ copied, copy }) => <Button variant="light" onClick={copy}>{copied ? 'Copied' : 'Copy key'}</Button>}</CopyButton>
            <Button onClick={close}>I have copied it</Button>
          </Group>
        </Stack>
      ) : (
        <form onSubmit={submit} noValidate>
          <Stack gap="sm">
            {create.isError && <ErrorNotice title="The key was not created" error={create.error} />}
            <TextInput label="Name" description="Which feed sends with it" withAsterisk {...form.getInputProps('name')} />
            <Select
              label="May send for"
              description="A key limited to one zone is refused readings for any other."
              data={scopeOptions}
              allowDeselect={false}
              {...form.getInputProps('zone')}
            />
            <Group justify="flex-end" mt="sm">
              <Button variant="default" onClick={close}>
                Cancel
              </Button>
              <Button type="submit" loading={create.isPending}>
                Create key
              </Button>
            </Group>
          </Stack>
        </form>
      )}
    </Modal>
  );
}
