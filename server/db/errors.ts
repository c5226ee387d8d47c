/** What a failed database call means for the answer: the server can't reach it, or a value didn't fit. */
export type DbFailure = 'unavailable' | 'bad_value' | null;

// Node's network errors when the server can't be reached at all.
const NETWORK = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN', 'EHOSTUNREACH', 'EPIPE']);

// node-postgres's own messages when a connection can't be had or was lost.
const POOL_MESSAGES = [
  'Connection terminated',
  'timeout exceeded when trying to connect',
  'Client has encountered a connection error',
  'Connection refused',
  'the database system is starting up',
  'the database system is shutting down',
];

/**
 * Reads an error (and the errors it wraps: Drizzle puts the driver's in `cause`) the way the
 * PostgreSQL manual's error-code appendix groups them: class 08 (connection exception),
 * 57P01-57P03 (shut down, crashed, not accepting connections yet) and class 53 (out of
 * resources, e.g. too many connections) mean "try again soon"; class 22 (data exception:
 * out-of-range numbers, bad dates, NUL bytes) means a value from the request did not fit.
 */
export function classifyDbError(err: unknown): DbFailure {
  for (
    let e = err as { code?: unknown; message?: unknown; cause?: unknown } | undefined, depth = 0;
    e && depth < 5;
    depth++
  ) {
    const code = typeof e.code === 'string' ? e.code : '';
    if (NETWORK.has(code)) return 'unavailable';
    if (/^(08|53)/.test(code) || /^57P0[123]$/.test(code)) return 'unavailable';
    if (/^22/.test(code)) return 'bad_value';
    const message = typeof e.message === 'string' ? e.message : '';
    if (POOL_MESSAGES.some((m) => message.includes(m))) return 'unavailable';
    // AggregateError (a host with several addresses, all refused)
    const errors = (e as { errors?: unknown[] }).errors;
    if (Array.isArray(errors) && errors.some((x) => classifyDbError(x) === 'unavailable')) return 'unavailable';
    e = e.cause as typeof e;
  }
  return null;
}
