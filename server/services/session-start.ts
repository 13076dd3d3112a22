/**
 * Starting a session on a link, or resuming one: this browser's earlier token, else the
 * personal link's or the de-duplicated panel id's respondent (respondent-identity.ts), else a
 * new respondent (with the panel id from the link as external id).
 *
 * A panel launch sends hundreds of starts a second, and each round trip to PostgreSQL costs
 * the web process a socket write and a read besides the statement. So everything the decision
 * reads comes in one statement (db/queries/session-start.ts), which also takes the new
 * respondent's block place when nothing resumes and the study is live; the respondent insert
 * is the second and last. The decisions below are taken in the same order, on the same facts,
 * as when each was read on its own; a place the start does not use is given back.
 */
import type { AppDeps } from '../deps';
import { AppError } from '../lib/errors';
import { readSessionStart } from '../../db/queries/session-start';
import { releaseBlock } from '../../db/queries/respondent-blocks';
import type { RespondentRow } from '../../db/queries/respondents';
import type { RespondentSession, StartSessionInput } from '../../shared/schemas/respondent';
import { readSettings } from './lifecycle';
import {
  assertOpen,
  buildSession,
  createRespondent,
  linkState,
  settlePublicStudy,
} from './respondent-session';
import { findEarlierRespondent, identityOf, lostIdentityRace } from './respondent-identity';
import { rememberRespondent } from './known-respondents';

export async function startSession(
  deps: AppDeps,
  publicId: string,
  input: Required<Pick<StartSessionInput, 'params' | 'device'>> & { sessionToken?: string },
): Promise<RespondentSession> {
  const inviteToken = input.params.inv || null;
  const read = await readSessionStart(deps.db, {
    publicId,
    sessionToken: input.sessionToken || null,
    inviteToken,
    linkParams: input.params,
  });
  // The place the read took, until a new respondent holds it (createRespondent then owns it).
  let place = read?.block ?? null;
  try {
    const study = await settlePublicStudy(
      deps,
      publicId,
      read?.study ?? null,
      new Date(),
      read?.completes,
    );
    const found = read!.found;
    // The answers that follow find this respondent in memory (known-respondents.ts).
    const open = (r: RespondentRow, opts?: Parameters<typeof buildSession>[3]) => {
      rememberRespondent(publicId, r);
      return buildSession(deps.db, study, r, opts);
    };
    // A closed study still resumes this phone's own session: its outbox may hold answers
    // given before the close, which the grace period accepts (late-answers.ts).
    if (found?.by === 'token' && linkState(study) !== 'not_open') return open(found.respondent);
    assertOpen(study);
    const settings = readSettings(study.settings);
    const invitee = inviteToken ? read!.invitee : null;
    if (inviteToken) {
      if (!invitee)
        throw new AppError(
          404,
          'invitation_not_found',
          'This personal link is not valid for this survey.',
        );
      // A personal link already started resumes its respondent (read with the invitee).
      if (found?.by === 'invitee') return open(found.respondent);
    }
    const identity = identityOf(settings, input.params, invitee);
    // The statement looked the panel id up under the settings' defaults; settings it could
    // not read the same way are looked up again here.
    const earlier = invitee
      ? null
      : identity.panelKey === read!.panelKey
        ? found?.by === 'panel'
          ? found.respondent
          : null
        : await findEarlierRespondent(deps.db, study.id, identity);
    if (earlier) return open(earlier);
    const block = place;
    place = null;
    try {
      const { respondent, plan } = await createRespondent(deps.db, {
        studyId: study.id,
        ...identity,
        device: input.device,
        language: input.params.lang,
        standalone: true,
        latestVersionId: study.latestVersionId,
        block,
      });
      return open(respondent, { isNew: true, builtPlan: plan });
    } catch (err) {
      // Opened on two devices at once: the unique index let the other start win; resume it.
      if (!lostIdentityRace(err)) throw err;
      const winner = await findEarlierRespondent(deps.db, study.id, identity);
      if (!winner) throw err;
      return open(winner);
    }
  } finally {
    if (place !== null && read?.study.latestVersionId)
      await releaseBlock(deps.db, { versionId: read.study.latestVersionId, block: place }).catch(
        () => {},
      );
  }
}
