import { formatDateTime } from '@/lib/format';
import type { Result } from '@/types/api';
import { useResultRevisions } from '../api/get-result-revisions';
import { ResultChanges } from './result-changes';

/** Every version of a result, newest first, each with what it changed; shown once a result was edited. */
export function ResultRevisions({ result }: { result: Result }) {
  const revisions = useResultRevisions(result.id);
  const items = revisions.data?.items ?? [];
  if (items.length < 2) return null;
  return (
    <section aria-labelledby={`versions-${result.id}`} className="flex flex-col gap-3">
      <h2 id={`versions-${result.id}`} className="text-xl font-semibold">
        Versions
      </h2>
      <ol className="flex flex-col gap-4">
        {items.map((r) => (
          <li key={r.number} className="rounded-md border border-rule bg-panel p-3">
            <p className="text-sm">
              <span className="font-semibold">Version {r.number}</span> · {r.statusLabel} · {formatDateTime(r.createdAt)}
              {r.author ? ` by @${r.author.handle}` : ''}
              {r.reviewedBy ? ` · decided by @${r.reviewedBy.handle}` : ''}
            </p>
            {r.note ? <p className="mt-1 text-sm whitespace-pre-line">Reviewer’s note: {r.note}</p> : null}
            {r.replaces !== null ? (
              <div className="mt-2">
                <ResultChanges changes={r.changes} caption={`Changes against version ${r.replaces}`} />
              </div>
            ) : (
              <p className="mt-1 text-sm text-muted">As first posted.</p>
            )}
          </li>
        ))}
      </ol>
    </section>
  );
}
