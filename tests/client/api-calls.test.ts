import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as admin from '../../shared/schemas/admin';
import { type ApiRoute, apiResponses } from '../../shared/schemas/api';
import * as assignments from '../../shared/schemas/assignments';
import * as auth from '../../shared/schemas/auth';
import * as books from '../../shared/schemas/books';
import * as dev from '../../shared/schemas/dev';
import * as drills from '../../shared/schemas/drills';
import * as health from '../../shared/schemas/health';
import * as history from '../../shared/schemas/history';
import * as maps from '../../shared/schemas/maps';
import * as remarks from '../../shared/schemas/remarks';
import * as settings from '../../shared/schemas/settings';
import * as studios from '../../shared/schemas/studios';
import * as takes from '../../shared/schemas/takes';

/** The name each response schema is exported under (its type has the same name). */
const schemaNames = new Map<unknown, string>();
for (const mod of [
  admin,
  assignments,
  auth,
  books,
  dev,
  drills,
  health,
  history,
  maps,
  remarks,
  settings,
  studios,
  takes,
])
  for (const [name, value] of Object.entries(mod)) if (name.endsWith('Response')) schemaNames.set(value, name);

interface Call {
  file: string;
  method: string;
  type: string;
  path: string;
}

/** Every `api.<method><Type>('/api/...')` in the browser app, its path with `${...}` segments as params. */
function clientCalls(): Call[] {
  const src = join(__dirname, '../../src');
  const calls: Call[] = [];
  for (const file of readdirSync(src, { recursive: true }) as string[]) {
    if (!/\.tsx?$/.test(file)) continue;
    const text = readFileSync(join(src, file), 'utf8');
    for (const m of text.matchAll(/api\.(get|post|put|patch|delete)<(\w+)>\(\s*([`'])(\/api[^`']*)\3/g)) {
      const path = m[4]
        .split('?')[0]
        .split('/')
        .map((seg) => (/^\$\{[^}]*\}$/.test(seg) ? ':param' : seg.replace(/\$\{[^}]*\}/g, '')))
        .join('/');
      calls.push({ file, method: m[1].toUpperCase(), type: m[2], path });
    }
  }
  return calls;
}

/** The registry's route for a call: literal segments equal, params where the route has params. */
function routeOf(call: Call): ApiRoute | undefined {
  const segs = call.path.split('/');
  return (Object.keys(apiResponses) as ApiRoute[]).find((route) => {
    const [method, pattern] = route.split(' ');
    const parts = pattern.split('/');
    return (
      method === call.method &&
      parts.length === segs.length &&
      parts.every((p, i) => (p.startsWith(':') ? segs[i] === ':param' : p === segs[i]))
    );
  });
}

describe("the browser's API calls", () => {
  const calls = clientCalls();

  it('are found in the app', () => {
    expect(calls.length).toBeGreaterThan(50);
  });

  it('each name a route of the registry', () => {
    const unknown = calls.filter((c) => !routeOf(c)).map((c) => `${c.file}: ${c.method} ${c.path}`);
    expect(unknown).toEqual([]);
  });

  it("each read the answer as the registry's schema type (void for no body)", () => {
    const wrong = calls.flatMap((c) => {
      const route = routeOf(c);
      if (!route) return [];
      const contract = apiResponses[route];
      const expected = contract === null ? 'void' : (schemaNames.get(contract) ?? '(a file)');
      return c.type === expected ? [] : [`${c.file}: ${route} read as ${c.type}, answered as ${expected}`];
    });
    expect(wrong).toEqual([]);
  });
});
