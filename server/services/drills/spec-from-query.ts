import { ZodError } from 'zod';
import { DrillSpec } from '../../../shared/schemas/drills';
import { AppError } from '../../errors';

/**
 * A DrillSpec sent as URL-encoded JSON in a query parameter. Not JSON, or a field that fails its
 * check, is a 400 naming the field (under `prefix` when the answer names it so, e.g. 'spec.tempo').
 */
export function specFromQuery(raw: string, prefix?: string): DrillSpec {
  let json: unknown;
  try {
    json = JSON.parse(raw);
  } catch {
    throw new AppError('validation', 'The spec is not valid JSON', {
      spec: ['Send the drill spec as URL-encoded JSON'],
    });
  }
  const parsed = DrillSpec.safeParse(json);
  if (parsed.success) return parsed.data;
  if (!prefix) throw parsed.error;
  throw new ZodError(parsed.error.issues.map((i) => ({ ...i, path: [prefix, ...i.path] })));
}
