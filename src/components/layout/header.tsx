import { useEffect, useId, useState } from 'react';
import { Link, NavLink, useLocation, useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCan, useSession, useSignOut } from '@/lib/auth';
import { buttonClasses } from '@/components/ui/button';
import { Wordmark } from './wordmark';

const navItems = [
  // `end`: the results list only, not a single result or the new-result form.
  { to: paths.results.getHref(), label: 'Results', end: true },
  { to: paths.compare.getHref(), label: 'Compare', end: false },
  { to: paths.steels.getHref(), label: 'Steels', end: false },
  { to: paths.abrasives.getHref(), label: 'Abrasives', end: false },
  { to: paths.methods.getHref(), label: 'Methods', end: false },
  { to: paths.tools.index.getHref(), label: 'Tools', end: false },
];

function navClass({ isActive }: { isActive: boolean }) {
  return `block whitespace-nowrap rounded px-1.5 py-1.5 no-underline ${
    isActive ? 'bg-accent-soft font-semibold text-accent-strong' : 'text-ink hover:bg-paper hover:text-accent-strong'
  }`;
}

/** The site header: wordmark, main sections, and who is signed in. */
export function Header() {
  const session = useSession();
  const user = session.data?.user ?? null;
  const mayReview = useCan('read:review-desk');
  const mayAdmin = useCan('manage:users');
  // Every moderator and admin screen, for those who may use it, in a second row of its own.
  const staffItems = [
    ...(mayReview ? [{ to: paths.reviewDesk.getHref(), label: 'Review desk' }, { to: paths.audit.getHref(), label: 'Audit log' }] : []),
    ...(mayAdmin
      ? [
          { to: paths.adminUsers.getHref(), label: 'Members' },
          { to: paths.publisherApplications.getHref(), label: 'Publisher applications' },
          { to: paths.devMail.getHref(), label: 'Outgoing mail' },
        ]
      : []),
  ];
  // Staff may import too, but reach it from their page; the header stays one line for them.
  const mayImport = useCan('import:results') && user?.role === 'publisher';
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut({ onSuccess: () => navigate(paths.home.getHref()) });
  const [open, setOpen] = useState(false);
  const menuId = useId();
  const returnTo = `${location.pathname}${location.search}`;

  // A new page closes the phone menu.
  useEffect(() => setOpen(false), [location.pathname]);

  return (
    <header className="border-b border-rule bg-panel">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
        <Link to={paths.home.getHref()} className="rounded no-underline" aria-label="Edgeledger, home">
          <Wordmark />
        </Link>
        <button
          type="button"
          className={`${buttonClasses('secondary', 'sm')} ml-auto lg:hidden`}
          aria-expanded={open}
          aria-controls={menuId}
          onClick={() => setOpen((v) => !v)}
        >
          Menu
        </button>
        <div
          id={menuId}
          className={`${open ? 'flex' : 'hidden'} w-full flex-col gap-3 pb-2 lg:flex lg:w-auto lg:flex-1 lg:flex-row lg:items-center lg:pb-0`}
        >
          <nav aria-label="Main" className="lg:flex-1">
            <ul className="flex flex-col gap-0.5 lg:flex-row lg:flex-wrap lg:items-center">
              {navItems.map((item) => (
                <li key={item.to}>
                  <NavLink to={item.to} end={item.end} className={navClass}>
                    {item.label}
                  </NavLink>
                </li>
              ))}
              {mayImport ? (
                <li>
                  <NavLink to={paths.importResults.getHref()} className={navClass}>
                    Import
                  </NavLink>
                </li>
              ) : null}
            </ul>
          </nav>
          <div className="flex flex-wrap items-center gap-1.5">
            {session.isPending ? null : user ? (
              <>
                <Link to={paths.newResult.getHref()} className={buttonClasses('primary', 'sm')}>
                  Post a result
                </Link>
                <NavLink to={paths.myResults.getHref()} className={navClass} title={`My results (signed in as @${user.handle})`}>
                  <span className="sr-only">My results, signed in as </span>
                  <span className="inline-block max-w-36 truncate align-bottom">{user.displayName}</span>
                </NavLink>
                <button
                  type="button"
                  className={buttonClasses('quiet', 'sm')}
                  onClick={() => void signOut.mutate()}
                  disabled={signOut.isPending}
                >
                  Sign out
                </button>
              </>
            ) : (
              <Link to={paths.signIn.getHref(returnTo)} className={buttonClasses('secondary', 'sm')}>
                Sign in
              </Link>
            )}
          </div>
        </div>
      </div>
      {staffItems.length ? (
        <nav aria-label="Staff" className="border-t border-rule bg-paper">
          <ul className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-1 gap-y-0.5 px-4 py-1 text-sm">
            <li className="pr-1 text-muted">{mayAdmin ? 'Admin:' : 'Moderation:'}</li>
            {staffItems.map((item) => (
              <li key={item.to}>
                <NavLink to={item.to} className={navClass}>
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      ) : null}
      {signOut.isError ? (
        <p role="alert" className="bg-danger-soft px-4 py-2 text-center text-danger">
          Signing out failed. Try again.
        </p>
      ) : null}
    </header>
  );
}
