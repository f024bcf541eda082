import type { ReactNode } from 'react';

/** A list of labelled facts (term and value), stacked on a phone and in two columns wider up. */
export function Facts({ items }: { items: { term: string; value: ReactNode }[] }) {
  return (
    <dl className="rounded-md border border-rule bg-panel px-4">
      {items.map((item) => (
        <div
          key={item.term}
          className="grid grid-cols-1 gap-0.5 border-b border-rule/70 py-2 last:border-b-0 sm:grid-cols-[14rem_1fr] sm:gap-4"
        >
          <dt className="text-sm font-semibold text-muted">{item.term}</dt>
          <dd>{item.value}</dd>
        </div>
      ))}
    </dl>
  );
}
