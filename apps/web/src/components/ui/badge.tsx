import type { ReactNode } from 'react';

export type BadgeTone = 'neutral' | 'ok' | 'warn' | 'danger';

const tones: Record<BadgeTone, string> = {
  neutral: 'bg-brand-50 text-brand-800',
  ok: 'bg-ok-50 text-ok-700',
  warn: 'bg-ember-100 text-ember-700',
  danger: 'bg-danger-50 text-danger-700',
};

export function Badge({ tone, children }: { tone: BadgeTone; children: ReactNode }) {
  return (
    <span className={`inline-block rounded-full px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${tones[tone]}`}>
      {children}
    </span>
  );
}
