import type { User } from '../users/entities/user.entity';
import { loadTokenUser, refusal, TOKEN_MESSAGES } from './token-check';

const user = { id: 3, email: 'pia.lund@tallowmere.example', name: 'Pia Lund', role: 'viewer', active: true, sessionVersion: 2 } as User;
const payload = (sv: unknown) => ({ sub: 3, email: user.email, role: 'viewer' as const, sv: sv as number });

describe('token check', () => {
  it('accepts a token of the current session version only', () => {
    expect(refusal(payload(2), user)).toBeNull();
    expect(refusal(payload(1), user)).toBe(TOKEN_MESSAGES.ended);
    expect(refusal(payload(undefined), user)).toBe(TOKEN_MESSAGES.ended);
  });

  it('refuses a token whose user is gone or inactive', () => {
    expect(refusal(payload(2), null)).toBe(TOKEN_MESSAGES.inactive);
  });

  it('turns an unreachable database into a 503, not a refusal', async () => {
    const down = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3306'), { code: 'ECONNREFUSED' });
    const error = await loadTokenUser(payload(2), () => Promise.reject(down)).catch((e: unknown) => e);
    expect((error as { getStatus(): number }).getStatus()).toBe(503);
    expect((error as Error).message).not.toContain('127.0.0.1');
  });

  it('lets other errors through as they are (a 500, never a 401)', async () => {
    const bug = new TypeError('x is undefined');
    await expect(loadTokenUser(payload(2), () => Promise.reject(bug))).rejects.toBe(bug);
  });
});
