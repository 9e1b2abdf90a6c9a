import type { ReactNode } from 'react';

type Tone = 'error' | 'success' | 'info';

const tones: Record<Tone, string> = {
  error: 'border-danger-700 bg-danger-50 text-danger-700',
  success: 'border-ok-700 bg-ok-50 text-ok-700',
  info: 'border-brand-600 bg-brand-50 text-brand-800',
};

export function Alert({ tone, title, children }: { tone: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border-l-4 px-4 py-3 ${tones[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={title ? 'mt-1 text-ink' : 'font-semibold'}>{children}</div> : null}
    </div>
  );
}
