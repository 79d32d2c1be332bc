import { Button, Group, Modal, PasswordInput, Select, Stack, TextInput } from '@mantine/core';
import { hasLength, isEmail, isNotEmpty, useForm } from '@mantine/form';
import { isRole, type CreateUserRequest, type Role } from '@morrowline/shared';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { notifySuccess } from '../../../lib/notify';
import { useCreateUser } from '../api/use-create-user';
import { MIN_PASSWORD_LENGTH, ROLE_OPTIONS } from '../role-options';

interface CreateUserDialogProps {
  opened: boolean;
  onClose: () => void;
}

interface CreateUserValues {
  name: string;
  email: string;
  role: Role | '';
  password: string;
}

export function CreateUserDialog({ opened, onClose }: CreateUserDialogProps) {
  const createUser = useCreateUser();
  const form = useForm<CreateUserValues>({
    mode: 'uncontrolled',
    initialValues: { name: '', email: '', role: 'viewer', password: '' },
    validate: {
      name: isNotEmpty('Enter the person’s name'),
      email: isEmail('Enter a valid e-mail address'),
      role: (value) => (isRole(value) ? null : 'Choose a role'),
      password: hasLength({ min: MIN_PASSWORD_LENGTH }, `At least ${MIN_PASSWORD_LENGTH} characters`),
    },
  });

  const close = () => {
    form.reset();
    createUser.reset();
    onClose();
  };

  const submit = form.onSubmit((values) => {
    if (!isRole(values.role)) return;
    const request: CreateUserRequest = {
      name: values.name.trim(),
      email: values.email.trim(),
      role: values.role,
      password: values.password,
    };
    createUser.mutate(request, {
      onSuccess: (user) => {
        notifySuccess(`${user.name} can now sign in as ${user.email}.`);
        close();
      },
    });
  });

  return (
    <Modal opened={opened} onClose={close} title="Add a user">
      <form onSubmit={submit} noValidate>
        <Stack gap="sm">
          {createUser.isError && <ErrorNotice title="The user was not added" error={createUser.error} />}
          <TextInput label="Name" withAsterisk key={form.key('name')} {...form.getInputProps('name')} />
          <TextInput label="E-mail" type="email" withAsterisk key={form.key('email')} {...form.getInputProps('email')} />
          <Select
            label="Role"
            withAsterisk
            data={ROLE_OPTIONS}
            allowDeselect={false}
            key={form.key('role')}
            {...form.getInputProps('role')}
          />
          <PasswordInput
            label="First password"
            description="Share it with the person by a separate channel."
            withAsterisk
            autoComplete="new-password"
            key={form.key('password')}
            {...form.getInputProps('password')}
          />
          <Group justify="flex-end" mt="sm">
            <Button variant="default" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" loading={createUser.isPending}>
              Add user
            </Button>
          </Group>
        </Stack>
      </form>
    </Modal>
  );
}
