/**
 * Fault tests of ordered, durable ingest against real processes: a server run from source and
 * the test MariaDB, killed with SIGKILL (and the server stopped with SIGTERM) while the project's
 * own sender (simulators/src/sender.ts) streams readings with resends and late corrections.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as mariadb from 'mariadb';
import { DEMO_USERS, HOUR_MS, type ReadingBatch, type ReadingBatchAck } from '@morrowline/shared';
import { freePort, ROOT, ServerProcess } from './support/server-process';

jest.setTimeout(420_000);

/** What the test uses of the simulator's FeedSender (loaded at run time: it lives in another workspace). */
interface Sender {
  send(readings: { zone: string; hour: string; mw: number }[]): Promise<void>;
  drain(): Promise<void>;
  close(): void;
  readonly stats: { stored: number; resent: number; rejected: number };
}
type SenderClass = new (
  url: string,
  apiKey: string,
  runId: string,
  log: (line: string) => void,
  options: { maxInFlight: number; retryDelayMs: number; reconnectionDelay: number; reconnectionDelayMax: number; onStored: (batch: ReadingBatch, ack: ReadingBatchAck) => void },
) => Sender;
const { FeedSender } = require(join(ROOT, 'simulators', 'src', 'sender')) as { FeedSender: SenderClass };

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};
const START = Date.UTC(2021, 0, 4, 0);
const HOURS_PER_ZONE = 20_000;
const SLICE = 500;

interface Sent {
  zone: string;
  hour: string;
  mw: number;
}

/**
 * 40,000 (zone, hour) values in hour order over two zones; every fifth sent again later with the
 * same value (8,000 resends, 20 %) and every twentieth corrected later to a new value (2,000, 5 %):
 * 50,000 readings. Resends and corrections follow their first send by 60 to 2,000 positions.
 */
function stream(zones: [string, string]): Sent[] {
  const firsts: Sent[] = [];
  for (let h = 0; h < HOURS_PER_ZONE; h++) {
    for (const zone of zones) firsts.push({ zone, hour: new Date(START + h * HOUR_MS).toISOString(), mw: 100 + ((h * 7 + zone.length) % 500) });
  }
  const later = new Map<number, Sent[]>();
  const at = (position: number, reading: Sent) => {
    const list = later.get(position) ?? [];
    list.push(reading);
    later.set(position, list);
  };
  firsts.forEach((r, i) => {
    if (i % 5 === 0) at(i + 60 + ((i * 37) % 1940), { ...r });
    if (i % 20 === 3) at(i + 60 + ((i * 53) % 1940), { ...r, mw: r.mw + 0.5 });
  });
  const out: Sent[] = [];
  const end = firsts.length + 2000;
  for (let i = 0; i < end; i++) {
    if (i < firsts.length) out.push(firsts[i]);
    out.push(...(later.get(i) ?? []));
  }
  return out;
}

describe('ingest under faults (real server processes, real MariaDB)', () => {
  const dbPort = Number(process.env.DB_PORT);
  let server: ServerProcess;
  let apiKey: string;
  let zones: [string, string];
  let zoneIds: Map<string, number>;
  const logs: string[] = [];
  const log = (line: string) => logs.push(`${new Date().toISOString()} ${line}`);

  // A connection of its own for each look: the database is killed in between.
  const connect = () => mariadb.createConnection({ host: '127.0.0.1', port: dbPort, database: process.env.DB_NAME, user: process.env.DB_USER, password: process.env.DB_PASSWORD });
  const dbEnvPid = () => Number(readFileSync(join(ROOT, '.data', 'test', 'mysqld.pid'), 'utf8').trim());
  const startDatabase = () => execFileSync('bash', [join(ROOT, 'scripts', 'db.sh'), 'start', 'test', String(dbPort)], { stdio: 'ignore', env: process.env });

  async function api<T>(path: string, token: string | null, body?: unknown): Promise<T> {
    const response = await fetch(`${server.url}${path}`, {
      method: body === undefined ? 'GET' : 'POST',
      headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!response.ok) throw new Error(`${path}: ${response.status} ${await response.text()}`);
    return (await response.json()) as T;
  }

  /** Stored (version, mw) per "zone|hour ISO" of the test's zones. */
  async function storedRows(): Promise<Map<string, { mw: number; version: number }>> {
    const codes = new Map([...zoneIds].map(([code, id]) => [id, code]));
    const db = await connect();
    const rows = (await db.query({ sql: 'select zone_id, hour_start, mw, cast(version as char) as version from readings where zone_id in (?, ?)', dateStrings: true }, [...zoneIds.values()])) as {
      zone_id: number;
      hour_start: string;
      mw: number;
      version: string;
    }[];
    await db.end();
    return new Map(rows.map((r) => [`${codes.get(r.zone_id)}|${new Date(`${r.hour_start.replace(' ', 'T')}Z`).toISOString()}`, { mw: Number(r.mw), version: Number(r.version) }]));
  }

  /**
   * Every acknowledged reading is stored: its (zone, hour) holds its version or a later one. The
   * acknowledgements are copied before the table is read: readings go on flowing while the query
   * runs (after the database kill the server is up), and a batch acknowledged after the query's
   * snapshot would otherwise count as lost.
   */
  async function lostAcknowledged(acked: Map<string, number>): Promise<string[]> {
    const ackedBefore = new Map(acked);
    const stored = await storedRows();
    const lost: string[] = [];
    for (const [key, version] of ackedBefore) if ((stored.get(key)?.version ?? 0) < version) lost.push(key);
    return lost;
  }

  beforeAll(async () => {
    server = new ServerProcess(await freePort(), join(tmpdir(), `morrowline-ingest-faults-${process.pid}.log`));
    await server.start();
    const admin = DEMO_USERS.find((u) => u.role === 'admin')!;
    const token = (await api<{ accessToken: string }>('/api/auth/login', null, { email: admin.email, password: admin.password })).accessToken;
    const suffix = (Date.now() % 1_000_000).toString(36).toUpperCase();
    zones = [`FA${suffix}`, `FB${suffix}`];
    for (const code of zones) {
      await api('/api/zones', token, { code, name: `Fault ${code}`, timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000 });
    }
    apiKey = (await api<{ apiKey: string }>('/api/feeds/keys', token, { name: `fault test feed ${suffix}` })).apiKey;
    const db = await connect();
    const rows = (await db.query('select id, code from zones where code in (?, ?)', zones)) as { id: number; code: string }[];
    await db.end();
    zoneIds = new Map(rows.map((r) => [r.code, r.id]));
  });

  afterAll(async () => {
    await server?.stop('SIGTERM');
  });

  afterEach(() => {
    // The sender's own account of the run (connects, refusals, resends), when asked for.
    if (process.env.INGEST_FAULTS_VERBOSE) console.log(logs.join('\n'));
    logs.length = 0;
  });

  it('keeps every (zone, hour) once with the last value sent, losing nothing acknowledged, through three server kills and a database kill', async () => {
    const readings = stream(zones);
    expect(readings).toHaveLength(50_000);
    const last = new Map<string, number>();
    for (const r of readings) last.set(`${r.zone}|${r.hour}`, r.mw);
    expect(last.size).toBe(40_000);

    const acked = new Map<string, number>();
    let ackedCount = 0;
    const sender = new FeedSender(server.url, apiKey, 'faults', log, {
      maxInFlight: 4,
      retryDelayMs: 300,
      reconnectionDelay: 100,
      reconnectionDelayMax: 500,
      onStored: (batch) => {
        for (const r of batch.readings) {
          const key = `${r.zone}|${r.hour}`;
          acked.set(key, Math.max(acked.get(key) ?? 0, r.version!));
        }
        ackedCount += batch.readings.length;
      },
    });
    const sending = (async () => {
      for (let i = 0; i < readings.length; i += SLICE) await sender.send(readings.slice(i, i + SLICE));
      await sender.drain();
    })();
    let sendingDone = false;
    void sending.finally(() => (sendingDone = true));

    const losses: string[] = [];
    const until = async (share: number) => {
      while (ackedCount < share * readings.length && !sendingDone) await sleep(50);
    };
    const faults: [number, string][] = [
      [0.15, 'server'],
      [0.35, 'database'],
      [0.55, 'server'],
      [0.75, 'server'],
    ];
    for (const [share, what] of faults) {
      await until(share);
      expect(sendingDone).toBe(false); // the fault lands while readings are still flowing
      if (what === 'server') {
        log(`kill -9 the server at ${ackedCount} acknowledged`);
        await server.stop('SIGKILL');
        losses.push(...(await lostAcknowledged(acked)));
        await server.start();
      } else {
        log(`kill -9 mariadbd at ${ackedCount} acknowledged`);
        const pid = dbEnvPid();
        process.kill(pid, 'SIGKILL');
        while (alive(pid)) await sleep(100);
        await sleep(1000); // batches meet the outage and are answered with errors
        startDatabase();
        losses.push(...(await lostAcknowledged(acked)));
      }
    }
    await sending;
    sender.close();

    expect(losses).toEqual([]);
    expect(await lostAcknowledged(acked)).toEqual([]);
    const stored = await storedRows();
    expect(stored.size).toBe(last.size);
    const wrong = [...last].filter(([key, mw]) => stored.get(key)?.mw !== mw);
    expect(wrong.slice(0, 10)).toEqual([]);
    // Every one of the 50,000 was eventually acknowledged, and the faults made the sender resend.
    expect(sender.stats.stored).toBe(readings.length);
    expect(sender.stats.resent).toBeGreaterThan(0);
  });

  it('on SIGTERM answers the batches in hand: each acknowledged batch is stored', async () => {
    const corrections = [...(await storedRows()).keys()].slice(0, 6_000).map((key) => {
      const [zone, hour] = key.split('|');
      return { zone, hour, mw: 900.25 };
    });
    const ackedBatches: ReadingBatch[] = [];
    const sender = new FeedSender(server.url, apiKey, 'sigterm', log, {
      maxInFlight: 4,
      retryDelayMs: 300,
      reconnectionDelay: 100,
      reconnectionDelayMax: 500,
      onStored: (batch) => ackedBatches.push(batch),
    });
    const sending = (async () => {
      for (let i = 0; i < corrections.length; i += 200) await sender.send(corrections.slice(i, i + 200));
      await sender.drain();
    })();
    while (ackedBatches.length < 5) await sleep(20);
    log(`SIGTERM to the server at ${ackedBatches.length} acknowledged batches`);
    await server.stop('SIGTERM');
    const acked = new Map<string, number>();
    for (const batch of ackedBatches) for (const r of batch.readings) acked.set(`${r.zone}|${r.hour}`, Math.max(acked.get(`${r.zone}|${r.hour}`) ?? 0, r.version!));
    expect(ackedBatches.length).toBeLessThan(30); // it stopped while the feed was sending
    expect(await lostAcknowledged(acked)).toEqual([]);

    await server.start();
    await sending;
    sender.close();
    const stored = await storedRows();
    expect(corrections.filter((r) => stored.get(`${r.zone}|${r.hour}`)?.mw !== 900.25)).toEqual([]);
  });
});
