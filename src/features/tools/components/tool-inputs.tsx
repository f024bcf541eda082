import { useMemo, useState, type ReactNode } from 'react';
import { ComputationError } from '@shared/computation-error';
import type { EdgeAngle } from '@shared/geometry';
import { Field, Input, controlA11y } from '@/components/ui/field';
import { Facts } from '@/components/ui/facts';
import { formatDegrees } from '@/lib/format';
import { formatLength, lengthsIn, lengthText, toMillimetres, useLengthUnit, type LengthUnit } from '@/lib/lengths';

export type Outcome<T> = { value: T; error?: undefined; field?: undefined } | { value?: undefined; error: string; field?: string };

/** Run a computation; a ComputationError becomes a message for the field it names, its lengths in `unit`. */
export function attempt<T>(run: () => T, unit: LengthUnit = 'mm'): Outcome<T> {
  try {
    return { value: run() };
  } catch (err) {
    if (err instanceof ComputationError) return { error: lengthsIn(err.message, unit), field: err.field };
    throw err;
  }
}

/** A typed number, accepting a decimal comma; NaN when the box is empty or not a number. */
export function toNumber(text: string): number {
  const t = text.trim().replace(',', '.');
  return t === '' ? Number.NaN : Number(t);
}

const mapValues = <F extends string, A, B>(o: Record<F, A>, f: (a: A) => B) => Object.fromEntries(Object.entries(o).map(([k, v]) => [k, f(v as A)])) as Record<F, B>;

/**
 * A tool's length boxes in the unit the person chose (src/lib/lengths.ts): the typed text, the
 * values in mm the computations take, the boxes not yet a number, and a setter. When the unit changes, what was typed is
 * rewritten in the new unit, so the setup stays the same one.
 */
export function useLengthBoxes<F extends string>(initialMm: Record<F, number>) {
  const [unit] = useLengthUnit();
  // `exact`: the length in mm a box's text was written from, kept until the person types in it, so
  // that switching units and back gives the same millimetres, not a rounded inch.
  const [state, setState] = useState(() => ({ unit, text: mapValues(initialMm, (mm) => lengthText(mm, unit)), exact: { ...initialMm } as Partial<Record<F, number>> }));
  let current = state;
  if (state.unit !== unit) {
    const mmOf = (field: F) => state.exact[field] ?? toMillimetres(state.text[field], state.unit);
    const fields = Object.keys(state.text) as F[];
    current = {
      unit,
      text: Object.fromEntries(fields.map((f) => [f, Number.isFinite(mmOf(f)) ? lengthText(mmOf(f), unit) : state.text[f]])) as Record<F, string>,
      exact: Object.fromEntries(fields.filter((f) => Number.isFinite(mmOf(f))).map((f) => [f, mmOf(f)])) as Partial<Record<F, number>>,
    };
    setState(current);
  }
  const { mm, missing } = useMemo(() => {
    const values = Object.fromEntries((Object.keys(current.text) as F[]).map((f) => [f, current.exact[f] ?? toMillimetres(current.text[f], unit)])) as Record<F, number>;
    return { mm: values, missing: (Object.keys(values) as F[]).filter((k) => !Number.isFinite(values[k])) };
  }, [current.text, current.exact, unit]);
  return {
    unit,
    text: current.text,
    /** The values in mm (NaN where a box is empty or not a number) and the boxes that are so. */
    mm,
    missing,
    set: (field: F, value: string) => setState((s) => ({ ...s, text: { ...s.text, [field]: value }, exact: { ...s.exact, [field]: undefined } })),
  };
}

/** A drawing of a setup in its frame, or what it waits for, with its caption. */
export function DrawingFigure({ children, waiting, caption }: { children: ReactNode | null; waiting: string; caption: string }) {
  return (
    <figure className="min-w-0 rounded-md border border-rule bg-panel p-3">
      {children ?? <p className="p-6 text-muted">{waiting}</p>}
      <figcaption className="mt-2 text-sm text-muted">{caption}</figcaption>
    </figure>
  );
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
  unit: LengthUnit | '°';
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
 * A setup's measurements (each a number box in the chosen unit) beside a drawing, with the angle they grind:
 * the top section of the angle tools.
 */
export function SetupSection<F extends string>({
  id,
  unit,
  labels,
  text,
  onChange,
  errorFor,
  angle,
  drawing,
}: {
  id: string;
  unit: LengthUnit;
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
              unit={unit}
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

/** A fact of the "angle you want" section: a length in the chosen unit and what it keeps, or why there is none. */
export function lengthFact(term: string, mm: number | undefined, error: string | undefined, keeping: string, unit: LengthUnit) {
  return {
    term,
    value:
      mm !== undefined ? (
        <span>
          <strong className="font-semibold">{formatLength(mm, unit)}</strong> <span className="text-muted">{keeping}</span>
        </span>
      ) : (
        <span className="text-danger">{error}</span>
      ),
  };
}

/** "The gap for the angle you want": the wanted angle's box beside what it takes (hidden while the angle itself is refused). */
export function WantedAngleSection({
  id,
  title,
  wantedText,
  onChange,
  error,
  children,
}: {
  id: string;
  title: string;
  wantedText: string;
  onChange: (v: string) => void;
  error: string | undefined;
  children: ReactNode;
}) {
  return (
    <section aria-labelledby={`${id}-inverse`} className="flex flex-col gap-4">
      <h2 id={`${id}-inverse`} className="text-2xl font-semibold">
        {title}
      </h2>
      <div className="grid gap-4 md:grid-cols-[16rem_1fr] md:items-start">
        <NumberField id={`${id}-wanted`} label="Wanted angle per side" unit="°" value={wantedText} onChange={onChange} error={error} />
        {error ? null : children}
      </div>
    </section>
  );
}
