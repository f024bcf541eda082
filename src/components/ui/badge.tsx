import type { ReactNode } from 'react';

export type BadgeTone = 'neutral' | 'accent' | 'caution' | 'danger';

const tones: Record<BadgeTone, string> = {
  neutral: 'border-rule bg-paper text-muted',
  accent: 'border-accent/40 bg-accent-soft text-accent-strong',
  caution: 'border-caution/40 bg-caution-soft text-caution',
  danger: 'border-danger/40 bg-danger-soft text-danger',
};

/** A short text label; the words carry the meaning, the colour only supports them. */
export function Badge({ tone = 'neutral', children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center whitespace-nowrap rounded border px-1.5 py-0.5 text-xs font-semibold ${tones[tone]}`}>
      {children}
    </span>
  );
}
