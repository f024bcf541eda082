import { useMemo, useState } from 'react';
import { diffRevisions, type DiffRow, type DiffSegment } from '@shared/page-diff';
import type { PageContent, PageType } from '@shared/schemas/pages';

function Segments({ segments }: { segments: DiffSegment[] | null }) {
  if (!segments) return null;
  return (
    <>
      {segments.map((s, i) =>
        s.change === 'added' ? (
          <ins key={i} className="rounded-sm bg-accent-soft px-0.5 font-semibold text-accent-strong no-underline">
            {s.text}
          </ins>
        ) : s.change === 'removed' ? (
          <del key={i} className="rounded-sm bg-danger-soft px-0.5 text-danger">
            {s.text}
          </del>
        ) : (
          <span key={i}>{s.text}</span>
        ),
      )}
    </>
  );
}

const rowTone: Record<DiffRow['kind'], string> = {
  same: '',
  changed: 'bg-caution-soft/40',
  added: 'bg-accent-soft/40',
  removed: 'bg-danger-soft/40',
};
const kindWords: Record<DiffRow['kind'], string> = { same: 'unchanged', changed: 'changed', added: 'added', removed: 'removed' };

/** Rows of a side-by-side diff; runs of unchanged lines fold to a count unless `full`. */
function Rows({ rows, full }: { rows: DiffRow[]; full: boolean }) {
  const out: React.ReactNode[] = [];
  let i = 0;
  while (i < rows.length) {
    const r = rows[i];
    if (!full && r.kind === 'same') {
      let j = i;
      while (j < rows.length && rows[j].kind === 'same') j++;
      const run = j - i;
      // Keep one line of context on each side of a change; fold the rest.
      if (run > 2) {
        const keepStart = i > 0 ? 1 : 0;
        const keepEnd = j < rows.length ? 1 : 0;
        for (let k = i; k < i + keepStart; k++) out.push(<Row key={k} row={rows[k]} />);
        out.push(
          <tr key={`fold-${i}`}>
            <td colSpan={2} className="border-b border-rule/60 px-3 py-1 text-center text-sm text-muted">
              {run - keepStart - keepEnd} unchanged line{run - keepStart - keepEnd === 1 ? '' : 's'}
            </td>
          </tr>,
        );
        for (let k = j - keepEnd; k < j; k++) out.push(<Row key={k} row={rows[k]} />);
        i = j;
        continue;
      }
    }
    out.push(<Row key={i} row={r} />);
    i++;
  }
  return <>{out}</>;
}

function Row({ row }: { row: DiffRow }) {
  return (
    <tr className={rowTone[row.kind]}>
      <td className="w-1/2 border-b border-r border-rule/60 px-3 py-1.5 align-top whitespace-pre-wrap">
        <span className="sr-only">{kindWords[row.kind]}: </span>
        <Segments segments={row.before} />
      </td>
      <td className="w-1/2 border-b border-rule/60 px-3 py-1.5 align-top whitespace-pre-wrap">
        <Segments segments={row.after} />
      </td>
    </tr>
  );
}

/**
 * Two revisions of a page side by side: each changed field, then the body's text, with added
 * words marked (ins) on the right and removed ones (del) on the left. Computed in the browser
 * with the same shared diff the server uses.
 */
export function RevisionDiff({
  type,
  before,
  after,
  beforeLabel,
  afterLabel,
}: {
  type: PageType;
  before: PageContent;
  after: PageContent;
  beforeLabel: string;
  afterLabel: string;
}) {
  const diff = useMemo(() => diffRevisions(type, before, after), [type, before, after]);
  const [full, setFull] = useState(false);
  if (diff.changed.length === 0) return <p className="text-muted">These two revisions have the same content.</p>;
  const head = (
    <thead>
      <tr>
        <th scope="col" className="border-b border-rule px-3 py-2 text-left text-sm font-semibold text-muted">
          {beforeLabel}
        </th>
        <th scope="col" className="border-b border-rule px-3 py-2 text-left text-sm font-semibold text-muted">
          {afterLabel}
        </th>
      </tr>
    </thead>
  );
  return (
    <div className="flex flex-col gap-6">
      {diff.fields.length ? (
        <section aria-labelledby="diff-fields" className="flex flex-col gap-3">
          <h3 id="diff-fields" className="text-lg font-semibold">
            Fields changed
          </h3>
          {diff.fields.map((f) => (
            <div key={f.field} className="overflow-x-auto rounded-md border border-rule bg-panel">
              <table className="w-full border-collapse text-[0.95rem]" aria-label={`Changes to ${f.label}`}>
                <caption className="px-3 py-2 text-left font-semibold">{f.label}</caption>
                {head}
                <tbody>
                  <Rows rows={f.rows} full />
                </tbody>
              </table>
            </div>
          ))}
        </section>
      ) : null}
      {diff.changed.includes('body') ? (
        <section aria-labelledby="diff-body" className="flex flex-col gap-3">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h3 id="diff-body" className="text-lg font-semibold">
              Text
            </h3>
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={full} onChange={(e) => setFull(e.target.checked)} /> Show unchanged lines
            </label>
          </div>
          <div className="overflow-x-auto rounded-md border border-rule bg-panel">
            <table className="w-full border-collapse text-[0.95rem]" aria-label="Changes to the text">
              {head}
              <tbody>
                <Rows rows={diff.body} full={full} />
              </tbody>
            </table>
          </div>
        </section>
      ) : null}
    </div>
  );
}
