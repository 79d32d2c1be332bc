import type { EntityManager } from '@mikro-orm/mariadb';
import type { AuditService } from '../audit/audit.service';
import { AuditEntry } from '../audit/entities/audit-entry.entity';
import { Zone } from '../zones/entities/zone.entity';
import { DEMO_SCHEDULE_STORIES, type DemoScheduleStory } from './demo-schedule-stories';
import type { DemoScheduleOutcome, DemoSchedulesService } from './demo-schedules.service';
import type { ForecastReplayService, ZoneReplaySummary } from './forecast-replay.service';

/** The audit action that marks the first-start replay as done; it is never done again. */
export const DEMO_REPLAY_ACTION = 'system.demo-replay';
/** A MariaDB named lock: two replays started at once run one after the other (the second finds the mark). */
const LOCK = 'morrowline.demo-replay';
const LOCK_WAIT_SECONDS = 900;

export interface DemoReplayOptions {
  /** Zone codes (default every active zone). */
  zones?: readonly string[];
  /** The demo's published schedules (default the scenario's). */
  stories?: readonly DemoScheduleStory[];
  now?: number;
  log?: (line: string) => void;
}

export type DemoReplayOutcome =
  | { state: 'done'; forecasts: ZoneReplaySummary[]; schedules: DemoScheduleOutcome[] }
  | { state: 'done-before'; at: string }
  | { state: 'nothing-to-replay' };

/**
 * The first start's replay of the desk's daily work over the history it was given (forecast runs
 * marked replayed; see ForecastReplayService) and the demo scenario's published schedules
 * (DemoSchedulesService). When it has replayed something it writes an audit entry, checked first
 * by every later call, so it is done once per installation; when no zone has enough history yet
 * it writes nothing and a later call tries again. Each forecast day and each schedule is kept as
 * soon as it is made, and a call after an interruption goes on from there.
 */
export class DemoReplayService {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly forecasts: ForecastReplayService,
    private readonly schedules: DemoSchedulesService,
  ) {}

  /** When the replay was done (its audit entry), or null while it has not been. */
  async doneAt(): Promise<string | null> {
    const mark = await this.em.fork().findOne(AuditEntry, { action: DEMO_REPLAY_ACTION }, { orderBy: { id: 'asc' } });
    return mark ? mark.at.toISOString() : null;
  }

  async run(options: DemoReplayOptions = {}): Promise<DemoReplayOutcome> {
    const log = options.log ?? (() => undefined);
    return this.exclusively(async () => {
      const at = await this.doneAt();
      if (at) return { state: 'done-before', at };
      const now = options.now ?? Date.now();
      const zones = await this.zones(options.zones);
      log(`replaying the desk's daily forecasts over the stored history (${zones.map((z) => z.code).join(', ')})`);
      const forecasts = await this.forecasts.replay(zones, now, log);
      if (forecasts.every((z) => z.stored + z.kept === 0)) return { state: 'nothing-to-replay' };
      log("publishing the demo scenario's schedules");
      const schedules = await this.schedules.make(options.stories ?? DEMO_SCHEDULE_STORIES, now, log);
      await this.audit.record(null, {
        action: DEMO_REPLAY_ACTION,
        subjectType: 'system',
        after: { forecasts, schedules: schedules.map((s) => ({ zone: s.zone, operatingDay: s.operatingDay, revisionId: s.revisionId, skipped: s.skipped })) },
        reason: "first start: the desk's daily forecasts replayed over the backfilled history (runs marked replayed) and the demo scenario's published schedules",
      });
      return { state: 'done', forecasts, schedules };
    });
  }

  private async zones(codes: readonly string[] | undefined): Promise<Zone[]> {
    const em = this.em.fork();
    if (!codes) return em.find(Zone, { active: true }, { orderBy: { code: 'asc' } });
    const found = await em.find(Zone, { code: { $in: [...codes] }, active: true }, { orderBy: { code: 'asc' } });
    const missing = codes.filter((c) => !found.some((z) => z.code === c));
    if (missing.length) throw new Error(`no active zone ${missing.join(', ')}`);
    return found;
  }

  /** Holds the named lock on a connection of its own for as long as `work` runs. */
  private async exclusively<T>(work: () => Promise<T>): Promise<T> {
    return this.em.getKnex().transaction(async (trx) => {
      const got = unwrap<{ got: number | null }>(await trx.raw('select get_lock(?, ?) as got', [LOCK, LOCK_WAIT_SECONDS]))[0]?.got;
      if (Number(got) !== 1) throw new Error('another replay has held the lock for too long; try again later');
      try {
        return await work();
      } finally {
        await trx.raw('select release_lock(?)', [LOCK]);
      }
    });
  }
}

function unwrap<T>(result: unknown): T[] {
  if (Array.isArray(result) && Array.isArray(result[0])) return result[0] as T[];
  if (Array.isArray(result)) return result as T[];
  return [];
}
