/**
 * A refinement's error on one field: the custom issue every cross-field check of the schemas
 * raises, with the field's path and the message the form shows beside it.
 */
import type { z } from 'zod';

export function addIssue(ctx: z.RefinementCtx, path: PropertyKey[], message: string): void {
  ctx.addIssue({ code: 'custom', path, message });
}
