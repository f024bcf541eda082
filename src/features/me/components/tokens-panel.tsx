import { useEffect, useId, useRef, useState } from 'react';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input } from '@/components/ui/field';
import { describeError } from '@/components/ui/states';
import { Badge } from '@/components/ui/badge';
import type { ApiTokenInfo } from '../types';
import { tokenCreateSchema, useCreateToken, useRevokeToken } from '../api/tokens';

/** A publisher's API tokens: create one (shown once, to copy), see when each was last used, revoke. */
export function TokensPanel({ tokens }: { tokens: ApiTokenInfo[] }) {
  const nameId = useId();
  const [name, setName] = useState('');
  const [nameError, setNameError] = useState<string | undefined>();
  const create = useCreateToken();
  const revoke = useRevokeToken();
  const fresh = create.data;
  // The new token takes the focus, selected, so it can be copied at once (or with the button).
  const tokenRef = useRef<HTMLInputElement>(null);
  const [copied, setCopied] = useState<string | null>(null);
  useEffect(() => {
    if (fresh) {
      tokenRef.current?.focus();
      tokenRef.current?.select();
    }
    setCopied(null);
  }, [fresh?.token]);

  return (
    <section aria-labelledby="tokens" className="flex flex-col gap-3">
      <h2 id="tokens" className="text-xl font-semibold">
        API tokens
      </h2>
      <p className="text-muted">
        A token lets a script use the API as you: send it as <code>Authorization: Bearer &lt;token&gt;</code>. Keep it secret; revoke it when a machine is lost.
      </p>
      <form
        aria-label="Create a token"
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const parsed = tokenCreateSchema.safeParse({ name });
          if (!parsed.success) return setNameError(parsed.error.issues[0]?.message);
          setNameError(undefined);
          create.mutate(parsed.data.name, { onSuccess: () => setName('') });
        }}
      >
        <Field id={nameId} label="Token name" error={nameError} className="min-w-64 flex-1">
          <Input {...controlA11y(nameId, { error: nameError })} value={name} maxLength={60} onChange={(e) => setName(e.target.value)} placeholder="e.g. lab laptop" />
        </Field>
        <Button type="submit" busy={create.isPending}>
          Create token
        </Button>
      </form>
      {create.isError ? (
        <p role="alert" className="text-danger">
          {describeError(create.error)}
        </p>
      ) : null}
      {fresh ? (
        <div role="status" className="rounded-md border border-caution/40 bg-caution-soft px-4 py-3">
          <p className="font-semibold">Your new token “{fresh.name}”: copy it now, it is shown only once.</p>
          <div className="mt-2 flex flex-wrap items-center gap-2">
            <Input ref={tokenRef} readOnly value={fresh.token} aria-label="New token" className="min-w-0 flex-1 font-mono" onFocus={(e) => e.currentTarget.select()} />
            <Button
              variant="secondary"
              onClick={() => {
                (navigator.clipboard?.writeText(fresh.token) ?? Promise.reject(new Error('no clipboard'))).then(
                  () => setCopied('Copied to the clipboard.'),
                  () => setCopied('The browser did not allow copying; select the token and copy it yourself.'),
                );
              }}
            >
              Copy token
            </Button>
          </div>
          <p aria-live="polite" className="mt-1 text-sm empty:hidden">
            {copied}
          </p>
        </div>
      ) : null}
      {tokens.length ? (
        <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
          {tokens.map((t) => (
            <li key={t.id} className="flex flex-wrap items-center justify-between gap-2 px-4 py-2">
              <span>
                <span className="font-semibold">{t.name}</span> <span className="font-mono text-sm text-muted">{t.prefix}…</span>{' '}
                <span className="text-sm text-muted">
                  made {formatDate(t.createdAt)}, {t.lastUsedAt ? `last used ${formatDate(t.lastUsedAt)}` : 'never used'}
                </span>{' '}
                {t.active ? null : <Badge>Revoked {formatDate(t.revokedAt)}</Badge>}
              </span>
              {t.active ? (
                <Button variant="danger" size="sm" onClick={() => revoke.mutate(t.id)} disabled={revoke.isPending} aria-label={`Revoke token ${t.name}`}>
                  Revoke
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
