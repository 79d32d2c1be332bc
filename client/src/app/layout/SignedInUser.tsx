import { Badge, Group, Text } from '@mantine/core';
import type { UserDto } from '@morrowline/shared';
import { ROLE_COLORS, ROLE_LABELS } from '../../lib/roles';

/** Who is at the desk, always in view: shift handovers and approvals depend on it. */
export function SignedInUser({ user }: { user: UserDto }) {
  return (
    <Group gap="xs" wrap="nowrap" data-testid="signed-in-user">
      <Text size="sm" fw={500} truncate maw={200} data-testid="signed-in-name">
        {user.name}
      </Text>
      <Badge color={ROLE_COLORS[user.role]} data-testid="signed-in-role">
        {ROLE_LABELS[user.role]}
      </Badge>
    </Group>
  );
}
