import { Navigate } from 'react-router';
import { useSessionUser } from '../lib/auth';
import { landingPathFor } from '../lib/landing';

export function HomeRedirect() {
  const user = useSessionUser();
  return <Navigate to={landingPathFor(user.role)} replace />;
}
