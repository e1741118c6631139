import { Link } from '@carbon/react';
import { ROLE_LABELS, type Section } from '@stormhour/shared';
import { Link as RouterLink } from 'react-router';
import { SECTION_NAMES } from '../../config/paths';
import { useSessionUser } from '../../lib/auth';
import { landingPathFor } from '../../lib/landing';

export function NoAccessPage({ section }: { section: Section }) {
  const user = useSessionUser();
  return (
    <section aria-labelledby="no-access-title">
      <h1 id="no-access-title" className="page-title">
        You don't have access to this section
      </h1>
      <p className="page-lead">
        {SECTION_NAMES[section]} is not part of the {ROLE_LABELS[user.role].toLowerCase()} role. If your work
        needs it, ask an administrator to change your role.
      </p>
      <Link as={RouterLink} to={landingPathFor(user.role)}>
        Go to your start page
      </Link>
    </section>
  );
}
