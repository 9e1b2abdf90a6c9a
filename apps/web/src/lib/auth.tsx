import { createContext, useContext, type ReactNode } from 'react';
import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { Navigate, useLocation } from 'react-router-dom';
import { meEnvelopeSchema, type Me, type SessionEnvelope } from '@heatfleet/domain';
import { apiClient, isApiError, setCsrfToken } from '@/lib/api-client';
import { paths, safeNextPath } from '@/config/paths';
import { forgetPerson, moveToFirm } from '@/lib/offline/start-offline';
import { PageSpinner } from '@/components/ui/page-spinner';
import { QueryErrorNotice } from '@/components/ui/query-error-notice';

// The answers' shapes are the domain's: `{ me }`, and `{ me, csrfToken }` for whatever starts a session.
export { meEnvelopeSchema, sessionEnvelopeSchema, type SessionEnvelope } from '@heatfleet/domain';

async function fetchMe(): Promise<Me | null> {
  try {
    return (await apiClient.get('/api/me', meEnvelopeSchema)).me;
  } catch (error) {
    // Being signed out is a state of the app, not a failure.
    if (isApiError(error, 401)) return null;
    throw error;
  }
}

export const sessionQueries = {
  all: () => ['session'] as const,
  me: () =>
    queryOptions({
      queryKey: [...sessionQueries.all(), 'me'] as const,
      queryFn: fetchMe,
      meta: { session: true },
      staleTime: 5 * 60_000,
    }),
};

function isSessionQuery(query: { meta?: { session?: boolean } | undefined }): boolean {
  return query.meta?.session === true;
}

export function startSession(client: QueryClient, { me, csrfToken }: SessionEnvelope): void {
  setCsrfToken(csrfToken);
  // Nothing cached for the previous person or firm may show to this one.
  client.removeQueries({ predicate: (query) => !isSessionQuery(query) });
  client.setQueryData(sessionQueries.me().queryKey, me);
}

/** Same person, same firm, new session id (after a password change): nothing cached needs to go. */
export function renewSession(client: QueryClient, { me, csrfToken }: SessionEnvelope): void {
  setCsrfToken(csrfToken);
  client.setQueryData(sessionQueries.me().queryKey, me);
}

export function endSession(client: QueryClient): void {
  setCsrfToken(null);
  // Signing out wipes this person's data on the phone (README, Working offline).
  void forgetPerson();
  client.clear();
  client.setQueryData(sessionQueries.me().queryKey, null);
}

export function changeActiveFirm(client: QueryClient, me: Me): void {
  moveToFirm(me);
  client.setQueryData(sessionQueries.me().queryKey, me);
  // Reset rather than invalidate: stale rows of the previous firm must not flash under the new firm's name.
  void client.resetQueries({ predicate: (query) => !isSessionQuery(query) });
}

// The person <RequireSession> let in. Read from here rather than from the query, so a screen still
// mounted in the moment between sign-out clearing the query and the redirect never sees nobody.
const SignedInMeContext = createContext<Me | null>(null);

/** For screens inside <RequireSession>: the signed-in person, always present. */
export function useSignedInMe(): Me {
  const me = useContext(SignedInMeContext);
  if (!me) throw new Error('useSignedInMe is used outside <RequireSession>.');
  return me;
}

export function RequireSession({ children }: { children: (me: Me) => ReactNode }) {
  const location = useLocation();
  const me = useQuery(sessionQueries.me());
  if (me.isPending) return <PageSpinner />;
  // With no signal the last answer (kept on the phone) stands: a failed refresh is not a sign-out.
  if (me.data) return <SignedInMeContext.Provider value={me.data}>{children(me.data)}</SignedInMeContext.Provider>;
  if (me.isError) return <QueryErrorNotice error={me.error} onRetry={() => void me.refetch()} />;
  return <Navigate to={paths.signIn.getHref(location.pathname + location.search)} replace />;
}

export function RedirectIfSignedIn({ children }: { children: ReactNode }) {
  const location = useLocation();
  const me = useQuery(sessionQueries.me());
  if (me.isPending) return <PageSpinner />;
  if (me.data) return <Navigate to={safeNextPath(new URLSearchParams(location.search).get('next'))} replace />;
  // An unreachable API must not lock people out of the sign-in form; the form shows its own errors.
  return children;
}
