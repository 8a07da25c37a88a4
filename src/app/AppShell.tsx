import { useState } from 'react';
import { Link, NavLink, Outlet, useNavigate } from 'react-router-dom';
import { ROLE_LABELS } from '../../shared/auth/roles';
import { KeyboardShortcuts } from '../components/keyboard/KeyboardShortcuts';
import { ThemeToggle } from '../components/ui/ThemeToggle';
import { useMe } from '../features/auth/api/get-me';
import { useLogout } from '../features/auth/api/logout';
import { navFor } from './nav';

function Wordmark() {
  return (
    <Link to="/" className="flex items-center gap-2 font-serif text-xl font-bold tracking-tight">
      <img src="/favicon.svg" alt="" className="h-7 w-7" />
      Falsetrace
    </Link>
  );
}

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 text-sm font-semibold ${isActive ? 'bg-ink text-paper' : 'text-ink hover:bg-rule/50'}`;

export function AppShell() {
  const { user, localMail } = useMe();
  const logout = useLogout();
  const navigate = useNavigate();
  const [menuOpen, setMenuOpen] = useState(false);

  const signOut = () => logout.mutate(undefined, { onSettled: () => navigate('/sign-in') });

  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:rounded focus:bg-sheet focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-rule bg-sheet/90 backdrop-blur">
        <div className="mx-auto flex max-w-page flex-wrap items-center gap-3 px-4 py-3">
          <Wordmark />
          {user && (
            <>
              <button
                type="button"
                className="ml-auto rounded-md border border-rule px-3 py-1.5 text-sm md:hidden"
                aria-expanded={menuOpen}
                aria-controls="main-nav"
                onClick={() => setMenuOpen((o) => !o)}
              >
                Menu
              </button>
              <nav
                id="main-nav"
                aria-label="Main"
                className={`${menuOpen ? 'flex' : 'hidden'} w-full flex-col gap-1 md:ml-6 md:flex md:w-auto md:flex-row`}
              >
                {navFor(user.role, { localMail }).map((item) => (
                  <NavLink key={item.to} to={item.to} end={item.to === '/'} className={linkClass} onClick={() => setMenuOpen(false)}>
                    {item.label}
                  </NavLink>
                ))}
              </nav>
              <div className={`${menuOpen ? 'flex' : 'hidden'} w-full items-center gap-3 md:ml-auto md:flex md:w-auto`}>
                <ThemeToggle />
                <Link to="/profile" className="text-sm" data-testid="user-menu">
                  <span className="font-semibold">{user.name}</span>{' '}
                  <span className="text-muted">· {ROLE_LABELS[user.role]}</span>
                </Link>
                <button type="button" onClick={signOut} className="text-sm underline underline-offset-2">
                  Sign out
                </button>
              </div>
            </>
          )}
          {!user && (
            <div className="ml-auto">
              <ThemeToggle />
            </div>
          )}
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-6 sm:py-8">
        <Outlet />
      </main>
      <footer className="border-t border-rule py-4 text-center text-xs text-muted">
        Falsetrace — the team casebook of measurements that lied.
        {user && (
          <>
            {' '}
            Press <kbd className="rounded border border-rule px-1 font-mono">?</kbd> for keyboard shortcuts.
          </>
        )}
      </footer>
      {user && <KeyboardShortcuts />}
    </div>
  );
}
