/**
 * /api/teams/:teamId/imports — a study from choice data collected elsewhere: `POST /preview`
 * reads the uploaded files and lists their problems (saves nothing); `POST /` saves the study
 * when there is none. Both take multipart `choices` (required) and `background` (optional)
 * files; the save also takes the confirmed set-up as the JSON field `setup`. Creating a study
 * needs study:write.
 */
import { Router, type Request, type RequestHandler } from 'express';
import type { AppDeps } from '../deps';
import { parseBody } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { acceptFilesOnDisk, removeUploadedFiles, uploadedFile } from '../middleware/upload';
import { ValidationError } from '../lib/errors';
import { openTextFile } from '../lib/text-file';
import {
  importPreviewFieldsSchema,
  importSetupFieldSchema,
} from '../../shared/schemas/study-import';
import * as studyImport from '../services/study-import';
import type { ImportFiles } from '../services/study-import/analyse-import';

async function filesOf(req: Request): Promise<ImportFiles> {
  const choices = uploadedFile(req, 'choices');
  if (!choices)
    throw new ValidationError('Choose the choice file to upload.', [
      { path: 'choices', message: 'Choose a file' },
    ]);
  const background = uploadedFile(req, 'background');
  return {
    choices: await openTextFile(choices.path),
    background: background ? await openTextFile(background.path) : null,
  };
}

/** Runs the handler, then deletes the uploaded temporary files whatever happened. */
const withUploads =
  (handler: RequestHandler): RequestHandler =>
  async (req, res, next) => {
    try {
      await handler(req, res, next);
    } finally {
      await removeUploadedFiles(req);
    }
  };

export function createStudyImportsRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));
  const write = requireTeam(deps, 'study:write');
  const receiveFiles = acceptFilesOnDisk(
    ['choices', 'background'],
    Math.round(deps.env.IMPORT_MAX_MB * 1024 * 1024),
  );

  router.post(
    '/preview',
    write,
    receiveFiles,
    withUploads(async (req, res) => {
      const { setup } = parseBody(importPreviewFieldsSchema, req);
      res.json(await studyImport.previewStudyImport(await filesOf(req), setup ?? null));
    }),
  );

  router.post(
    '/',
    write,
    receiveFiles,
    withUploads(async (req, res) => {
      const { setup } = parseBody(importSetupFieldSchema, req);
      const actor = actorOf(req);
      res
        .status(201)
        .json(await studyImport.saveStudyImport(deps, actor, await filesOf(req), setup));
    }),
  );

  return router;
}
