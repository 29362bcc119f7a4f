import type { ComponentType } from 'react';
import { createBrowserRouter, Navigate } from 'react-router-dom';
import { AppShell } from './routes/app-shell';
import { ErrorPage } from './routes/error-page';
import { HomeRedirect } from './routes/home-redirect';
import { NotFoundPage } from './routes/not-found';

// Screens load with their route (React Router `lazy`): the first page brings only the shell and
// the screen asked for. The shell, the error page and the redirects stay in the main bundle.
const screen =
  <K extends string, M extends Record<K, ComponentType>>(load: () => Promise<M>, name: K) =>
  async () => ({ Component: (await load())[name] });

/** Shown on the first load while the screen's code arrives. */
const loading = <p className="p-6 text-sm text-asphalt-muted">Loading…</p>;

export const router = createBrowserRouter([
  {
    path: '/sign-in',
    lazy: screen(() => import('./routes/sign-in'), 'SignInPage'),
    errorElement: <ErrorPage />,
    hydrateFallbackElement: loading,
  },
  {
    path: '/forgot-password',
    lazy: screen(() => import('./routes/forgot-password'), 'ForgotPasswordPage'),
    errorElement: <ErrorPage />,
    hydrateFallbackElement: loading,
  },
  {
    path: '/reset-password/:token',
    lazy: screen(() => import('./routes/reset-password'), 'ResetPasswordPage'),
    errorElement: <ErrorPage />,
    hydrateFallbackElement: loading,
  },
  {
    path: '/invite/:token',
    lazy: screen(() => import('./routes/invite'), 'InvitePage'),
    errorElement: <ErrorPage />,
    hydrateFallbackElement: loading,
  },
  { path: '/', element: <HomeRedirect />, errorElement: <ErrorPage />, hydrateFallbackElement: loading },
  {
    path: '/a/:agencyId',
    element: <AppShell />,
    errorElement: <ErrorPage />,
    hydrateFallbackElement: loading,
    children: [
      { index: true, element: <Navigate to="network" replace /> },
      { path: 'network', lazy: screen(() => import('./routes/network'), 'NetworkPage') },
      { path: 'roads', lazy: screen(() => import('./routes/roads'), 'RoadsPage') },
      { path: 'roads/:segmentRef', lazy: screen(() => import('./routes/segment'), 'SegmentPage') },
      { path: 'imports', lazy: screen(() => import('./routes/imports'), 'ImportsPage') },
      { path: 'catalog', lazy: screen(() => import('./routes/catalog'), 'CatalogPage') },
      { path: 'compare', lazy: screen(() => import('./routes/compare'), 'ComparePage') },
      { path: 'forecast', lazy: screen(() => import('./routes/forecast'), 'ForecastPage') },
      { path: 'plans', lazy: screen(() => import('./routes/plans'), 'PlansPage') },
      { path: 'plans/:planId', lazy: screen(() => import('./routes/plan'), 'PlanPage') },
      { path: 'plans/:planId/brief', lazy: screen(() => import('./routes/brief'), 'BriefPage') },
      { path: 'members', lazy: screen(() => import('./routes/members'), 'MembersPage') },
      { path: 'settings', lazy: screen(() => import('./routes/settings'), 'SettingsPage') },
      { path: 'activity', lazy: screen(() => import('./routes/activity'), 'ActivityPage') },
      { path: 'sent-mail', lazy: screen(() => import('./routes/sent-mail'), 'SentMailPage') },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
  { path: '*', element: <NotFoundPage /> },
]);
