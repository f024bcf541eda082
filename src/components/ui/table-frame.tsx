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
