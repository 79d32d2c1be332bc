import { floorHour } from '@morrowline/shared';
import { useEffect, useState } from 'react';

/** Start of the current hour (epoch ms), moving on when the clock passes the hour. */
export function useCurrentHour(): number {
  const [hour, setHour] = useState(() => floorHour(Date.now()));
  useEffect(() => {
    const timer = setInterval(() => setHour(floorHour(Date.now())), 30_000);
    return () => clearInterval(timer);
  }, []);
  return hour;
}
