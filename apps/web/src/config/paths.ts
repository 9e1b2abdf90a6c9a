/** Every client URL in one place; e-mails from the API link to `invitation`, `signUpConfirm` and `resetPasswordConfirm`. */
export const paths = {
  home: { path: '/', getHref: () => '/' },
  signIn: {
    path: '/sign-in',
    getHref: (next?: string) => (next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  signUp: { path: '/sign-up', getHref: () => '/sign-up' },
  /** The link in the sign-up e-mail (the API builds the same URL). */
  signUpConfirm: {
    path: '/sign-up/confirm/:token',
    getHref: (token: string) => `/sign-up/confirm/${encodeURIComponent(token)}`,
  },
  resetPassword: { path: '/reset-password', getHref: () => '/reset-password' },
  resetPasswordConfirm: {
    path: '/reset-password/:token',
    getHref: (token: string) => `/reset-password/${encodeURIComponent(token)}`,
  },
  invitation: { path: '/invitations/:token', getHref: (token: string) => `/invitations/${encodeURIComponent(token)}` },
  unsubscribe: {
    path: '/unsubscribe/:token',
    getHref: (token: string) => `/unsubscribe/${encodeURIComponent(token)}`,
  },
  team: { path: '/team', getHref: () => '/team' },
  vans: { path: '/vans', getHref: () => '/vans' },
  van: { path: '/vans/:id', getHref: (id: number) => `/vans/${id}` },
  myVan: { path: '/my-van', getHref: () => '/my-van' },
  kits: { path: '/kits', getHref: () => '/kits' },
  kit: { path: '/kits/:id', getHref: (id: number) => `/kits/${id}` },
  /** Printed into every QR label (the API builds the same URL), so it must never move. */
  kitItem: { path: '/kit-items/:id', getHref: (id: number) => `/kit-items/${id}` },
  labels: {
    path: '/labels',
    getHref: (of: { kitId: number } | { ids: number[] }) =>
      'kitId' in of ? `/labels?kitId=${of.kitId}` : `/labels?ids=${of.ids.join(',')}`,
  },
  reminders: { path: '/reminders', getHref: () => '/reminders' },
  vibration: { path: '/vibration', getHref: () => '/vibration' },
  stock: { path: '/stock', getHref: () => '/stock' },
  products: { path: '/stock/products', getHref: () => '/stock/products' },
  product: { path: '/stock/products/:id', getHref: (id: number) => `/stock/products/${id}` },
  stockLedger: { path: '/stock/ledger', getHref: () => '/stock/ledger' },
  stockReceive: { path: '/stock/receive', getHref: () => '/stock/receive' },
  stockTransfer: { path: '/stock/transfer', getHref: () => '/stock/transfer' },
  stockUse: { path: '/stock/use', getHref: () => '/stock/use' },
  stockStocktake: { path: '/stock/stocktake', getHref: () => '/stock/stocktake' },
  stockWriteOff: { path: '/stock/write-off', getHref: () => '/stock/write-off' },
  restockRun: { path: '/stock/restock-run', getHref: () => '/stock/restock-run' },
  reorderList: { path: '/stock/reorder-list', getHref: () => '/stock/reorder-list' },
  settings: { path: '/settings', getHref: () => '/settings' },
  /** The payment service's onboarding returns here (the API builds the same URL). */
  paymentSettings: { path: '/settings/payments', getHref: () => '/settings/payments' },
  /** The customer's pay link in the invoice e-mail and the doorstep QR code (the API builds the same URL). */
  /** The customer's quote link (modules/money quote e-mail): public, no sign-in. */
  money: { path: '/money', getHref: () => '/money' },
  /** Settings, Prices: VAT, terms, reminders and the price list (issue 15). */
  prices: { path: '/settings/prices', getHref: () => '/settings/prices' },
  invoice: { path: '/invoices/:id', getHref: (id: number) => `/invoices/${id}` },
  quoteLink: { path: '/q/:token', getHref: (token: string) => `/q/${encodeURIComponent(token)}` },
  pay: { path: '/pay/:token', getHref: (token: string) => `/pay/${encodeURIComponent(token)}` },
  invoicePayment: { path: '/invoices/:id/payment', getHref: (id: number) => `/invoices/${id}/payment` },
  /** The payment service's card page returns here (the API builds the same URL). */
  billing: { path: '/billing', getHref: () => '/billing' },
  jobs: { path: '/jobs', getHref: () => '/jobs' },
  newJob: { path: '/jobs/new', getHref: () => '/jobs/new' },
  job: { path: '/jobs/:id', getHref: (id: number) => `/jobs/${id}` },
  editJob: { path: '/jobs/:id/edit', getHref: (id: number) => `/jobs/${id}/edit` },
  customers: { path: '/customers', getHref: () => '/customers' },
  site: { path: '/sites/:id', getHref: (id: number) => `/sites/${id}` },
  account: { path: '/account', getHref: () => '/account' },
  outbox: { path: '/outbox', getHref: () => '/outbox' },
  outboxMessage: { path: '/outbox/:id', getHref: (id: string) => `/outbox/${encodeURIComponent(id)}` },
} as const;

/** Only same-site paths are followed after sign-in, so a crafted link cannot send someone elsewhere. */
export function safeNextPath(next: string | null): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return paths.home.getHref();
  return next;
}
