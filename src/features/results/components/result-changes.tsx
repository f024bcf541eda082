import type { ResultFieldChange } from '@/types/api';

/**
 * What a revision changes, field by field: the value it replaces and the new one, marked as
 * removed and added in words as well as colour. Wide values wrap; the table never scrolls.
 */
export function ResultChanges({ changes, caption }: { changes: ResultFieldChange[]; caption: string }) {
  if (!changes.length) return <p className="text-sm text-muted">No entered value changes.</p>;
  return (
    <table className="w-full table-fixed border-collapse text-sm">
      <caption className="mb-1 text-left font-semibold">{caption}</caption>
      <thead>
        <tr className="border-b border-rule text-left text-muted">
          <th scope="col" className="w-1/4 py-1 pr-2 font-medium">Field</th>
          <th scope="col" className="py-1 pr-2 font-medium">Was</th>
          <th scope="col" className="py-1 font-medium">Becomes</th>
        </tr>
      </thead>
      <tbody>
        {changes.map((c) => (
          <tr key={c.path} className="border-b border-rule align-top">
            <th scope="row" className="py-1 pr-2 text-left font-medium break-words">{c.label}</th>
            <td className="py-1 pr-2 break-words">
              {c.before === null ? <span className="text-muted">(none)</span> : <del className="bg-danger-soft decoration-danger">{c.before}</del>}
            </td>
            <td className="py-1 break-words">
              {c.after === null ? <span className="text-muted">(none)</span> : <ins className="bg-accent-soft no-underline">{c.after}</ins>}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
