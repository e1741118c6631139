import { Button, InlineNotification } from '@carbon/react';
import { QueryErrorResetBoundary } from '@tanstack/react-query';
import { Component, type ErrorInfo, type ReactNode } from 'react';
import { messageOf } from '../lib/apiError';

interface BoundaryProps {
  children: ReactNode;
  /** What this region shows, for the message ("the blocks table"). */
  region: string;
  onReset: () => void;
}

interface BoundaryState {
  error: unknown;
}

class Boundary extends Component<BoundaryProps, BoundaryState> {
  override state: BoundaryState = { error: null };

  static getDerivedStateFromError(error: unknown): BoundaryState {
    return { error };
  }

  override componentDidCatch(error: unknown, info: ErrorInfo): void {
    console.error(`Stormhour: ${this.props.region} failed`, error, info.componentStack);
  }

  private retry = () => {
    this.props.onReset();
    this.setState({ error: null });
  };

  override render() {
    if (this.state.error === null) return this.props.children;
    return (
      <div className="region-error" role="alert">
        <InlineNotification
          kind="error"
          lowContrast
          hideCloseButton
          title={`Could not show ${this.props.region}.`}
          subtitle={messageOf(this.state.error)}
        />
        <Button kind="tertiary" size="sm" onClick={this.retry}>
          Try again
        </Button>
      </div>
    );
  }
}

/** Keeps a failure inside one region of the page, with a readable message and a retry. */
export function RegionBoundary({ region, children }: { region: string; children: ReactNode }) {
  return (
    <QueryErrorResetBoundary>
      {({ reset }) => (
        <Boundary region={region} onReset={reset}>
          {children}
        </Boundary>
      )}
    </QueryErrorResetBoundary>
  );
}
