import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { EngineError } from '../../shared/engine/errors';
import type { ErrorResponse } from '../../shared/schemas/errors';
import { fieldErrors } from '../../shared/schemas/field-errors';
import { classifyDbError } from '../db/errors';
import { AppError } from '../errors';

/** Seconds a client should wait before trying again while the database is unreachable. */
export const DB_RETRY_AFTER_SECONDS = 5;

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route for ${req.method} ${req.path}`));
};

export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ZodError) {
    const fields = fieldErrors(err.issues);
    const names = Object.keys(fields).join(', ');
    res
      .status(400)
      .json({ error: { code: 'validation', message: `Check these fields: ${names}`, fields } } satisfies ErrorResponse);
    return;
  }
  if (err instanceof AppError) {
    if (err.retryAfter) res.set('Retry-After', String(err.retryAfter));
    res.status(err.status).json({
      error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) },
    } satisfies ErrorResponse);
    return;
  }
  if (err instanceof EngineError) {
    res.status(400).json({ error: { code: 'bad_request', message: err.message } } satisfies ErrorResponse);
    return;
  }
  const status =
    typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
  if (status === 400 && err?.type === 'entity.parse.failed') {
    res
      .status(400)
      .json({ error: { code: 'bad_request', message: 'The request body is not valid JSON' } } satisfies ErrorResponse);
    return;
  }
  if (status === 413) {
    res
      .status(413)
      .json({ error: { code: 'payload_too_large', message: 'The request body is too large' } } satisfies ErrorResponse);
    return;
  }
  if (status >= 400 && status < 500) {
    res
      .status(status)
      .json({ error: { code: 'bad_request', message: String(err?.message ?? 'Bad request') } } satisfies ErrorResponse);
    return;
  }
  const dbFailure = classifyDbError(err);
  if (dbFailure === 'unavailable') {
    res.set('Retry-After', String(DB_RETRY_AFTER_SECONDS));
    res.status(503).json({
      error: {
        code: 'unavailable',
        message: 'The server is busy: its database cannot be reached just now. Try again in a few seconds.',
      },
    } satisfies ErrorResponse);
    return;
  }
  if (dbFailure === 'bad_value') {
    // A last net: the schemas catch these first and name the field.
    res.status(400).json({
      error: {
        code: 'bad_request',
        message:
          'A value in the request does not fit (a number too large, a date that does not exist, or a character not allowed)',
      },
    } satisfies ErrorResponse);
    return;
  }
  // The first line only: a failed query's message goes on to list its parameters.
  const stack = typeof err?.stack === 'string' ? err.stack.split('\n').filter((l: string) => /^\s+at /.test(l)) : [];
  console.error(`[error] ${err?.name ?? 'Error'}: ${String(err?.message ?? err).split('\n')[0]}\n${stack.join('\n')}`);
  res.status(500).json({
    error: { code: 'internal', message: 'Something went wrong on our side; nothing you sent was lost' },
  } satisfies ErrorResponse);
};
