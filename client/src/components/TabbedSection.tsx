import { Tab, TabList, Tabs } from '@carbon/react';
import { Suspense } from 'react';
import { Outlet, useLocation, useNavigate } from 'react-router';

export interface SectionPage {
  name: string;
  path: string;
}

/**
 * A section with its own sub-navigation: a title, tabs that are routes (so pages can be linked and
 * reloaded), and the chosen page below. `tabOf` says which tab a deeper path belongs to.
 */
export function TabbedSection(props: {
  title: string;
  label: string;
  pages: readonly SectionPage[];
  tabOf?: (pathname: string) => number;
}) {
  const { pathname } = useLocation();
  const navigate = useNavigate();
  const selectedIndex = props.tabOf
    ? props.tabOf(pathname)
    : Math.max(
        0,
        props.pages.findIndex((page) => pathname.startsWith(page.path)),
      );
  return (
    <>
      <h1 className="page-title">{props.title}</h1>
      <div className="admin-tabs">
        <Tabs
          selectedIndex={selectedIndex}
          onChange={({ selectedIndex: next }) => navigate(props.pages[next].path)}
        >
          <TabList aria-label={props.label}>
            {props.pages.map((page) => (
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
