import { renderToString } from 'react-dom/server';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { SignInPage } from '@/app/routes/auth/sign-in-page';
import { paths } from '@/config/paths';

// Run at build time only (vite.config.ts, `prerenderSignIn`): the sign-in page's markup, put into a copy of
// index.html that the API serves at /sign-in. The page paints from the HTML and the stylesheet alone, before
// any script has loaded; main.tsx then hydrates it, so what was typed meanwhile stays in the fields (issue 16:
// the sign-in page free of the app shell's weight).
export function renderSignInPage(): string {
  const client = new QueryClient();
  try {
    return renderToString(
      <QueryClientProvider client={client}>
        <MemoryRouter initialEntries={[paths.signIn.getHref()]}>
          <SignInPage />
        </MemoryRouter>
      </QueryClientProvider>,
    );
  } finally {
    // The queries the page asked for would otherwise hold the build open until their garbage-collection timers end.
    client.clear();
  }
}
