import { spawn, type ChildProcess } from 'node:child_process';
import { openSync } from 'node:fs';
import { join } from 'node:path';

/** The server workspace (test/cluster → ../..), where the compiled dist/ the suite runs lives. */
const SERVER_DIR = join(__dirname, '..', '..');
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * One process of the test cluster, run from the compiled server (`node dist/main.js` for an API
 * node, `node dist/worker.js` for a worker), with the suite's environment (database, REDIS_URL)
 * plus its own, output appended to a log file. Killed with SIGKILL by the failure tests.
 */
export class ClusterProcess {
  private child: ChildProcess | null = null;
  private exited: Promise<void> = Promise.resolve();
  private readonly logFile: string;

  constructor(
    readonly name: string,
    private readonly entry: 'main' | 'worker',
    private readonly env: Record<string, string>,
    logDir: string,
  ) {
    this.logFile = join(logDir, `cluster-${name}.log`);
  }

  get pid(): number | undefined {
    return this.child?.pid;
  }

  get running(): boolean {
    return this.child !== null && this.child.exitCode === null && this.child.signalCode === null;
  }

  /** Starts it and resolves when it is ready: an API node answers /api/health, a worker logs that it takes jobs. */
  async start(): Promise<void> {
    const log = openSync(this.logFile, 'a');
    const child = spawn(process.execPath, [join('dist', `${this.entry}.js`)], { cwd: SERVER_DIR, env: { ...process.env, ...this.env }, stdio: ['ignore', 'pipe', log] });
    this.child = child;
    this.exited = new Promise((resolve) => child.once('exit', () => resolve()));
    let output = '';
    child.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.length > 100_000) output = output.slice(-10_000);
    });
    const { appendFileSync } = await import('node:fs');
    child.stdout!.on('data', (chunk: Buffer) => appendFileSync(this.logFile, chunk));
    for (let i = 0; i < 240; i++) {
      if (!this.running) throw new Error(`${this.name} exited while starting; see ${this.logFile}`);
      if (this.entry === 'worker' ? /worker \d+ taking jobs/.test(output) : await this.healthy()) return;
      await sleep(250);
    }
    throw new Error(`${this.name} was not ready within a minute; see ${this.logFile}`);
  }

  private async healthy(): Promise<boolean> {
    try {
      return (await fetch(`http://127.0.0.1:${this.env.PORT}/api/health`)).ok;
    } catch {
      return false;
    }
  }

  /** kill -9: no shutdown hook runs, nothing is handed back. */
  async kill9(): Promise<void> {
    if (!this.running) return;
    this.child!.kill('SIGKILL');
    await this.exited;
  }

  async stop(): Promise<void> {
    if (!this.running) return;
    this.child!.kill('SIGTERM');
    let timer: NodeJS.Timeout | undefined;
    const done = await Promise.race([this.exited.then(() => true), new Promise<boolean>((resolve) => (timer = setTimeout(() => resolve(false), 10_000)))]);
    clearTimeout(timer);
    if (!done) await this.kill9();
  }
}
