import { fieldErrors as fromIssues } from '@shared/schemas/field-errors';
import type { z } from 'zod';

/** Field errors keyed by dotted path, the same shape as the API's 400 `fields`. */
export function fieldErrors(err: z.ZodError): Record<string, string[]> {
  return fromIssues(err.issues);
}
