import { expect } from 'vitest';
import type { ZoneDto } from '@morrowline/shared';
import { BASE_URL } from './browser';
import { apiToken } from './history';

/**
 * A zone of the browser test's own, made by the administrator through the API, so no other
 * browser test writes to it (the test database is fresh each run; an existing one is reused).
 */
export async function ownZone(code: string, name: string, gateClosure = '10:00'): Promise<ZoneDto> {
  const admin = await apiToken('admin');
  const headers = { Authorization: `Bearer ${admin}`, 'Content-Type': 'application/json' };
  const existing = ((await (await fetch(`${BASE_URL}/api/zones`, { headers })).json()) as ZoneDto[]).find((z) => z.code === code);
  if (existing) return existing;
  const made = await fetch(`${BASE_URL}/api/zones`, {
    method: 'POST',
    headers,
    body: JSON.stringify({ code, name, timeZone: 'America/Denver', alertThresholdPct: 8, alertConsecutiveHours: 3, gateClosure, minPlausibleMw: 0, maxPlausibleMw: 1000 }),
  });
  expect(made.status).toBe(201);
  return (await made.json()) as ZoneDto;
}
