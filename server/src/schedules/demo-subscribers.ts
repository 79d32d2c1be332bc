import type { EntityManager } from '@mikro-orm/core';
import { ScheduleSubscriber } from './entities/schedule-subscriber.entity';

/** Two invented recipients of the publication e-mails (Tallowmere Valley Electric Cooperative). */
export const DEMO_SUBSCRIBERS = [
  { email: 'trading.desk@tallowmere.example', name: 'Tallowmere trading desk', zones: null },
  { email: 'copperline.dispatch@tallowmere.example', name: 'Copperline dispatch', zones: ['COPPERLINE'] },
];

/**
 * Adds the demo subscribers once: only while the table has never held a subscriber, so a
 * supervisor's removals (kept as inactive rows) and additions are never undone by a restart.
 */
export async function seedDemoSubscribers(em: EntityManager): Promise<void> {
  if ((await em.count(ScheduleSubscriber, {})) > 0) return;
  for (const s of DEMO_SUBSCRIBERS) em.create(ScheduleSubscriber, { ...s, active: true, addedBy: null, addedAt: new Date() });
  await em.flush();
}
