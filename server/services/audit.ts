/**
 * The audit trail's use cases: record an event (inside the caller's transaction where there is
 * one, so the change and its record stand or fall together), list a team's events with filters,
 * and download them as CSV. Owners only ('audit:read', checked by the route).
 */
import type { AppDeps } from '../deps';
import type { Actor, AuditName } from './actor';
import type { DbOrTx } from '../../db/client';
import { insertAuditEvent, listAuditEvents, type AuditInsert } from '../../db/queries/audit';
import type { AuditAction, AuditPage, ListAuditQuery } from '../../shared/schemas/audit';
import { writeCsv } from '../lib/safe-csv';

export type AuditRecord = Omit<AuditInsert, 'action' | 'actorId' | 'actorEmail'> & {
  action: AuditAction;
  actor?: AuditName | null;
};

export async function recordAudit(db: DbOrTx, e: AuditRecord): Promise<void> {
  const { actor, ...rest } = e;
  await insertAuditEvent(db, {
    ...rest,
    actorId: actor?.userId ?? null,
    actorEmail: actor?.email ?? null,
  });
}

function filterOf(teamId: string, q: ListAuditQuery) {
  return {
    teamId,
    action: q.action,
    actorId: q.actorId,
    studyId: q.studyId,
    from: q.from ? new Date(q.from) : undefined,
    to: q.to ? new Date(q.to) : undefined,
    before: q.before,
    limit: q.limit,
  };
}

export async function listAudit(
  deps: AppDeps,
  teamId: string,
  q: ListAuditQuery,
): Promise<AuditPage> {
  const rows = await listAuditEvents(deps.db, filterOf(teamId, q));
  return {
    events: rows.map((r) => ({
      ...r,
      at: r.at.toISOString(),
      details: (r.details ?? {}) as Record<string, unknown>,
    })),
    nextBefore: rows.length === q.limit ? rows[rows.length - 1]!.id : null,
  };
}

/** Every event matching the filters (newest first, at most 100,000) as a CSV download. */
export async function exportAudit(deps: AppDeps, actor: Actor, q: ListAuditQuery, at = new Date()) {
  const rows: Awaited<ReturnType<typeof listAuditEvents>> = [];
  let before = q.before;
  for (let page = 0; page < 100; page++) {
    const batch = await listAuditEvents(deps.db, {
      ...filterOf(actor.teamId, q),
      before,
      limit: 1000,
    });
    rows.push(...batch);
    if (batch.length < 1000) break;
    before = batch[batch.length - 1]!.id;
  }
  await recordAudit(deps.db, {
    teamId: actor.teamId,
    actor,
    action: 'audit.downloaded',
    details: { rows: rows.length, filters: { ...q, before: undefined, limit: undefined } },
  });
  const header = [
    'id',
    'at',
    'action',
    'actor_id',
    'actor_email',
    'study_id',
    'target_type',
    'target_id',
    'details',
  ];
  return {
    filename: `audit-trail-${at.toISOString().slice(0, 10)}.csv`,
    body: writeCsv(
      header,
      rows.map((r) => [
        r.id,
        r.at.toISOString(),
        r.action,
        r.actorId,
        r.actorEmail,
        r.studyId,
        r.targetType,
        r.targetId,
        JSON.stringify(r.details ?? {}),
      ]),
    ),
  };
}
