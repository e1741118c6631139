import {
  Button,
  Content,
  Header,
  HeaderGlobalBar,
  HeaderName,
  Link,
  Loading,
  SideNav,
  SideNavItems,
  SideNavLink,
  SkipToContent,
} from '@carbon/react';
import { ROLE_LABELS, sectionsFor } from '@stormhour/shared';
import { Suspense } from 'react';
import { Outlet, Link as RouterLink, useLocation, useNavigate } from 'react-router';
import { RegionBoundary } from '../components/RegionBoundary';
import { paths, SECTION_NAMES } from '../config/paths';
import { useAuth, useSessionUser } from '../lib/auth';

function UserBar() {
  const user = useSessionUser();
  const { signOut } = useAuth();
  const navigate = useNavigate();
  return (
    <div className="header-user">
      <span className="header-user__name">{user.name}</span>
      <span>{ROLE_LABELS[user.role]}</span>
      <Link as={RouterLink} to={paths.changePassword}>
        Change password
      </Link>
      <Button
        kind="ghost"
        size="sm"
        onClick={async () => {
          await signOut();
          navigate(paths.signIn, { replace: true });
        }}
      >
        Sign out
      </Button>
    </div>
  );
}

function SectionNav() {
  const user = useSessionUser();
  const { pathname } = useLocation();
  return (
    // A sibling before Content, not inside Header, so it does not cover the page.
    <SideNav aria-label="Sections" isFixedNav expanded isChildOfHeader={false}>
      <SideNavItems>
        {sectionsFor(user.role).map((section) => {
          const to = paths.section[section];
          return (
            <SideNavLink key={section} as={RouterLink} to={to} isActive={pathname.startsWith(to)}>
              {SECTION_NAMES[section]}
            </SideNavLink>
          );
        })}
      </SideNavItems>
    </SideNav>
  );
}

export function AppShell() {
  const { pathname } = useLocation();
  return (
    <>
      <Header aria-label="Stormhour">
        <SkipToContent />
        <HeaderName as={RouterLink} to={paths.home} prefix="">
          Stormhour
        </HeaderName>
        <HeaderGlobalBar>
          <UserBar />
        </HeaderGlobalBar>
      </Header>
      <SectionNav />
      <Content id="main-content" className="app-content">
        {/* Keyed by path so leaving a broken page clears its error. */}
        <RegionBoundary key={pathname} region="this page">
          <Suspense fallback={<Loading description="Loading the page" withOverlay={false} small />}>
            <Outlet />
          </Suspense>
        </RegionBoundary>
        <footer className="app-caution">
          Stormhour’s storm chances are statistical guidance from past radar and reanalysis data, not official
          warnings: follow the national weather service and local authorities. Lightning can strike far from a
          storm — when thunder is heard, go to a building or a closed vehicle. Farm advice defers to product
          labels and licensed local advice.
        </footer>
      </Content>
    </>
  );
}
