/** Every client route in one place. Build links with these, never with string literals. */
export const studySections = [
  'attributes',
  'tasks',
  'questionnaire',
  'preview',
  'fieldwork',
  'responses',
  'models',
  'tastes',
  'shares',
  'exports',
] as const;
export type StudySection = (typeof studySections)[number];

export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    getHref: (redirectTo?: string) =>
      `/sign-in${redirectTo ? `?redirectTo=${encodeURIComponent(redirectTo)}` : ''}`,
  },
  signUp: { path: '/sign-up', getHref: () => '/sign-up' },
  forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
  resetPassword: {
    path: '/reset-password',
    getHref: (token: string) => `/reset-password?token=${encodeURIComponent(token)}`,
  },
  confirmEmail: { path: '/confirm-email', getHref: () => '/confirm-email' },
  acceptInvitation: {
    path: '/invitations/:token',
    getHref: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },
  account: { path: '/account', getHref: () => '/account' },
  studies: {
    path: '/teams/:teamId/studies',
    getHref: (teamId: string) => `/teams/${teamId}/studies`,
  },
  /** Create a study from a choice file collected elsewhere. */
  importStudy: {
    path: '/teams/:teamId/studies/import',
    getHref: (teamId: string) => `/teams/${teamId}/studies/import`,
  },
  members: {
    path: '/teams/:teamId/members',
    getHref: (teamId: string) => `/teams/${teamId}/members`,
  },
  audit: {
    path: '/teams/:teamId/audit',
    getHref: (teamId: string) => `/teams/${teamId}/audit`,
  },
  study: {
    path: '/teams/:teamId/studies/:studyId',
    getHref: (teamId: string, studyId: string) => `/teams/${teamId}/studies/${studyId}`,
  },
  studySection: {
    path: '/teams/:teamId/studies/:studyId/:section',
    getHref: (teamId: string, studyId: string, section: StudySection) =>
      `/teams/${teamId}/studies/${studyId}/${section}`,
  },
  /** The Questionnaire section's Languages view: the study's languages and translated texts. */
  studyLanguages: {
    getHref: (teamId: string, studyId: string) =>
      `/teams/${teamId}/studies/${studyId}/questionnaire?tab=languages`,
  },
  /** The Tasks screen with a run's estimates offered as priors for a new design. */
  redesignFromRun: {
    getHref: (teamId: string, studyId: string, runId: string) =>
      `/teams/${teamId}/studies/${studyId}/tasks?priorsFromRun=${encodeURIComponent(runId)}`,
  },
  runEstimates: {
    path: '/teams/:teamId/studies/:studyId/models/:runId',
    getHref: (teamId: string, studyId: string, runId: string) =>
      `/teams/${teamId}/studies/${studyId}/models/${runId}`,
  },
  respondentProfile: {
    path: '/teams/:teamId/studies/:studyId/tastes/:runId/respondents/:respondentId',
    getHref: (teamId: string, studyId: string, runId: string, respondentId: string) =>
      `/teams/${teamId}/studies/${studyId}/tastes/${runId}/respondents/${respondentId}`,
  },
  /** Public page behind the unsubscribe link of invitation e-mails. */
  unsubscribe: {
    path: '/unsubscribe/:token',
    getHref: (token: string) => `/unsubscribe/${encodeURIComponent(token)}`,
  },
  /** The respondent app (public link); personal links add ?inv=<token>. */
  respond: { path: '/s/:publicId', getHref: (publicId: string) => `/s/${publicId}` },
  /** The respondent app on a study's current draft, shown inside the Preview section. */
  previewFrame: {
    path: '/preview/:teamId/:studyId',
    getHref: (
      teamId: string,
      studyId: string,
      respondent: { block: number; seed: number; screen: number; lang?: string },
    ) =>
      `/preview/${teamId}/${studyId}?block=${respondent.block}&seed=${respondent.seed}&screen=${respondent.screen}${respondent.lang ? `&lang=${encodeURIComponent(respondent.lang)}` : ''}`,
  },
} as const;
