import { Button, InlineNotification } from '@carbon/react';
import { isRouteErrorResponse, useRouteError } from 'react-router';

/** Last resort for an error no region caught, e.g. a page's code failing to download. */
export function RouteErrorPage() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <main className="app-content" role="alert">
      <InlineNotification
        kind="error"
        lowContrast
        hideCloseButton
        title="Stormhour could not show this page."
        subtitle={message}
      />
      <Button kind="tertiary" size="sm" onClick={() => window.location.reload()}>
        Reload the page
      </Button>
    </main>
  );
}
