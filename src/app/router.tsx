import { createBrowserRouter, Navigate } from 'react-router-dom';
import { ActivityPage } from './routes/activity';
import { AppShell } from './routes/app-shell';
import { BriefPage } from './routes/brief';
import { CatalogPage } from './routes/catalog';
import { ComparePage } from './routes/compare';
import { ErrorPage } from './routes/error-page';
import { ForecastPage } from './routes/forecast';
import { PlanPage } from './routes/plan';
import { PlansPage } from './routes/plans';
import { ForgotPasswordPage } from './routes/forgot-password';
import { HomeRedirect } from './routes/home-redirect';
import { ImportsPage } from './routes/imports';
import { InvitePage } from './routes/invite';
import { MembersPage } from './routes/members';
import { NetworkPage } from './routes/network';
import { NotFoundPage } from './routes/not-found';
import { ResetPasswordPage } from './routes/reset-password';
import { RoadsPage } from './routes/roads';
import { SegmentPage } from './routes/segment';
import { SentMailPage } from './routes/sent-mail';
import { SettingsPage } from './routes/settings';
import { SignInPage } from './routes/sign-in';

export const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInPage />, errorElement: <ErrorPage /> },
  { path: '/forgot-password', element: <ForgotPasswordPage />, errorElement: <ErrorPage /> },
  { path: '/reset-password/:token', element: <ResetPasswordPage />, errorElement: <ErrorPage /> },
  { path: '/invite/:token', element: <InvitePage />, errorElement: <ErrorPage /> },
  { path: '/', element: <HomeRedirect />, errorElement: <ErrorPage /> },
  {
    path: '/a/:agencyId',
    element: <AppShell />,
    errorElement: <ErrorPage />,
    children: [
      { index: true, element: <Navigate to="network" replace /> },
      { path: 'network', element: <NetworkPage /> },
      { path: 'roads', element: <RoadsPage /> },
      { path: 'roads/:segmentRef', element: <SegmentPage /> },
      { path: 'imports', element: <ImportsPage /> },
      { path: 'catalog', element: <CatalogPage /> },
      { path: 'compare', element: <ComparePage /> },
      { path: 'forecast', element: <ForecastPage /> },
      { path: 'plans', element: <PlansPage /> },
      { path: 'plans/:planId', element: <PlanPage /> },
      { path: 'plans/:planId/brief', element: <BriefPage /> },
      { path: 'members', element: <MembersPage /> },
      { path: 'settings', element: <SettingsPage /> },
      { path: 'activity', element: <ActivityPage /> },
      { path: 'sent-mail', element: <SentMailPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
  { path: '*', element: <NotFoundPage /> },
]);
