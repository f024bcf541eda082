import { useId, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { AUDIT_ACTION_LABELS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { SignInRequired } from '@/lib/authorization';
import { useCan } from '@/lib/auth';
import { Badge } from '@/components/ui/badge';
import { cardBodyClass, cardCellClass, cardRowClass, cardTableClass } from '@/components/ui/table-frame';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useAudit } from '../api/get-audit';

type Entry = NonNullable<ReturnType<typeof useAudit>['data']>['items'][number];

/** What an entry names, as a link where it has a page: a result, a member, a flag, an application. */
function AuditSubject({ entry: e }: { entry: Entry }) {
  const details = (e.details ?? {}) as Record<string, unknown>;
  if (e.subjectType === 'result' && e.subjectId) {
    return (
      <Link to={paths.result.getHref(e.subjectId)}>
        result {e.subjectId}
        {typeof details.revision === 'number' ? `, version ${details.revision}` : ''}
      </Link>
    );
  }
  if (e.subjectType === 'user' && typeof details.handle === 'string') {
    const to = details.to as { role?: string } | undefined;
    return (
      <>
        <Link to={paths.adminUsers.getHref(details.handle)}>@{details.handle}</Link>
        {e.action === 'user.role' && to?.role ? ` to ${to.role}` : ''}
      </>
    );
  }
  if (e.subjectType === 'flag') return <Link to={paths.reviewDesk.getHref()}>flag {e.subjectId}</Link>;
  if (e.subjectType === 'publisher-application') {
    return <Link to={paths.publisherApplications.getHref()}>{typeof details.applicant === 'string' ? `of @${details.applicant}` : `application ${e.subjectId}`}</Link>;
  }
  if ((e.subjectType === 'steel' || e.subjectType === 'abrasive' || e.subjectType === 'method') && typeof details.slug === 'string') {
    const name = typeof details.name === 'string' ? details.name : details.slug;
    return <Link to={paths[e.subjectType].getHref(details.slug)}>{name}</Link>;
  }
  if (e.subjectType === 'site-settings') return <>{String(details.key ?? 'setting')}: {String(details.from)} → {String(details.to)}</>;
  return <>{e.subjectType}{e.subjectId ? ` ${e.subjectId}` : ''}</>;
}

function AuditTable() {
  const [params, setParams] = useSearchParams();
  const actorId = useId();
  const actionId = useId();
  const [actor, setActor] = useState(params.get('actor') ?? '');
  const [action, setAction] = useState(params.get('action') ?? '');
  const page = Math.max(1, Number(params.get('page')) || 1);
  const filters = { actor: params.get('actor') ?? undefined, action: params.get('action') ?? undefined, page };
  const audit = useAudit(filters);
  const go = (next: Record<string, string>) => {
    const p = new URLSearchParams(params);
    for (const [k, v] of Object.entries(next)) v ? p.set(k, v) : p.delete(k);
    setParams(p, { replace: true });
  };
  return (
    <div className="flex flex-col gap-4">
      <form
        aria-label="Filter the audit log"
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          go({ actor: actor.trim(), action: action.trim(), page: '' });
        }}
      >
        <Field id={actorId} label="Who (handle)">
          <Input id={actorId} value={actor} onChange={(e) => setActor(e.target.value)} placeholder="anyone" />
        </Field>
        <Field id={actionId} label="Action starts with">
          <Input id={actionId} value={action} onChange={(e) => setAction(e.target.value)} placeholder="e.g. result." />
        </Field>
        <Button type="submit" variant="secondary">
          Filter
        </Button>
      </form>
      {audit.isPending ? (
        <Loading label="Loading the audit log…" />
      ) : audit.isError ? (
        <ErrorState error={audit.error} onRetry={() => audit.refetch()} />
      ) : audit.data.items.length === 0 ? (
        <Empty title="No entries">{filters.actor || filters.action ? 'Nothing matches these filters.' : 'No moderator or admin has acted yet.'}</Empty>
      ) : (
        <>
          {/* Below the md breakpoint each entry is a labelled card, and the caption wraps within the frame. */}
          <div className="rounded-md border border-rule bg-panel md:overflow-x-auto">
            <table className={`${cardTableClass} text-sm`}>
              <caption className="px-3 py-2 text-left text-muted max-md:block">
                Every moderator and admin action, newest first; refused attempts included. {audit.data.total} entries.
              </caption>
              <thead className="max-md:sr-only">
                <tr className="border-b border-rule text-left">
                  {['When', 'Who', 'What', 'On', 'Outcome', 'Why'].map((h) => (
                    <th key={h} scope="col" className="px-3 py-1.5">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className={cardBodyClass}>
                {audit.data.items.map((e) => (
                  <tr key={e.id} className={`border-b border-rule/60 align-top md:last:border-0 ${cardRowClass}`}>
                    <td data-label="When" className={`whitespace-nowrap px-3 py-1.5 ${cardCellClass}`}>{formatDateTime(e.at)}</td>
                    <td data-label="Who" className={`px-3 py-1.5 md:whitespace-nowrap ${cardCellClass}`}>@{e.actor?.handle}</td>
                    <td data-label="What" className={`px-3 py-1.5 ${cardCellClass}`}>{AUDIT_ACTION_LABELS[e.action] ?? e.action}</td>
                    <td data-label="On" className={`px-3 py-1.5 ${cardCellClass}`}>
                      <AuditSubject entry={e} />
                    </td>
                    <td data-label="Outcome" className={`px-3 py-1.5 ${cardCellClass}`}>{e.outcome === 'done' ? <Badge tone="accent">Done</Badge> : <Badge tone="caution">Refused</Badge>}</td>
                    <td data-label="Why" className={`px-3 py-1.5 max-md:col-span-2 ${cardCellClass}`}>
                      {e.reason}
                      {typeof e.details?.refusal === 'string' ? <span className="block text-muted">Refused: {e.details.refusal}</span> : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="flex gap-2">
            <Button variant="secondary" size="sm" disabled={page <= 1} onClick={() => go({ page: String(page - 1) })}>
              Newer
            </Button>
            <Button variant="secondary" size="sm" disabled={page * audit.data.pageSize >= audit.data.total} onClick={() => go({ page: String(page + 1) })}>
              Older
            </Button>
          </div>
        </>
      )}
    </div>
  );
}

/** The audit log (moderators): read-only, who did what, when and why. */
export default function AuditLogPage() {
  const mayRead = useCan('read:audit');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Audit log" lead="Every decision and change made by moderators and admins, with the reason given. Nobody can edit or remove an entry.">
        Audit log
      </PageTitle>
      <SignInRequired what="read the audit log" action="read:audit">
        {mayRead ? <AuditTable /> : null}
      </SignInRequired>
    </div>
  );
}
