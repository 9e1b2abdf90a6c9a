import type { ReactNode } from 'react';

export function Card({
  title,
  description,
  children,
  headingLevel = 2,
}: {
  title?: string;
  description?: ReactNode;
  children: ReactNode;
  headingLevel?: 2 | 3;
}) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className="rounded-xl border border-line bg-card p-4 shadow-sm sm:p-6">
      {title ? <Heading className="text-lg font-bold text-brand-900">{title}</Heading> : null}
      {description ? <div className="mt-1 text-ink-muted">{description}</div> : null}
      <div className={title || description ? 'mt-4' : ''}>{children}</div>
    </section>
  );
}
