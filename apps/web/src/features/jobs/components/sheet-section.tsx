import { useId, type ReactNode } from 'react';

/**
 * One part of the job sheet: a card whose heading opens and closes it, so an engineer can fold away
 * what is done. Native details/summary: no hover, a large tap target, and it works without script.
 */
export function SheetSection({
  title,
  summary,
  children,
  defaultOpen = true,
}: {
  title: string;
  summary?: ReactNode;
  children: ReactNode;
  defaultOpen?: boolean;
}) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="rounded-xl border border-line bg-card shadow-sm">
      <details open={defaultOpen} className="group">
        <summary className="flex min-h-14 cursor-pointer list-none items-center justify-between gap-3 px-4 py-2 sm:px-6 [&::-webkit-details-marker]:hidden">
          <span className="min-w-0">
            <h2 id={id} className="text-lg font-bold text-brand-900">
              {title}
            </h2>
            {summary ? <span className="block text-sm text-ink-muted">{summary}</span> : null}
          </span>
          <span
            aria-hidden="true"
            className="shrink-0 text-2xl leading-none text-brand-700 transition-transform group-open:rotate-180"
          >
            ⌄
          </span>
        </summary>
        <div className="space-y-4 px-4 pb-4 sm:px-6 sm:pb-6">{children}</div>
      </details>
    </section>
  );
}
