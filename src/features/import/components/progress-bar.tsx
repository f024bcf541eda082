/** A labelled progress bar; without `value` it shows that work goes on without a known end. */
export function ProgressBar({ label, value }: { label: string; value?: number }) {
  const pct = value === undefined ? undefined : Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <div className="flex flex-col gap-1">
      <div className="flex justify-between text-sm">
        <span>{label}</span>
        {pct !== undefined ? <span className="tabular-nums text-muted">{pct} %</span> : null}
      </div>
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-2 overflow-hidden rounded bg-paper">
        <div className={`h-full bg-accent ${pct === undefined ? 'w-1/3 animate-pulse' : ''}`} style={pct === undefined ? undefined : { width: `${pct}%` }} />
      </div>
    </div>
  );
}
