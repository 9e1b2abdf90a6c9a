import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { PageSpinner } from '@/components/ui/page-spinner';
import { paths } from '@/config/paths';
import { AppLayout, OutboxLayout } from '@/app/routes/app-layout';
import { NotFoundPage } from '@/app/routes/not-found-page';
import { RouteErrorPage } from '@/app/routes/route-error-page';

// Pages load on demand so the first download stays the shell, the router and the data layer.
export const router = createBrowserRouter([
  {
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageSpinner />,
    children: [
      { path: paths.signIn.path, lazy: () => import('@/app/routes/auth/sign-in-page').then((m) => ({ Component: m.SignInPage })) },
      { path: paths.signUp.path, lazy: () => import('@/app/routes/auth/sign-up-page').then((m) => ({ Component: m.SignUpPage })) },
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
          import('@/app/routes/invitations/accept-invitation-page').then((m) => ({ Component: m.AcceptInvitationPage })),
      },
      {
        element: <AppLayout />,
        children: [
          { index: true, lazy: () => import('@/app/routes/home/home-page').then((m) => ({ Component: m.HomePage })) },
          { path: paths.team.path, lazy: () => import('@/app/routes/team/team-page').then((m) => ({ Component: m.TeamPage })) },
        ],
      },
      {
        element: <OutboxLayout />,
        children: [
          { path: paths.outbox.path, lazy: () => import('@/app/routes/outbox/outbox-page').then((m) => ({ Component: m.OutboxPage })) },
          {
            path: paths.outboxMessage.path,
            lazy: () => import('@/app/routes/outbox/outbox-message-page').then((m) => ({ Component: m.OutboxMessagePage })),
          },
        ],
      },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
