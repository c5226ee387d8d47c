import type { RequestHandler } from 'express';
import { AppError } from '../errors';

/** The range of a PostgreSQL `integer`, the widest number column Sixfold stores from a request. */
export const INT_MIN = -2_147_483_648;
export const INT_MAX = 2_147_483_647;

// A high surrogate not followed by a low one, or a low one not preceded by a high one (UTF-16).
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string can't be stored, or null when it can. */
export function badText(s: string): string | null {
  if (s.includes('\u0000')) return 'must not contain a NUL character (\\u0000)';
  // A lone UTF-16 surrogate has no UTF-8 form, so the database would refuse it.
  if (LONE_SURROGATE.test(s)) return 'must not contain a lone surrogate (broken Unicode)';
  return null;
}

/** Why a number can't be stored, or null when it can. */
export function badNumber(n: number): string | null {
  if (!Number.isFinite(n)) return 'must be a finite number';
  if (n < INT_MIN || n > INT_MAX) return `must be between ${INT_MIN} and ${INT_MAX}`;
  return null;
}

/**
 * Checks every value under `value`; `path` is the way down to it, pushed and popped in place
 * (a take's body holds thousands of values, so nothing is allocated unless one is bad).
 */
function walk(value: unknown, path: string[], fields: Record<string, string[]>, depth: number): void {
  let why: string | null = null;
  if (typeof value === 'string') why = badText(value);
  else if (typeof value === 'number') why = badNumber(value);
  else if (value && typeof value === 'object' && depth < 64) {
    for (const key in value) {
      if (!Object.hasOwn(value, key)) continue;
      const keyWhy = badText(key);
      if (keyWhy) {
        fields[[...path, '(name)'].join('.')] = [`a field name ${keyWhy}`];
        continue;
      }
      path.push(key);
      walk((value as Record<string, unknown>)[key], path, fields, depth + 1);
      path.pop();
    }
  }
  if (why) {
    const at = path.join('.') || '_';
    fields[at] = [...(fields[at] ?? []), why];
  }
}

/**
 * One check over every request's JSON body and query string, before any route: text may not
 * hold NUL or lone surrogates (PostgreSQL stores neither), and numbers must be finite and fit an
 * integer column. A 400 names each bad field, as the schemas' own errors do.
 */
export const cleanInput: RequestHandler = (req, _res, next) => {
  const fields: Record<string, string[]> = {};
  walk(req.body, [], fields, 0);
  walk(req.query, [], fields, 0);
  const names = Object.keys(fields);
  if (names.length === 0) return next();
  next(new AppError('validation', `Check these fields: ${names.join(', ')}`, fields));
};
