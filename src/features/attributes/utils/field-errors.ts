/**
 * Field errors of the definition editor, from the client's zod check or the server's answer,
 * keyed by path inside the definition ("attributes.1.levels.0.label").
 */
import type { ZodError } from 'zod';
import type { FieldIssue } from '@/lib/api-client';

export type FieldErrors = Map<string, string>;

export function fromZod(error: ZodError): FieldErrors {
  const out: FieldErrors = new Map();
  for (const issue of error.issues) {
    const path = issue.path.join('.');
    if (!out.has(path)) out.set(path, issue.message);
  }
  return out;
}

export function fromServer(fields: FieldIssue[]): FieldErrors {
  const out: FieldErrors = new Map();
  for (const f of fields) {
    const path = f.path.replace(/^definition\.?/, '');
    if (!out.has(path)) out.set(path, f.message);
  }
  return out;
}
