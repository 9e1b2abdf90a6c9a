export function PageSpinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center justify-center gap-3 py-16 text-ink-muted">
      <span
        aria-hidden="true"
        className="size-6 animate-spin rounded-full border-3 border-brand-600 border-t-transparent"
      />
      <span>{label}</span>
    </div>
  );
}
