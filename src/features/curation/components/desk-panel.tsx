import { useId, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { ReviewDeskQuery } from '@shared/schemas/publishing';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, Textarea } from '@/components/ui/field';
import { describeError, ErrorState, Loading } from '@/components/ui/states';
import { flagResolutionSchema, useBulkApprove, useDeskExtras, useResolveFlag } from '../api/desk';
import type { DeskFlag, DeskImport } from '../types';

/** The desk's filters as they appear in its URL (`author`, `steel`, `importId`, `kind`). */
export function deskFiltersOf(params: URLSearchParams): ReviewDeskQuery {
  const kind = params.get('kind');
  const importId = Number(params.get('importId'));
  return {
    ...(params.get('author') ? { author: params.get('author')! } : {}),
    ...(params.get('steel') ? { steel: params.get('steel')! } : {}),
    ...(Number.isInteger(importId) && importId > 0 ? { importId } : {}),
    ...(kind === 'result' || kind === 'flag' || kind === 'page-revision' ? { kind } : {}),
  };
}

/** The desk's URL parameters with `open` set to an item (or removed), keeping the filters. */
export function withOpen(params: URLSearchParams, open: number | null): URLSearchParams {
  const next = new URLSearchParams(params);
  if (open === null) next.delete('open');
  else next.set('open', String(open));
  return next;
}

/** Filters of the desk: by author, by steel, by kind; kept in the URL. */
export function DeskFilters() {
  const [params, setParams] = useSearchParams();
  const authorId = useId();
  const steelId = useId();
  const kindId = useId();
  const [author, setAuthor] = useState(params.get('author') ?? '');
  const [steel, setSteel] = useState(params.get('steel') ?? '');
  const apply = (next: Record<string, string>) => {
    const p = new URLSearchParams(params);
    p.delete('open');
    for (const [k, v] of Object.entries(next)) v ? p.set(k, v) : p.delete(k);
    setParams(p, { replace: true });
  };
  return (
    <form
      aria-label="Filter the desk"
      className="flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        apply({ author: author.trim(), steel: steel.trim() });
      }}
    >
      <Field id={kindId} label="Show">
        <Select id={kindId} value={params.get('kind') ?? ''} onChange={(e) => apply({ kind: e.target.value })}>
          <option value="">Everything</option>
          <option value="result">Results</option>
          <option value="page-revision">Page edits</option>
          <option value="flag">Flags</option>
        </Select>
      </Field>
      <Field id={authorId} label="Author (handle)">
        <Input id={authorId} value={author} onChange={(e) => setAuthor(e.target.value)} placeholder="any" />
      </Field>
      <Field id={steelId} label="Steel (slug)">
        <Input id={steelId} value={steel} onChange={(e) => setSteel(e.target.value)} placeholder="any" />
      </Field>
      <Button type="submit" variant="secondary">
        Filter
      </Button>
      {params.get('author') || params.get('steel') || params.get('kind') || params.get('importId') ? (
        <Button variant="quiet" onClick={() => { setAuthor(''); setSteel(''); apply({ author: '', steel: '', kind: '', importId: '' }); }}>
          Clear filters
        </Button>
      ) : null}
      <Link to={paths.audit.getHref()} className="ml-auto self-center">
        Audit log
      </Link>
    </form>
  );
}

function ImportRow({ batch, onApprove, busy }: { batch: DeskImport; onApprove: () => void; busy: boolean }) {
  const [, setParams] = useSearchParams();
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 px-4 py-2">
      <span>
        Import #{batch.id} by {batch.publisher?.displayName ?? 'unknown'} (@{batch.publisher?.handle}), {formatDate(batch.createdAt)}:{' '}
        <strong>{batch.pending}</strong> of {batch.rows} awaiting review
      </span>
      <span className="flex gap-2">
        <Button variant="quiet" size="sm" onClick={() => setParams(new URLSearchParams({ importId: String(batch.id), kind: 'result' }), { replace: true })}>
          Show its results
        </Button>
        <Button size="sm" busy={busy} onClick={onApprove}>
          Approve all {batch.pending}
        </Button>
      </span>
    </li>
  );
}

function FlagItem({ flag }: { flag: DeskFlag }) {
  const noteId = useId();
  const outcomeId = useId();
  const [note, setNote] = useState('');
  const [outcome, setOutcome] = useState<'upheld' | 'dismissed'>('dismissed');
  const [error, setError] = useState<string | undefined>();
  const resolve = useResolveFlag();
  const late = resolve.error instanceof ApiError && resolve.error.status === 409;
  return (
    <li className="flex flex-col gap-2 px-4 py-3">
      <p>
        <strong>{flag.reasonLabel}</strong> on{' '}
        {flag.subject ? <Link to={flag.subject.path}>{flag.subject.title}</Link> : `${flag.subjectType} ${flag.subjectId}`}{' '}
        <span className="text-sm text-muted">
          by @{flag.reporter?.handle} · {formatDate(flag.createdAt)}
        </span>
      </p>
      {flag.text ? <p className="border-l-2 border-rule pl-3">{flag.text}</p> : null}
      <form
        aria-label={`Close flag ${flag.id}`}
        className="flex flex-wrap items-end gap-2"
        onSubmit={(e) => {
          e.preventDefault();
          const parsed = flagResolutionSchema.safeParse({ outcome, note });
          if (!parsed.success) return setError(parsed.error.issues[0]?.message);
          setError(undefined);
          resolve.mutate({ id: flag.id, input: parsed.data });
        }}
      >
        <Field id={outcomeId} label="Outcome">
          <Select id={outcomeId} value={outcome} onChange={(e) => setOutcome(e.target.value as 'upheld' | 'dismissed')}>
            <option value="dismissed">Dismiss</option>
            <option value="upheld">Uphold (something was done)</option>
          </Select>
        </Field>
        <Field id={noteId} label="Note" error={error} className="min-w-64 flex-1">
          <Textarea id={noteId} className="min-h-10" value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
        </Field>
        <Button type="submit" size="sm" busy={resolve.isPending}>
          Close flag
        </Button>
      </form>
      {resolve.isError ? (
        <p role="alert" className="text-danger">
          {late ? 'Another moderator closed this flag first.' : describeError(resolve.error)}
        </p>
      ) : null}
    </li>
  );
}

/** The desk's imports (with one-click approval of a trusted publisher's batch) and open flags. */
export function DeskImportsAndFlags() {
  const [params] = useSearchParams();
  const filters = deskFiltersOf(params);
  const extras = useDeskExtras(filters);
  const bulk = useBulkApprove();
  const outcome = bulk.data ? (
    <p role="status" className="rounded-md border border-accent/40 bg-accent-soft px-4 py-2">
      Approved {bulk.data.approved.length}
      {bulk.data.refused.length ? `; ${bulk.data.refused.length} not approved (already decided, or your own)` : ''}.
    </p>
  ) : bulk.isError ? (
    <p role="alert" className="text-danger">
      {describeError(bulk.error)}
    </p>
  ) : null;
  if (extras.isPending) return <Loading label="Loading flags and imports…" />;
  if (extras.isError) return <ErrorState error={extras.error} onRetry={() => extras.refetch()} />;
  const { imports, flags } = extras.data;
  if (!imports.length && !flags.length) return outcome;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {imports.length || outcome ? (
        <section aria-labelledby="desk-imports" className="flex flex-col gap-2">
          <h2 id="desk-imports" className="text-xl font-semibold">
            Imports awaiting review <span className="font-sans text-base font-normal text-muted">({imports.length})</span>
          </h2>
          {outcome}
          {imports.length ? (
            <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
              {imports.map((b) => (
                <ImportRow key={b.id} batch={b} busy={bulk.isPending && bulk.variables && 'importId' in bulk.variables && bulk.variables.importId === b.id} onApprove={() => bulk.mutate({ importId: b.id })} />
              ))}
            </ul>
          ) : null}
        </section>
      ) : null}
      {flags.length ? (
        <section aria-labelledby="desk-flags">
          <h2 id="desk-flags" className="mb-2 text-xl font-semibold">
            Flags <span className="font-sans text-base font-normal text-muted">({flags.length})</span>
          </h2>
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {flags.map((f) => (
              <FlagItem key={f.id} flag={f} />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
