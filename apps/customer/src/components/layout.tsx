import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { Button, ShopLogo } from '@benchwright/ui';
import { paths } from '../config/paths';
import { useMe } from '@benchwright/ui/auth';
import { useSignOut } from '@benchwright/ui/auth';

export function Layout() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <div className="min-h-screen">
      <header className="border-b-4 border-wood bg-paper-deep">
        <div className="mx-auto flex max-w-4xl flex-wrap items-center justify-between gap-2 px-4 py-4 sm:px-6">
          <Link
            to={paths.home.getHref()}
            className="flex items-center gap-3 text-xl font-bold tracking-wide text-ink no-underline"
          >
            <ShopLogo className="h-10 w-auto" />
            Fernhill Joinery <span className="font-normal text-ink-soft">· client portal</span>
          </Link>
          <nav aria-label="Main" className="flex flex-wrap items-center gap-x-4 gap-y-1">
            {me.data ? (
              <>
                <NavLink to={paths.projects.getHref()} className="font-semibold text-wood">
                  My projects
                </NavLink>
                <NavLink
                  to={paths.account.getHref()}
                  className="text-ink-soft"
                  aria-label={`Your account (${me.data.name})`}
                >
                  {me.data.name}
                </NavLink>
                <Button
                  variant="quiet"
                  onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn.getHref()) })}
                >
                  Sign out
                </Button>
              </>
            ) : (
              <>
                <NavLink to={paths.signIn.getHref()} className="font-semibold text-wood">
                  Sign in
                </NavLink>
                <NavLink to={paths.signUp.getHref()} className="font-semibold text-wood">
                  Create an account
                </NavLink>
              </>
            )}
          </nav>
        </div>
      </header>
      <main className="mx-auto max-w-4xl px-4 py-8 sm:px-6">
        <Outlet />
      </main>
    </div>
  );
}
