import type { Express, Request, Response } from 'express';
import { z } from 'zod';
import { type ApiRoute, apiErrorResponse, apiResponses } from '../../shared/schemas/api';
import { routeNames } from './routes';

/** Broken contracts seen since the last check, one message each. */
const failures: string[] = [];

/** The broken contracts seen so far (and forgets them); the server tests fail on any. */
export function takeContractFailures(): string[] {
  return failures.splice(0);
}

/**
 * Makes the app check every 2xx JSON answer against the schema its route has in the registry of
 * responses (shared/schemas/api.ts), and every 4xx/5xx JSON answer against the error schema: a
 * body the schema refuses, or a route with no entry there, is noted with zod's message and
 * fails the test that made the request. The answer itself goes out unchanged, so the test's
 * own assertions still run.
 */
export function checkResponseContracts(app: Express): void {
  const names = routeNames(app);
  const sentJson = new WeakSet<object>();
  const json = app.response.json;
  app.response.json = function checkedJson(body: unknown) {
    sentJson.add(this);
    const ok = this.statusCode >= 200 && this.statusCode < 300;
    const failure = ok
      ? contractFailure(names, this.req, this.statusCode, body)
      : errorFailure(names, this.req, this.statusCode, body);
    if (failure) failures.push(failure);
    return json.call(this, body);
  };
  // Answers without JSON: a route marked "no body" answers 204, a file route its content type.
  const end = app.response.end as (...args: unknown[]) => Response;
  app.response.end = function checkedEnd(this: Response, ...args: unknown[]) {
    if (this.statusCode >= 200 && this.statusCode < 300 && !sentJson.has(this)) {
      const failure = bodilessFailure(names, this.req, this);
      if (failure) failures.push(failure);
    }
    return end.apply(this, args);
  } as typeof app.response.end;
}

/** A failure answers the one error shape, unless its route's own schema covers it (the health check's 503). */
function errorFailure(
  names: WeakMap<object, Map<string, string>>,
  req: Request,
  status: number,
  body: unknown,
): string | null {
  if (status < 400) return null;
  const parsed = apiErrorResponse.safeParse(body);
  if (parsed.success) return null;
  const route: unknown = req.route;
  const key = route && typeof route === 'object' ? names.get(route)?.get(req.method) : undefined;
  const own = key && Object.hasOwn(apiResponses, key) ? apiResponses[key as ApiRoute] : null;
  if (own instanceof z.ZodType && own.safeParse(body).success) return null;
  return `${req.method} ${req.originalUrl} answered ${status} with a body the error schema refuses:\n${z.prettifyError(parsed.error)}`;
}

function bodilessFailure(names: WeakMap<object, Map<string, string>>, req: Request, res: Response): string | null {
  const route: unknown = req.route;
  if (!route || typeof route !== 'object') return null;
  const key = names.get(route)?.get(req.method === 'HEAD' ? 'GET' : req.method);
  if (!key?.split(' ')[1].startsWith('/api/')) return null;
  const where = `${key} (${req.method} ${req.originalUrl})`;
  if (!Object.hasOwn(apiResponses, key)) return `${where} has no entry in the registry of responses`;
  const contract = apiResponses[key as ApiRoute];
  if (contract === null) {
    return res.statusCode === 204
      ? null
      : `${where} answered ${res.statusCode}, but the registry says 204 with no body`;
  }
  if (contract instanceof z.ZodType) return `${where} answered ${res.statusCode} without the JSON its schema describes`;
  const type = String(res.get('Content-Type') ?? '');
  return type.startsWith(contract.file) ? null : `${where} answered a file of type "${type}", not ${contract.file}`;
}

function contractFailure(
  names: WeakMap<object, Map<string, string>>,
  req: Request,
  status: number,
  body: unknown,
): string | null {
  const url = `${req.method} ${req.originalUrl}`;
  const route: unknown = req.route;
  if (!route || typeof route !== 'object') return `${url} answered ${status} with JSON outside any route`;
  const method = req.method === 'HEAD' ? 'GET' : req.method;
  const key = names.get(route)?.get(method);
  if (!key) return `${url} answered from a route the app's router does not list`;
  const where = key === url ? key : `${key} (${url})`;
  if (!Object.hasOwn(apiResponses, key)) return `${where} has no entry in the registry of responses`;
  const contract = apiResponses[key as ApiRoute];
  if (!(contract instanceof z.ZodType)) {
    return `${where} answered JSON, but the registry says it answers ${contract === null ? 'no body' : 'a file'}`;
  }
  const parsed = contract.safeParse(body);
  if (parsed.success) return null;
  return `${where} answered ${status} with a body its schema refuses:\n${z.prettifyError(parsed.error)}`;
}
