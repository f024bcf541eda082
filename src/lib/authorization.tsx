import type { ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { can, type Action } from '@shared/permissions';
import { paths } from '@/config/paths';
import { buttonClasses } from '@/components/ui/button';
import { Loading } from '@/components/ui/states';
import { actorOf, useSession } from '@/lib/auth';

/**
 * Shows its children to a signed-in person (holding `action`, if given); otherwise explains
 * why the page is closed and offers to sign in.
 */
export function SignInRequired({ children, action, what, who = 'moderators' }: { children: ReactNode; action?: Action; what: string; who?: string }) {
  const session = useSession();
  const location = useLocation();
  if (session.isPending) return <Loading label="Checking who is signed in…" />;
  const user = session.data?.user ?? null;
  const returnTo = `${location.pathname}${location.search}`;
  if (!user) {
    return (
      <div className="rounded-md border border-rule bg-panel px-5 py-6">
        <p className="font-serif text-lg">Sign in to {what}.</p>
        <p className="mt-1 text-muted">Reading is open to everyone; posting and reviewing need an account.</p>
        <Link to={paths.signIn.getHref(returnTo)} className={`${buttonClasses('primary')} mt-4`}>
          Sign in
        </Link>
      </div>
    );
  }
  if (action && !can(actorOf(user), action)) {
    return (
      <div role="alert" className="rounded-md border border-rule bg-panel px-5 py-6">
        <p className="font-serif text-lg">This page is for {who}.</p>
        <p className="mt-1 text-muted">You are signed in as {user.displayName} ({user.role}).</p>
      </div>
    );
  }
  return <>{children}</>;
}
