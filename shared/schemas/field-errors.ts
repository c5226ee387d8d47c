/** One problem with one input, as zod reports it (only what the messages need). */
export interface FieldIssue {
  path: ReadonlyArray<PropertyKey>;
  message: string;
}

/**
 * Field errors keyed by dotted path: the shape of a 400's `fields`, made the same way on the
 * server (from a failed parse of a request) and in the browser (before anything is sent).
 * A problem with the whole input is filed under '_'.
 *
 * @example
 * fieldErrors([{ path: ['range', 'low'], message: 'Too low' }]) // { 'range.low': ['Too low'] }
 */
export function fieldErrors(issues: ReadonlyArray<FieldIssue>): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.') || '_';
    fields[key] = [...(fields[key] ?? []), issue.message];
  }
  return fields;
}
