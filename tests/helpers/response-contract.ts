import type { Express, Request } from 'express';
import { z } from 'zod';
import { type ApiRoute, apiResponses } from '../../shared/schemas/api';
import { routeNames } from './routes';

/** Broken contracts seen since the last check, one message each. */
const failures: string[] = [];

/** The broken contracts seen so far (and forgets them); the server tests fail on any. */
export function takeContractFailures(): string[] {
  return failures.splice(0);
}

/**
 * Makes the app check every 2xx JSON answer against the schema its route has in the registry of
 * responses (shared/schemas/api.ts): a body the schema refuses, or a route with no entry there,
 * is noted with zod's message and fails the test that made the request. The answer itself goes
 * out unchanged, so the test's own assertions still run.
 */
export function checkResponseContracts(app: Express): void {
  const names = routeNames(app);
  const json = app.response.json;
  app.response.json = function checkedJson(body: unknown) {
    if (this.statusCode >= 200 && this.statusCode < 300) {
      const failure = contractFailure(names, this.req, this.statusCode, body);
      if (failure) failures.push(failure);
    }
    return json.call(this, body);
  };
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
