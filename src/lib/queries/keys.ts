import type { DrillSpec } from '@shared/engine';
import type { ListTakesQuery } from '@shared/schemas/history';
import type { MapQuery } from '@shared/schemas/maps';

/**
 * Every query key of the app, one factory per resource. Each endpoint is cached under the one
 * key its factory builds, and every key of a resource sits under its `all`, so a mutation
 * invalidates a resource (or one item of it) with the same factory the queries read.
 */

// The session's key sits in a module of its own: the app shell (the first page) reads it, and
// every other page's keys stay out of the first page's code.
export { sessionKeys } from './session-keys';

export const adminKeys = {
  all: ['admin'] as const,
  /** GET /api/admin/users */
  users: ['admin', 'users'] as const,
  /** GET /api/admin/audit */
  audit: ['admin', 'audit'] as const,
  /** GET /api/admin/purchases */
  purchases: ['admin', 'purchases'] as const,
};

export const bookKeys = {
  all: ['books'] as const,
  /** GET /api/books */
  catalogue: ['books', 'catalogue'] as const,
  /** GET /api/books/mine */
  mine: ['books', 'mine'] as const,
  /** GET /api/books/sales */
  sales: ['books', 'sales'] as const,
  /** GET /api/books/:id (and, under it, the book's drills and edition) */
  detail: (id: string) => ['books', 'detail', id] as const,
  /** GET /api/books/:id/drills/:drillId */
  drill: (id: string, drillId: string | null) => ['books', 'detail', id, 'drill', drillId] as const,
  /** GET /api/books/:id/edition */
  edition: (id: string) => ['books', 'detail', id, 'edition'] as const,
};

export const savedDrillKeys = {
  all: ['drills', 'saved'] as const,
  /** GET /api/drills */
  list: ['drills', 'saved', 'list'] as const,
  /** GET /api/drills/:id */
  one: (id: string) => ['drills', 'saved', 'one', id] as const,
};

export const customPatternKeys = {
  all: ['patterns'] as const,
  /** GET /api/patterns */
  list: ['patterns', 'list'] as const,
};

export const takeKeys = {
  all: ['takes'] as const,
  /** GET /api/takes?… */
  list: (params: Partial<ListTakesQuery>) => ['takes', 'list', params] as const,
  /** GET /api/takes/:id */
  one: (id: string) => ['takes', 'one', id] as const,
};

export const remarkKeys = {
  all: ['remarks'] as const,
  /** GET /api/takes/:takeId/remarks */
  forTake: (takeId: string) => ['remarks', 'take', takeId] as const,
};

export const notificationKeys = {
  all: ['notifications'] as const,
  /** GET /api/notifications */
  list: ['notifications', 'list'] as const,
};

export const studioKeys = {
  all: ['studios'] as const,
  /** GET /api/studios */
  list: ['studios', 'list'] as const,
  /** GET /api/studios/:id (and, under it, everything shown on the studio's pages) */
  detail: (id: string) => ['studios', 'detail', id] as const,
  /** GET /api/studios/:id/board */
  board: (id: string) => ['studios', 'detail', id, 'board'] as const,
  /** GET /api/studios/:id/players/:playerId */
  player: (id: string, playerId: string) => ['studios', 'detail', id, 'players', playerId] as const,
  /** GET /api/studios/:id/invites */
  invites: (id: string) => ['studios', 'detail', id, 'invites'] as const,
};

export const inviteKeys = {
  all: ['invites'] as const,
  /** GET /api/invites/:token */
  preview: (token: string) => ['invites', 'preview', token] as const,
};

export const assignmentKeys = {
  all: ['assignments'] as const,
  /** GET /api/assignments */
  mine: ['assignments', 'mine'] as const,
  /** GET /api/assignments/:id/weekly?tz= */
  weekly: (id: string, tz: string) => ['assignments', 'weekly', id, tz] as const,
};

/** The maps' endpoints by their last path segment. */
export type MapName = 'keys' | 'range' | 'beats' | 'timeline' | 'calendar' | 'weekly' | 'next';

export const mapKeys = {
  all: ['maps'] as const,
  /** every filter of one map (all of GET /api/maps/calendar, say) */
  map: (name: MapName) => ['maps', name] as const,
  /** GET /api/maps/:name?… */
  filtered: (name: MapName, filters: Partial<MapQuery> & { tz?: string }) => ['maps', name, filters] as const,
};

export const settingsKeys = {
  all: ['settings'] as const,
  /** GET /api/settings (PUT /api/settings and /api/settings/latency answer the same) */
  mine: ['settings', 'mine'] as const,
};

export const tempoKeys = {
  all: ['practice', 'tempo'] as const,
  /** GET /api/practice/tempo?spec=: one climb per drill and key, whatever tempo the spec asks */
  forSpec: (spec: DrillSpec) => ['practice', 'tempo', JSON.stringify({ ...spec, tempo: undefined })] as const,
};
