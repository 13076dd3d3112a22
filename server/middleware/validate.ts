/**
 * Parses request parts with zod schemas from shared/. A failure becomes a 400 with field issues
 * through the error middleware; handlers only ever see parsed values.
 */
import type { Request } from 'express';
import type { z } from 'zod';

export function parseBody<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.body ?? {});
}
export function parseParams<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.params);
}
export function parseQuery<S extends z.ZodType>(schema: S, req: Request): z.infer<S> {
  return schema.parse(req.query);
}
