import { ComputationError } from '@shared/computation-error';
import { Field, Input, controlA11y } from '@/components/ui/field';
import { formatNumber } from '@/lib/format';

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

