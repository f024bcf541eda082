import { Link } from 'react-router-dom';
import { atLeast } from '@shared/permissions';
import { paths } from '@/config/paths';
import { formatDate } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { ErrorState, Loading } from '@/components/ui/states';
import type { Result } from '@/types/api';
import { useMe } from '../api/get-me';
import { NotificationSettings } from './notification-settings';
import { PublisherApplication } from './application-form';
import { TokensPanel } from './tokens-panel';

function ResultList({ id, title, results, empty, showNote }: { id: string; title: string; results: Result[]; empty?: string; showNote?: boolean }) {
  if (!results.length && !empty) return null;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-2">
      <h2 id={id} className="text-xl font-semibold">
        {title} <span className="font-sans text-base font-normal text-muted">({results.length})</span>
      </h2>
      {results.length ? (
        <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
          {results.map((r) => (
            <li key={r.id} className="px-4 py-2">
              <Link to={paths.result.getHref(r.id)} className="font-semibold">
                #{r.id}: {r.steelName} on {r.abrasiveName}
              </Link>{' '}
              <span className="text-sm text-muted">{formatDate(r.updatedAt)}</span>
              {showNote && r.review?.note ? (
                <p className="mt-1 border-l-2 border-caution pl-3">
                  <span className="text-sm font-semibold">Moderator’s note:</span> {r.review.note}
                </p>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-muted">{empty}</p>
      )}
    </section>
  );
}

/**
 * The member's own page beyond the list of results: what needs their attention (returned
 * results with the moderator's notes, drafts, pending), imports, followed pages, e-mail
 * settings, the publisher application and, for publishers, API tokens.
 */
export function OwnPageSections() {
  const me = useMe();
  if (me.isPending) return <Loading label="Loading your page…" />;
  if (me.isError) return <ErrorState error={me.error} onRetry={() => me.refetch()} />;
  const m = me.data;
  const staff = atLeast(m.account.role, 'moderator');
  return (
    <div className="flex flex-col gap-8">
      <p className="flex flex-wrap items-center gap-2">
        {m.account.badge ? <Badge tone="accent">{m.account.badge.workshop ? `Publisher · ${m.account.badge.workshop}` : 'Publisher'}</Badge> : null}
        <Link to={paths.profile.getHref(m.account.handle)}>Your public profile</Link>
        {m.can.import ? (
          <>
            {' · '}
            <Link to={paths.importResults.getHref()}>Import results</Link>
          </>
        ) : null}
        {staff ? (
          <>
            {' · '}
            <Link to={paths.audit.getHref()}>Audit log</Link>
          </>
        ) : null}
        {m.account.role === 'admin' ? (
          <>
            {' · '}
            <Link to={paths.publisherApplications.getHref()}>Publisher applications</Link>
            {' · '}
            <Link to={paths.devMail.getHref()}>Mail catcher</Link>
          </>
        ) : null}
      </p>
      <ResultList id="returned" title="Changes asked" results={m.returned} showNote />
      <ResultList id="drafts" title="Drafts" results={m.drafts} />
      <ResultList id="pending" title="Awaiting review" results={m.pending} />
      {m.imports.length ? (
        <section aria-labelledby="imports" className="flex flex-col gap-2">
          <h2 id="imports" className="text-xl font-semibold">
            Your imports
          </h2>
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {m.imports.map((b) => (
              <li key={b.id} className="px-4 py-2">
                Import #{b.id}, {formatDate(b.createdAt)}: {b.rows} rows, {b.pending ? `${b.pending} awaiting review` : 'all decided'}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="following-heading" id="following" className="flex flex-col gap-2">
        <h2 id="following-heading" className="text-xl font-semibold">
          Pages you follow
        </h2>
        {m.following.length ? (
          <ul className="flex flex-wrap gap-2">
            {m.following.map((f) => (
              <li key={`${f.pageType}:${f.slug}`}>
                <Link to={f.pageType === 'steel' ? paths.steel.getHref(f.slug) : paths.abrasive.getHref(f.slug)}>{f.name}</Link>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">Follow a steel or abrasive page to get a weekly e-mail of new results on it.</p>
        )}
      </section>
      <NotificationSettings settings={m.notifications} hasEmail={m.account.hasEmail} />
      <PublisherApplication application={m.application} mayApply={m.can.apply} />
      {m.can.tokens ? <TokensPanel tokens={m.tokens} /> : null}
    </div>
  );
}
