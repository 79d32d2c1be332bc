import type { EntityManager } from '@mikro-orm/core';
import { DEMO_STATIONS, DEMO_TIME_ZONE, DEMO_ZONE_STATIONS, demoSpecialDays } from '@morrowline/shared';
import { AuditEntry } from '../../audit/entities/audit-entry.entity';
import { SpecialDay } from '../../calendar/entities/special-day.entity';
import { WeatherStation } from '../../weather/entities/weather-station.entity';
import { ZoneStationWeight } from '../../weather/entities/zone-station-weight.entity';
import { Zone } from '../../zones/entities/zone.entity';

/**
 * The demo scenario's weather stations, the zones' weights over them, and the valley's calendar
 * (last year to next year), from the same data the simulator uses (shared/src/demo-weather.ts).
 * Each part only into an empty table, so databases seeded before weather existed get it once.
 */
export async function seedDemoWeather(em: EntityManager, now = new Date()): Promise<void> {
  const zones = await em.find(Zone, { code: { $in: Object.keys(DEMO_ZONE_STATIONS) } });
  const byCode = new Map(zones.map((z) => [z.code, z]));
  if ((await em.count(WeatherStation, {})) === 0) {
    const stations = new Map<string, WeatherStation>();
    for (const s of DEMO_STATIONS) {
      stations.set(
        s.code,
        em.create(WeatherStation, { code: s.code, name: s.name, timeZone: DEMO_TIME_ZONE, latitude: s.latitude, longitude: s.longitude, elevationM: s.elevationM, createdAt: new Date() }),
      );
    }
    for (const [zone, weights] of Object.entries(DEMO_ZONE_STATIONS)) {
      const z = byCode.get(zone);
      if (!z) continue;
      for (const w of weights) em.create(ZoneStationWeight, { zone: z, station: stations.get(w.station)!, weight: w.weight });
    }
    em.create(AuditEntry, { at: new Date(), action: 'system.seed', subjectType: 'weather', subjectId: null, after: { stations: DEMO_STATIONS.length }, reason: 'Demo weather stations loaded' });
  }
  if ((await em.count(SpecialDay, {})) === 0) {
    const year = now.getUTCFullYear();
    let count = 0;
    for (let y = year - 1; y <= year + 1; y++) {
      for (const d of demoSpecialDays(y)) {
        const day = em.create(SpecialDay, { day: d.day, name: d.name, kind: d.kind, createdAt: new Date(), updatedAt: new Date() });
        day.zones.set(d.zones.map((code) => byCode.get(code)).filter((z): z is Zone => z !== undefined));
        count++;
      }
    }
    em.create(AuditEntry, { at: new Date(), action: 'system.seed', subjectType: 'calendar', subjectId: null, after: { days: count }, reason: 'Demo calendar loaded' });
  }
  await em.flush();
}
