import { DrillSpec, generateChecked, type PreviewQuery } from '../../../shared/schemas/drills';
import type { Drill } from '../../../shared/engine';
import { AppError } from '../../errors';

/**
 * The drill a spec makes, exactly as the browser generates it. A spec that is not JSON, that
 * fails a field check, or that is musically impossible becomes a 400 naming the field.
 */
export function previewDrill(query: PreviewQuery): Drill {
  let raw: unknown;
  try {
    raw = JSON.parse(query.spec);
  } catch {
    throw new AppError('validation', 'The spec is not valid JSON', { spec: ['Send the drill spec as URL-encoded JSON'] });
  }
  const spec = DrillSpec.parse(raw);
  const result = generateChecked(spec);
  if (!result.ok) throw new AppError('validation', result.message, result.fields);
  return result.drill;
}
