import { useEffect, useRef, type ReactNode } from 'react';

/** Which of a row's buttons opened its panel, and gets the focus back when it closes. */
export type RowButton = 'results' | 'pair';

/** The row's button of that kind (marked with `data-row-button` and `data-cell`), if drawn. */
function rowButton(kind: RowButton, cell: string): HTMLElement | null {
  return document.querySelector<HTMLElement>(`button[data-row-button="${kind}"][data-cell="${CSS.escape(cell)}"]`);
}

/**
 * A panel drawn under the comparison row it belongs to (inside the `<td colSpan>` of the table's
 * next row). Opened by a press, it scrolls its row to the top of the window, so the row's steel,
 * material and grit band stay in view above it, and moves the focus to its heading; Escape
 * anywhere inside closes it, and the focus goes back to the row's button that opened it (unless the
 * reader had already moved it elsewhere). Its width is the cell's: a wide table inside scrolls in its own frame
 * instead of widening the comparison (`contain: inline-size`).
 */
export function RowPanel({ cell, opener, focusOnOpen, onClose, children }: { cell: string; opener: RowButton; focusOnOpen: boolean; onClose: () => void; children: ReactNode }) {
  const ref = useRef<HTMLDivElement>(null);
  // Only when the panel first opens and closes: a later render (its data arriving) leaves the reader where they are.
  useEffect(() => {
    const el = ref.current;
    if (focusOnOpen && el) {
      el.closest('tr')?.previousElementSibling?.scrollIntoView({ block: 'start' });
      el.querySelector<HTMLElement>('h2')?.focus({ preventScroll: true });
    }
    return () => {
      const active = document.activeElement;
      if (!active || active === document.body || el?.contains(active)) rowButton(opener, cell)?.focus();
    };
  }, []);
  return (
    <div
      ref={ref}
      className="[contain:inline-size]"
      onKeyDown={(e) => {
        if (e.key === 'Escape') {
          e.stopPropagation();
          onClose();
        }
      }}
    >
      {children}
    </div>
  );
}
