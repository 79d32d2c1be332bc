import { Badge, Button, Group, Table, Text } from '@mantine/core';
import type { UserDto } from '@morrowline/shared';
import { formatDateTime } from '../../../lib/format';
import { useDeskTimeZone } from '../../../lib/use-desk-time-zone';
import { ROLE_COLORS, ROLE_LABELS } from '../../../lib/roles';
import type { UserChange } from './UserChangeDialog';

interface UsersTableProps {
  users: UserDto[];
  /** The admin looking at the table: their own row offers no changes, so nobody locks themselves out. */
  currentUserId: number;
  onChange: (user: UserDto, change: UserChange) => void;
}

export function UsersTable({ users, currentUserId, onChange }: UsersTableProps) {
  const deskTimeZone = useDeskTimeZone();
  return (
    <Table.ScrollContainer minWidth={760}>
      <Table aria-label="Users">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Name</Table.Th>
            <Table.Th>E-mail</Table.Th>
            <Table.Th>Role</Table.Th>
            <Table.Th>Status</Table.Th>
            <Table.Th>Last sign-in</Table.Th>
            <Table.Th aria-label="Actions" />
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {users.map((user) => (
            <Table.Tr key={user.id} data-testid={`user-row-${user.id}`}>
              <Table.Td fw={500}>{user.name}</Table.Td>
              <Table.Td>{user.email}</Table.Td>
              <Table.Td>
                <Badge color={ROLE_COLORS[user.role]}>{ROLE_LABELS[user.role]}</Badge>
              </Table.Td>
              <Table.Td>
                {user.active ? (
                  <Badge color="tide" variant="dot">Active</Badge>
                ) : (
                  <Badge color="gray" variant="outline">Deactivated</Badge>
                )}
              </Table.Td>
              <Table.Td className="numeric">{formatDateTime(user.lastLoginAt, deskTimeZone)}</Table.Td>
              <Table.Td>
                {user.id === currentUserId ? (
                  <Text size="xs" c="dimmed" ta="right">
                    Your account
                  </Text>
                ) : (
                  <Group gap="xs" justify="flex-end" wrap="nowrap">
                    <Button size="compact-xs" variant="light" onClick={() => onChange(user, 'role')}>
                      Change role
                    </Button>
                    {user.active ? (
                      <Button size="compact-xs" variant="subtle" color="ember" onClick={() => onChange(user, 'deactivate')}>
                        Deactivate
                      </Button>
                    ) : (
                      <Button size="compact-xs" variant="subtle" onClick={() => onChange(user, 'reactivate')}>
                        Reactivate
                      </Button>
                    )}
                  </Group>
                )}
              </Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </Table.ScrollContainer>
  );
}
