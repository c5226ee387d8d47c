import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { DrillSpec } from '../../shared/engine';
import * as keys from '../../src/lib/queries/keys';

const spec: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up' };

/** One key per endpoint the client caches, built by the factories. */
const endpointKeys: Record<string, readonly unknown[]> = {
  'GET /api/auth/session': keys.sessionKeys.session,
  'GET /api/admin/users': keys.adminKeys.users,
  'GET /api/admin/audit': keys.adminKeys.audit,
  'GET /api/admin/purchases': keys.adminKeys.purchases,
  'GET /api/books': keys.bookKeys.catalogue,
  'GET /api/books/mine': keys.bookKeys.mine,
  'GET /api/books/sales': keys.bookKeys.sales,
  'GET /api/books/:id': keys.bookKeys.detail('b1'),
  'GET /api/books/:id/drills/:drillId': keys.bookKeys.drill('b1', 'd1'),
  'GET /api/books/:id/edition': keys.bookKeys.edition('b1'),
  'GET /api/drills': keys.savedDrillKeys.list,
  'GET /api/drills/:id': keys.savedDrillKeys.one('d1'),
  'GET /api/patterns': keys.customPatternKeys.list,
  'GET /api/takes': keys.takeKeys.list({}),
  'GET /api/takes/:id': keys.takeKeys.one('t1'),
  'GET /api/takes/:takeId/remarks': keys.remarkKeys.forTake('t1'),
  'GET /api/notifications': keys.notificationKeys.list,
  'GET /api/studios': keys.studioKeys.list,
  'GET /api/studios/:id': keys.studioKeys.detail('s1'),
  'GET /api/studios/:id/board': keys.studioKeys.board('s1'),
  'GET /api/studios/:id/players/:playerId': keys.studioKeys.player('s1', 'p1'),
  'GET /api/studios/:id/invites': keys.studioKeys.invites('s1'),
  'GET /api/invites/:token': keys.inviteKeys.preview('tok'),
  'GET /api/assignments': keys.assignmentKeys.mine,
  'GET /api/assignments/:id/weekly': keys.assignmentKeys.weekly('a1', 'UTC'),
  'GET /api/maps/keys': keys.mapKeys.filtered('keys', {}),
  'GET /api/maps/calendar': keys.mapKeys.filtered('calendar', {}),
  'GET /api/settings': keys.settingsKeys.mine,
  'GET /api/practice/tempo': keys.tempoKeys.forSpec(spec),
};

/** Every factory of the module, each with the key its whole resource sits under. */
const factories: ReadonlyArray<{ all: readonly unknown[] }> = Object.values(keys);

function startsWith(key: readonly unknown[], prefix: readonly unknown[]): boolean {
  return prefix.every((part, i) => JSON.stringify(key[i]) === JSON.stringify(part));
}

describe('query keys', () => {
  it('caches each endpoint under a key no other endpoint uses', () => {
    const seen = new Map<string, string>();
    for (const [endpoint, key] of Object.entries(endpointKeys)) {
      const text = JSON.stringify(key);
      expect(seen.get(text), `${endpoint} shares its key with ${seen.get(text)}`).toBeUndefined();
      seen.set(text, endpoint);
    }
  });

  it("puts every key under exactly one resource's `all`, so invalidating a resource reaches all of it", () => {
    for (const [endpoint, key] of Object.entries(endpointKeys)) {
      const owners = factories.filter((f) => startsWith(key, f.all));
      expect(owners.length, endpoint).toBe(1);
    }
  });

  it('nests one item under its detail, so invalidating a studio or a book refreshes its pages', () => {
    expect(startsWith(keys.studioKeys.board('s1'), keys.studioKeys.detail('s1'))).toBe(true);
    expect(startsWith(keys.studioKeys.invites('s1'), keys.studioKeys.detail('s1'))).toBe(true);
    expect(startsWith(keys.studioKeys.board('s2'), keys.studioKeys.detail('s1'))).toBe(false);
    expect(startsWith(keys.bookKeys.edition('b1'), keys.bookKeys.detail('b1'))).toBe(true);
    expect(startsWith(keys.mapKeys.filtered('calendar', { tz: 'UTC' }), keys.mapKeys.map('calendar'))).toBe(true);
  });

  it('keeps one tempo climb per drill whatever tempo the spec asks', () => {
    expect(keys.tempoKeys.forSpec({ ...spec, tempo: 90 })).toEqual(keys.tempoKeys.forSpec({ ...spec, tempo: 140 }));
    expect(keys.tempoKeys.forSpec({ ...spec, pair: ['E', 'D'] })).not.toEqual(keys.tempoKeys.forSpec(spec));
  });

  it('is the only place the app writes a query key', () => {
    const src = join(__dirname, '../../src');
    const files = (readdirSync(src, { recursive: true }) as string[]).filter(
      (f) => /\.tsx?$/.test(f) && !f.endsWith(join('queries', 'keys.ts')),
    );
    const adHoc = files.filter((f) =>
      /queryKey:\s*\[|QueryData\(\s*\[|invalidateQueries\(\{\s*queryKey:\s*\[/.test(readFileSync(join(src, f), 'utf8')),
    );
    expect(adHoc).toEqual([]);
  });
});
