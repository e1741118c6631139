import { Tab, TabList, Tabs } from '@carbon/react';
import { Suspense } from 'react';
import { Outlet, useLocation, useNavigate } from 'react-router';
import { paths } from '../../config/paths';

const ADMIN_PAGES = [
  { name: 'Districts & blocks', path: paths.admin.blocks },
  { name: 'People', path: paths.admin.people },
  { name: 'Audit trail', path: paths.admin.audit },
] as const;

/** Admin's own sub-navigation: each tab is a route, so pages can be linked and reloaded. */
export default function AdminLayout() {
  const { pathname } = useLocation();
  const navigate = useNavigate();
  const selectedIndex = Math.max(
    0,
    ADMIN_PAGES.findIndex((page) => pathname.startsWith(page.path)),
  );
  return (
    <>
      <h1 className="page-title">Admin</h1>
      <div className="admin-tabs">
        <Tabs
          selectedIndex={selectedIndex}
          onChange={({ selectedIndex: next }) => navigate(ADMIN_PAGES[next].path)}
        >
          <TabList aria-label="Admin pages">
            {ADMIN_PAGES.map((page) => (
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
