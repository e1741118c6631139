import { SECTION_ROLES, type Section } from '@stormhour/shared';
import type { ReactNode } from 'react';
import { useSessionUser } from '../lib/auth';
import { NoAccessPage } from './routes/NoAccessPage';

/**
 * Shows a section only to the roles that may open it. The server enforces the same table; this
 * only spares people a screen full of refusals.
 */
export function RequireSection({ section, children }: { section: Section; children: ReactNode }) {
  const user = useSessionUser();
  if (!SECTION_ROLES[section].includes(user.role)) return <NoAccessPage section={section} />;
  return children;
}
