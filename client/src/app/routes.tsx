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

const placeholderSections: Record<Exclude<Section, 'admin'>, LazyExoticComponent<ComponentType>> = {
  atlas: lazy(() => import('./routes/AtlasPage')),
  intake: lazy(() => import('./routes/IntakePage')),
  regimes: lazy(() => import('./routes/RegimesPage')),
  outlook: lazy(() => import('./routes/OutlookPage')),
  bulletins: lazy(() => import('./routes/BulletinsPage')),
  inbox: lazy(() => import('./routes/InboxPage')),
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
