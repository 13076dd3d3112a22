/**
 * Who calls a use case. Every team use case that needs to know the caller (their role, for what
 * they may see; their name, for the audit trail and mails) takes one `Actor`; a use case that
 * only reads or writes a team's data and may also run without a signed-in caller (the demo
 * seed, the scheduler, the worker) takes the team id alone, as the tenant of its queries.
 */
import type { Role } from '../../shared/permissions';

/** A signed-in user, as the audit trail and mails name them. */
export type SignedInUser = { userId: string; email: string; name: string };

/** A signed-in user acting in one team, with their role there (set by requireTeam). */
export type Actor = SignedInUser & { teamId: string; role: Role };

/** What the audit trail records of a caller (null for the system). */
export type AuditName = Pick<SignedInUser, 'userId' | 'email'>;
