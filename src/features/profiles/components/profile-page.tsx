import { Link, useParams } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDate, formatDegrees, formatGrams, formatNumber } from '@/lib/format';
import { Badge } from '@/components/ui/badge';
import { Facts } from '@/components/ui/facts';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useProfile } from '../api/get-profile';

/** A member's public profile: handle, badge, counts, methods and steels, newest published results. */
export default function ProfilePage() {
  const { handle = '' } = useParams();
  const profile = useProfile(handle);
  if (profile.isPending) return <Loading label="Loading the profile…" />;
  if (profile.isError) return <ErrorState error={profile.error} onRetry={() => profile.refetch()} />;
  const p = profile.data;
  return (
    <article className="flex flex-col gap-6">
      <PageTitle title={p.displayName} lead={p.bio ?? undefined}>
        {p.displayName} <span className="font-sans text-xl font-normal text-muted">@{p.handle}</span>{' '}
        {p.badge ? <Badge tone="accent">{p.badge.workshop ? `Publisher · ${p.badge.workshop}` : 'Publisher'}</Badge> : null}
      </PageTitle>
      <Facts
        items={[
          { term: 'Role', value: p.role },
          { term: 'Member since', value: formatDate(p.joinedAt) },
          { term: 'Published results', value: formatNumber(p.counts.published, 0) },
          { term: 'Withdrawn by them', value: formatNumber(p.counts.withdrawn, 0) },
          ...(p.badge?.link ? [{ term: 'Workshop or lab', value: <a href={p.badge.link} rel="nofollow noopener noreferrer">{p.badge.link}</a> }] : []),
        ]}
      />
      <section aria-labelledby="methods" className="flex flex-col gap-2">
        <h2 id="methods" className="text-xl font-semibold">
          Methods they measure with
        </h2>
        {p.methods.length ? (
          <ul className="list-disc pl-6">
            {p.methods.map((m) => (
              <li key={m.slug}>
                <Link to={paths.method.getHref(m.slug)}>{m.name}</Link> · {m.results} result{m.results === 1 ? '' : 's'}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-muted">No published results yet.</p>
        )}
      </section>
      {p.steels.length ? (
        <section aria-labelledby="steels" className="flex flex-col gap-2">
          <h2 id="steels" className="text-xl font-semibold">
            Steels they test
          </h2>
          <ul className="flex flex-wrap gap-x-4 gap-y-1">
            {p.steels.map((s) => (
              <li key={s.slug}>
                <Link to={paths.steel.getHref(s.slug)}>{s.name}</Link> ({s.results})
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <section aria-labelledby="recent" className="flex flex-col gap-2">
        <h2 id="recent" className="text-xl font-semibold">
          Newest published results
        </h2>
        {p.recent.length ? (
          <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
            {p.recent.map((r) => (
              <li key={r.id} className="px-4 py-2">
                <Link to={paths.result.getHref(r.id)}>
                  #{r.id}: {r.steelName} on {r.abrasiveName}
                </Link>{' '}
                <span className="text-sm text-muted">
                  {formatNumber(r.derived.hrc, 1)} HRC · {formatDegrees(r.derived.perSideDeg)} per side · median {formatGrams(r.derived.sharpnessMedianG)}
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <Empty title="Nothing published yet" />
        )}
        {p.recent.length ? (
          <p className="text-sm">
            <a href={`/api/v1/profiles/${encodeURIComponent(p.handle)}/results.csv`} download>
              Download as CSV
            </a>
          </p>
        ) : null}
      </section>
    </article>
  );
}
