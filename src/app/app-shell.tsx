import type { ReactNode } from 'react';
import { Link, NavLink, useMatches } from 'react-router-dom';
import { Button } from '../components/ui/button';
import { ErrorNotice } from '../components/ui/error-notice';
import { useSignOut } from '../features/auth/api/sign-out';
import type { SessionUser } from '../types/api';

const navItems = [
  { to: '/drafts', label: 'Drafts' },
  { to: '/yarns', label: 'Yarns' },
  { to: '/studios', label: 'Studios' },
  { to: '/account', label: 'Account' },
];

/** The frame of every signed-in page: product name, the areas, who is signed in, sign out. */
export function AppShell({ user, children }: { user: SessionUser; children: ReactNode }) {
  const signOut = useSignOut();
  // A route marked `wide` (the draft workspace) gets the whole window, and scrolls inside itself.
  const wide = useMatches().some((m) => (m.handle as { wide?: boolean } | undefined)?.wide === true);
  const frame = wide ? 'px-3' : 'mx-auto max-w-6xl px-4';

  return (
    <div className={wide ? 'flex h-dvh flex-col' : 'flex min-h-screen flex-col'}>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:rounded focus:bg-surface focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-line bg-surface">
        <div className={`${frame} flex flex-wrap items-center gap-x-8 gap-y-2 ${wide ? 'py-1.5' : 'py-3'}`}>
          <Link to="/drafts" className="text-lg font-semibold tracking-tight text-accent no-underline">
            Shedwright
          </Link>
          <nav aria-label="Main">
            <ul className="flex gap-1">
              {navItems.map((item) => (
                <li key={item.to}>
                  {/* The current area is bold and underlined, not only a different colour. */}
                  <NavLink
                    to={item.to}
                    className={({ isActive }) =>
                      `block rounded-md px-3 py-2 text-sm no-underline ${
                        isActive ? 'bg-accent-soft font-semibold text-accent-strong underline decoration-2 underline-offset-8' : 'text-ink hover:bg-sunken'
                      }`
                    }
                  >
                    {item.label}
                  </NavLink>
                </li>
              ))}
            </ul>
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span>
              <span className="sr-only">Signed in as </span>
              <span className="font-medium">{user.name}</span>
            </span>
            <Button onClick={() => signOut.mutate()} busy={signOut.isPending} busyLabel="Signing out…">
              Sign out
            </Button>
          </div>
        </div>
        {signOut.isError && (
          <div className={`${frame} pb-3`}>
            <ErrorNotice title="Could not sign out" error={signOut.error} />
          </div>
        )}
      </header>
      <main id="main" tabIndex={-1} className={`${wide ? 'flex min-h-0 flex-1 flex-col px-3 pt-2' : `${frame} w-full flex-1 py-6`} focus:outline-none`}>
        {children}
      </main>
    </div>
  );
}
