import type { Request } from 'express';
import type { z } from 'zod';

/** Parses a request part with a zod schema; a ZodError becomes a 400 naming each field. */
export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.body ?? {});
}

export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.query ?? {});
}

export function parseParams<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.params ?? {});
}
