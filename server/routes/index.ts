/**
 * Where every API router is mounted. Team-scoped routers sit under /teams/:teamId and each of
 * their handlers declares its permission through requireTeam (server/middleware/auth.ts).
 */
import type { Router } from 'express';
import type { AppDeps } from '../deps';
import { createHealthRouter } from './health';
import { createAuthRouter } from './auth';
import { createAccountRouter } from './account';
import { createTeamsRouter } from './teams';
import { createInvitationsRouter } from './invitations';
import { createStudiesRouter } from './studies';
import { createQuestionnaireRouter } from './questionnaire';
import { createLifecycleRouter } from './lifecycle';
import { createRespondRouter, type RespondentSteps } from './respond';
import { createRunsRouter } from './runs';
import { createDesignsRouter } from './designs';
import { createPublicFilesRouter, createStudyFilesRouter } from './files';
import { createInviteesRouter } from './invitees';
import { createUnsubscribeRouter } from './unsubscribe';
import { createFieldworkRouter } from './fieldwork';
import { createResponsesRouter } from './responses';
import { createErasureRouter } from './erasure';
import { createTastesRouter } from './tastes';
import { createSharesRouter } from './shares';
import { createExportsRouter } from './exports';
import { createAuditRouter } from './audit';
import { createPreviewRouter } from './preview';
import { createStudyTextsRouter } from './study-texts';
import { createStudyImportsRouter } from './study-imports';

/** `respondent`: the answer routes' steps when the app also runs them in its answer lane. */
export function mountApiRoutes(api: Router, deps: AppDeps, respondent?: RespondentSteps): void {
  api.use('/health', createHealthRouter(deps));
  // First after health: a panel launch sends hundreds of respondent requests a second, and
  // Express tries the mounts in order (no other mount begins with /r, so order is free here).
  api.use('/r/:publicId', createRespondRouter(deps, respondent));
  api.use('/auth', createAuthRouter(deps));
  api.use('/account', createAccountRouter(deps));
  api.use('/invitations', createInvitationsRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/invitees', createInviteesRouter(deps));
  api.use('/unsubscribe', createUnsubscribeRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/fieldwork', createFieldworkRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/responses', createResponsesRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/erasure', createErasureRouter(deps));
  api.use('/files', createPublicFilesRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/files', createStudyFilesRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/design', createDesignsRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/tastes', createTastesRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/shares', createSharesRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/exports', createExportsRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/runs', createRunsRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/preview', createPreviewRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/questionnaire', createQuestionnaireRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/lifecycle', createLifecycleRouter(deps));
  api.use('/teams/:teamId/studies/:studyId/texts', createStudyTextsRouter(deps));
  api.use('/teams/:teamId/audit', createAuditRouter(deps));
  api.use('/teams/:teamId/imports', createStudyImportsRouter(deps));
  api.use('/teams/:teamId/studies', createStudiesRouter(deps));
  api.use('/teams', createTeamsRouter(deps));
}
