import { Loading } from '@carbon/react';
import { Navigate, Outlet, useLocation } from 'react-router';
import { paths } from '../config/paths';
import { useAuth } from '../lib/auth';

/** Sends anyone without a session to sign-in, remembering where they were going. */
export function RequireSession() {
  const { user, restoring } = useAuth();
  const location = useLocation();
  if (restoring) return <Loading description="Restoring your session" withOverlay={false} />;
  if (!user) return <Navigate to={paths.signIn} replace state={{ from: location.pathname }} />;
  return <Outlet />;
}
