import { Logger } from '@nestjs/common';
import { RefitQueue } from './refit-queue';

/** A job that ends when the test says so. */
function gate() {
  let open!: () => void;
  const done = new Promise<void>((resolve) => (open = resolve));
  return { done, open };
}

describe('RefitQueue', () => {
  const logger = new Logger('test');
  beforeEach(() => jest.spyOn(logger, 'error').mockImplementation(() => undefined));

  it('runs at most `concurrency` jobs at once, the rest in arrival order', async () => {
    const gates = new Map([1, 2, 3].map((id) => [id, gate()]));
    const started: number[] = [];
    const queue = new RefitQueue((id) => (started.push(id), gates.get(id)!.done), 2, logger);
    [1, 2, 3].forEach((id) => queue.push(id));
    expect(started).toEqual([1, 2]);
    gates.get(2)!.open();
    await new Promise((r) => setImmediate(r));
    expect(started).toEqual([1, 2, 3]);
    gates.get(1)!.open();
    gates.get(3)!.open();
    await queue.settled();
  });

  it('logs a failed job and goes on with the next', async () => {
    const ran: number[] = [];
    const queue = new RefitQueue(async (id) => {
      ran.push(id);
      if (id === 1) throw new Error('no readings');
    }, 1, logger);
    queue.push(1);
    queue.push(2);
    await queue.settled();
    expect(ran).toEqual([1, 2]);
    expect(logger.error).toHaveBeenCalledWith('refit job 1: no readings');
  });

  it('drops waiting jobs when stopped', async () => {
    const g = gate();
    const ran: number[] = [];
    const queue = new RefitQueue((id) => (ran.push(id), g.done), 1, logger);
    queue.push(1);
    queue.push(2);
    const stopped = queue.stop();
    g.open();
    await stopped;
    await queue.settled();
    expect(ran).toEqual([1]);
  });
});
