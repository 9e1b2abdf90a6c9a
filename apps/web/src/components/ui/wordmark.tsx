/** The Heatfleet wordmark is plain text so it stays crisp, translatable by screen readers and tiny to ship. */
export function Wordmark({ tone = 'light' }: { tone?: 'light' | 'dark' }) {
  return (
    <span className={`text-xl font-bold tracking-tight ${tone === 'light' ? 'text-white' : 'text-brand-900'}`}>
      <span className={tone === 'light' ? 'text-ember-400' : 'text-ember-700'}>Heat</span>fleet
    </span>
  );
}
