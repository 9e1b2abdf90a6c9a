import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { PageSpinner } from '@/components/ui/page-spinner';
import { paths } from '@/config/paths';
import { startBootReads, startHomeReads } from '@/app/early-data';
import { NotFoundPage } from '@/app/routes/not-found-page';
import { RouteErrorPage } from '@/app/routes/route-error-page';

startBootReads();

// Pages load on demand so the first download stays the router and the data layer; the signed-in shell (AppLayout)
// is a chunk of its own, so the sign-in page never waits for it.
const appLayout = () => import('@/app/routes/app-layout');

export const router = createBrowserRouter([
  {
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageSpinner />,
    children: [
      {
        path: paths.signIn.path,
        lazy: () => import('@/app/routes/auth/sign-in-page').then((m) => ({ Component: m.SignInPage })),
      },
      {
        path: paths.signUp.path,
        lazy: () => import('@/app/routes/auth/sign-up-page').then((m) => ({ Component: m.SignUpPage })),
      },
      {
        path: paths.signUpConfirm.path,
        lazy: () => import('@/app/routes/auth/confirm-sign-up-page').then((m) => ({ Component: m.ConfirmSignUpPage })),
      },
      {
        path: paths.resetPassword.path,
        lazy: () => import('@/app/routes/auth/reset-password-page').then((m) => ({ Component: m.ResetPasswordPage })),
      },
      {
        path: paths.resetPasswordConfirm.path,
        lazy: () =>
          import('@/app/routes/auth/choose-new-password-page').then((m) => ({ Component: m.ChooseNewPasswordPage })),
      },
      {
        path: paths.invitation.path,
        lazy: () =>
          import('@/app/routes/invitations/accept-invitation-page').then((m) => ({
            Component: m.AcceptInvitationPage,
          })),
      },
      {
        path: paths.quoteLink.path,
        lazy: () => import('@/app/routes/money/quote-link-page').then((m) => ({ Component: m.QuoteLinkPage })),
      },
      {
        path: paths.pay.path,
        lazy: () => import('@/app/routes/payments/pay-page').then((m) => ({ Component: m.PayPage })),
      },
      {
        path: paths.unsubscribe.path,
        lazy: () => import('@/app/routes/unsubscribe/unsubscribe-page').then((m) => ({ Component: m.UnsubscribePage })),
      },
      {
        lazy: () => appLayout().then((m) => ({ Component: m.AppLayout })),
        children: [
          {
            index: true,
            lazy: () => {
              startHomeReads();
              return import('@/app/routes/home/home-page').then((m) => ({ Component: m.HomePage }));
            },
          },
          {
            path: paths.team.path,
            lazy: () => import('@/app/routes/team/team-page').then((m) => ({ Component: m.TeamPage })),
          },
          {
            path: paths.vans.path,
            lazy: () => import('@/app/routes/vans/vans-page').then((m) => ({ Component: m.VansPage })),
          },
          {
            path: paths.van.path,
            lazy: () => import('@/app/routes/vans/van-page').then((m) => ({ Component: m.VanPage })),
          },
          {
            path: paths.myVan.path,
            lazy: () => import('@/app/routes/vans/my-van-page').then((m) => ({ Component: m.MyVanPage })),
          },
          {
            path: paths.kits.path,
            lazy: () => import('@/app/routes/kits/kits-page').then((m) => ({ Component: m.KitsPage })),
          },
          {
            path: paths.kit.path,
            lazy: () => import('@/app/routes/kits/kit-page').then((m) => ({ Component: m.KitPage })),
          },
          {
            path: paths.kitItem.path,
            lazy: () => import('@/app/routes/kits/kit-item-page').then((m) => ({ Component: m.KitItemPage })),
          },
          {
            path: paths.labels.path,
            lazy: () => import('@/app/routes/labels/labels-page').then((m) => ({ Component: m.LabelsPage })),
          },
          {
            path: paths.reminders.path,
            lazy: () => import('@/app/routes/reminders/reminders-page').then((m) => ({ Component: m.RemindersPage })),
          },
          {
            path: paths.vibration.path,
            lazy: () => import('@/app/routes/vibration/vibration-page').then((m) => ({ Component: m.VibrationPage })),
          },
          {
            path: paths.jobs.path,
            lazy: () => import('@/app/routes/jobs/jobs-page').then((m) => ({ Component: m.JobsPage })),
          },
          {
            path: paths.newJob.path,
            lazy: () => import('@/app/routes/jobs/new-job-page').then((m) => ({ Component: m.NewJobPage })),
          },
          {
            path: paths.job.path,
            lazy: () => import('@/app/routes/jobs/job-page').then((m) => ({ Component: m.JobPage })),
          },
          {
            path: paths.editJob.path,
            lazy: () => import('@/app/routes/jobs/edit-job-page').then((m) => ({ Component: m.EditJobPage })),
          },
          {
            path: paths.account.path,
            lazy: () => import('@/app/routes/account/account-page').then((m) => ({ Component: m.AccountPage })),
          },
          {
            path: paths.customers.path,
            lazy: () => import('@/app/routes/customers/customers-page').then((m) => ({ Component: m.CustomersPage })),
          },
          {
            path: paths.site.path,
            lazy: () => import('@/app/routes/sites/site-page').then((m) => ({ Component: m.SitePage })),
          },
          {
            path: paths.paymentSettings.path,
            lazy: () =>
              import('@/app/routes/payments/payment-settings-page').then((m) => ({ Component: m.PaymentSettingsPage })),
          },
          {
            path: paths.invoicePayment.path,
            lazy: () =>
              import('@/app/routes/payments/invoice-payment-page').then((m) => ({ Component: m.InvoicePaymentPage })),
          },
          {
            path: paths.money.path,
            lazy: () => import('@/app/routes/money/money-page').then((m) => ({ Component: m.MoneyPage })),
          },
          {
            path: paths.prices.path,
            lazy: () => import('@/app/routes/money/prices-page').then((m) => ({ Component: m.PricesPage })),
          },
          {
            path: paths.invoice.path,
            lazy: () => import('@/app/routes/money/invoice-page').then((m) => ({ Component: m.InvoicePage })),
          },
          {
            path: paths.billing.path,
            lazy: () => import('@/app/routes/billing/billing-page').then((m) => ({ Component: m.BillingPage })),
          },
          {
            path: paths.settings.path,
            lazy: () => import('@/app/routes/settings/settings-page').then((m) => ({ Component: m.SettingsPage })),
          },
          {
            path: paths.stock.path,
            lazy: () => import('@/app/routes/stock/stock-page').then((m) => ({ Component: m.StockPage })),
          },
          {
            path: paths.products.path,
            lazy: () => import('@/app/routes/stock/products-page').then((m) => ({ Component: m.ProductsPage })),
          },
          {
            path: paths.product.path,
            lazy: () => import('@/app/routes/stock/product-page').then((m) => ({ Component: m.ProductPage })),
          },
          {
            path: paths.stockLedger.path,
            lazy: () => import('@/app/routes/stock/ledger-page').then((m) => ({ Component: m.LedgerPage })),
          },
          {
            path: paths.stockReceive.path,
            lazy: () => import('@/app/routes/stock/stock-form-pages').then((m) => ({ Component: m.ReceivePage })),
          },
          {
            path: paths.stockTransfer.path,
            lazy: () => import('@/app/routes/stock/stock-form-pages').then((m) => ({ Component: m.TransferPage })),
          },
          {
            path: paths.stockUse.path,
            lazy: () => import('@/app/routes/stock/stock-form-pages').then((m) => ({ Component: m.UsePage })),
          },
          {
            path: paths.stockStocktake.path,
            lazy: () => import('@/app/routes/stock/stock-form-pages').then((m) => ({ Component: m.StocktakePage })),
          },
          {
            path: paths.stockWriteOff.path,
            lazy: () => import('@/app/routes/stock/stock-form-pages').then((m) => ({ Component: m.WriteOffPage })),
          },
          {
            path: paths.restockRun.path,
            lazy: () => import('@/app/routes/stock/restock-run-page').then((m) => ({ Component: m.RestockRunPage })),
          },
          {
            path: paths.reorderList.path,
            lazy: () => import('@/app/routes/stock/reorder-list-page').then((m) => ({ Component: m.ReorderListPage })),
          },
        ],
      },
      {
        lazy: () => appLayout().then((m) => ({ Component: m.OutboxLayout })),
        children: [
          {
            path: paths.outbox.path,
            lazy: () => import('@/app/routes/outbox/outbox-page').then((m) => ({ Component: m.OutboxPage })),
          },
          {
            path: paths.outboxMessage.path,
            lazy: () =>
              import('@/app/routes/outbox/outbox-message-page').then((m) => ({ Component: m.OutboxMessagePage })),
          },
        ],
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);

/** Resolves once the first route's lazy chunk has loaded, so the first render is the page, not the fallback. */
export function routerReady(): Promise<void> {
  if (router.state.initialized) return Promise.resolve();
  return new Promise((resolve) => {
    const stop = router.subscribe((state) => {
      if (!state.initialized) return;
      stop();
      resolve();
    });
  });
}

export function AppRouter() {
  return <RouterProvider router={router} />;
}
