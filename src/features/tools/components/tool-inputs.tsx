import type { ReactNode } from 'react';
import { ComputationError } from '@shared/computation-error';
import type { EdgeAngle } from '@shared/geometry';
import { Field, Input, controlA11y } from '@/components/ui/field';
import { Facts } from '@/components/ui/facts';
import { formatDegrees, formatNumber } from '@/lib/format';

export type Outcome<T> = { value: T; error?: undefined; field?: undefined } | { value?: undefined; error: string; field?: string };

/** Run a computation; a ComputationError becomes a message for the field it names. */
export function attempt<T>(run: () => T): Outcome<T> {
  try {
    return { value: run() };
  } catch (err) {
    if (err instanceof ComputationError) return { error: err.message, field: err.field };
    throw err;
  }
}

/** A typed number, accepting a decimal comma; NaN when the box is empty or not a number. */
export function toNumber(text: string): number {
  const t = text.trim().replace(',', '.');
  return t === '' ? Number.NaN : Number(t);
}

export function mm(value: number, digits = 1): string {
  return `${formatNumber(value, digits)}\u00a0mm`;
}

/** A labelled number box in millimetres or degrees, with its error underneath. */
export function NumberField({
  id,
  label,
  unit,
  hint,
  value,
  onChange,
  error,
}: {
  id: string;
  label: string;
  unit: 'mm' | '°';
  hint?: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
}) {
  return (
    <Field id={id} label={`${label} (${unit})`} hint={hint} error={error}>
      <Input
        {...controlA11y(id, { hint, error })}
        value={value}
        onChange={(e) => onChange(e.target.value)}
        inputMode="decimal"
        autoComplete="off"
      />
    </Field>
  );
}


/**
 * A setup's measurements (each a number box in mm) beside a drawing, with the angle they grind:
 * the top section of the angle tools.
 */
export function SetupSection<F extends string>({
  id,
  labels,
  text,
  onChange,
  errorFor,
  angle,
  drawing,
}: {
  id: string;
  labels: Record<F, { label: string; hint: string }>;
  text: Record<F, string>;
  onChange: (field: F, value: string) => void;
  errorFor: (field: F) => string | undefined;
  angle: EdgeAngle | undefined;
  drawing: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-setup`} className="grid gap-6 lg:grid-cols-[1fr_1fr]">
      <div className="flex min-w-0 flex-col gap-4">
        <h2 id={`${id}-setup`} className="text-2xl font-semibold">
          Your setup
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          {(Object.keys(labels) as F[]).map((field) => (
            <NumberField
              key={field}
              id={`${id}-${field}`}
              label={labels[field].label}
              unit="mm"
              hint={labels[field].hint}
              value={text[field]}
              onChange={(v) => onChange(field, v)}
              error={errorFor(field)}
            />
          ))}
        </div>
        <div aria-live="polite">
          {angle ? (
            <Facts
              items={[
                { term: 'Angle per side', value: <strong className="text-xl font-semibold">{formatDegrees(angle.perSideDeg)}</strong> },
                { term: 'Inclusive angle', value: formatDegrees(angle.inclusiveDeg) },
              ]}
            />
          ) : null}
        </div>
      </div>
      {drawing}
    </section>
  );
}
