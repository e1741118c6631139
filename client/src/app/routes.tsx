import type { Section } from '@stormhour/shared';
import { type ComponentType, type LazyExoticComponent, lazy } from 'react';
import { Navigate, type RouteObject } from 'react-router';
import { paths } from '../config/paths';
import { AppShell } from './AppShell';
import { HomeRedirect } from './HomeRedirect';
import { RequireSection } from './RequireSection';
import { RequireSession } from './RequireSession';
import { RouteErrorPage } from './routes/RouteErrorPage';

const SignInPage = lazy(() => import('./routes/SignInPage'));
const NotFoundPage = lazy(() => import('./routes/NotFoundPage'));
const ChangePasswordPage = lazy(() => import('../features/account/components/ChangePasswordPage'));
const AdminLayout = lazy(() => import('./routes/AdminLayout'));
const BlocksPage = lazy(() => import('../features/admin/blocks/components/BlocksPage'));
const PeoplePage = lazy(() => import('../features/admin/people/components/PeoplePage'));
const AuditPage = lazy(() => import('../features/admin/audit/components/AuditPage'));
const MailLogPage = lazy(() => import('../features/admin/mail/components/MailLogPage'));
const MailMessagePage = lazy(() => import('../features/admin/mail/components/MailMessagePage'));
const IntakeLayout = lazy(() => import('./routes/IntakeLayout'));
const UploadsPage = lazy(() => import('../features/intake/uploads/components/UploadsPage'));
const JobDetailPage = lazy(() => import('../features/intake/jobs/components/JobDetailPage'));
const SitesPage = lazy(() => import('../features/intake/sites/components/SitesPage'));
const SiteFormPage = lazy(() => import('../features/intake/sites/components/SiteFormPage'));
const TracksPage = lazy(() => import('../features/intake/tracks/components/TracksPage'));
const TrackDetailPage = lazy(() => import('../features/intake/tracks/components/TrackDetailPage'));
const BulletinsLayout = lazy(() => import('./routes/BulletinsLayout'));
const AdviceRulesPage = lazy(() => import('../features/advice/components/AdviceRulesPage'));
const CropCalendarsPage = lazy(() => import('../features/advice/components/CropCalendarsPage'));
const BulletinsListPage = lazy(() => import('../features/bulletins/components/BulletinsListPage'));
const BulletinPage = lazy(() => import('../features/bulletins/components/BulletinPage'));
const InboxLayout = lazy(() => import('./routes/InboxLayout'));
const InboxListPage = lazy(() => import('../features/inbox/components/InboxListPage'));
const InboxBulletinPage = lazy(() => import('../features/inbox/components/InboxBulletinPage'));

const placeholderSections: Record<
  Exclude<Section, 'admin' | 'intake' | 'bulletins' | 'inbox'>,
  LazyExoticComponent<ComponentType>
> = {
  atlas: lazy(() => import('./routes/AtlasPage')),
  regimes: lazy(() => import('./routes/RegimesPage')),
  outlook: lazy(() => import('./routes/OutlookPage')),
  scorecard: lazy(() => import('./routes/ScorecardPage')),
};

function sectionRoute(section: Section, Page: ComponentType): RouteObject {
  return {
    path: `${paths.section[section]}/*`,
    element: (
      <RequireSection section={section}>
        <Page />
      </RequireSection>
    ),
  };
}

export const routes: RouteObject[] = [
  {
    errorElement: <RouteErrorPage />,
    children: [
      { path: paths.signIn, element: <SignInPage /> },
      {
        element: <RequireSession />,
        children: [
          {
            element: <AppShell />,
            children: [
              { index: true, element: <HomeRedirect /> },
              ...Object.entries(placeholderSections).map(([section, Page]) =>
                sectionRoute(section as Section, Page),
              ),
              {
                path: paths.section.intake,
                element: (
                  <RequireSection section="intake">
                    <IntakeLayout />
                  </RequireSection>
                ),
                children: [
                  { index: true, element: <UploadsPage /> },
                  { path: 'jobs/:jobId', element: <JobDetailPage /> },
                  { path: 'sites', element: <SitesPage /> },
                  { path: 'sites/new', element: <SiteFormPage /> },
                  { path: 'sites/:siteId', element: <SiteFormPage /> },
                  { path: 'tracks', element: <TracksPage /> },
                  { path: 'tracks/:trackId', element: <TrackDetailPage /> },
                  { path: '*', element: <NotFoundPage /> },
                ],
              },
              {
                path: paths.section.bulletins,
                element: (
                  <RequireSection section="bulletins">
                    <BulletinsLayout />
                  </RequireSection>
                ),
                children: [
                  { index: true, element: <BulletinsListPage /> },
                  { path: paths.bulletins.rules, element: <AdviceRulesPage /> },
                  { path: paths.bulletins.calendars, element: <CropCalendarsPage /> },
                  { path: ':bulletinId', element: <BulletinPage /> },
                  { path: '*', element: <NotFoundPage /> },
                ],
              },
              {
                path: paths.section.inbox,
                element: (
                  <RequireSection section="inbox">
                    <InboxLayout />
                  </RequireSection>
                ),
                children: [
                  { index: true, element: <InboxListPage /> },
                  { path: ':bulletinId', element: <InboxBulletinPage /> },
                  { path: '*', element: <NotFoundPage /> },
                ],
              },
              {
                path: paths.section.admin,
                element: (
                  <RequireSection section="admin">
                    <AdminLayout />
                  </RequireSection>
                ),
                children: [
                  { index: true, element: <Navigate to={paths.admin.blocks} replace /> },
                  { path: paths.admin.blocks, element: <BlocksPage /> },
                  { path: paths.admin.people, element: <PeoplePage /> },
                  { path: paths.admin.audit, element: <AuditPage /> },
                  { path: paths.admin.mail, element: <MailLogPage /> },
                  { path: 'mail/messages/:messageId', element: <MailMessagePage /> },
                  { path: paths.admin.calendars, element: <CropCalendarsPage /> },
                  { path: '*', element: <NotFoundPage /> },
                ],
              },
              { path: paths.changePassword, element: <ChangePasswordPage /> },
              { path: '*', element: <NotFoundPage /> },
            ],
          },
        ],
      },
    ],
  },
];
