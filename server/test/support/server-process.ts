import { spawn, type ChildProcess } from 'node:child_process';
import { openSync } from 'node:fs';
import { join } from 'node:path';

/** The repository's root (server/test/support → ../../..). */
export const ROOT = join(__dirname, '..', '..', '..');

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * A real server process run from source (fault tests kill it): the environment of the test run
 * (its database), on a port of its own, output appended to a log file.
 */
export class ServerProcess {
  private child: ChildProcess | null = null;
  private exited: Promise<number | null> = Promise.resolve(null);

  constructor(
    readonly port: number,
    private readonly logFile: string,
  ) {}

  get url(): string {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    const log = openSync(this.logFile, 'a');
    const child = spawn(process.execPath, ['-r', join(__dirname, 'swc-register.cjs'), 'src/main.ts'], {
      cwd: join(ROOT, 'server'),
      env: { ...process.env, PORT: String(this.port), HOST: '127.0.0.1' },
      stdio: ['ignore', log, log],
    });
    this.child = child;
    this.exited = new Promise((resolve) => child.once('exit', (code) => resolve(code)));
    for (let i = 0; i < 240; i++) {
      if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode} while starting; see ${this.logFile}`);
      try {
        if ((await fetch(`${this.url}/api/health`)).ok) return;
      } catch {
        // not listening yet
      }
      await sleep(250);
    }
    throw new Error(`the server did not answer within a minute; see ${this.logFile}`);
  }

  /** Sends a signal and waits until the process is gone; answers its exit code. */
  async stop(signal: NodeJS.Signals): Promise<number | null> {
    if (!this.child || this.child.exitCode !== null) return this.child?.exitCode ?? null;
    this.child.kill(signal);
    return this.exited;
  }
}

/** A free loopback port. */
export async function freePort(): Promise<number> {
  const { createServer } = await import('node:net');
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}
