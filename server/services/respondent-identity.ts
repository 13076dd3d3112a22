/**
 * One person, one respondent. A personal link (invitee) yields at most one respondent, and so
 * does a panel pass-through id when the study de-duplicates them (setting dedupePanelIds, on
 * by default). Unique indexes on respondents (invitee_id; study_id + panel_key) decide races:
 * when two devices start at once, one insert wins and the other reads the winner back and
 * resumes its session, so nobody is counted twice.
 */
import type { DbOrTx } from '../../db/client';
import {
  getRespondentByInvitee,
  getRespondentByPanelKey,
  type RespondentRow,
} from '../../db/queries/respondents';
import { violatedUniqueIndex } from '../lib/db-errors';
import type { FieldworkSettings } from '../../shared/schemas/study-lifecycle';

export type SessionIdentity = {
  inviteeId: string | null;
  externalId: string | null;
  /** The panel id that de-duplicates, or null when there is none or the study keeps duplicates. */
  panelKey: string | null;
};

const IDENTITY_INDEXES = new Set(['respondents_invitee_uq', 'respondents_study_panel_key_uq']);

export function identityOf(
  settings: FieldworkSettings,
  params: Record<string, string>,
  invitee: { id: string; externalId: string | null } | null,
): SessionIdentity {
  const panelId = params[settings.panelParam] || null;
  return {
    inviteeId: invitee?.id ?? null,
    externalId: panelId ?? invitee?.externalId ?? null,
    // A personal link is de-duplicated by its invitee already.
    panelKey: !invitee && panelId && settings.dedupePanelIds ? panelId : null,
  };
}

/** The respondent this invitee or panel id already started in the study, if any. */
export async function findEarlierRespondent(
  db: DbOrTx,
  studyId: string,
  identity: SessionIdentity,
): Promise<RespondentRow | null> {
  if (identity.inviteeId)
    return getRespondentByInvitee(db, { studyId, inviteeId: identity.inviteeId });
  if (identity.panelKey)
    return getRespondentByPanelKey(db, { studyId, panelKey: identity.panelKey });
  return null;
}

/** Whether a failed insert lost a race for the same invitee or panel id. */
export function lostIdentityRace(err: unknown): boolean {
  const index = violatedUniqueIndex(err);
  return index !== null && IDENTITY_INDEXES.has(index);
}
