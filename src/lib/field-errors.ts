import type { z } from 'zod';

/** Field errors keyed by dotted path, the same shape as the API's 400 `fields`. */
export function fieldErrors(err: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of err.issues) {
    const key = issue.path.map(String).join('.') || '_';
    fields[key] = [...(fields[key] ?? []), issue.message];
  }
  return fields;
}
