import { Link } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';
import { paths } from '@/config/paths';

export function NotFoundPage() {
  return (
    <main id="main" className="mx-auto max-w-md space-y-4 px-4 py-16 text-center">
      <h1 className="text-2xl font-bold text-brand-900">There is nothing at this address</h1>
      <p className="text-ink-muted">The link may be mistyped, or the page has moved.</p>
      <Link to={paths.home.getHref()} className={buttonClasses('primary')}>
        Go to Heatfleet home
      </Link>
    </main>
  );
}
