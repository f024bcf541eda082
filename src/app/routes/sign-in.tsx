import { useSearchParams } from 'react-router-dom';
import { paths, safeReturnTo } from '@/config/paths';
import { useSession } from '@/lib/auth';
import { buttonClasses } from '@/components/ui/button';
import { PageTitle } from '@/components/ui/page-title';
import { Loading } from '@/components/ui/states';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { useDemoAccounts } from '@/features/auth/api/get-demo-accounts';

function DemoAccounts({ returnTo }: { returnTo: string }) {
  const accounts = useDemoAccounts();
  // Production has no demo accounts (the server answers 404): say nothing about them.
  if (accounts.isPending) return <Loading label="Looking for demo accounts…" />;
  if (accounts.isError || accounts.data.length === 0) return null;
  return (
    <section aria-labelledby="demo" className="flex flex-col gap-3">
      <h2 id="demo" className="text-xl font-semibold">
        Demo accounts
      </h2>
      <p className="max-w-2xl text-muted">
        This is a development server with invented people. Pick one to sign in through the same round trip, with the
        account chosen for you.
      </p>
      <TableFrame label="Demo accounts">
        <table className="w-full min-w-[28rem] border-collapse">
          <thead>
            <tr>
              <th scope="col" className={thClass}>Name</th>
              <th scope="col" className={thClass}>Handle</th>
              <th scope="col" className={thClass}>Role</th>
              <th scope="col" className={thClass}>
                <span className="sr-only">Sign in</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {accounts.data.map((a) => (
              <tr key={a.handle}>
                <td className={`${tdClass} align-middle`}>{a.displayName ?? a.handle}</td>
                <td className={`${tdClass} align-middle`}>@{a.handle}</td>
                <td className={`${tdClass} align-middle`}>{a.role}</td>
                <td className={`${tdClass} text-right align-middle`}>
                  <a href={paths.auth.signIn(returnTo, a.handle)} className={buttonClasses('secondary', 'sm')}>
                    Sign in as {a.displayName ?? a.handle}
                  </a>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
    </section>
  );
}

/** Sign in: what an account is for, the way in, and (outside production) the demo accounts. */
export default function SignInRoute() {
  const [params] = useSearchParams();
  const returnTo = safeReturnTo(params.get('returnTo'));
  // The server sends a failed round trip back here with ?failed=1.
  const failed = params.get('failed') === '1';
  const session = useSession();
  const user = session.data?.user;
  const accounts = useDemoAccounts();
  const demo = !!accounts.data?.length;
  return (
    <div className="flex flex-col gap-8">
      <PageTitle
        title="Sign in"
        lead="Reading is open to everyone. An account lets you post results, see them through review, and propose changes to reference pages."
      >
        Sign in
      </PageTitle>
      {failed && !user ? (
        <div role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-4 py-3">
          <p className="font-semibold text-danger">Signing in did not complete.</p>
          <p>The sign-in service did not confirm who you are, or the attempt expired. Please try again.</p>
        </div>
      ) : null}
      {user ? (
        <p>
          You are signed in as <strong className="font-semibold">{user.displayName}</strong> (@{user.handle}, {user.role}).
        </p>
      ) : (
        <div className="flex flex-col gap-2">
          <p className="max-w-2xl">
            You will be sent to the sign-in service and brought back here. Edgeledger keeps your handle, display name
            and role; it never sees your password.
          </p>
          {accounts.isPending ? null : demo ? (
            // The local sign-in service has no login screen: without a choice it would sign the visitor in as a default demo member.
            <p className="max-w-2xl font-semibold">
              On this development server, choose whom to sign in as from the <a href="#demo">demo accounts</a> below.
            </p>
          ) : (
            <p>
              <a href={paths.auth.signIn(returnTo)} className={buttonClasses('primary')}>
                Continue to sign in
              </a>
            </p>
          )}
        </div>
      )}
      <DemoAccounts returnTo={returnTo} />
    </div>
  );
}
