import { Badge, Tooltip } from '@mantine/core';
import { formatLocalDayClock } from '@morrowline/shared';
import { useEffect, useState } from 'react';
import { formatDateTime } from '../../../lib/format';
import { gateCountdown } from '../model/countdown';

/** Re-renders every 15 s so the countdown moves; minutes are the finest unit it shows. */
function useNow(everyMs = 15_000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(timer);
  }, [everyMs]);
  return now;
}

/**
 * Time left to gate closure, in the zone's local time. `clockOffsetMs` is the server's clock minus
 * ours, so a desk with a wrong clock still counts to the server's gate.
 */
export function GateCountdownBadge({ gateClosureAt, timeZone, clockOffsetMs }: { gateClosureAt: string; timeZone: string; clockOffsetMs: number }) {
  const now = useNow();
  const countdown = gateCountdown(Date.parse(gateClosureAt), now + clockOffsetMs);
  const color = countdown.closed ? 'slate' : countdown.urgent ? 'ember' : 'tide';
  return (
    <Tooltip label={`Gate closure ${formatDateTime(gateClosureAt, timeZone)} (${timeZone})`}>
      <Badge color={color} variant={countdown.urgent ? 'filled' : 'light'} size="lg" tt="none" data-testid="gate-countdown" data-urgent={countdown.urgent}>
        {countdown.text} · gate {formatLocalDayClock(gateClosureAt, timeZone)}
      </Badge>
    </Tooltip>
  );
}
