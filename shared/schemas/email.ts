import { z } from 'zod';

/**
 * An e-mail address as people type or paste it: the spaces around it dropped (phone keyboards
 * add one after a suggested word) and lower-cased, then checked. The one e-mail rule of every
 * form, upload and route: sign-up and sign-in, team invitations, invitee lists, the reply-to
 * address of a study's mail.
 */
export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email('Not a valid e-mail address').max(254, 'E-mail address is too long'));
