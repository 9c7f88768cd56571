import type { ReactNode } from 'react';
import { NavLink, Navigate, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { Button, Notice, Panel, ShopLogo } from '@benchwright/ui';
import { paths, PORTAL_URL } from '../config/paths';
import { useMe } from '@benchwright/ui/auth';
import { useSignOut } from '@benchwright/ui/auth';
import {
  canInviteBuilders,
  canChangeSettings,
  canSeeBoard,
  canEditPriceBook,
  canSeeClients,
  canSeeMail,
  canSeeOverview,
  canSeePayments,
  canSeeRequests,
  isStaff,
} from '../lib/policies';

function Frame({ nav, children }: { nav?: ReactNode; children: ReactNode }) {
  return (
    <div className="min-h-screen">
      <header className="border-b-4 border-wood bg-ink text-paper print:hidden">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-2 px-4 py-3 sm:px-6">
          <span className="flex items-center gap-3 text-lg font-bold tracking-wide">
            <ShopLogo className="h-8 w-auto rounded bg-paper p-0.5" />
            Fernhill Joinery · shop
          </span>
          {nav}
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-8 sm:px-6">{children}</main>
    </div>
  );
}

/** Pages anyone may open (sign-in, invitations, password reset). */
export function PublicLayout() {
  return (
    <Frame>
      <Outlet />
    </Frame>
  );
}

/** The signed-in shop: navigation follows the role; clients are told this app is not theirs. */
export function ShopLayout() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  if (me.isPending) return <Frame>Loading…</Frame>;
  if (!me.data) return <Navigate to={paths.signIn.getHref()} replace />;
  const user = me.data;
  const out = () => signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn.getHref()) });
  if (!isStaff(user)) {
    return (
      <Frame>
        <Panel level={1} title="This app is for the shop">
          <Notice>
            You are signed in as {user.name}, a client of the shop. The shop app is only for its owner and builders;
            your projects, estimates and payments are in the client portal.
          </Notice>
          <p className="mb-4">
            <a href={PORTAL_URL} className="text-wood underline">
              Go to the client portal
            </a>
          </p>
          <Button variant="quiet" onClick={out}>
            Sign out
          </Button>
        </Panel>
      </Frame>
    );
  }
  const link = 'rounded px-3 py-1 font-semibold text-paper hover:bg-wood aria-[current=page]:bg-wood';
  const nav = (
    <div className="flex flex-wrap items-center gap-2">
      <nav aria-label="Shop" className="flex flex-wrap items-center gap-2">
        {canSeeOverview(user) ? (
          <NavLink to={paths.overview.getHref()} className={link}>
            Overview
          </NavLink>
        ) : null}
        {canSeeRequests(user) ? (
          <NavLink to={paths.requests.getHref()} className={link}>
            Requests
          </NavLink>
        ) : null}
        {canSeeClients(user) ? (
          <NavLink to={paths.clients.getHref()} className={link}>
            Clients
          </NavLink>
        ) : null}
        {canSeeBoard(user) ? (
          <NavLink to={paths.board.getHref()} className={link}>
            Board
          </NavLink>
        ) : null}
        {canSeePayments(user) ? (
          <NavLink to={paths.payments.getHref()} className={link}>
            Payments
          </NavLink>
        ) : null}
        {canInviteBuilders(user) ? (
          <NavLink to={paths.team.getHref()} className={link}>
            Team
          </NavLink>
        ) : null}
        {canSeeMail(user) ? (
          <NavLink to={paths.mail.getHref()} className={link}>
            Mail
          </NavLink>
        ) : null}
        {canEditPriceBook(user) ? (
          <NavLink to={paths.priceBook.getHref()} className={link}>
            Price book
          </NavLink>
        ) : null}
        {canChangeSettings(user) ? (
          <NavLink to={paths.settings.getHref()} className={link}>
            Settings
          </NavLink>
        ) : null}
      </nav>
      <NavLink
        to={paths.account.getHref()}
        className={`ml-4 text-sm ${link}`}
        aria-label={`Your account (${user.name})`}
      >
        {user.name}
      </NavLink>
      <Button variant="quiet" className="text-wood-light" onClick={out}>
        Sign out
      </Button>
    </div>
  );
  if (location.pathname === '/')
    return <Navigate to={canSeeRequests(user) ? paths.requests.getHref() : paths.board.getHref()} replace />;
  return (
    <Frame nav={nav}>
      <Outlet context={user} />
    </Frame>
  );
}

/** Keeps a page to the roles that may see it. */
export function RoleGate({
  allow,
  children,
}: {
  allow: (u: ReturnType<typeof useMe>['data']) => boolean;
  children: ReactNode;
}) {
  const me = useMe();
  if (!allow(me.data))
    return (
      <Panel level={1} title="Not part of your work">
        <Notice tone="error">Your role does not include this page.</Notice>
      </Panel>
    );
  return <>{children}</>;
}
