import { useId, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { ROLES, type Role } from '@shared/permissions';
import { paths } from '@/config/paths';
import { useUser } from '@/lib/auth';
import { SignInRequired } from '@/lib/authorization';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input, Select } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { describeError, Empty, ErrorState, Loading } from '@/components/ui/states';
import { useAdminUsers, type ManagedUser } from '../api/get-users';
import { adminUserChangeSchema, useChangeUser } from '../api/change-user';

const ROLE_WORDS: Record<Role, string> = { member: 'Member', publisher: 'Publisher', moderator: 'Moderator', admin: 'Admin' };

/** One account with its standing and the admin's change form (role, ban, reason). */
function Account({ user, self }: { user: ManagedUser; self: boolean }) {
  const base = useId();
  const [role, setRole] = useState<Role>(user.role);
  const [banned, setBanned] = useState(user.banned);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | undefined>();
  const [done, setDone] = useState('');
  const change = useChangeUser();
  const changed = role !== user.role || banned !== user.banned;
  const save = () => {
    const parsed = adminUserChangeSchema.safeParse({ ...(role !== user.role ? { role } : {}), ...(banned !== user.banned ? { banned } : {}), reason });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message);
    setError(undefined);
    change.mutate(
      { handle: user.handle, change: parsed.data },
      {
        onSuccess: (u) => {
          setReason('');
          setDone(`Saved: @${u.handle} is now ${ROLE_WORDS[u.role as Role].toLowerCase()}${u.banned ? ', banned (signed out everywhere, API tokens revoked)' : ''}.`);
        },
      },
    );
  };
  return (
    <li className="flex flex-col gap-3 px-4 py-4">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <Link to={paths.profile.getHref(user.handle)} className="font-semibold">
          {user.displayName}
        </Link>
        <span className="text-sm text-muted">@{user.handle}</span>
        <span className="text-sm">{ROLE_WORDS[user.role]}</span>
        {user.banned ? <span className="rounded bg-danger-soft px-2 text-sm text-danger">Banned</span> : null}
        <span className="text-sm text-muted">
          joined {formatDate(user.createdAt)} · {user.published} published · {user.returned} returned · {user.pending} awaiting review
        </span>
      </div>
      {self ? (
        <p className="text-sm text-muted">This is you: another admin changes your own role or standing.</p>
      ) : (
        <form
          aria-label={`Change @${user.handle}`}
          className="grid gap-3 sm:grid-cols-[10rem_auto_1fr_auto] sm:items-end"
          onSubmit={(e) => {
            e.preventDefault();
            save();
          }}
        >
          <Field id={`${base}-role`} label="Role">
            <Select id={`${base}-role`} value={role} onChange={(e) => setRole(e.target.value as Role)}>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_WORDS[r]}
                </option>
              ))}
            </Select>
          </Field>
          <label className="flex items-center gap-2 pb-2">
            <input type="checkbox" checked={banned} onChange={(e) => setBanned(e.target.checked)} />
            Banned
          </label>
          <Field id={`${base}-reason`} label="Reason (kept in the audit log)" error={error}>
            <Input {...controlA11y(`${base}-reason`, { error })} value={reason} maxLength={2000} onChange={(e) => setReason(e.target.value)} />
          </Field>
          <Button type="submit" size="sm" busy={change.isPending} disabled={!changed} className="sm:mb-1">
            Save
          </Button>
        </form>
      )}
      <p role="status" aria-live="polite" className="text-sm text-accent-strong">
        {change.isError ? <span className="text-danger">{describeError(change.error)}</span> : done}
      </p>
    </li>
  );
}

function Accounts() {
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  const [text, setText] = useState(q);
  const me = useUser();
  const users = useAdminUsers(q);
  const searchId = useId();
  return (
    <div className="flex flex-col gap-4">
      <form
        role="search"
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          setParams(text.trim() ? { q: text.trim() } : {});
        }}
      >
        <Field id={searchId} label="Find a member by handle or name" className="min-w-0 flex-1">
          <Input id={searchId} type="search" value={text} maxLength={40} onChange={(e) => setText(e.target.value)} />
        </Field>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
      {users.isError ? (
        <ErrorState error={users.error} onRetry={() => users.refetch()} />
      ) : !users.data ? (
        <Loading label="Loading members…" />
      ) : users.data.items.length === 0 ? (
        <Empty title={q ? `No member matches “${q}”.` : 'No members yet.'} />
      ) : (
        <>
          <p className="text-sm text-muted">
            {users.data.total} account{users.data.total === 1 ? '' : 's'}
            {q ? ` matching “${q}”` : ''}
            {users.data.total > users.data.items.length ? `; the first ${users.data.items.length} shown` : ''}.
          </p>
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {users.data.items.map((u) => (
              <Account key={u.handle} user={u} self={u.handle === me?.handle} />
            ))}
          </ul>
        </>
      )}
    </div>
  );
}

/** Admins: members' roles and bans. A ban signs the member out everywhere and revokes their API tokens at once. */
export default function AdminUsersPage() {
  return (
    <div className="flex max-w-5xl flex-col gap-6">
      <PageTitle title="Members" lead="Change a member’s role, or ban an account. Each change needs a reason and is kept in the audit log. A ban signs the member out everywhere and revokes their API tokens on their next request.">
        Members
      </PageTitle>
      <SignInRequired what="manage members" action="manage:users" who="admins">
        <Accounts />
      </SignInRequired>
    </div>
  );
}
