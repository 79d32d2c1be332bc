import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

/**
 * One machine needs no Redis: without REDIS_URL, loading the whole application (the module tree
 * and the entry's socket adapter) loads none of the cluster's packages, so nothing can connect.
 * Run in a child process from the TypeScript source (tsx), where Node's own module cache says
 * what was loaded.
 */
describe('the single machine (no REDIS_URL)', () => {
  it('loads neither bullmq, ioredis nor the socket.io Redis adapter', () => {
    const script = [
      "require('reflect-metadata');",
      "require('./src/app.module');",
      "require('./src/cluster/cluster-io.adapter');",
      'const loaded = Object.keys(require.cache).filter((k) => /node_modules[\\\\/](bullmq|ioredis|@socket\\.io[\\\\/]redis)/.test(k));',
      "const app = Object.keys(require.cache).filter((k) => k.endsWith('app.module.ts')).length;",
      'console.log(JSON.stringify({ loaded, app }));',
    ].join('\n');
    const env = { ...process.env, REDIS_URL: '', MORROWLINE_ROLE: '' };
    const out = execFileSync(process.execPath, ['-r', 'tsx/cjs', '-e', script], { cwd: join(__dirname, '..', '..'), env, encoding: 'utf8' });
    const { loaded, app } = JSON.parse(out.trim().split('\n').pop()!) as { loaded: string[]; app: number };
    expect(app).toBe(1); // the probe did load the application
    expect(loaded).toEqual([]);
  }, 60_000);
});
