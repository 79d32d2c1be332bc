import { Badge, Group, Stack, Text } from '@mantine/core';
import type { HandoverItemDto } from '@morrowline/shared';
import { useZones } from '../../zones';
import { ITEM_KIND_LABELS, ITEM_STATUS_COLORS, ITEM_STATUS_LABELS } from '../handover-labels';

/** A note's structured items, open ones first, each with its zone's name (the code until the zones load). */
export function HandoverItemsList({ items }: { items: HandoverItemDto[] }) {
  const zones = useZones();
  if (items.length === 0) return null;
  const zoneName = (code: string) => zones.data?.find((zone) => zone.code === code)?.name ?? code;
  const ordered = [...items].sort((a, b) => Number(a.status === 'closed') - Number(b.status === 'closed'));
  return (
    <Stack gap={6} component="ul" p={0} m={0} style={{ listStyle: 'none' }} aria-label="Items">
      {ordered.map((item) => (
        <Group key={item.id} component="li" gap="xs" wrap="nowrap" align="flex-start" data-testid={`handover-item-${item.id}`}>
          <Badge color={ITEM_STATUS_COLORS[item.status]} variant={item.status === 'open' ? 'filled' : 'light'} miw={84}>
            {ITEM_STATUS_LABELS[item.status]}
          </Badge>
          <Text size="sm">
            <Text span fw={600}>
              {ITEM_KIND_LABELS[item.kind]}
            </Text>
            {item.zoneCode ? ` · ${zoneName(item.zoneCode)}` : ''} — {item.text}
            {item.carriedFromItemId !== null && (
              <Text span size="xs" c="dimmed">
                {' '}
                (carried on from an earlier note)
              </Text>
            )}
          </Text>
        </Group>
      ))}
    </Stack>
  );
}
