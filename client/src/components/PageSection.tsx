import { type ReactNode, useId } from 'react';
import { RegionBoundary } from './RegionBoundary';

/** A titled part of a page whose failure is contained: the rest of the page keeps working. */
export function PageSection({
  title,
  region,
  children,
}: {
  title: string;
  region: string;
  children: ReactNode;
}) {
  const id = useId();
  return (
    <section aria-labelledby={id}>
      <h2 id={id} className="section-title">
        {title}
      </h2>
      <RegionBoundary region={region}>{children}</RegionBoundary>
    </section>
  );
}
