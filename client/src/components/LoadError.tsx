import { Button, InlineNotification } from '@carbon/react';
import { messageOf } from '../lib/apiError';

/** A failed load, said plainly, with a way to try again. */
export function LoadError({ what, error, onRetry }: { what: string; error: unknown; onRetry: () => void }) {
  return (
    <div className="region-error">
      <InlineNotification
        kind="error"
        lowContrast
        hideCloseButton
        title={`Could not load ${what}.`}
        subtitle={messageOf(error)}
      />
      <Button kind="tertiary" size="sm" onClick={onRetry}>
        Try again
      </Button>
    </div>
  );
}
