import { Tag } from '@carbon/react';
import type { ReactNode } from 'react';

/** A section that is routed and guarded but not built yet; says what it will hold and nothing more. */
export function PlaceholderPage({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-labelledby="placeholder-title">
      <h1 id="placeholder-title" className="page-title">
        {title}
      </h1>
      <p className="page-lead">{children}</p>
      <Tag type="cool-gray">Not available yet</Tag>
    </section>
  );
}
