/**
 * The audit trail: INSERT and SELECT only (the table refuses UPDATE and DELETE). A team's trail
 * holds its own events plus the sign-ins of its current members, which belong to no team.
 * Tenant: every read filters on the team (the members' sign-ins through the team's memberships).
 */
import { and, desc, eq, gte, inArray, isNull, like, lt, lte, or, sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { auditEvents } from '../schema/audit';
import { memberships } from '../schema/accounts';

export type AuditInsert = {
  teamId?: string | null;
  actorId?: string | null;
  actorEmail?: string | null;
  action: string;
  studyId?: string | null;
  targetType?: string | null;
  targetId?: string | null;
  details?: Record<string, unknown>;
  at?: Date;
};

export async function insertAuditEvent(db: DbOrTx, event: AuditInsert) {
  await db.insert(auditEvents).values({ ...event, details: event.details ?? {} });
}

export type AuditFilter = {
  teamId: string;
  /** An exact action ("study.closed") or a group prefix ("study"). */
  action?: string;
  actorId?: string;
  studyId?: string;
  from?: Date;
  to?: Date;
  before?: number;
  limit: number;
};

function teamScope(teamId: string): SQL {
  const members = sql`(select ${memberships.userId} from ${memberships} where ${memberships.teamId} = ${teamId})`;
  return or(
    eq(auditEvents.teamId, teamId),
    and(isNull(auditEvents.teamId), inArray(auditEvents.actorId, members)),
  )!;
}

export async function listAuditEvents(db: DbOrTx, f: AuditFilter) {
  const action = f.action
    ? f.action.includes('.')
      ? eq(auditEvents.action, f.action)
      : like(auditEvents.action, `${f.action}.%`)
    : undefined;
  return db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      action: auditEvents.action,
      actorId: auditEvents.actorId,
      actorEmail: auditEvents.actorEmail,
      studyId: auditEvents.studyId,
      targetType: auditEvents.targetType,
      targetId: auditEvents.targetId,
      details: auditEvents.details,
    })
    .from(auditEvents)
    .where(
      and(
        teamScope(f.teamId),
        action,
        f.actorId ? eq(auditEvents.actorId, f.actorId) : undefined,
        f.studyId ? eq(auditEvents.studyId, f.studyId) : undefined,
        f.from ? gte(auditEvents.at, f.from) : undefined,
        f.to ? lte(auditEvents.at, f.to) : undefined,
        f.before ? lt(auditEvents.id, f.before) : undefined,
      ),
    )
    .orderBy(desc(auditEvents.id))
    .limit(f.limit);
}
