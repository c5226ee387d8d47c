import { EngineError } from '../errors';
import { triadPair } from '../theory/pairs';
import type { Drill, DrillSpec } from '../types';
import { generateDrill } from './generate';

/** Field name -> messages, as the API's 400 answers carry them. */
export type FieldErrors = Record<string, string[]>;

export type DrillResult = { ok: true; drill: Drill } | { ok: false; fields: FieldErrors; message: string };

/**
 * Generates the drill for a checked spec, or says which field makes it impossible: the pair
 * (unknown triad, or a shared note), the start (its first cell does not fit) or the range.
 * The browser and `GET /api/drills/preview` both call this, so they agree on the drill.
 *
 * @example
 * generateChecked({ pair: ['D', 'Dm'], pattern: 'weave', direction: 'up' })
 * // { ok: false, fields: { pair: ['D and Dm share ...'] }, ... }
 */
export function generateChecked(spec: DrillSpec): DrillResult {
  const fail = (field: string, err: EngineError): DrillResult => ({
    ok: false,
    fields: { [field]: [err.message] },
    message: err.message,
  });
  if (spec.changes) return generateProgression(spec, fail);
  try {
    if (spec.pair) triadPair(spec.pair[0], spec.pair[1]);
  } catch (err) {
    if (err instanceof EngineError) return fail('pair', err);
    throw err;
  }
  const engineSpec = spec;
  try {
    return { ok: true, drill: generateDrill(engineSpec) };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    if (spec.start === undefined) return fail('range', err);
    // A given start is to blame when the same drill works from the default start.
    const { start: _start, ...rest } = engineSpec;
    try {
      generateDrill(rest);
      return fail('start', err);
    } catch {
      return fail('range', err);
    }
  }
}

/**
 * A progression drill, or the field to blame: the changes (a chord no pair fits, a length the
 * pattern cannot fill, a pinned pair that shares a note), the start, or the range.
 */
function generateProgression(spec: DrillSpec, fail: (field: string, err: EngineError) => DrillResult): DrillResult {
  try {
    return { ok: true, drill: generateDrill(spec) };
  } catch (err) {
    if (!(err instanceof EngineError)) throw err;
    if (/range|start/i.test(err.message)) {
      if (spec.start === undefined) return fail('range', err);
      const { start: _start, ...rest } = spec;
      try {
        generateDrill(rest);
        return fail('start', err);
      } catch {
        return fail('range', err);
      }
    }
    if (/choose another meter/i.test(err.message)) return fail('meter', err);
    if (/no pattern called|a pattern/i.test(err.message)) return fail('pattern', err);
    return fail('changes', err);
  }
}
