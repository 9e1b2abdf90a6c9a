import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Wordmark } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';

interface PublicLayoutProps {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}

export function PublicLayout({ title, intro, children, footer }: PublicLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="bg-brand-900 px-4 py-3">
        <Link
          to={paths.home.getHref()}
          className="inline-flex min-h-12 items-center rounded-md"
          aria-label="Heatfleet home"
        >
          <Wordmark />
        </Link>
      </header>
      <main id="main" className="flex flex-1 justify-center px-4 py-8 sm:py-12">
        <div className="w-full max-w-md">
          <div className="rounded-xl border border-line bg-card p-5 shadow-sm sm:p-8">
            <h1 className="text-2xl font-bold text-brand-900">{title}</h1>
            {intro ? <div className="mt-2 text-ink-muted">{intro}</div> : null}
            <div className="mt-6">{children}</div>
          </div>
          {footer ? <div className="mt-6 space-y-2 text-center">{footer}</div> : null}
        </div>
      </main>
    </div>
  );
}

export function FooterLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link to={to} className="inline-block py-2 font-semibold text-brand-700 underline-offset-4 hover:underline">
      {children}
    </Link>
  );
}
