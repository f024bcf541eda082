/**
 * Edgeledger's wordmark: a bevel seen end-on (two flanks meeting at the apex) standing on a
 * ledger rule, beside the name set in Literata. Drawn here; the favicon uses the same glyph.
 */
export function WordmarkGlyph({ className = 'h-7 w-7' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="6" className="fill-accent" />
      <path d="M16 6 L23 22 L9 22 Z" className="fill-paper" />
      <path d="M16 6 L16 22" stroke="currentColor" strokeWidth="1.2" className="text-accent-strong" />
      <rect x="6" y="24.5" width="20" height="2" rx="1" className="fill-paper" />
    </svg>
  );
}

/** The glyph and the name, as one link-able unit. */
export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <WordmarkGlyph />
      <span className="font-serif text-xl font-semibold tracking-tight text-ink">Edgeledger</span>
    </span>
  );
}
