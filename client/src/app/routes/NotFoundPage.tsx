import { Link } from '@carbon/react';
import { Link as RouterLink } from 'react-router';
import { paths } from '../../config/paths';

export default function NotFoundPage() {
  return (
    <section aria-labelledby="not-found-title">
      <h1 id="not-found-title" className="page-title">
        Page not found
      </h1>
      <p className="page-lead">
        There is no page at this address. It may have moved, or the link may be mistyped.
      </p>
      <Link as={RouterLink} to={paths.home}>
        Go to your start page
      </Link>
    </section>
  );
}
