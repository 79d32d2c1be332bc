import { HttpException } from '@nestjs/common';
import { PasswordCheckGate } from './password-check-gate';

/** A check that finishes when the test says so. */
function heldCheck() {
  let finish!: () => void;
  const done = new Promise<void>((resolve) => (finish = resolve));
  const check = jest.fn(() => done.then(() => true));
  return { check, finish };
}

describe('PasswordCheckGate', () => {
  it('runs at most `concurrency` checks, queues `queue` more, and refuses the rest with 503 and Retry-After without running them', async () => {
    const gate = new PasswordCheckGate(2, 1, 3);
    const held = [heldCheck(), heldCheck(), heldCheck()];
    const running = held.map((h) => gate.run(h.check));
    await Promise.resolve();
    expect(held.map((h) => h.check.mock.calls.length)).toEqual([1, 1, 0]);
    expect(gate.load()).toEqual({ running: 2, waiting: 1 });

    const extra = jest.fn(async () => true);
    const refused = await gate.run(extra).catch((error: unknown) => error);
    expect(refused).toBeInstanceOf(HttpException);
    expect((refused as HttpException).getStatus()).toBe(503);
    expect((refused as { retryAfterSeconds: number }).retryAfterSeconds).toBe(3);
    expect(extra).not.toHaveBeenCalled();

    held[0].finish();
    await running[0];
    await Promise.resolve();
    expect(held[2].check).toHaveBeenCalledTimes(1);
    expect(gate.load()).toEqual({ running: 2, waiting: 0 });
    held[1].finish();
    held[2].finish();
    await Promise.all(running);
    expect(gate.load()).toEqual({ running: 0, waiting: 0 });
  });

  it('gives the slot back when a check fails', async () => {
    const gate = new PasswordCheckGate(1, 0);
    await expect(gate.run(async () => Promise.reject(new Error('boom')))).rejects.toThrow('boom');
    await expect(gate.run(async () => 'next')).resolves.toBe('next');
  });
});
