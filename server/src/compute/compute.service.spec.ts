import { threadId } from 'node:worker_threads';
import { batchPoolSize, ComputeService, poolSize, workerFilename } from './compute.service';

describe('compute pool', () => {
  const compute = new ComputeService();
  afterAll(() => compute.onModuleDestroy());

  it('sizes the pool one below the cores, never below one', () => {
    expect(poolSize(1)).toBe(1);
    expect(poolSize(2)).toBe(1);
    expect(poolSize(8)).toBe(7);
  });

  it('takes the thread counts from COMPUTE_THREADS and COMPUTE_BATCH_THREADS, the batch one per core by default', () => {
    expect(poolSize(2, { COMPUTE_THREADS: '2' })).toBe(2);
    expect(batchPoolSize(2, {})).toBe(2);
    expect(batchPoolSize(1, {})).toBe(1);
    expect(batchPoolSize(8, { COMPUTE_BATCH_THREADS: '3' })).toBe(3);
    expect(() => poolSize(2, { COMPUTE_THREADS: '0' })).toThrow(/positive integer/);
    expect(() => batchPoolSize(2, { COMPUTE_BATCH_THREADS: 'all' })).toThrow(/positive integer/);
  });

  it('runs a batch task in the batch pool, off the calling thread', async () => {
    const result = await compute.runBatch('compute.echo', { value: 7 });
    expect(result.value).toBe(7);
    expect(result.threadId).not.toBe(threadId);
  });

  it('loads the TypeScript worker through the tsx bootstrap when run from source', () => {
    expect(workerFilename()).toMatch(/compute\.worker\.bootstrap\.js$/);
  });

  it('runs a task in a worker thread, not on the calling thread', async () => {
    const result = await compute.run('compute.echo', { value: 42 });
    expect(result.value).toBe(42);
    expect(result.threadId).not.toBe(threadId);
  });

  it('runs an engine task and returns its result', async () => {
    let seed = 7;
    const noise = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 6;
    const values = Float64Array.from({ length: 24 * 28 }, (_, t) => 100 + 20 * Math.sin((2 * Math.PI * t) / 24) + noise());
    const report = await compute.run('workbench.stationarity', { values, maxLag: 48 });
    expect(report.checks.map((c) => c.label)).toEqual(['as recorded', '(1−B^24)', '(1−B^168)', '(1−B^24)(1−B^168)', '(1−B)(1−B^168)']);
    expect(report.checks[0].problems).toContain('daily');
  });

  it('refuses a task name it does not know', async () => {
    await expect(compute.run('no.such.task' as 'compute.echo', { value: 1 })).rejects.toThrow(/No compute task named no.such.task/);
  });
});
