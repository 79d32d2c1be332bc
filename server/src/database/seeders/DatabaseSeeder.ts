import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { DEMO_TIME_ZONE, DEMO_USERS, DEMO_ZONES } from '@morrowline/shared';
import { AuditEntry } from '../../audit/entities/audit-entry.entity';
import { seedDemoWeather } from './demo-weather';
import { seedDemoSubscribers } from '../../schedules/demo-subscribers';
import { User } from '../../users/entities/user.entity';
import { hashPassword } from '../../users/password';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * The invented demo scenario (Tallowmere Valley Electric Cooperative): its users and five
 * zones. Runs only into an empty database, so a second `npm start` keeps what is there.
 */
export class DatabaseSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    // Its own idempotent step, so databases seeded before schedules existed get the subscribers too.
    await seedDemoSubscribers(em);
    if ((await em.count(User, {})) > 0) {
      await seedDemoWeather(em);
      return;
    }
    for (const demo of DEMO_USERS) {
      em.create(User, {
        email: demo.email,
        name: demo.name,
        role: demo.role,
        passwordHash: await hashPassword(demo.password),
        active: true,
        createdAt: new Date(),
        lastLoginAt: null,
      });
    }
    for (const demo of DEMO_ZONES) {
      em.create(Zone, {
        code: demo.code,
        name: demo.name,
        timeZone: DEMO_TIME_ZONE,
        alertThresholdPct: 5,
        alertConsecutiveHours: 2,
        gateClosure: '10:00',
        minPlausibleMw: 0,
        // Room above the typical peak for a heat wave, while a meter fault reading 10x is still refused.
        maxPlausibleMw: Math.round(demo.peakMw * 1.8),
        active: true,
        createdAt: new Date(),
        updatedAt: new Date(),
      });
    }
    em.create(AuditEntry, {
      at: new Date(),
      action: 'system.seed',
      subjectType: 'system',
      subjectId: null,
      after: { users: DEMO_USERS.length, zones: DEMO_ZONES.length },
      reason: 'Demo scenario loaded',
    });
    await em.flush();
    await seedDemoWeather(em);
  }
}
