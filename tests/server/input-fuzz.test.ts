import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as adminSchemas from '../../shared/schemas/admin';
import * as assignmentsSchemas from '../../shared/schemas/assignments';
import * as authSchemas from '../../shared/schemas/auth';
import * as booksSchemas from '../../shared/schemas/books';
import * as devSchemas from '../../shared/schemas/dev';
import * as drillsSchemas from '../../shared/schemas/drills';
import * as historySchemas from '../../shared/schemas/history';
import * as mapsSchemas from '../../shared/schemas/maps';
import * as remarksSchemas from '../../shared/schemas/remarks';
import * as settingsSchemas from '../../shared/schemas/settings';
import * as studiosSchemas from '../../shared/schemas/studios';
import * as takesSchemas from '../../shared/schemas/takes';
import { type Client, client, createStudio, createUser, signedIn } from '../helpers/factories';
import { listRoutes, type RouteInfo } from '../helpers/routes';
import { createSavedDrill, postTake, STUDIO_SPEC, takeBody } from '../helpers/studio-fixtures';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
let admin: Client;
let teacher: Client;
let player: Client;
let anon: Client;
const ids: Record<string, string> = {};

beforeAll(async () => {
  const t = await createUser(ctx.db, { role: 'teacher' });
  const p = await createUser(ctx.db, { role: 'player' });
  admin = await signedIn(ctx.app, await createUser(ctx.db, { role: 'admin' }));
  teacher = await signedIn(ctx.app, t);
  player = await signedIn(ctx.app, p);
  anon = await client(ctx.app);
  ids.studio = (await createStudio(ctx.db, t.id, [p.id])).id;
  ids.player = p.id;
  ids.drill = (await createSavedDrill(ctx.db, p.id)).id;
  ids.take = (await postTake(player, STUDIO_SPEC)).id;
});
afterAll(() => ctx.close());

/** Every field name the shared schemas know, so bad values land where a route reads them. */
function fieldNames(): string[] {
  const names = new Set<string>(['name', 'email', 'password', 'token', 'text', 'title', 'spec', 'device', 'from']);
  const modules = [
    adminSchemas,
    assignmentsSchemas,
    authSchemas,
    booksSchemas,
    devSchemas,
    drillsSchemas,
    historySchemas,
    mapsSchemas,
    remarksSchemas,
    settingsSchemas,
    studiosSchemas,
    takesSchemas,
  ];
  for (const value of modules.flatMap((m) => Object.values(m))) {
    const shape = (value as { shape?: Record<string, unknown> })?.shape;
    if (shape && typeof shape === 'object') for (const k of Object.keys(shape)) names.add(k);
  }
  return [...names];
}
const FIELDS = fieldNames();

// Values the probe found answering 500, and their neighbours: NUL, lone surrogates (UTF-16),
// numbers past a PostgreSQL integer or real, year-zero dates (the database's calendar has none).
const BAD_VALUES: unknown[] = [
  'a\u0000b',
  '\ud800',
  1e300,
  -2147483649,
  '0000-01-01T00:00:00Z',
  'x'.repeat(20_000),
  [],
  null,
];

const everyField = (v: unknown) => Object.fromEntries(FIELDS.map((f) => [f, v]));

/** Bodies as raw JSON text, so 1e400 (Infinity once parsed) can be sent too. */
function badBodies(): string[] {
  const bodies = BAD_VALUES.map((v) => JSON.stringify(everyField(v)));
  bodies.push(`{"tempo":1e400,"timeMs":-1e400,"priceMinor":1e400}`);
  bodies.push(JSON.stringify({ latency: { 'dev\u0000ice': 10 }, name: { nested: ['\ud83d'] } }));
  bodies.push(JSON.stringify(['not', 'an', 'object']));
  bodies.push('"just a string"');
  return bodies;
}

const BAD_QUERIES = [
  'from=0000-01-01&to=0000-12-31',
  'from=2026-13-45&to=x',
  'page=1e300&pageSize=-5',
  `key=%00&pattern=%ED%A0%80&instrument=a%00b&pair=${'x'.repeat(500)}`,
  'spec=%00&to=%00&id=%00',
  'spec={"pair":["D","C"],"tempo":1e300}',
];

function concretePath(route: RouteInfo, variant: number): string {
  return route.path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    if (variant === 1) return encodeURIComponent('bad\u0000id');
    if (name === 'token') return 'not-a-real-token';
    if (name === 'takeId' || (name === 'id' && route.path.startsWith('/api/takes'))) return ids.take;
    if (name === 'id' && route.path.startsWith('/api/studios')) return ids.studio;
    if (name === 'id' && route.path.startsWith('/api/drills')) return ids.drill;
    if (name === 'playerId') return ids.player;
    return randomUUID();
  });
}

// Routes whose success would change who a test client is; they are tried from a fresh client.
const CHANGES_SESSION = new Set(['/api/auth/sign-out', '/api/auth/sign-in', '/api/auth/sign-up']);

async function send(c: Client, method: string, path: string, body?: string) {
  const req = c.agent[method.toLowerCase() as 'post'](path).set('X-CSRF-Token', c.csrf);
  if (body === undefined) return req;
  return req.set('Content-Type', 'application/json').send(body);
}

function check(res: { status: number; body: unknown }, what: string) {
  if (res.status >= 500) throw new Error(`${what} answered ${res.status}: ${JSON.stringify(res.body)}`);
}

describe('bad input never answers 500', () => {
  const routes = () =>
    listRoutes(ctx.app).filter((r) => r.path.startsWith('/api') && r.path !== '/api/payments/webhook');

  it('reads the route list from the app', () => {
    const list = routes();
    expect(list.length).toBeGreaterThan(50);
    expect(list).toContainEqual({ method: 'POST', path: '/api/takes' });
  });

  it('every route, every role, bad bodies and queries: 4xx (or a success), never 5xx', async () => {
    const bodies = badBodies();
    const letIn = new Set<RouteInfo>();
    let tries = 0;
    for (const route of routes()) {
      const fresh = CHANGES_SESSION.has(route.path);
      const writes = route.method !== 'GET' && route.method !== 'DELETE';
      for (const role of fresh ? ['anon'] : ['player', 'teacher', 'admin', 'anon']) {
        const c =
          role === 'anon' ? (fresh ? await client(ctx.app) : anon) : { player, teacher, admin }[role as 'player'];
        // A bad id first: refused before anything else is read.
        const badId = concretePath(route, 1);
        check(await send(c, route.method, badId, writes ? bodies[0] : undefined), `${role} ${route.method} ${badId}`);
        const path = concretePath(route, 0);
        const first = await send(c, route.method, `${path}?${BAD_QUERIES[0]}`, writes ? bodies[0] : undefined);
        check(first, `${role} ${route.method} ${path}`);
        tries += 2;
        // A role the route turns away sees nothing more of it; one role it lets in gets every bad input.
        if (first.status === 401 || first.status === 403 || letIn.has(route)) continue;
        letIn.add(route);
        for (const body of writes ? bodies.slice(1) : []) {
          check(await send(c, route.method, path, body), `${role} ${route.method} ${path} ${body.slice(0, 80)}`);
          tries++;
        }
        for (const q of BAD_QUERIES.slice(1)) {
          check(await send(c, route.method, `${path}?${q}`), `${role} ${route.method} ${path}?${q}`);
          tries++;
        }
      }
    }
    expect(tries).toBeGreaterThan(500);
  }, 300_000);

  it('names the field that holds a NUL or a lone surrogate, with a 400', async () => {
    const nul = await player.agent
      .put('/api/settings/latency')
      .set('X-CSRF-Token', player.csrf)
      .send({ device: 'Keys\u0000', offsetMs: 10 });
    expect(nul.status).toBe(400);
    expect(Object.keys(nul.body.error.fields)).toEqual(['device']);
    const remark = await teacher.post(`/api/takes/${ids.take}/remarks`, { body: 'fine \ud800 work' });
    expect(remark.status).toBe(400);
    expect(remark.body.error.fields.body[0]).toMatch(/surrogate/);
    const name = await teacher.post('/api/studios', { name: 'Tue\u0000sday' });
    expect(name.status).toBe(400);
    expect(name.body.error.fields.name[0]).toMatch(/NUL/);
  });

  it('a take with numbers past what its columns hold is a 400, not a 500', async () => {
    const body = takeBody(STUDIO_SPEC);
    const huge = { ...body, played: body.played.map((n, i) => (i === 0 ? { ...n, timeMs: 1e300 } : n)) };
    const res = await player.post('/api/takes', huge);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['played.0.timeMs']);
    const infinite = await player.agent
      .post('/api/takes')
      .set('X-CSRF-Token', player.csrf)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ ...body, id: randomUUID() }).replace('"tempo":100', '"tempo":1e400'));
    expect(infinite.status).toBe(400);
  });

  it('a take started in the year zero is a 400 naming startedAt', async () => {
    const res = await player.post('/api/takes', { ...takeBody(STUDIO_SPEC), startedAt: '0000-06-01T10:00:00Z' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['startedAt']);
  });

  it('a year-zero date in the history filters is a 400 naming it', async () => {
    const res = await player.get('/api/takes?from=0000-01-01');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['from']);
  });

  it('random JSON to every POST, PUT and PATCH route as a player (fixed seed)', async () => {
    const writes = routes().filter((r) => r.method !== 'GET' && r.method !== 'DELETE' && !CHANGES_SESSION.has(r.path));
    const value = fc.oneof(
      fc.string({ unit: 'binary' }),
      fc.double(),
      fc.integer(),
      fc.constantFrom(...BAD_VALUES),
      fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
    );
    const body = fc.dictionary(fc.constantFrom(...FIELDS), fc.oneof(value, fc.array(value, { maxLength: 3 })), {
      maxKeys: 6,
    });
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...writes), body, async (route, b) => {
        const res = await send(player, route.method, concretePath(route, 0), JSON.stringify(b));
        return res.status < 500;
      }),
      { numRuns: 150 },
    );
  }, 120_000);
});
