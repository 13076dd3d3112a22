/**
 * /api/teams/:teamId/studies/:studyId/texts — the study's languages and translated texts.
 * Reading (and exporting a translator's file) needs study:read; changing languages, saving,
 * importing and confirming texts needs study:write (owner, editor).
 */
import { Router, type Request } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../services/study-access';
import { parseQuery } from '../middleware/validate';
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

export function createStudyTextsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const read = requireTeam(deps, 'study:read');
  const write = requireTeam(deps, 'study:write');
  const ids = (req: Request) => ({
    teamId: actorOf(req).teamId,
    studyId: parseParams(studyParamsSchema, req).studyId,
  });

  router.get('/', read, async (req, res) => {
    const { teamId, studyId } = ids(req);
    res.json(await studyTexts.getStudyTexts(deps, teamId, studyId));
  });
  router.put('/languages', write, async (req, res) => {
    const { studyId } = ids(req);
    const { languages } = parseBody(updateLanguagesSchema, req);
    res.json(await studyTexts.updateLanguages(deps, actorOf(req), studyId, languages));
  });
  router.get('/:lang/file', read, async (req, res) => {
    const { teamId, studyId } = ids(req);
    const { lang } = parseParams(languageParamsSchema, req);
    const { format } = parseQuery(exportTranslationsQuerySchema, req);
    const file = await exportTranslationFile(deps, teamId, studyId, lang, format);
    res.setHeader('Content-Type', file.contentType);
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
    res.send(file.body);
  });
  router.post('/:lang/file', write, async (req, res) => {
    const { studyId } = ids(req);
    const { lang } = parseParams(languageParamsSchema, req);
    const input = parseBody(importTranslationsSchema, req);
    res.json(await importTranslationFile(deps, actorOf(req), studyId, lang, input));
  });
  router.put('/:lang/confirmed', write, async (req, res) => {
    const { studyId } = ids(req);
    const { lang } = parseParams(languageParamsSchema, req);
    const { keys } = parseBody(confirmTranslationsSchema, req);
    res.json(await confirmTranslations(deps, actorOf(req), studyId, lang, keys));
  });
  router.put('/:lang', write, async (req, res) => {
    const { studyId } = ids(req);
    const { lang } = parseParams(languageParamsSchema, req);
    const { texts } = parseBody(saveTranslationsSchema, req);
    res.json(await saveTranslations(deps, actorOf(req), studyId, lang, texts));
  });
  return router;
}
