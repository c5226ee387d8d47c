import { generateChecked } from '../../../shared/engine/patterns/checked';
import type { PreviewQuery } from '../../../shared/schemas/drills';
import type { Drill } from '../../../shared/engine';
import { AppError } from '../../errors';
import { specFromQuery } from './spec-from-query';

/**
 * The drill a spec makes, exactly as the browser generates it. A spec that is not JSON, that
 * fails a field check, or that is musically impossible becomes a 400 naming the field.
 */
export function previewDrill(query: PreviewQuery): Drill {
  const spec = specFromQuery(query.spec);
  const result = generateChecked(spec);
  if (!result.ok) throw new AppError('validation', result.message, result.fields);
  return result.drill;
}
