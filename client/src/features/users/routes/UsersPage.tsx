import { Button, Center, Loader, Paper } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import type { UserDto } from '@morrowline/shared';
import { useState } from 'react';
import { ErrorNotice } from '../../../components/ErrorNotice';
import { PageHeader } from '../../../components/PageHeader';
import { useSignedInUser } from '../../auth';
import { useUsers } from '../api/use-users';
import { CreateUserDialog } from '../components/CreateUserDialog';
import { UserChangeDialog, type UserChange } from '../components/UserChangeDialog';
import { UsersTable } from '../components/UsersTable';

export function UsersPage() {
  const me = useSignedInUser();
  const users = useUsers();
  const [creating, { open: openCreate, close: closeCreate }] = useDisclosure(false);
  const [pending, setPending] = useState<{ user: UserDto; change: UserChange } | null>(null);

  return (
    <>
      <PageHeader
        title="Users"
        description="Who may sign in to the desk, and with which role."
        actions={<Button onClick={openCreate}>Add user</Button>}
      />
      <Paper withBorder radius="md" p="xs">
        {users.isPending && (
          <Center p="xl">
            <Loader aria-label="Loading users" />
          </Center>
        )}
        {users.isError && <ErrorNotice title="Users could not be loaded" error={users.error} onRetry={() => void users.refetch()} />}
        {users.data && (
          <UsersTable users={users.data} currentUserId={me.id} onChange={(user, change) => setPending({ user, change })} />
        )}
      </Paper>
      <CreateUserDialog opened={creating} onClose={closeCreate} />
      {pending && <UserChangeDialog user={pending.user} change={pending.change} onClose={() => setPending(null)} />}
    </>
  );
}
