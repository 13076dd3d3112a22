/**
 * Erasure of one respondent on a data-protection request. In one transaction: the respondent's
 * row gives way to a tombstone (id and start time only, so nobody else is renumbered), their
 * answers, earlier answers and taste profiles are deleted with it, their invitation (address,
 * name, external id, queued mail) is deleted, the block place is given back, every run that
 * may have used them is marked, and the audit trail records the erasure by respondent number
 * and reason, never by the address or id it was found by. A refused request changes nothing.
 */
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';
import { AppError, ConflictError } from '../lib/errors';
import { loadStudy } from './study-access';
import { recordAudit } from './audit';
import {
  countRespondentData,
  countRunningRuns,
  countRunsUsing,
  deleteInvitee,
  findInviteesBy,
  findNumberHolder,
  findRespondentsBy,
  lockRespondent,
  markRunsUsing,
  replaceByTombstone,
  type LockedRespondent,
} from '../../db/queries/erasure';
import { releaseBlock } from '../../db/queries/respondent-blocks';
import type {
  EraseRespondentInput,
  ErasureLookup,
  ErasurePreview,
  ErasureResult,
} from '../../shared/schemas/erasure';
import type { Actor } from './actor';

type Target = { respondent: LockedRespondent | null; inviteeId: string | null };

const notFound = (message: string) =>
  new AppError(404, 'respondent_not_found', message, [{ path: 'value', message }]);

/** One person's respondent id and/or invitee id, from the lookup. */
async function resolveIds(
  db: DbOrTx,
  studyId: string,
  lookup: ErasureLookup,
): Promise<{ respondentId: string | null; inviteeId: string | null }> {
  if (lookup.by === 'number') {
    const holder = await findNumberHolder(db, { studyId, number: Number(lookup.value) });
    if (!holder) throw notFound(`This study has no respondent number ${lookup.value}.`);
    if (holder.erased)
      throw new ConflictError('already_erased', `Respondent ${lookup.value} is already erased.`, [
        { path: 'value', message: 'Already erased' },
      ]);
    return { respondentId: holder.id, inviteeId: null };
  }
  const invited =
    lookup.by === 'email'
      ? await findInviteesBy(db, { studyId, email: lookup.value })
      : await findInviteesBy(db, { studyId, externalId: lookup.value });
  const people = new Map<string, { respondentId: string | null; inviteeId: string | null }>();
  for (const inv of invited) {
    const [r] = await findRespondentsBy(db, { studyId, inviteeId: inv.id });
    people.set(r?.id ?? inv.id, { respondentId: r?.id ?? null, inviteeId: inv.id });
  }
  if (lookup.by === 'externalId')
    for (const r of await findRespondentsBy(db, { studyId, externalId: lookup.value }))
      if (!people.has(r.id)) people.set(r.id, { respondentId: r.id, inviteeId: null });
  if (people.size === 0)
    throw notFound(
      lookup.by === 'email'
        ? 'Nobody was invited to this study with that address.'
        : 'No respondent or invitee of this study has that external id.',
    );
  if (people.size > 1)
    throw new ConflictError(
      'ambiguous_respondent',
      `${people.size} respondents have this external id: erase them one by one by number.`,
      [{ path: 'value', message: 'More than one respondent matches' }],
    );
  return [...people.values()][0]!;
}

async function resolveTarget(db: DbOrTx, studyId: string, lookup: ErasureLookup): Promise<Target> {
  const ids = await resolveIds(db, studyId, lookup);
  const respondent = ids.respondentId
    ? await lockRespondent(db, { studyId, id: ids.respondentId })
    : null;
  if (ids.respondentId && !respondent) throw notFound('That respondent no longer exists.');
  return { respondent, inviteeId: respondent?.inviteeId ?? ids.inviteeId };
}

async function describe(db: DbOrTx, studyId: string, t: Target): Promise<ErasurePreview> {
  const r = t.respondent;
  const data = r ? await countRespondentData(db, { respondentId: r.id }) : null;
  return {
    number: r?.number ?? null,
    reference: r ? r.id.slice(0, 8) : null,
    status: r?.status ?? null,
    answers: data?.answers ?? 0,
    revisions: data?.revisions ?? 0,
    invitation: t.inviteeId !== null,
    runsAffected: r ? await countRunsUsing(db, { studyId, respondent: r }) : 0,
  };
}

/** What erasing the person found by `lookup` would remove; changes nothing. */
export async function previewErasure(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  lookup: ErasureLookup,
): Promise<ErasurePreview> {
  await loadStudy(deps, teamId, studyId);
  return deps.db.transaction(async (tx) =>
    describe(tx, studyId, await resolveTarget(tx, studyId, lookup)),
  );
}

export async function eraseRespondent(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  input: EraseRespondentInput,
  at = new Date(),
): Promise<ErasureResult> {
  const { teamId } = actor;
  await loadStudy(deps, teamId, studyId);
  return deps.db.transaction(async (tx) => {
    const target = await resolveTarget(tx, studyId, input);
    // A running run may still write this respondent's taste profile; erase after it ends.
    if (target.respondent && (await countRunningRuns(tx, { studyId })) > 0)
      throw new ConflictError(
        'run_in_progress',
        'A model of this study is being estimated. Erase once it has finished, or cancel it first.',
      );
    const preview = await describe(tx, studyId, target);
    const r = target.respondent;
    if (r) {
      await markRunsUsing(tx, { studyId, respondent: r });
      await replaceByTombstone(tx, { studyId, respondent: r });
      if (r.status === 'in_progress' || r.status === 'completed')
        await releaseBlock(tx, { versionId: r.versionId, block: r.block });
    }
    if (target.inviteeId) await deleteInvitee(tx, { studyId, id: target.inviteeId });
    await recordAudit(tx, {
      teamId,
      studyId,
      actor,
      action: 'respondent.erased',
      targetType: 'respondent',
      // The number, never the address or external id it was found by.
      targetId: preview.number === null ? null : String(preview.number),
      details: {
        number: preview.number,
        foundBy: input.by,
        answers: preview.answers,
        revisions: preview.revisions,
        invitation: preview.invitation,
        runsMarked: preview.runsAffected,
        reason: input.reason,
      },
    });
    return { ...preview, erasedAt: at.toISOString() };
  });
}
