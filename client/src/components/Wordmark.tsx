import { Group, Text } from '@mantine/core';
import { MorrowlineMark } from './MorrowlineMark';

export function Wordmark({ size = 28 }: { size?: number }) {
  return (
    <Group gap={10} wrap="nowrap">
      <MorrowlineMark size={size} />
      <Text component="span" fw={700} fz={size * 0.66} lts={-0.3}>
        Morrowline
      </Text>
    </Group>
  );
}
