/**
 * Invitees of a study (mounted at /teams/:teamId/studies/:studyId/invitees): CSV preview and
 * import, list, remove, send invitations and reminders. The list shows e-mail addresses, so it
 * needs personal:read; everything that changes or mails needs fieldwork:manage.
 */
import { Router, type RequestHandler } from 'express';
import type { AppDeps } from '../deps';
import { parseBody, parseParams, parseQuery } from '../middleware/validate';
import { acceptOneFile, requireFile } from '../middleware/upload';
import { actorOf, requireTeam, requireUser } from '../middleware/auth';
import { studyParamsSchema } from '../../shared/schemas/study-params';
import {
  importInviteesFieldsSchema,
  INVITEE_CSV_MAX_BYTES,
  inviteeParamsSchema,
  listInviteesQuerySchema,
  sendInvitationsSchema,
  sendRemindersSchema,
} from '../../shared/schemas/invitees';
import * as invitees from '../services/invitees';

/** The CSV upload (one file, at most INVITEE_CSV_MAX_BYTES), required. */
const receiveCsv: RequestHandler[] = [
  acceptOneFile('file', INVITEE_CSV_MAX_BYTES, { fields: 5, parts: 6 }),
  (req, _res, next) => {
    requireFile(req, 'file');
    next();
  },
];

export function createInviteesRouter(deps: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.use(requireUser(deps));

  router.post(
    '/preview',
    requireTeam(deps, 'fieldwork:manage'),
    ...receiveCsv,
    async (req, res) => {
      const { studyId } = parseParams(studyParamsSchema, req);
      res.json(
        await invitees.previewInviteeCsv(deps, actorOf(req).teamId, studyId, req.file!.buffer),
      );
    },
  );

  router.post('/import', requireTeam(deps, 'fieldwork:manage'), ...receiveCsv, async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const { onlyValid } = parseBody(importInviteesFieldsSchema, req);
    res.status(201).json(
      await invitees.importInviteeCsv(deps, actorOf(req).teamId, studyId, req.file!.buffer, {
        onlyValid,
      }),
    );
  });

  router.get('/', requireTeam(deps, 'personal:read'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const q = parseQuery(listInviteesQuerySchema, req);
    res.json(await invitees.getInvitees(deps, actorOf(req).teamId, studyId, q));
  });

  router.delete('/:inviteeId', requireTeam(deps, 'fieldwork:manage'), async (req, res) => {
    const { studyId, inviteeId } = parseParams(inviteeParamsSchema, req);
    await invitees.removeInvitee(deps, actorOf(req).teamId, studyId, inviteeId);
    res.status(204).end();
  });

  router.post('/send', requireTeam(deps, 'fieldwork:manage'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(sendInvitationsSchema, req);
    res.json(await invitees.sendInvitations(deps, actorOf(req).teamId, studyId, input));
  });

  router.post('/remind', requireTeam(deps, 'fieldwork:manage'), async (req, res) => {
    const { studyId } = parseParams(studyParamsSchema, req);
    const input = parseBody(sendRemindersSchema, req);
    res.json(await invitees.sendReminders(deps, actorOf(req).teamId, studyId, input));
  });

  return router;
}
