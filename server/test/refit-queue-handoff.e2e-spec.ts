/**
 * The refit path a cluster worker takes, against the real MariaDB but without Redis: the queue is
 * replaced by a recording dispatch (REFIT_DISPATCH), and the test plays the workers, calling
 * RefitsService.runFromQueue as refit-worker-host.ts does. What the cluster suite shows with real
 * processes (scripts/test.sh cluster), here job by job: a stored job goes to the queue and is not
 * run in-process; a job taken over from a worker that died mid-fit completes; two workers finishing
 * the same job store one model version and one forecast run; a retry after the result is stored
 * changes nothing; a job the queue gave up on is failed and frees its zone; unfinished jobs are
 * queued again.
 */
import { EntityManager } from '@mikro-orm/mariadb';
import { Global, Module } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { Test } from '@nestjs/testing';
import request from 'supertest';
import type { RefitJobDto } from '@morrowline/shared';
import { AppModule } from '../src/app.module';
import { configureApp } from '../src/app.setup';
import { loadConfig } from '../src/config/configuration';
import { AuditEntry } from '../src/audit/entities/audit-entry.entity';
import { ForecastRun } from '../src/forecasts/entities/forecast-run.entity';
import { ModelVersion } from '../src/models/entities/model-version.entity';
import { RefitJob } from '../src/models/entities/refit-job.entity';
import { REFIT_DISPATCH, type RefitDispatchJob } from '../src/models/refit-dispatch';
import { RefitsService } from '../src/models/refits.service';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { Zone } from '../src/zones/entities/zone.entity';
import { createZone } from './support/feeds';
import { tokenFor } from './support/test-app';

jest.setTimeout(180_000);

const HOUR = 3_600_000;
const HISTORY_HOURS = 8 * 168;
const pushed: RefitDispatchJob[] = [];

@Global()
@Module({ providers: [{ provide: REFIT_DISPATCH, useValue: { push: async (job: RefitDispatchJob) => void pushed.push(job) } }], exports: [REFIT_DISPATCH] })
class RecordingDispatchModule {}

describe('refit jobs handed to a queue and run by workers (real MariaDB, queue recorded)', () => {
  let app: NestExpressApplication;
  let operator: string;
  let admin: string;
  let zone: string;
  let zoneId: number;
  const em = () => app.get(EntityManager).fork();

  beforeAll(async () => {
    const moduleRef = await Test.createTestingModule({ imports: [AppModule, RecordingDispatchModule] }).compile();
    app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
    configureApp(app, loadConfig());
    await app.listen(0, '127.0.0.1');
    [operator, admin] = await Promise.all([tokenFor(app, 'operator'), tokenFor(app, 'admin')]);
    zone = await createZone(app, admin);
    zoneId = (await em().findOneOrFail(Zone, { code: zone })).id;
    const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
    const rows = Array.from({ length: HISTORY_HOURS }, (_, i) => {
      const t = last - (HISTORY_HOURS - 1 - i) * HOUR;
      const hourOfDay = (t / HOUR) % 24;
      return { zoneId, zone, hourStart: t, mw: Math.round((300 + 80 * Math.sin((2 * Math.PI * (hourOfDay - 9)) / 24) + ((i * 7919) % 13) - 6) * 10) / 10, quality: 'good' as const };
    });
    await app.get(ReadingsRepository).store(rows, 'test:history');
  });
  afterAll(async () => {
    await app?.close();
  });

  const counts = async () => ({
    versions: await em().count(ModelVersion, { zone: zoneId }),
    runs: await em().count(ForecastRun, { zone: zoneId }),
  });

  let jobId: number;
  let thirdId: number;

  it('queues a requested refit and does not run it in this process', async () => {
    const res = await request(app.getHttpServer()).post('/api/models/refits').set('Authorization', `Bearer ${operator}`).send({ zone, reason: 'queued refit' }).expect(202);
    jobId = (res.body as RefitJobDto[])[0].id;
    expect(pushed).toEqual([{ refitJobId: jobId, zoneId, mode: 'full', trigger: 'operator' }]);
    await app.get(RefitsService).settled();
    expect((await em().findOneOrFail(RefitJob, jobId)).state).toBe('queued');
    // a second request joins the job already there: nothing more is queued
    const again = await request(app.getHttpServer()).post('/api/models/refits').set('Authorization', `Bearer ${operator}`).send({ zone, reason: 'again' }).expect(202);
    expect((again.body as RefitJobDto[])[0].id).toBe(jobId);
    expect(pushed).toHaveLength(1);
  });

  it('finishes a job taken over from a worker that died mid-fit, storing once when two workers both finish it', async () => {
    // the first worker had started: the row says running, 20 %, and nothing was stored
    await em().nativeUpdate(RefitJob, { id: jobId }, { state: 'running', progress: 20, stage: 'choosing the differencing and ARMA orders', startedAt: new Date() });
    const refits = app.get(RefitsService);
    await Promise.all([refits.runFromQueue(jobId), refits.runFromQueue(jobId)]);
    const job = await em().findOneOrFail(RefitJob, jobId);
    expect(job).toMatchObject({ state: 'done', promoted: true, activeZoneId: null });
    expect(await counts()).toEqual({ versions: 1, runs: 1 });
    expect(await em().count(AuditEntry, { action: 'refit.finish', subjectType: 'refit', subjectId: String(jobId) })).toBe(1);
    expect(await em().count(ModelVersion, { zone: zoneId, status: 'in-service' })).toBe(1);
  });

  it('changes nothing when the queue hands over a job whose result is already stored', async () => {
    await app.get(RefitsService).runFromQueue(jobId);
    await app.get(RefitsService).failFromQueue(jobId, 'the workers running it stopped');
    expect(await em().findOneOrFail(RefitJob, jobId)).toMatchObject({ state: 'done' });
    expect(await counts()).toEqual({ versions: 1, runs: 1 });
  });

  it('fails a job the queue gave up on, so the zone can be refitted again', async () => {
    const res = await request(app.getHttpServer()).post('/api/models/refits').set('Authorization', `Bearer ${operator}`).send({ zone, reason: 'second refit' }).expect(202);
    const second = (res.body as RefitJobDto[])[0].id;
    expect(second).not.toBe(jobId);
    await em().nativeUpdate(RefitJob, { id: second }, { state: 'running', progress: 20 });
    await app.get(RefitsService).failFromQueue(second, 'the workers running it stopped (job stalled more than allowable limit)');
    expect(await em().findOneOrFail(RefitJob, second)).toMatchObject({ state: 'failed', activeZoneId: null, message: 'the workers running it stopped (job stalled more than allowable limit)' });
    expect(await counts()).toEqual({ versions: 1, runs: 1 });
    const third = await request(app.getHttpServer()).post('/api/models/refits').set('Authorization', `Bearer ${operator}`).send({ zone, reason: 'third refit' }).expect(202);
    thirdId = (third.body as RefitJobDto[])[0].id;
    expect(thirdId).toBeGreaterThan(second);
  });

  it('puts an unfinished job on the queue again each hour (its node may have stopped before queueing it), as the same queue job', async () => {
    pushed.length = 0;
    await app.get(RefitsService).requeueUnfinished();
    expect(pushed).toContainEqual({ refitJobId: thirdId, zoneId, mode: 'full', trigger: 'operator' });
    expect(pushed.map((p) => p.refitJobId)).not.toContain(jobId);
  });
});
