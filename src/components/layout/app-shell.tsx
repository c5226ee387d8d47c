import { useEffect, useState } from 'react';
import { Link, NavLink, Outlet, useLocation } from 'react-router-dom';
import { ThemeToggle } from '@/components/ui/theme-toggle';
import { Logo } from './logo';

export interface NavItem {
  to: string;
  label: string;
}

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-body font-semibold ${isActive ? 'bg-brass-100 text-ink-900 dark:bg-ink-700 dark:text-white' : 'text-muted hover:text-text'}`;

/**
 * The frame around every page: brand, navigation, theme, and the page itself. On a narrow
 * screen the navigation and the account corner fold into a menu button.
 */
export function AppShell({ nav = [], aside }: { nav?: NavItem[]; aside?: React.ReactNode }) {
  const [open, setOpen] = useState(false);
  const { pathname } = useLocation();
  // A new page closes the menu.
  // biome-ignore lint/correctness/useExhaustiveDependencies: runs on each change of page
  useEffect(() => setOpen(false), [pathname]);
  const folds = nav.length > 0;
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-raised focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="no-print border-b border-line bg-raised/80 backdrop-blur">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-3 px-4 py-3">
          <Link to="/" className="mr-4 flex items-center gap-2 text-lead font-extrabold tracking-tight">
            <Logo />
            Sixfold
          </Link>
          {folds ? (
            <button
              type="button"
              className="ml-auto inline-flex items-center gap-2 rounded-lg border border-line px-3 py-2 font-semibold md:hidden"
              aria-expanded={open}
              aria-controls="sf-menu"
              onClick={() => setOpen((o) => !o)}
            >
              <svg viewBox="0 0 20 20" className="h-4 w-4" aria-hidden="true">
                <path
                  d={open ? 'M4 4 16 16M16 4 4 16' : 'M3 5h14M3 10h14M3 15h14'}
                  stroke="currentColor"
                  strokeWidth="2"
                  strokeLinecap="round"
                />
              </svg>
              Menu
            </button>
          ) : null}
          <div
            id="sf-menu"
            className={`${folds && !open ? 'hidden' : 'flex'} w-full flex-col gap-3 md:flex md:w-auto md:flex-1 md:flex-row md:items-center`}
          >
            <nav aria-label="Main" className="flex flex-col gap-1 md:flex-1 md:flex-row md:flex-wrap">
              {nav.map((item) => (
                <NavLink key={item.to} to={item.to} className={navClass}>
                  {item.label}
                </NavLink>
              ))}
            </nav>
            <div className="flex flex-wrap items-center gap-2">
              {aside}
              <ThemeToggle />
            </div>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
        <Outlet />
      </main>
      <footer className="no-print border-t border-line px-4 py-6 text-center text-caption text-muted">
        Sixfold — practise in short blocks, rest your ears and hands, and see a medical professional about any pain.
      </footer>
    </div>
  );
}
