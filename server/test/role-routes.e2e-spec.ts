import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { DiscoveryService, MetadataScanner, Reflector } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { io, type Socket } from 'socket.io-client';
import request from 'supertest';
import { DESK_EVENTS, DESK_NAMESPACE, ROLES, type AlertDto, type ForecastRunDto, type RefitJobDto, type Role } from '@morrowline/shared';
import { PUBLIC_KEY, ROLES_KEY } from '../src/common/decorators/roles.decorator';
import { DOMAIN_EVENTS } from '../src/events/domain-events';
import { DomainEventsPublisher } from '../src/events/domain-events.publisher';
import { baseUrl, startTestApp, tokenFor } from './support/test-app';

/**
 * Who may call what, written out from README's role table ("may" column) — not read from the
 * code. v viewer, o operator, s supervisor, a admin; "public" needs no token. Every route the
 * controllers declare must appear here (and nothing else), so a new route cannot be missed.
 */
const EXPECTED: Record<string, 'public' | string> = {
  'POST /api/auth/login': 'public',
  'GET /api/auth/me': 'vosa',
  'POST /api/auth/logout': 'vosa',
  'GET /api/health': 'public',
  // live load: readings, alerts, forecasts, outage windows, zones
  'GET /api/readings': 'vosa',
  'GET /api/readings/status': 'vosa',
  'GET /api/readings/export': 'vosa',
  'POST /api/readings/upload': 'os',
  'GET /api/alerts': 'vosa',
  'POST /api/alerts/:id/acknowledge': 'os',
  'GET /api/forecasts/latest': 'vosa',
  'GET /api/forecasts/runs': 'vosa',
  'GET /api/forecasts/runs/:id/diff': 'vosa',
  'GET /api/live/committed': 'vosa',
  'GET /api/clock': 'vosa',
  'GET /api/outages': 'vosa',
  'POST /api/outages': 'os',
  'PATCH /api/outages/:id': 'os',
  'POST /api/outages/:id/close': 'os',
  'GET /api/zones': 'vosa',
  'POST /api/zones': 'a',
  'PATCH /api/zones/:id': 'a',
  // published schedules and accuracy for viewers; drafts, adjustments and submissions for the desk
  'GET /api/accuracy': 'vos',
  'GET /api/schedules/:day': 'vos',
  'GET /api/schedules/:day/:zone/revisions': 'vos',
  'GET /api/schedules/revisions/:id': 'vos',
  'GET /api/schedules/revisions/:id/export': 'vos',
  'POST /api/schedules/:day/adjustments': 'os',
  'DELETE /api/schedules/adjustments/:id': 'os',
  'POST /api/schedules/:day/:zone/draft': 'os',
  'POST /api/schedules/:day/:zone/corrections': 'os',
  'GET /api/schedules/:day/:zone/weather-what-if': 'os',
  'GET /api/schedules/:day/:zone/weather-vintages': 'os',
  'POST /api/schedules/:day/:zone/weather-what-if/adjustments': 'os',
  'DELETE /api/schedules/adjustment-batches/:id': 'os',
  'POST /api/schedules/revisions/:id/submit': 'os',
  'POST /api/schedules/revisions/:id/restart': 'os',
  'POST /api/schedules/revisions/:id/back-to-model': 'os',
  'POST /api/schedules/revisions/:id/approve': 's',
  'POST /api/schedules/revisions/:id/return': 's',
  'GET /api/schedules/subscribers': 's',
  'POST /api/schedules/subscribers': 's',
  'DELETE /api/schedules/subscribers/:id': 's',
  // handover notes and model internals: the forecasting roles only
  'GET /api/handover/shift': 'os',
  'GET /api/handover/draft': 'os',
  'GET /api/handover/pending': 'os',
  'GET /api/handover': 'os',
  'GET /api/handover/:id': 'os',
  'POST /api/handover': 'os',
  'POST /api/handover/:id/acknowledge': 'os',
  'GET /api/models/refits': 'os',
  'POST /api/models/refits': 'os',
  'GET /api/models': 'os',
  'GET /api/models/:id': 'os',
  'GET /api/models/:id/compare': 'os',
  'POST /api/models/:id/promote': 'os',
  'GET /api/workbench/:zone/stationarity': 'os',
  'GET /api/workbench/:zone/model': 'os',
  'POST /api/workbench/:zone/backtest': 'os',
  // the audit trail: supervisors and admin; users, zones and feed keys: admin
  'GET /api/audit': 'sa',
  'GET /api/users': 'a',
  'POST /api/users': 'a',
  'PATCH /api/users/:id': 'a',
  'GET /api/feeds/keys': 'a',
  'POST /api/feeds/keys': 'a',
  'POST /api/feeds/keys/:id/revoke': 'a',
  // weather: everyone reads it; the desk uploads it; admin keeps the stations and zone weights
  'GET /api/weather/stations': 'vosa',
  'POST /api/weather/stations': 'a',
  'GET /api/weather/zone-stations': 'vosa',
  'PUT /api/weather/zone-stations/:zone': 'a',
  'GET /api/weather/zones': 'vosa',
  'GET /api/weather/status': 'vosa',
  'POST /api/weather/observed/upload': 'os',
  'POST /api/weather/forecasts/upload': 'os',
  'GET /api/weather/observed/export': 'vosa',
  'GET /api/weather/forecasts/export': 'vosa',
  // the holiday calendar: everyone reads it; supervisors and admin keep it
  'GET /api/calendar': 'vosa',
  'POST /api/calendar': 'sa',
  'PATCH /api/calendar/:id': 'sa',
  'DELETE /api/calendar/:id': 'sa',
};

const LETTER: Record<Role, string> = { viewer: 'v', operator: 'o', supervisor: 's', admin: 'a' };

interface Route {
  key: string;
  method: string;
  path: string;
  /** What the metadata says: the roles of @Roles/@SignedIn, or "public". */
  declared: Role[] | 'public' | 'none';
}

/** Every route of every controller, from Nest's own metadata. */
function discoverRoutes(app: NestExpressApplication): Route[] {
  const discovery = app.get(DiscoveryService, { strict: false });
  const reflector = app.get(Reflector, { strict: false });
  const scanner = new MetadataScanner();
  const routes: Route[] = [];
  for (const wrapper of discovery.getControllers()) {
    const { metatype, instance } = wrapper as { metatype: (new (...args: never[]) => object) | null; instance: object | null };
    if (!metatype || !instance) continue;
    const base = String(Reflect.getMetadata(PATH_METADATA, metatype) ?? '');
    const prototype = Object.getPrototypeOf(instance) as Record<string, (...args: unknown[]) => unknown>;
    for (const name of scanner.getAllMethodNames(prototype)) {
      const handler = prototype[name];
      const own = Reflect.getMetadata(PATH_METADATA, handler) as string | string[] | undefined;
      if (own === undefined) continue;
      const method = RequestMethod[Reflect.getMetadata(METHOD_METADATA, handler) as number];
      for (const part of Array.isArray(own) ? own : [own]) {
        const path = '/' + ['api', base, part].map((p) => p.replace(/^\/|\/$/g, '')).filter(Boolean).join('/');
        const isPublic = reflector.getAllAndOverride<boolean>(PUBLIC_KEY, [handler, metatype]);
        const roles = reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [handler, metatype]);
        routes.push({ key: `${method} ${path}`, method, path, declared: isPublic ? 'public' : roles ? [...roles] : 'none' });
      }
    }
  }
  return routes;
}

/** Path parameters that name nothing, so an allowed call fails on its input (4xx), never changes data. */
function concrete(path: string): string {
  return path.replace(':id', '999999').replace(':day', '2031-02-30').replace(':zone', 'NOZONE');
}

function call(app: NestExpressApplication, route: Route, token: string | null) {
  const agent = request(app.getHttpServer());
  const url = concrete(route.path);
  const req =
    route.method === 'GET' ? agent.get(url) : route.method === 'POST' ? agent.post(url) : route.method === 'PATCH' ? agent.patch(url) : route.method === 'DELETE' ? agent.delete(url) : agent.put(url);
  if (token) req.set('Authorization', `Bearer ${token}`);
  return route.method === 'GET' || route.method === 'DELETE' ? req : req.send({});
}

describe('role × route: every route as README says (routes from the controllers\' metadata)', () => {
  let app: NestExpressApplication;
  let routes: Route[];
  const tokens = {} as Record<Role, string>;

  beforeAll(async () => {
    app = await startTestApp();
    routes = discoverRoutes(app);
    for (const role of ROLES) tokens[role] = await tokenFor(app, role);
  });
  afterAll(async () => {
    await app.close();
  });

  it('lists exactly the routes the controllers declare', () => {
    const declared = routes.map((r) => r.key).sort();
    expect(declared.filter((key) => !(key in EXPECTED))).toEqual([]);
    expect(Object.keys(EXPECTED).filter((key) => !declared.includes(key))).toEqual([]);
    expect(new Set(declared).size).toBe(declared.length);
  });

  it('declares on every route the roles README gives it', () => {
    const mismatches = routes.filter((r) => {
      const wanted = EXPECTED[r.key];
      if (r.declared === 'public' || r.declared === 'none') return r.declared !== wanted;
      return wanted !== ROLES.filter((role) => (r.declared as Role[]).includes(role)).map((role) => LETTER[role]).join('');
    });
    expect(mismatches.map((r) => `${r.key}: ${JSON.stringify(r.declared)} vs ${EXPECTED[r.key]}`)).toEqual([]);
  });

  it('answers every role on every route as declared: allowed is neither 401 nor 403, refused is 403, no token is 401', async () => {
    const wrong: string[] = [];
    for (const route of routes.filter((r) => r.key !== 'POST /api/auth/logout')) {
      const wanted = EXPECTED[route.key];
      const anonymous = (await call(app, route, null)).status;
      if (wanted === 'public' ? anonymous === 401 || anonymous === 403 : anonymous !== 401) wrong.push(`${route.key} without a token: ${anonymous}`);
      for (const role of ROLES) {
        const status = (await call(app, route, tokens[role])).status;
        const allowed = wanted === 'public' || wanted.includes(LETTER[role]);
        if (allowed ? status === 401 || status === 403 || status >= 500 : status !== 403) wrong.push(`${route.key} as ${role}: ${status}`);
      }
    }
    expect(wrong).toEqual([]);
  }, 300_000); // some 280 requests, a few of them real reads: minutes on a loaded machine

  it('lets every role sign out (last: it ends the tokens above)', async () => {
    const route = routes.find((r) => r.key === 'POST /api/auth/logout')!;
    expect((await call(app, route, null)).status).toBe(401);
    for (const role of ROLES) expect((await call(app, route, tokens[role])).status).toBe(204);
  });
});

/**
 * Who hears each desk message, written out from README's role table: live load, forecasts and
 * alerts for everyone; refit progress and unpublished schedule changes for the forecasting
 * roles; a publication for everyone who reads published schedules. Every DESK_EVENTS name must
 * have a row.
 */
const DESK_EXPECTED: Record<string, { hearers: string; publish: (events: DomainEventsPublisher) => void }[]> = {
  [DESK_EVENTS.readings]: [{ hearers: 'vosa', publish: (e) => e.publish(DOMAIN_EVENTS.readingsStored, { zones: [], receivedAt: new Date().toISOString() }) }],
  [DESK_EVENTS.alertRaised]: [{ hearers: 'vosa', publish: (e) => e.publish(DOMAIN_EVENTS.alertRaised, { id: -1 } as AlertDto) }],
  [DESK_EVENTS.alertAcknowledged]: [{ hearers: 'vosa', publish: (e) => e.publish(DOMAIN_EVENTS.alertAcknowledged, { id: -1 } as AlertDto) }],
  [DESK_EVENTS.forecast]: [{ hearers: 'vosa', publish: (e) => e.publish(DOMAIN_EVENTS.forecastIssued, { id: -1 } as ForecastRunDto) }],
  [DESK_EVENTS.refitProgress]: [{ hearers: 'os', publish: (e) => e.publish(DOMAIN_EVENTS.refitProgress, { id: -1 } as RefitJobDto) }],
  [DESK_EVENTS.schedule]: [
    ...(['draft', 'submitted', 'returned'] as const).map((state) => ({
      hearers: 'os',
      publish: (e: DomainEventsPublisher) => e.publish(DOMAIN_EVENTS.scheduleChanged, { action: 'adjust', zone: 'NOZONE', operatingDay: '2031-01-01', revisionId: -1, revision: 1, state }),
    })),
    ...(['published', 'superseded'] as const).map((state) => ({
      hearers: 'vos',
      publish: (e: DomainEventsPublisher) => e.publish(DOMAIN_EVENTS.scheduleChanged, { action: 'publish', zone: 'NOZONE', operatingDay: '2031-01-01', revisionId: -1, revision: 1, state }),
    })),
  ],
};

describe('role × desk event: who hears what on /desk', () => {
  let app: NestExpressApplication;
  const sockets = {} as Record<Role, Socket>;
  const heard = {} as Record<Role, string[]>;

  beforeAll(async () => {
    app = await startTestApp();
    for (const role of ROLES) {
      heard[role] = [];
      const socket = io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: { token: await tokenFor(app, role) }, transports: ['websocket'], reconnection: false });
      await new Promise((resolve, reject) => {
        socket.once(DESK_EVENTS.hello, resolve);
        socket.once('connect_error', reject);
      });
      socket.onAny((event: string) => heard[role].push(event));
      sockets[role] = socket;
    }
  });
  afterAll(async () => {
    for (const socket of Object.values(sockets)) socket.close();
    await app.close();
  });

  it('has a row for every desk message', () => {
    const names = Object.values(DESK_EVENTS).filter((name) => name !== DESK_EVENTS.hello);
    expect(names.filter((name) => !(name in DESK_EXPECTED))).toEqual([]);
  });

  it.each(Object.entries(DESK_EXPECTED).flatMap(([event, rows]) => rows.map((row, i) => [`${event} #${i + 1} → ${row.hearers}`, event, row] as const)))(
    '%s',
    async (_label, event, row) => {
      for (const role of ROLES) heard[role] = [];
      const events = app.get(DomainEventsPublisher);
      row.publish(events);
      // Then a marker every desk hears: a socket delivers in order, so once the marker is in,
      // whatever was sent to that desk before it has arrived too.
      const marker = `marker-${event}-${Math.random()}`;
      const markers = ROLES.map(
        (role) => new Promise<void>((resolve) => {
          const seen = (payload: { receivedAt?: string }) => {
            if (payload?.receivedAt !== marker) return;
            sockets[role].off(DESK_EVENTS.readings, seen);
            resolve();
          };
          sockets[role].on(DESK_EVENTS.readings, seen);
        }),
      );
      events.publish(DOMAIN_EVENTS.readingsStored, { zones: [], receivedAt: marker });
      await Promise.all(markers);
      for (const role of ROLES) {
        const before = heard[role].slice(0, heard[role].lastIndexOf(DESK_EVENTS.readings));
        expect([role, before.includes(event)]).toEqual([role, row.hearers.includes(LETTER[role])]);
      }
    },
  );
});
