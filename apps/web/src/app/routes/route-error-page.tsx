import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { NotFoundPage } from '@/app/routes/not-found-page';

function isStaleChunk(error: unknown): boolean {
  return (
    error instanceof TypeError && /dynamically imported module|Importing a module script failed/i.test(error.message)
  );
}

export function RouteErrorPage() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundPage />;
  // After a new release the old page's code files are gone; reloading fetches the new ones.
  const message = isStaleChunk(error)
    ? 'Heatfleet has been updated. Reload to carry on.'
    : 'Something went wrong on this screen. Reloading usually helps; if not, tell whoever looks after Heatfleet.';
  return (
    <main id="main" role="alert" className="mx-auto max-w-md space-y-4 px-4 py-16 text-center">
      <h1 className="text-2xl font-bold text-brand-900">This screen stopped working</h1>
      <p className="text-ink-muted">{message}</p>
      <Button onClick={() => window.location.reload()}>Reload</Button>
    </main>
  );
}
