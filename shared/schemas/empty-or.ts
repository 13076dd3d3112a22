import { z } from 'zod';

/**
 * A form's text field where empty (or only spaces) means "none" and any other text must pass
 * the server's own rule `schema`, so the form refuses exactly what the server would refuse,
 * with the same message.
 */
export function emptyOr<T extends z.ZodType<string, string>>(schema: T) {
  return z
    .string()
    .trim()
    .pipe(z.union([z.literal(''), schema]));
}
