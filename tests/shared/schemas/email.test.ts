/**
 * The one e-mail rule (shared/schemas/email.ts), used by every form, upload and route. The
 * address forms follow RFC 5321 §4.5.3.1.3 (at most 254 characters in a path's address, less
 * its angle brackets) and zod's e-mail check.
 */
import { describe, expect, it } from 'vitest';
import { emailSchema } from '../../../shared/schemas/email';
import { inviteeRowSchema } from '../../../shared/schemas/invitees';
import { createInvitationSchema } from '../../../shared/schemas/team';
import { fieldworkSettingsSchema } from '../../../shared/schemas/study-lifecycle';

describe('emailSchema', () => {
  it.each([
    ['Ana@Example.org', 'ana@example.org'],
    [' ana@example.org ', 'ana@example.org'],
    ['\tANA@EXAMPLE.ORG\n', 'ana@example.org'],
  ])('reads %j as %j', (typed, stored) => {
    expect(emailSchema.parse(typed)).toBe(stored);
  });

  it.each(['', '   ', 'ana', 'ana@', 'ana @example.org', `${'a'.repeat(250)}@x.org`])(
    'refuses %j with one message',
    (typed) => {
      const result = emailSchema.safeParse(typed);
      expect(result.success).toBe(false);
      expect(result.error?.issues[0].message).toMatch(
        /^(Not a valid e-mail address|E-mail address is too long)$/,
      );
    },
  );

  it('is the rule of invitee rows, team invitations and the reply-to address alike', () => {
    const typed = ' Ana@Example.org ';
    expect(inviteeRowSchema.parse({ email: typed }).email).toBe('ana@example.org');
    expect(createInvitationSchema.parse({ email: typed, role: 'analyst' }).email).toBe(
      'ana@example.org',
    );
    expect(fieldworkSettingsSchema.parse({ mailReplyTo: typed }).mailReplyTo).toBe(
      'ana@example.org',
    );
  });
});
