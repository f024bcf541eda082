import type { ReactNode } from 'react';

/** A plainly worded safety note; it defers to the maker's instructions and local rules. */
export function Caution({ title = 'Work safely', children }: { title?: string; children: ReactNode }) {
  return (
    <aside aria-label={title} className="rounded-md border-l-4 border-caution bg-caution-soft px-4 py-3">
      <p className="font-semibold text-caution">{title}</p>
      <div className="mt-1 text-sm">{children}</div>
    </aside>
  );
}
