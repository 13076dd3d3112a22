/**
 * All client routes. Route modules are lazy-loaded; each exports `Component` (and may export a
 * `loader` that prefetches with the same query-options builders the page uses).
 */
import { createBrowserRouter } from 'react-router';
import type { QueryClient } from '@tanstack/react-query';
import { paths } from '@/config/paths';
import { AppShell } from './app-shell';
import { HomeRedirect, RequireAuth } from './routes/require-auth';
import { NotFound } from './routes/not-found';
import { getSectionRoutes } from './routes/studies/section-modules';

export function createRouter(queryClient: QueryClient) {
  return createBrowserRouter([
    { path: paths.home.path, element: <HomeRedirect /> },
    { path: paths.signIn.path, lazy: () => import('./routes/auth/sign-in') },
    { path: paths.signUp.path, lazy: () => import('./routes/auth/sign-up') },
    { path: paths.forgotPassword.path, lazy: () => import('./routes/auth/forgot-password') },
    { path: paths.resetPassword.path, lazy: () => import('./routes/auth/reset-password') },
    { path: paths.confirmEmail.path, lazy: () => import('./routes/auth/confirm-email') },
    { path: paths.acceptInvitation.path, lazy: () => import('./routes/auth/accept-invitation') },
    // The respondent app: public, no sign-in, outside the researcher shell.
    { path: paths.respond.path, lazy: () => import('./routes/respond/respond') },
    { path: paths.unsubscribe.path, lazy: () => import('./routes/unsubscribe') },
    {
      element: <RequireAuth />,
      children: [
        // The respondent app on the draft, framed by the Preview section (no researcher shell).
        { path: paths.previewFrame.path, lazy: () => import('./routes/preview-frame') },
        {
          element: <AppShell />,
          children: [
            { path: paths.studies.path, lazy: () => import('./routes/studies/study-list') },
            { path: paths.importStudy.path, lazy: () => import('./routes/studies/import-study') },
            {
              path: paths.members.path,
              lazy: async () => {
                const m = await import('./routes/team/members');
                return { Component: m.Component, loader: m.createMembersLoader(queryClient) };
              },
            },
            { path: paths.account.path, lazy: () => import('./routes/account') },
            { path: paths.audit.path, lazy: () => import('./routes/team/audit') },
            {
              // Section screens register themselves: see routes/studies/section-modules.ts.
              path: paths.study.path,
              lazy: async () => {
                const m = await import('./routes/studies/study-layout');
                return { Component: m.StudyLayout, loader: m.createStudyLoader(queryClient) };
              },
              children: [
                {
                  index: true,
                  lazy: async () => ({
                    Component: (await import('./routes/studies/study-layout')).StudyIndexRedirect,
                  }),
                },
                ...getSectionRoutes(),
                {
                  path: 'models/:runId',
                  lazy: async () => {
                    const m = await import('./routes/studies/runs/run-estimates');
                    return { Component: m.Component, loader: m.createRunLoader(queryClient) };
                  },
                },
                {
                  path: 'tastes/:runId/respondents/:respondentId',
                  lazy: () => import('./routes/studies/tastes/respondent-profile'),
                },
              ],
            },
          ],
        },
      ],
    },
    { path: '*', element: <NotFound /> },
  ]);
}
