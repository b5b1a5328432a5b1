import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { Link, NavLink, useLocation } from 'react-router-dom';
import { LogOut, Mail, Menu, X, type LucideIcon } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Wordmark } from './logo';

export interface NavItem {
  to: string;
  label: string;
  icon: LucideIcon;
  /** Match the path exactly, for "Home" links that prefix every other path. */
  end?: boolean;
}

export interface AppLayoutProps {
  homeHref: string;
  nav: NavItem[];
  /** The club switcher (or the club's name), supplied by the app. */
  clubPicker?: ReactNode;
  personName: string;
  /** The person's own settings in this club (their e-mail choices), shown beside their name. */
  accountLink?: { to: string; label: string };
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}

function navClasses(isActive: boolean, stacked: boolean): string {
  const shape = stacked
    ? 'flex min-h-12 items-center gap-3 rounded-lg px-3 text-lg'
    : 'inline-flex min-h-11 items-center gap-2 rounded-lg px-3 border-b-3';
  const tone = isActive
    ? stacked
      ? 'bg-leaf-50 font-semibold text-leaf-800'
      : 'border-leaf font-semibold text-leaf-800'
    : stacked
      ? 'text-soil hover:bg-paper-100'
      : 'border-transparent text-soil hover:bg-paper-100';
  return `${shape} ${tone} no-underline`;
}

function NavLinks({ items, stacked, onNavigate }: { items: NavItem[]; stacked: boolean; onNavigate?: () => void }) {
  return (
    <ul className={stacked ? 'flex flex-col gap-1' : 'flex flex-wrap gap-1'}>
      {items.map(({ to, label, icon: Icon, end }) => (
        <li key={to}>
          <NavLink
            to={to}
            end={end}
            onClick={onNavigate}
            className={({ isActive }) => navClasses(isActive, stacked)}
          >
            <Icon className="size-5 shrink-0" aria-hidden="true" />
            <span>{label}</span>
          </NavLink>
        </li>
      ))}
    </ul>
  );
}

/** Signed-in frame: top bar, role-based navigation (a menu on phones) and the main area. */
export function AppLayout({
  homeHref,
  nav,
  clubPicker,
  personName,
  accountLink,
  onSignOut,
  signingOut,
  children,
}: AppLayoutProps) {
  const [menuOpen, setMenuOpen] = useState(false);
  const ids = useId();
  const menuId = `${ids}-menu`;

  useEffect(() => {
    if (!menuOpen) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === 'Escape') setMenuOpen(false);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [menuOpen]);

  const closeMenu = () => setMenuOpen(false);

  // After a route change, focus goes to the new page's heading (else the main content), so a screen reader starts there.
  const { pathname } = useLocation();
  const shown = useRef(pathname);
  useEffect(() => {
    if (shown.current === pathname) return;
    shown.current = pathname;
    const main = document.getElementById('main')!;
    const heading = main.querySelector('h1') ?? main;
    heading.tabIndex = -1;
    heading.focus();
  }, [pathname]);

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="no-print sr-only rounded-lg bg-leaf px-4 py-3 text-white focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50"
      >
        Skip to content
      </a>

      <header className="no-print border-b border-paper-200 bg-white">
        <div className="mx-auto flex min-h-16 max-w-6xl items-center gap-4 px-4">
          <Link to={homeHref} className="rounded-lg no-underline" aria-label="Tillwell home">
            <Wordmark />
          </Link>
          <div className="hidden min-w-0 md:block">{clubPicker}</div>
          <div className="ml-auto hidden items-center gap-3 md:flex">
            <span className="max-w-48 truncate text-stone" title={personName}>
              {personName}
            </span>
            {accountLink && (
              <NavLink to={accountLink.to} className={({ isActive }) => navClasses(isActive, false)}>
                <Mail className="size-5 shrink-0" aria-hidden="true" />
                <span className="whitespace-nowrap">{accountLink.label}</span>
              </NavLink>
            )}
            <Button variant="secondary" onClick={onSignOut} loading={signingOut} loadingText="Signing out…">
              <LogOut className="size-5" aria-hidden="true" />
              Sign out
            </Button>
          </div>
          <Button
            variant="ghost"
            className="ml-auto md:hidden"
            aria-expanded={menuOpen}
            aria-controls={menuId}
            onClick={() => setMenuOpen((open) => !open)}
          >
            {menuOpen ? <X className="size-6" aria-hidden="true" /> : <Menu className="size-6" aria-hidden="true" />}
            Menu
          </Button>
        </div>

        {nav.length > 0 && (
          <nav aria-label="Main" className="mx-auto hidden max-w-6xl px-2 md:block">
            <NavLinks items={nav} stacked={false} />
          </nav>
        )}

        {menuOpen && (
          <div id={menuId} className="border-t border-paper-200 px-4 pt-3 pb-4 md:hidden">
            {clubPicker && <div className="mb-3">{clubPicker}</div>}
            {nav.length > 0 && (
              <nav aria-label="Main">
                <NavLinks items={nav} stacked onNavigate={closeMenu} />
              </nav>
            )}
            <div className="mt-4 flex flex-wrap items-center justify-between gap-3 border-t border-paper-200 pt-4">
              <span className="min-w-0 truncate text-stone">{personName}</span>
              {accountLink && (
                <NavLink to={accountLink.to} onClick={closeMenu} className="inline-flex min-h-11 items-center gap-2 underline">
                  <Mail className="size-5 shrink-0" aria-hidden="true" />
                  {accountLink.label}
                </NavLink>
              )}
              <Button variant="secondary" onClick={onSignOut} loading={signingOut} loadingText="Signing out…">
                <LogOut className="size-5" aria-hidden="true" />
                Sign out
              </Button>
            </div>
          </div>
        )}
      </header>

      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-6xl flex-1 px-4 py-6 sm:py-10 focus:outline-none">
        {children}
      </main>
    </div>
  );
}
