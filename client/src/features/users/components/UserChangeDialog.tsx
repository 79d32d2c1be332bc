import { Button, Group, Modal, Select, Stack, Text, Textarea } from '@mantine/core';
import { hasLength, useForm } from '@mantine/form';
import { isRole, type Role, type UpdateUserRequest, type UserDto } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { ROLE_LABELS } from '../../../lib/roles';
import { useUpdateUser } from '../api/use-update-user';
import { ROLE_OPTIONS } from '../role-options';

/** The three changes an admin makes to an account; each asks why, for the audit trail. */
export type UserChange = 'role' | 'deactivate' | 'reactivate';

interface UserChangeDialogProps {
  user: UserDto;
  change: UserChange;
  onClose: () => void;
}

const TITLES: Record<UserChange, string> = {
  role: 'Change role',
  deactivate: 'Deactivate user',
  reactivate: 'Reactivate user',
};

export function UserChangeDialog({ user, change, onClose }: UserChangeDialogProps) {
  const updateUser = useUpdateUser();
  const form = useForm<{ role: Role; reason: string }>({
    mode: 'uncontrolled',
    initialValues: { role: user.role, reason: '' },
    validate: {
      role: (value) => (change === 'role' && value === user.role ? 'Choose a different role' : null),
      reason: hasLength({ min: 3 }, 'Say why, for the audit trail'),
    },
  });

  const submit = form.onSubmit(({ role, reason }) => {
    const changes: UpdateUserRequest =
      change === 'role' ? { role, reason: reason.trim() } : { active: change === 'reactivate', reason: reason.trim() };
    updateUser.mutate(
      { id: user.id, changes },
      {
        onSuccess: (updated) => {
          notifySuccess(successMessage(change, updated));
          onClose();
        },
      },
    );
  });

  return (
    <Modal opened onClose={onClose} title={TITLES[change]}>
      <form onSubmit={submit} noValidate>
        <Stack gap="sm">
          <Text size="sm">
            {user.name} <Text span c="dimmed">({user.email})</Text>
          </Text>
          {change === 'deactivate' && (
            <Text size="sm" c="dimmed">
              They will not be able to sign in; their history and audit entries stay.
            </Text>
          )}
          {updateUser.isError && <ErrorNotice title="Nothing was changed" error={updateUser.error} />}
          {change === 'role' && (
            <Select
              label="New role"
              data={ROLE_OPTIONS}
              allowDeselect={false}
              key={form.key('role')}
              {...form.getInputProps('role')}
              onChange={(value) => {
                if (isRole(value)) form.setFieldValue('role', value);
              }}
            />
          )}
          <Textarea
            label="Reason"
            withAsterisk
            autosize
            minRows={2}
            key={form.key('reason')}
            {...form.getInputProps('reason')}
          />
          <Group justify="flex-end" mt="sm">
            <Button variant="default" onClick={onClose}>
              Cancel
            </Button>
            <Button type="submit" color={change === 'deactivate' ? 'ember' : undefined} loading={updateUser.isPending}>
              {TITLES[change]}
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}

function successMessage(change: UserChange, user: UserDto): string {
  if (change === 'role') return `${user.name} is now ${ROLE_LABELS[user.role].toLowerCase()}.`;
  return change === 'deactivate' ? `${user.name} can no longer sign in.` : `${user.name} can sign in again.`;
}
