// The start test: does what a new user does, on a clone of the committed HEAD in a temporary
// folder, so nothing installed, built or stored in this checkout (node_modules, dist/, .data/)
// can leak in. npm's download cache is shared; the installed tree never is.
//
//   1. fresh clone: `npm run dev` installs, builds, serves the desk through Vite; SIGINT to its
//      process group (a terminal's Ctrl-C) stops it with exit 0 and nothing of its own left.
//   2. back to a fresh clone: `npm run bench:ingest` (a small run) installs, builds, measures and
//      stops its MariaDB and server.
//   3. back to a fresh clone: `npm start` installs, builds, migrates, seeds, serves; the health
//      check reports the database up, a demo login signs in, `/` is the app's HTML, the demo
//      history is in place (Accuracy scores model forecasts); Ctrl-C → exit 0, nothing left.
//   4. `npm start` again: no install, no build, ready sooner; SIGTERM to npm alone (as a service
//      manager sends it) → exit 0, nothing left.
//
// Usage: node scripts/start-test.mjs REPORT.json   (scripts/test.sh runs it as the suite "start")
//        START_TEST_ONLY=start node scripts/start-test.mjs REPORT.json   (only the npm start steps)
// Writes a report in jest's shape, so the closing "N passed, N failed" line counts each step.
import { spawn, execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readlinkSync, readFileSync, rmSync, writeFileSync, mkdirSync, cpSync, existsSync } from 'node:fs';
import { createConnection } from 'node:net';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const reportPath = resolve(process.argv[2] ?? join(ROOT, '.data/test-reports/start.json'));
const keepDir = join(dirname(reportPath), 'start-test');
const PORTS = { app: 3291, db: 3391, smtp: 2591, client: 5291, benchApp: 3292, benchDb: 3392 };
const DEMO = { email: 'ines.marlow@tallowmere.example', password: 'operator-demo' };

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const seconds = (t0) => Math.round((Date.now() - t0) / 100) / 10;
const note = (line) => console.log(`  [start test] ${line}`);

function assert(condition, message) {
  if (!condition) throw new Error(message);
}

/** A child in a process group of its own, its output kept (and copied to a log file). */
function launch(command, args, cwd, env, logName) {
  const child = spawn(command, args, { cwd, env: { ...process.env, ...env }, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  const out = { text: '', code: undefined, signal: undefined, log: join(keepDir, logName) };
  const take = (chunk) => {
    out.text += chunk.toString();
  };
  child.stdout.on('data', take);
  child.stderr.on('data', take);
  out.exited = new Promise((done) => child.on('exit', (code, signal) => {
    out.code = code;
    out.signal = signal;
    writeFileSync(out.log, out.text);
    done();
  }));
  out.child = child;
  return out;
}

async function waitFor(what, timeoutMs, probe, run) {
  const t0 = Date.now();
  for (;;) {
    if (run && run.code !== undefined) throw new Error(`${what}: the command ended first (exit ${run.code ?? run.signal}); last output:\n${tail(run.text)}`);
    try {
      const value = await probe();
      if (value) return value;
    } catch {
      /* not yet */
    }
    if (Date.now() - t0 > timeoutMs) throw new Error(`${what}: not within ${timeoutMs / 1000} s; last output:\n${tail(run?.text ?? '')}`);
    await sleep(1000);
  }
}

const tail = (text, n = 25) => text.split('\n').slice(-n).join('\n');

async function stopAndCheck(run, signal, toGroup, clone, ports) {
  const pid = run.child.pid;
  if (toGroup) process.kill(-pid, signal);
  else process.kill(pid, signal);
  const ended = await Promise.race([run.exited.then(() => true), sleep(120_000).then(() => false)]);
  // Whatever the verdict, give what it started time to go, so a failure here does not spill into
  // the next step (a server still holding the port).
  for (let i = 0; i < 60 && processesUnder(clone).length > 0; i++) await sleep(1000);
  assert(ended, `after ${signal} the command was still running 120 s later`);
  assert(run.code === 0, `after ${signal} the command ended with ${run.code === null ? `signal ${run.signal}` : `exit status ${run.code}`}, not 0; last output:\n${tail(run.text)}`);
  const left = processesUnder(clone);
  assert(left.length === 0, `processes left running after ${signal}:\n${left.join('\n')}`);
  for (const port of ports) assert(!(await listening(port)), `port ${port} is still held after ${signal}`);
}

/** Processes whose working directory or command line lies inside the clone. */
function processesUnder(clone) {
  const found = [];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry) || Number(entry) === process.pid) continue;
    try {
      const cwd = readlinkSync(`/proc/${entry}/cwd`);
      const cmd = readFileSync(`/proc/${entry}/cmdline`, 'utf8').replace(/\0/g, ' ').trim();
      const state = /State:\s+(\w)/.exec(readFileSync(`/proc/${entry}/status`, 'utf8'))?.[1];
      if (state === 'Z') continue;
      if (cwd === clone || cwd.startsWith(`${clone}/`) || cmd.includes(clone)) found.push(`${entry} ${cmd}`);
    } catch {
      /* gone meanwhile, or not ours to read */
    }
  }
  return found;
}

function listening(port) {
  return new Promise((done) => {
    const socket = createConnection({ host: '127.0.0.1', port });
    socket.once('connect', () => {
      socket.destroy();
      done(true);
    });
    socket.once('error', () => done(false));
  });
}

async function json(url, init) {
  const response = await fetch(url, init);
  if (!response.ok) throw new Error(`${url}: HTTP ${response.status}`);
  return response.json();
}

async function healthy(base) {
  const health = await json(`${base}/api/health`);
  return health.database === 'up';
}

/** Back to the state of a fresh clone: every ignored and untracked file goes. */
function cleanClone(clone) {
  execFileSync('git', ['-C', clone, 'clean', '-xdfq']);
  assert(!existsSync(join(clone, 'node_modules')) && !existsSync(join(clone, '.data')), 'the clone still has node_modules or .data after git clean');
}

const appEnv = { PORT: String(PORTS.app), DB_PORT: String(PORTS.db), SMTP_PORT: String(PORTS.smtp), CI: process.env.CI ?? '' };
// The test suite's environment must not leak into the user's commands.
for (const name of ['NODE_ENV', 'DB_NAME', 'DB_USER', 'DB_PASSWORD', 'TEST_DB_PORT', 'TEST_APP_PORT', 'MAIL_FAKE_DIR', 'LOGIN_ATTEMPTS_PER_MINUTE']) delete process.env[name];

const results = [];
const figures = {};
// START_TEST_ONLY=dev,bench,start runs only those steps (while working on one of them).
const only = process.env.START_TEST_ONLY?.split(',');
async function test(name, body) {
  if (only && !only.some((word) => name.startsWith(`npm ${word === 'dev' || word === 'bench' ? 'run ' : ''}${word}`))) return;
  const t0 = Date.now();
  try {
    await body();
    results.push({ title: name, status: 'passed', duration: Date.now() - t0 });
    note(`✓ ${name} (${seconds(t0)} s)`);
  } catch (error) {
    results.push({ title: name, status: 'failed', duration: Date.now() - t0, failureMessages: [String(error?.stack ?? error)] });
    note(`✗ ${name} (${seconds(t0)} s)\n${String(error?.message ?? error)}`);
  }
}

rmSync(keepDir, { recursive: true, force: true });
mkdirSync(keepDir, { recursive: true });
const clone = mkdtempSync(join(tmpdir(), 'morrowline-start-'));
const head = execFileSync('git', ['-C', ROOT, 'rev-parse', 'HEAD']).toString().trim();
execFileSync('git', ['clone', '--quiet', '--no-checkout', ROOT, clone]);
execFileSync('git', ['-C', clone, 'checkout', '--quiet', '--detach', head]);
note(`clone of ${head.slice(0, 10)} in ${clone}`);

await test('npm run dev from a fresh clone: installs, serves the desk through Vite, Ctrl-C stops everything', async () => {
  const t0 = Date.now();
  const run = launch('npm', ['run', 'dev'], clone, { ...appEnv, DEV_CLIENT_PORT: String(PORTS.client), SIM_BACKFILL_WEEKS: '1' }, 'dev.log');
  const dev = `http://127.0.0.1:${PORTS.client}`;
  try {
    await waitFor('the dev server answering /api/health through Vite', 600_000, () => healthy(dev), run);
    const page = await (await fetch(`${dev}/`)).text();
    assert(page.includes('<div id="root">'), `GET / through Vite did not return the app's HTML:\n${page.slice(0, 300)}`);
    figures.dev = seconds(t0);
  } finally {
    if (run.code === undefined) await stopAndCheck(run, 'SIGINT', true, clone, [PORTS.app, PORTS.db, PORTS.smtp, PORTS.client]);
  }
});

await test('npm run bench:ingest from a fresh clone: installs, measures, stops its MariaDB and server', async () => {
  cleanClone(clone);
  const run = launch('npm', ['run', 'bench:ingest'], clone, { BENCH_READINGS: '3000', BENCH_APP_PORT: String(PORTS.benchApp), BENCH_DB_PORT: String(PORTS.benchDb) }, 'bench-ingest.log');
  const ended = await Promise.race([run.exited.then(() => true), sleep(600_000).then(() => false)]);
  if (!ended) process.kill(-run.child.pid, 'SIGKILL');
  assert(ended, 'bench:ingest did not finish within 600 s');
  assert(run.code === 0, `bench:ingest ended with ${run.code ?? run.signal}; last output:\n${tail(run.text)}`);
  assert(/ingest: [\d.]+ readings\/s/.test(run.text), `bench:ingest printed no result line:\n${tail(run.text)}`);
  const left = processesUnder(clone);
  assert(left.length === 0, `bench:ingest left processes running:\n${left.join('\n')}`);
  for (const port of [PORTS.benchApp, PORTS.benchDb]) assert(!(await listening(port)), `port ${port} still held after bench:ingest`);
});

await test('npm start from a fresh clone: installs, builds, serves, signs in, fills the demo desk; Ctrl-C stops everything', async () => {
  cleanClone(clone);
  const t0 = Date.now();
  const run = launch('npm', ['start'], clone, appEnv, 'start-first.log');
  const base = `http://127.0.0.1:${PORTS.app}`;
  try {
    await waitFor('npm start to report the desk ready', 900_000, () => run.text.includes('Ready after'), run);
    figures.firstStart = seconds(t0);
    assert(await healthy(base), '/api/health does not report the database up');
    assert(/installing npm dependencies/.test(run.text), 'the first start did not install the npm dependencies');
    const login = await json(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(DEMO) });
    assert(typeof login.accessToken === 'string' && login.accessToken.length > 20, `the demo login returned no token: ${JSON.stringify(login).slice(0, 200)}`);
    const page = await (await fetch(`${base}/`)).text();
    assert(page.includes('<div id="root">') && /<script[^>]+src="\/assets\//.test(page), `GET / did not return the built app's HTML:\n${page.slice(0, 300)}`);
    const zones = await json(`${base}/api/zones`, { headers: { authorization: `Bearer ${login.accessToken}` } });
    assert(Array.isArray(zones) && zones.length >= 5, `the demo scenario's zones are missing: ${JSON.stringify(zones).slice(0, 200)}`);
    // The demo desk is full from the first minute: Accuracy scores replayed model forecasts for
    // the last week at once, and says they are replays.
    const day = (offset) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
    const report = await json(`${base}/api/accuracy?from=${day(-8)}&to=${day(-2)}`, { headers: { authorization: `Bearer ${login.accessToken}` } });
    for (const zone of report.zones) {
      assert(zone.daysScored >= 5, `Accuracy scored only ${zone.daysScored} days of ${zone.zone} after the first start`);
      assert(zone.daysReplayed >= zone.daysScored, `${zone.zone}: ${zone.daysScored} days scored but only ${zone.daysReplayed} marked as replayed`);
    }
    assert(/demo history/.test(run.text), 'npm start did not say it was replaying the demo history');
  } finally {
    if (run.code === undefined) await stopAndCheck(run, 'SIGINT', true, clone, [PORTS.app, PORTS.db, PORTS.smtp]);
  }
});

await test('npm start a second time: no install, no build, ready sooner; SIGTERM to npm stops everything', async () => {
  const t0 = Date.now();
  const run = launch('npm', ['start'], clone, appEnv, 'start-second.log');
  const base = `http://127.0.0.1:${PORTS.app}`;
  try {
    await waitFor('the second npm start to report the desk ready', 600_000, () => run.text.includes('Ready after'), run);
    figures.secondStart = seconds(t0);
    assert(await healthy(base), '/api/health does not report the database up');
    assert(!/installing npm dependencies/.test(run.text), 'the second start installed the npm dependencies again');
    assert(/build is up to date/.test(run.text), 'the second start built again although nothing changed');
  } finally {
    if (run.code === undefined) await stopAndCheck(run, 'SIGTERM', false, clone, [PORTS.app, PORTS.db, PORTS.smtp]);
  }
});

const failed = results.filter((r) => r.status === 'failed').length;
note(`figures (s): ${JSON.stringify(figures)}`);
writeFileSync(
  reportPath,
  JSON.stringify({ numPassedTests: results.length - failed, numFailedTests: failed, numFailedTestSuites: 0, figures, testResults: [{ name: 'start', assertionResults: results }] }, null, 2),
);
// The clone goes; its logs stay beside the report when something failed.
if (failed) {
  for (const name of ['server.log', 'simulator.log', 'build.log', 'smtp-fake.log']) {
    const file = join(clone, '.data', name);
    if (existsSync(file)) cpSync(file, join(keepDir, name));
  }
}
try {
  processesUnder(clone).forEach((line) => process.kill(Number(line.split(' ')[0]), 'SIGKILL'));
} catch {
  /* nothing left */
}
rmSync(clone, { recursive: true, force: true });
process.exit(failed ? 1 : 0);
