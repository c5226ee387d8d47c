/** Typed errors: the error middleware maps each code to its HTTP status. */
export const errorStatus = {
  bad_request: 400,
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  rate_limited: 429,
  unavailable: 503,
  internal: 500,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export class AppError extends Error {
  constructor(
    public readonly code: ErrorCode,
    message: string,
    public readonly fields?: Record<string, string[]>,
  ) {
    super(message);
    this.name = 'AppError';
  }

  /** seconds, sent as Retry-After (rate limits, an unreachable database) */
  retryAfter?: number;

  get status(): number {
    return errorStatus[this.code];
  }
}

export const notFound = (what = 'That') => new AppError('not_found', `${what} was not found`);
export const forbidden = (message = 'Your role may not do this') => new AppError('forbidden', message);
export const unauthenticated = () => new AppError('unauthenticated', 'Sign in first');

/** A 429 that says when to come back (Retry-After, in whole seconds). */
export function rateLimited(message: string, retryAfterSeconds: number): AppError {
  const err = new AppError('rate_limited', message);
  err.retryAfter = Math.max(1, Math.ceil(retryAfterSeconds));
  return err;
}
