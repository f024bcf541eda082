import type { ReactNode } from 'react';

/**
 * The frame every table sits in: on a narrow screen it scrolls sideways inside its own box
 * (keyboard-scrollable, named for screen readers) instead of squeezing the columns; it is
 * positioned, so visually hidden text inside it (sr-only) cannot widen the page.
 */
export function TableFrame({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className="relative overflow-x-auto rounded-md border border-rule bg-panel">
      {children}
    </div>
  );
}

export const thClass = 'border-b border-rule bg-paper px-3 py-2 text-left align-bottom text-sm font-semibold text-muted';
export const tdClass = 'border-b border-rule/70 px-3 py-2 align-top';

/**
 * A table drawn as cards below the md breakpoint (as the comparison's, decision 028): the table
 * `cardTableClass`, its thead `max-md:sr-only`, its tbody `cardBodyClass`, each row `cardRowClass`
 * and each cell `cardCellClass` with `data-label` naming its column.
 */
export const cardTableClass = 'w-full border-collapse max-md:block';
export const cardBodyClass = 'max-md:flex max-md:flex-col max-md:gap-3 max-md:p-3';
export const cardRowClass = 'max-md:grid max-md:grid-cols-2 max-md:gap-x-3 max-md:gap-y-2 max-md:rounded-md max-md:border max-md:border-rule max-md:p-3';
export const cardCellClass = 'max-md:border-0 max-md:p-0 max-md:before:block max-md:before:text-xs max-md:before:text-muted max-md:before:content-[attr(data-label)]';
