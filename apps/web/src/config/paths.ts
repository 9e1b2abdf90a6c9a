/** Every client URL in one place; e-mails from the API link to `invitation` and `resetPasswordConfirm`. */
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  signUp: { path: '/sign-up', getHref: () => '/sign-up' },
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  resetPasswordConfirm: {
    path: '/reset-password/:token',
    getHref: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  },
  invitation: { path: '/invitations/:token', getHref: (token: string) => `/invitations/${encodeURIComponent(token)}` },
  team: { path: '/team', getHref: () => '/team' },
  outbox: { path: '/outbox', getHref: () => '/outbox' },
  outboxMessage: { path: '/outbox/:id', getHref: (id: string) => `/outbox/${encodeURIComponent(id)}` },
} as const;

/** Only same-site paths are followed after sign-in, so a crafted link cannot send someone elsewhere. */
export function safeNextPath(next: string | null): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.home.getHref();
  return next;
}
