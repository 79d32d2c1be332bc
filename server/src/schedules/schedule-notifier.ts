import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ScheduleMailOutcome, ScheduleRevisionDto } from '@morrowline/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../common/auth-user';
import { ScheduleRevision } from './entities/schedule-revision.entity';
import { ScheduleSubscriber } from './entities/schedule-subscriber.entity';
import { publicationMail } from './schedule-export';
import { ScheduleMailer } from './schedule-mailer';

/**
 * Publication e-mails to the zone's active subscribers. Runs after the publication has
 * committed: a mail failure is recorded on the revision and in the audit trail
 * (schedule.mail-failed) and shown, never undoing the publication.
 */
@Injectable()
export class ScheduleNotifier {
  constructor(
    private readonly em: EntityManager,
    private readonly audit: AuditService,
    private readonly mailer: ScheduleMailer,
  ) {}

  /** Answers the revision with its mail outcome, or null when nobody subscribes to the zone. */
  async publication(publisher: AuthUser, revision: ScheduleRevisionDto, zone: { name: string; timeZone: string }): Promise<ScheduleRevisionDto | null> {
    const em = this.em.fork();
    const subscribers = (await em.find(ScheduleSubscriber, { active: true }, { orderBy: { id: 'asc' } })).filter((s) => s.zones === null || s.zones.includes(revision.zone));
    if (subscribers.length === 0) return null;
    const mail = publicationMail(revision, zone, publisher);
    let result: { sent: string[]; error: string | null };
    try {
      result = await this.mailer.send({ to: subscribers.map((s) => s.email), ...mail });
    } catch (err) {
      result = { sent: [], error: (err as Error).message };
    }
    const outcome: ScheduleMailOutcome = { at: new Date().toISOString(), sent: result.sent, error: result.error };
    await em.transactional(async (tx) => {
      await tx.nativeUpdate(ScheduleRevision, { id: revision.id }, { mailOutcome: outcome });
      if (outcome.error) {
        this.audit.stage(tx, publisher, {
          action: 'schedule.mail-failed',
          subjectType: 'schedule',
          subjectId: revision.id,
          after: { zone: revision.zone, operatingDay: revision.operatingDay, revision: revision.revision, sent: result.sent.length, of: subscribers.length },
          reason: outcome.error,
        });
      }
    });
    return { ...revision, mail: outcome };
  }
}
