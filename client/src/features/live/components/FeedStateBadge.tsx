import { Badge } from '@mantine/core';
import type { FeedState } from '../model/zone-view';

/** The feed's state in plain words: keeping up, behind (how long), or not known yet. */
export function FeedStateBadge({ feed }: { feed: FeedState }) {
  if (feed.kind === 'live') return <Badge color="tide" data-testid="feed-state">Feed up to date</Badge>;
  if (feed.kind === 'unknown') return <Badge color="slate" data-testid="feed-state">Feed state not known</Badge>;
  const text = feed.staleZones
    ? `${feed.staleZones.length} ${feed.staleZones.length === 1 ? 'feed' : 'feeds'} stale`
    : feed.lastHour === null
      ? 'No readings yet'
      : `Feed ${feed.hoursBehind ?? '?'} h behind`;
  return (
    <Badge color="ember" variant="filled" data-testid="feed-state" title={feed.staleZones?.join(', ')}>
      {text}
    </Badge>
  );
}
