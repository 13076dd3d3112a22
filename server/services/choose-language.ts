/** The respondent's choice of language on the first screen (POST /api/r/:publicId/language). */
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError } from '../lib/errors';
import { getRespondentByToken, setRespondentLanguage } from '../../db/queries/respondents';
import { loadFrozenVersion } from './respondent-screens';
import { buildSession, findPublicStudy } from './respondent-session';
import { languageFromLink } from './respondent-language';
import { chooseLanguageSchema } from '../../shared/schemas/respondent';

/** The respondent's choice on the first screen: allowed until the first answer is stored. */
export async function chooseLanguage(
  deps: AppDeps,
  publicId: string,
  sessionToken: string,
  body: unknown,
) {
  const study = await findPublicStudy(deps, publicId);
  const respondent = await getRespondentByToken(deps.db, { studyId: study.id, sessionToken });
  if (!respondent) throw new NotFoundError('Session');
  const version = await loadFrozenVersion(deps.db, {
    id: respondent.versionId,
    studyId: study.id,
  });
  const language = languageFromLink(version, chooseLanguageSchema.parse(body ?? {}).language);
  if (
    language !== respondent.language &&
    !(await setRespondentLanguage(deps.db, { id: respondent.id, language }))
  )
    throw new ConflictError(
      'language_locked',
      'The language cannot change once the survey has begun.',
    );
  return buildSession(deps.db, study, { ...respondent, language });
}
