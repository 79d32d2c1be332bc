import { Button, Group, Loader, Modal, MultiSelect, Stack, Table, Text, TextInput } from '@mantine/core';
import { useForm } from '@mantine/form';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { useAddSubscriber, useRemoveSubscriber, useSubscribers } from '../api/use-subscribers';

interface SubscriberForm {
  name: string;
  email: string;
  zones: string[];
}

/** Supervisors keep the list of people e-mailed when a schedule is published. */
export function SubscribersDialog({ zones, onClose }: { zones: { code: string; name: string }[]; onClose: () => void }) {
  const list = useSubscribers(true);
  const add = useAddSubscriber();
  const remove = useRemoveSubscriber();
  const form = useForm<SubscriberForm>({
    mode: 'controlled',
    initialValues: { name: '', email: '', zones: [] },
    validate: {
      name: (v) => (v.trim() === '' ? 'Give a name' : null),
      email: (v) => (/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(v.trim()) ? null : 'Enter an e-mail address'),
    },
  });
  const zoneName = (code: string) => zones.find((z) => z.code === code)?.name ?? code;
  const active = (list.data ?? []).filter((s) => s.active);

  return (
    <Modal opened onClose={onClose} title="Who is e-mailed on publication" size="lg">
      <Stack gap="md">
        {list.isPending && <Loader size="sm" />}
        {list.isError && <ErrorNotice error={list.error} />}
        {list.data && active.length === 0 && <Text size="sm" c="dimmed">Nobody yet.</Text>}
        {active.length > 0 && (
          <Table aria-label="Subscribers" fz="sm">
            <Table.Tbody>
              {active.map((s) => (
                <Table.Tr key={s.id}>
                  <Table.Td>{s.name}</Table.Td>
                  <Table.Td>{s.email}</Table.Td>
                  <Table.Td>{s.zones === null ? 'Every zone' : s.zones.map(zoneName).join(', ')}</Table.Td>
                  <Table.Td>
                    <Button size="xs" variant="subtle" color="ember" loading={remove.isPending && remove.variables === s.id} onClick={() => remove.mutate(s.id)}>
                      Remove
                    </Button>
                  </Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        )}
        <form
          aria-label="Add a subscriber"
          noValidate
          onSubmit={form.onSubmit((v) =>
            add.mutate({ name: v.name.trim(), email: v.email.trim(), zones: v.zones.length > 0 ? v.zones : null }, { onSuccess: () => form.reset() }),
          )}
        >
          <Stack gap="xs">
            <Group grow align="flex-start">
              <TextInput label="Name" {...form.getInputProps('name')} />
              <TextInput label="E-mail" {...form.getInputProps('email')} />
            </Group>
            <MultiSelect label="Zones" placeholder="Every zone" data={zones.map((z) => ({ value: z.code, label: z.name }))} {...form.getInputProps('zones')} />
            {(add.error ?? remove.error) && <ErrorNotice error={add.error ?? remove.error} />}
            <Group justify="flex-end">
              <Button type="submit" loading={add.isPending}>Add subscriber</Button>
            </Group>
          </Stack>
        </form>
      </Stack>
    </Modal>
  );
}
