import { Link, NavLink, Outlet } from 'react-router-dom';
import { ThemeToggle } from '@/components/ui/theme-toggle';

export interface NavItem {
  to: string;
  label: string;
}

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 text-body font-semibold ${isActive ? 'bg-brass-100 text-ink-900 dark:bg-ink-700 dark:text-white' : 'text-muted hover:text-text'}`;

/** The frame around every page: brand, navigation, theme, and the page itself. */
export function AppShell({ nav = [], aside }: { nav?: NavItem[]; aside?: React.ReactNode }) {
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
            <img src="/favicon.svg" alt="" className="h-7 w-7" />
            Sixfold
          </Link>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {nav.map((item) => (
              <NavLink key={item.to} to={item.to} className={navClass}>
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-2">
            {aside}
            <ThemeToggle />
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-8">
        <Outlet />
      </main>
      <footer className="no-print border-t border-line py-6 text-center text-caption text-muted">
        Sixfold — practise in short blocks, rest your ears and hands, and see a medical professional about any pain.
      </footer>
    </div>
  );
}
