import { Tab, TabList, Tabs } from '@carbon/react';
import { Suspense } from 'react';
import { Outlet, useLocation, useNavigate } from 'react-router';
import { paths } from '../../config/paths';

const INTAKE_PAGES = [
  { name: 'Uploads & jobs', path: paths.intake.uploads },
  { name: 'Radar sites', path: paths.intake.sites },
  { name: 'Tracks', path: paths.intake.tracks },
] as const;

/** Which tab a path belongs to; uploads also own the job pages under /intake/jobs. */
function tabIndexOf(pathname: string): number {
  if (pathname.startsWith(paths.intake.sites)) return 1;
  if (pathname.startsWith(paths.intake.tracks)) return 2;
  return 0;
}

/** Intake's own sub-navigation: each tab is a route, so pages can be linked and reloaded. */
export default function IntakeLayout() {
  const { pathname } = useLocation();
  const navigate = useNavigate();
  return (
    <>
      <h1 className="page-title">Intake</h1>
      <div className="admin-tabs">
        <Tabs
          selectedIndex={tabIndexOf(pathname)}
          onChange={({ selectedIndex }) => navigate(INTAKE_PAGES[selectedIndex].path)}
        >
          <TabList aria-label="Intake pages">
            {INTAKE_PAGES.map((page) => (
              <Tab key={page.path}>{page.name}</Tab>
            ))}
          </TabList>
        </Tabs>
      </div>
      <Suspense fallback={null}>
        <Outlet />
      </Suspense>
    </>
  );
}
