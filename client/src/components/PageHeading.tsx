import type { ReactNode } from 'react';

export function PageHeading({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <header>
      <h1 className="page-title">{title}</h1>
      {children ? <p className="page-lead">{children}</p> : null}
    </header>
  );
}
