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

function walk(value: unknown, path: string[], fields: Record<string, string[]>, depth: number): void {
  const at = () => path.join('.') || '_';
  const add = (message: string) => {
    fields[at()] = [...(fields[at()] ?? []), message];
  };
  if (typeof value === 'string') {
    const why = badText(value);
    if (why) add(why);
  } else if (typeof value === 'number') {
    const why = badNumber(value);
    if (why) add(why);
  } else if (value && typeof value === 'object' && depth < 64) {
    for (const [key, inner] of Object.entries(value)) {
      const keyWhy = badText(key);
      if (keyWhy) {
        fields[[...path, '(name)'].join('.')] = [`a field name ${keyWhy}`];
        continue;
      }
      walk(inner, [...path, key], fields, depth + 1);
    }
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
