/**
 * /api/teams/:teamId/studies/:studyId/texts — the study's languages and translated texts.
 * Reading (and exporting a translator's file) needs study:read; changing languages, saving,
 * importing and confirming texts needs study:write (owner, editor).
 */
import type { Request, Router } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { createTeamRouter } from './team-router';
import { sendFile } from './send-download';
import {
  confirmTranslationsSchema,
  exportTranslationsQuerySchema,
  importTranslationsSchema,
  languageParamsSchema,
  saveTranslationsSchema,
  updateLanguagesSchema,
} from '../../shared/schemas/study-texts';
import * as studyTexts from '../services/study-texts';
import {
  exportTranslationFile,
  importTranslationFile,
} from '../services/translations/translation-files';
import { confirmTranslations, saveTranslations } from '../services/translations/save-translations';

/**
 * The language in the path: parsed after the study's ids and before query and body, so that a
 * request with several bad parts reports the same one first as before.
 */
const langOf = (req: Request) => parseParams(languageParamsSchema, req).lang;

export function createStudyTextsRouter(deps: AppDeps): Router {
  const r = createTeamRouter(deps);
  r.get('/', 'study:read', {
    run: ({ actor, params }) => studyTexts.getStudyTexts(deps, actor.teamId, params.studyId),
  });
  r.put('/languages', 'study:write', {
    body: updateLanguagesSchema,
    run: ({ actor, params, body }) =>
      studyTexts.updateLanguages(deps, actor, params.studyId, body.languages),
  });
  r.get('/:lang/file', 'study:read', {
    run: ({ actor, params, req }) => {
      const lang = langOf(req);
      const { format } = parseQuery(exportTranslationsQuerySchema, req);
      return exportTranslationFile(deps, actor.teamId, params.studyId, lang, format);
    },
    send: (res, file) => sendFile(res, file),
  });
  r.post('/:lang/file', 'study:write', {
    run: ({ actor, params, req }) => {
      const lang = langOf(req);
      const input = parseBody(importTranslationsSchema, req);
      return importTranslationFile(deps, actor, params.studyId, lang, input);
    },
  });
  r.put('/:lang/confirmed', 'study:write', {
    run: ({ actor, params, req }) => {
      const lang = langOf(req);
      const { keys } = parseBody(confirmTranslationsSchema, req);
      return confirmTranslations(deps, actor, params.studyId, lang, keys);
    },
  });
  r.put('/:lang', 'study:write', {
    run: ({ actor, params, req }) => {
      const lang = langOf(req);
      const { texts } = parseBody(saveTranslationsSchema, req);
      return saveTranslations(deps, actor, params.studyId, lang, texts);
    },
  });
  return r.router;
}
