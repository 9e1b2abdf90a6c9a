import type { ReactNode } from 'react';

export function PageHeader({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <header className="mb-5 space-y-1">
      <h1 className="text-2xl font-bold text-brand-900 sm:text-3xl">{title}</h1>
      {children ? <div className="text-ink-muted">{children}</div> : null}
    </header>
  );
}
