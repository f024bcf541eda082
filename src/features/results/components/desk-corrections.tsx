import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import type { DeskCorrection, Result } from '@/types/api';
import { ResultChanges } from './result-changes';
import { ReviewDecisionForm } from './review-decision-form';

/**
 * Corrections of published results waiting on the desk, each as the changes against the
 * published version (which stays in the comparison until the correction is approved).
 */
export function DeskCorrections({ items, onDecided }: { items: DeskCorrection[]; onDecided: (result: Result, decision: string, what: string) => void }) {
  if (!items.length) return null;
  return (
    <section aria-labelledby="corrections" className="flex flex-col gap-3">
      <h2 id="corrections" className="text-xl font-semibold">
        Corrections of published results <span className="font-sans text-base font-normal text-muted">({items.length})</span>
      </h2>
      <ol className="flex flex-col gap-4">
        {items.map((c) => (
          <li key={`${c.result.id}:${c.number}`} className="flex min-w-0 flex-col gap-3 rounded-md border border-rule bg-panel p-4">
            <h3 className="text-lg font-semibold">
              <Link to={paths.result.getHref(c.result.id)}>
                Result {c.result.id}: {c.result.steelName} on {c.result.abrasiveName}
              </Link>
            </h3>
            <p className="text-sm text-muted">
              Version {c.number} by @{c.author?.handle ?? 'unknown'}, {formatDateTime(c.createdAt)}. The published version stays in the comparison until you approve.
            </p>
            <ResultChanges changes={c.changes} caption="Changes against the published version" />
            {c.can.review ? (
              <ReviewDecisionForm
                key={`${c.result.id}:${c.number}`}
                result={c.result}
                revision={c.number}
                onDecided={(r, decision) => onDecided(r, decision, `Correction (version ${c.number}) of result ${r.id}`)}
              />
            ) : (
              <p className="text-muted">You cannot review a correction of your own result; another moderator will.</p>
            )}
          </li>
        ))}
      </ol>
    </section>
  );
}
