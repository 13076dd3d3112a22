/**
 * Level images. Upload: POST /api/teams/:teamId/studies/:studyId/files (owner, editor).
 * Read: GET /api/files/:key — public, because respondents see the images; keys are random.
 */
import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { parseParams } from '../middleware/validate';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { acceptOneFile, requireFile } from '../middleware/upload';
import { publicRoute } from '../middleware/access';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import { NotFoundError } from '../lib/errors';
import {
  MAX_IMAGE_BYTES,
  readPublicFile,
  uploadLevelImage,
} from '../services/storage/level-images';

export function createStudyFilesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.post(
    '/',
    requireUser(deps),
    requireTeam(deps, 'study:write'),
    acceptOneFile('file', MAX_IMAGE_BYTES),
    async (req, res) => {
      const { studyId } = parseParams(studyParamsSchema, req);
      const file = requireFile(req, 'file');
      res.status(201).json(await uploadLevelImage(deps, actorOf(req).teamId, studyId, file));
    },
  );
  return router;
}

const keySchema = z.object({ key: z.string().regex(/^[A-Za-z0-9_-]{16,64}\.[a-z0-9]{2,5}$/) });

export function createPublicFilesRouter(deps: AppDeps): Router {
  const router = Router();
  router.get(
    '/:key',
    publicRoute('respondents see level images; keys are unguessable'),
    async (req, res) => {
      const parsed = keySchema.safeParse(req.params);
      if (!parsed.success) throw new NotFoundError('File');
      const file = await readPublicFile(deps, parsed.data.key);
      res
        .set('Cache-Control', 'public, max-age=31536000, immutable')
        .set('Content-Security-Policy', "default-src 'none'")
        .type(file.contentType)
        .send(file.bytes);
    },
  );
  return router;
}
