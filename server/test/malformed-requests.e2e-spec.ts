import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import type { Role } from '@morrowline/shared';
import { listRoutes, WRITE_METHODS, type BodyField, type RouteInfo } from './support/routes';
import { startTestApp, tokenFor } from './support/test-app';

/**
 * Malformed requests over every route the controllers declare (read from Nest's metadata, so a
 * new route is covered without editing this file): bad path ids and days on every route that
 * has them, and on every write route bodies that are oversized, deeply nested, prototype-keyed,
 * not JSON, or carry a bad value in one field. Each must be answered 4xx in the one error shape;
 * a 5xx is a failure, and so is a 2xx.
 */

/** A harmless, well-formed value for each path parameter, so that only the part under test is bad. */
const GOOD_PARAM: Record<string, string> = { id: '999999999', day: '2026-11-02', zone: 'MILLRACE' };
const BAD_IDS = ['%201', '0x10', '1e3', '0', '-1', '01', '1.5', '9007199254740993', 'abc'];
const BAD_DAYS = ['2023-02-30', '2024-02-29T00:00Z', '0000-01-01', '9999-12-31', '2026-1-1', '20261102'];
/**
 * Values of the wrong kind for a field of each declared type, one field at a time; a field that
 * may only be left out also gets null, and every text field a text longer than any field allows.
 */
const WRONG_KIND: Record<BodyField['type'], unknown[]> = {
  string: [123, true, {}, ['x'], 'x'.repeat(50_000)],
  number: ['12', true, {}, [1], '0x10'],
  boolean: ['true', 1, {}, [true]],
  array: ['x', 1, {}, [null], [[[]]]],
  unknown: [{ nested: {} }, [[[]]]],
};

function badValues(field: BodyField): unknown[] {
  return [...WRONG_KIND[field.type], ...(field.nullable ? [] : [null])];
}

function nestedJson(levels: number): string {
  return `${'{"a":'.repeat(levels)}1${'}'.repeat(levels)}`;
}

/** Raw bodies no route may accept, whatever it expects. */
const BAD_RAW_BODIES: { name: string; body: string; status: number }[] = [
  { name: 'a body over 100 KiB', body: JSON.stringify({ note: 'x'.repeat(200 * 1024) }), status: 413 },
  { name: 'invalid JSON', body: '{"note": "unterminated', status: 400 },
  { name: 'JSON null', body: 'null', status: 400 },
  { name: 'a JSON string', body: '"text"', status: 400 },
  { name: '3,000 levels of nesting', body: nestedJson(3000), status: 400 },
  { name: '3,000 levels of arrays', body: `${'['.repeat(3000)}${']'.repeat(3000)}`, status: 400 },
  { name: 'a __proto__ key', body: '{"__proto__":{"isAdmin":true},"reason":"x"}', status: 400 },
  { name: 'a constructor key', body: '{"constructor":{"prototype":{"isAdmin":true}},"reason":"x"}', status: 400 },
  { name: 'a nested prototype key', body: '{"items":[{"prototype":{}}]}', status: 400 },
];

interface Outcome {
  route: string;
  case: string;
  status: number;
  body: unknown;
}

function fill(route: RouteInfo, overrides: Record<string, string> = {}): string {
  return route.path.replace(/:(\w+)/g, (_, name: string) => {
    const value = overrides[name] ?? GOOD_PARAM[name];
    if (value === undefined) throw new Error(`no sample value for :${name} in ${route.method} ${route.path}; add it to GOOD_PARAM`);
    return value;
  });
}

function isErrorShape(body: unknown, status: number): boolean {
  if (typeof body !== 'object' || body === null) return false;
  const b = body as Record<string, unknown>;
  return b.statusCode === status && typeof b.error === 'string' && typeof b.message === 'string' && b.message.length > 0 && typeof b.path === 'string' && typeof b.timestamp === 'string';
}

describe('malformed requests on every route (real MariaDB)', () => {
  let app: NestExpressApplication;
  let routes: RouteInfo[];
  const tokens = new Map<Role, string>();
  beforeAll(async () => {
    app = await startTestApp();
    routes = listRoutes(app);
    for (const role of ['viewer', 'operator', 'supervisor', 'admin'] as const) tokens.set(role, await tokenFor(app, role));
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  /** The request as a user allowed on the route would send it, so that guards do not answer first. */
  function call(route: RouteInfo, path: string) {
    const method = route.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    const req = api()[method](path);
    const role = route.roles[0];
    return route.isPublic || !role ? req : req.set('Authorization', `Bearer ${tokens.get(role)}`);
  }

  it('finds the application routes from the controllers, write routes and :id routes among them', () => {
    const names = routes.map((r) => `${r.method} ${r.path}`);
    expect(names).toEqual(expect.arrayContaining(['PATCH /api/users/:id', 'PATCH /api/zones/:id', 'PATCH /api/outages/:id', 'POST /api/outages/:id/close', 'POST /api/schedules/:day/adjustments']));
    expect(routes.filter((r) => WRITE_METHODS.has(r.method)).length).toBeGreaterThanOrEqual(25);
    const update = routes.find((r) => r.method === 'PATCH' && r.path === '/api/users/:id');
    expect(update?.bodyFields).toEqual(expect.arrayContaining([
      { name: 'role', type: 'unknown', nullable: false },
      { name: 'active', type: 'boolean', nullable: false },
      { name: 'reason', type: 'string', nullable: false },
    ]));
    const outage = routes.find((r) => r.method === 'PATCH' && r.path === '/api/outages/:id');
    expect(outage?.bodyFields).toEqual(expect.arrayContaining([{ name: 'end', type: 'unknown', nullable: true }]));
  });

  it('answers every malformed id and day on every route with 400 in the error shape', async () => {
    const outcomes: Outcome[] = [];
    for (const route of routes) {
      const cases: [string, string][] = [];
      if (route.params.includes('id')) for (const id of BAD_IDS) cases.push([`id ${id}`, fill(route, { id })]);
      if (route.params.includes('day')) for (const day of BAD_DAYS) cases.push([`day ${day}`, fill(route, { day })]);
      for (const [name, path] of cases) {
        const response = await call(route, path).send(route.bodyType ? {} : undefined);
        outcomes.push({ route: `${route.method} ${route.path}`, case: name, status: response.status, body: response.body });
      }
    }
    expect(outcomes.length).toBeGreaterThan(100);
    const wrong = outcomes.filter((o) => o.status !== 400 || !isErrorShape(o.body, 400));
    expect(wrong.map((o) => `${o.route} ${o.case} → ${o.status} ${JSON.stringify(o.body).slice(0, 160)}`)).toEqual([]);
  });

  it('answers malformed bodies on every write route with a 4xx in the error shape, never a 5xx or a success', async () => {
    const outcomes: Outcome[] = [];
    for (const route of routes.filter((r) => WRITE_METHODS.has(r.method))) {
      const path = fill(route);
      for (const raw of BAD_RAW_BODIES) {
        const response = await call(route, path).set('Content-Type', 'application/json').send(raw.body);
        outcomes.push({ route: `${route.method} ${route.path}`, case: raw.name, status: response.status, body: response.status === raw.status ? response.body : { expected: raw.status, got: response.body } });
        if (response.status !== raw.status || !isErrorShape(response.body, raw.status)) outcomes.push({ route: `${route.method} ${route.path}`, case: `${raw.name} (expected ${raw.status})`, status: -1, body: response.body });
      }
      if (!route.bodyType) continue;
      for (const body of [[], [{}]]) {
        const response = await call(route, path).send(body);
        outcomes.push({ route: `${route.method} ${route.path}`, case: `array body ${JSON.stringify(body)}`, status: response.status, body: response.body });
      }
      for (const field of route.bodyFields) {
        for (const value of badValues(field)) {
          const response = await call(route, path).send({ [field.name]: value });
          outcomes.push({ route: `${route.method} ${route.path}`, case: `${field.name}: ${JSON.stringify(value).slice(0, 40)}`, status: response.status, body: response.body });
        }
      }
    }
    expect(outcomes.length).toBeGreaterThan(500);
    const wrong = outcomes.filter((o) => !(o.status >= 400 && o.status < 500) || !isErrorShape(o.body, o.status));
    expect(wrong.map((o) => `${o.route} ${o.case} → ${o.status} ${JSON.stringify(o.body).slice(0, 160)}`)).toEqual([]);
  });

  it('answers a form-encoded body over the limit with 413 in the error shape', async () => {
    const route = routes.find((r) => r.method === 'PATCH' && r.path === '/api/users/:id')!;
    const response = await call(route, '/api/users/1').set('Content-Type', 'application/x-www-form-urlencoded').send(`reason=${'x'.repeat(200 * 1024)}`);
    expect(response.status).toBe(413);
    expect(response.body).toMatchObject({ statusCode: 413, error: 'Payload Too Large', message: 'The request body is larger than the 100 KiB limit', path: '/api/users/1' });
  });

  it('refuses a weather what-if whose shift is not a plain decimal within ±10 °C, or whose vintage is not an instant, with 400 and the reason', async () => {
    const operator = tokens.get('operator')!;
    const path = `/api/schedules/${GOOD_PARAM.day}/${GOOD_PARAM.zone}/weather-what-if`;
    const cases: Array<[Record<string, string | string[]>, RegExp]> = [
      [{}, /exactly one of shift/],
      [{ shift: '2', vintage: '2026-11-01T05:00:00Z' }, /exactly one of shift/],
      [{ shift: '' }, /shift is empty/],
      [{ shift: '0x10' }, /not a plain decimal/],
      [{ shift: '1e1' }, /not a plain decimal/],
      [{ shift: ' 2' }, /not a plain decimal/],
      [{ shift: '+2' }, /not a plain decimal/],
      [{ shift: 'NaN' }, /not a plain decimal/],
      [{ shift: '10.5' }, /between −10 and 10 °C/],
      [{ shift: '-11' }, /between −10 and 10 °C/],
      [{ shift: ['1', '2'] }, /shift/],
      [{ vintage: '2026-02-30T05:00:00Z' }, /vintage/],
      [{ vintage: 'yesterday' }, /vintage/],
      [{ shift: '2', unit: 'F' }, /Unknown query parameter unit/],
    ];
    for (const [query, message] of cases) {
      const res = await request(app.getHttpServer()).get(path).query(query).set('Authorization', `Bearer ${operator}`);
      expect({ query, status: res.status }).toEqual({ query, status: 400 });
      expect(isErrorShape(res.body, 400)).toBe(true);
      expect(String(res.body.message)).toMatch(message);
    }
    const vintages = await request(app.getHttpServer()).get(`/api/schedules/${GOOD_PARAM.day}/${GOOD_PARAM.zone}/weather-vintages`).query({ issued: 'x' }).set('Authorization', `Bearer ${operator}`);
    expect(vintages.status).toBe(400);
    expect(String(vintages.body.message)).toMatch(/Unknown query parameter issued/);
  });
});

