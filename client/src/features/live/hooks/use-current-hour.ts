import { useEffect, useState } from 'react';
import { HOUR_MS } from '../model/hours';

/** Start of the current hour (epoch ms), moving on when the clock passes the hour. */
export function useCurrentHour(): number {
  const [hour, setHour] = useState(() => Math.floor(Date.now() / HOUR_MS) * HOUR_MS);
  useEffect(() => {
    const timer = setInterval(() => setHour(Math.floor(Date.now() / HOUR_MS) * HOUR_MS), 30_000);
    return () => clearInterval(timer);
  }, []);
  return hour;
}
