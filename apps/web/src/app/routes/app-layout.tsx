import { Suspense, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import type { Me } from '@heatfleet/domain';
import { OfflineStatus } from '@/components/offline/offline-status';
import { Button } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/page-spinner';
import { Wordmark } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';
import { Can, MemberAbilityProvider, useAbility } from '@/lib/ability';
import { outboxWrites } from '@/lib/offline/outbox';
import { changesText } from '@/lib/offline/outbox-actions';
import { sendOutbox } from '@/lib/offline/outbox-sender';
import { RequireSession, sessionQueries } from '@/lib/auth';
import { useSignOut } from '@/features/auth/api/use-sign-out';
import { ReadOnlyBanner } from '@/features/billing/components/read-only-banner';
import { FirmSwitcher } from '@/features/firms/components/firm-switcher';
import { outboxQueries } from '@/features/outbox/api/outbox-queries';
import { vanQueries } from '@/features/vans/api/van-queries';

function useOutboxIsAvailable(): boolean {
  // In production the API answers 404 here, so the Outbox only appears where a mail catcher runs.
  const probe = useQuery({ ...outboxQueries.list(), enabled: !import.meta.env.DEV, staleTime: 5 * 60_000 });
  return import.meta.env.DEV || probe.isSuccess;
}

const navLinkClass = ({ isActive }: { isActive: boolean }) =>
  `inline-flex min-h-12 items-center border-b-4 px-3 font-semibold ${
    isActive ? 'border-ember-500 text-white' : 'border-transparent text-brand-100 hover:text-white'
  }`;

function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only rounded-md bg-card px-4 py-2 font-semibold text-brand-900 focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-10 focus:px-4 focus:py-2"
    >
      Skip to content
    </a>
  );
}

/**
 * Signing out wipes this person's data on the phone, so what is waiting is sent first; anything that cannot go
 * (no signal, refused, or for another firm) is named, and only dropped if the engineer says so.
 */
function SignOutButton() {
  const navigate = useNavigate();
  const signOut = useSignOut();
  const [sending, setSending] = useState(false);
  const [unsent, setUnsent] = useState<number | null>(null);
  const finish = () =>
    signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn.getHref(), { replace: true }) });
  const start = async () => {
    if (outboxWrites().length > 0) {
      setSending(true);
      await sendOutbox();
      setSending(false);
    }
    const left = outboxWrites().length;
    if (left > 0) setUnsent(left);
    else finish();
  };
  return (
    <>
      <button
        type="button"
        disabled={signOut.isPending || sending}
        onClick={() => void start()}
        className="min-h-12 shrink-0 rounded-md border border-brand-600 px-3 font-semibold text-white hover:bg-brand-800 disabled:opacity-60"
      >
        {sending ? 'Sending…' : 'Sign out'}
      </button>
      {unsent !== null ? (
        <div
          role="alertdialog"
          aria-labelledby="unsent-title"
          className="fixed inset-x-0 top-0 z-20 bg-card p-4 text-ink shadow-lg"
        >
          <div className="mx-auto max-w-5xl space-y-3">
            <p id="unsent-title" className="font-semibold">
              {changesText(unsent)} {unsent === 1 ? 'has' : 'have'} not reached the server. Signing out deletes{' '}
              {unsent === 1 ? 'it' : 'them'} from this phone.
            </p>
            <div className="flex flex-col gap-2 sm:flex-row">
              <Button onClick={() => setUnsent(null)}>Stay signed in</Button>
              <Button variant="danger" busy={signOut.isPending} onClick={finish}>
                Sign out and delete {unsent === 1 ? 'it' : 'them'}
              </Button>
            </div>
            {signOut.isError ? (
              <p role="alert" className="text-danger-700">
                {signOut.error.message}
              </p>
            ) : null}
          </div>
        </div>
      ) : null}
    </>
  );
}

function useHasOwnVan(): boolean {
  // Anyone may be given a van (an owner who still does jobs), so ask rather than go by role.
  const mine = useQuery({ ...vanQueries.mine(), staleTime: 5 * 60_000 });
  return Boolean(mine.data?.van);
}

function NavItem({ to, children, end = false }: { to: string; children: string; end?: boolean }) {
  return (
    <li>
      <NavLink to={to} end={end} className={navLinkClass}>
        {children}
      </NavLink>
    </li>
  );
}

function SignedInHeader({ me }: { me: Me }) {
  const showOutbox = useOutboxIsAvailable();
  const hasOwnVan = useHasOwnVan();
  const ability = useAbility();
  const showSettings = ability.can('update', 'ItemKind') || ability.can('update', 'ReminderSettings');
  return (
    <header className="bg-brand-900 text-white print:hidden">
      <div className="mx-auto max-w-5xl px-4">
        <div className="flex items-center justify-between gap-3 pt-2">
          <Link
            to={paths.home.getHref()}
            className="inline-flex min-h-12 shrink-0 items-center rounded-md"
            aria-label="Heatfleet home"
          >
            <Wordmark />
          </Link>
          <div className="flex min-w-0 items-center gap-2">
            <Link
              to={paths.account.getHref()}
              className="inline-flex min-h-12 min-w-0 items-center truncate text-sm text-brand-100 underline-offset-4 hover:text-white hover:underline"
              title={`Your account (${me.user.email})`}
            >
              {me.user.name}
            </Link>
            <SignOutButton />
          </div>
        </div>
        <div className="flex min-h-12 items-center py-1">
          {me.memberships.length > 1 ? (
            <FirmSwitcher me={me} />
          ) : (
            <span className="truncate text-sm font-semibold text-brand-100">{me.activeFirm.name}</span>
          )}
        </div>
        <nav aria-label="Main">
          <ul className="-mx-3 flex flex-wrap">
            <NavItem to={paths.home.getHref()} end>
              Home
            </NavItem>
            {hasOwnVan ? <NavItem to={paths.myVan.getHref()}>My van</NavItem> : null}
            <Can I="read" a="Location">
              <NavItem to={paths.vans.getHref()}>Vans</NavItem>
            </Can>
            <Can I="read" a="Job">
              <NavItem to={paths.jobs.getHref()}>Jobs</NavItem>
            </Can>
            <Can I="read" a="Kit">
              <NavItem to={paths.kits.getHref()}>Kits</NavItem>
            </Can>
            <Can I="read" a="Stock">
              <NavItem to={paths.stock.getHref()}>Stock</NavItem>
            </Can>
            <Can I="read" a="Reminder">
              <NavItem to={paths.reminders.getHref()}>Reminders</NavItem>
            </Can>
            <Can I="read" a="Member">
              <NavItem to={paths.team.getHref()}>Team</NavItem>
            </Can>
            {/* The vibration register is for those who run the firm, as its API route (Owner, Admin). */}
            <Can I="update" a="Firm">
              <NavItem to={paths.vibration.getHref()}>Vibration</NavItem>
            </Can>
            {showSettings ? <NavItem to={paths.settings.getHref()}>Settings</NavItem> : null}
            <Can I="update" a="Invoice">
              <NavItem to={paths.money.getHref()}>Money</NavItem>
            </Can>
            <Can I="read" a="Billing">
              <NavItem to={paths.billing.getHref()}>Billing</NavItem>
            </Can>
            {showOutbox ? <NavItem to={paths.outbox.getHref()}>Outbox</NavItem> : null}
          </ul>
        </nav>
      </div>
    </header>
  );
}

function Main() {
  return (
    <main id="main" className="mx-auto w-full max-w-5xl px-4 py-6 print:max-w-none print:p-0">
      <Suspense fallback={<PageSpinner />}>
        <Outlet />
      </Suspense>
    </main>
  );
}

/** The shell of every signed-in screen; anyone signed out is sent to sign in and brought back after. */
export function AppLayout() {
  return (
    <RequireSession>
      {(me) => (
        <MemberAbilityProvider me={me}>
          <div className="flex min-h-dvh flex-col">
            <SkipLink />
            <SignedInHeader me={me} />
            <OfflineStatus me={me} />
            <ReadOnlyBanner timeZone={me.activeFirm.timeZone} />
            <Main />
          </div>
        </MemberAbilityProvider>
      )}
    </RequireSession>
  );
}

/** The Outbox is the local mail catcher's inbox: it must open signed out too, e.g. to read a password reset. */
export function OutboxLayout() {
  const me = useQuery(sessionQueries.me());
  if (me.isPending) return <PageSpinner />;
  if (me.data) return <AppLayout />;
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <header className="bg-brand-900 text-white">
        <div className="mx-auto flex max-w-5xl items-center justify-between gap-3 px-4 py-2">
          <Link
            to={paths.home.getHref()}
            className="inline-flex min-h-12 items-center rounded-md"
            aria-label="Heatfleet home"
          >
            <Wordmark />
          </Link>
          <Link
            to={paths.signIn.getHref()}
            className="inline-flex min-h-12 items-center rounded-md border border-brand-600 px-4 font-semibold text-white hover:bg-brand-800"
          >
            Sign in
          </Link>
        </div>
      </header>
      <Main />
    </div>
  );
}
