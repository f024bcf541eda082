import { useState, type Ref } from 'react';
import { lengthText, toMillimetres, useLengthUnit, type LengthUnit } from '@/lib/lengths';
import { controlA11y, Field, Input } from './field';

const same = (a: number, b: number) => a === b || (Number.isNaN(a) && Number.isNaN(b));

/**
 * A length box of a form that holds millimetres (NaN while empty), shown and typed in the unit
 * the person chose (src/lib/lengths.ts). The form's value changes only when the person types:
 * switching units rewrites the text from that value, and switching back shows again what was
 * typed, so mm → in → mm gives back exactly what was entered.
 */
export function LengthBox({
  id,
  label,
  hint,
  error,
  valueMm,
  onChangeMm,
  onBlur,
  inputRef,
}: {
  id: string;
  /** The label without its unit: "(mm)" or "(in)" is added. */
  label: string;
  hint?: string;
  error?: string;
  valueMm: number | undefined;
  onChangeMm: (mm: number) => void;
  onBlur?: () => void;
  /** The form's ref, so an error can move the focus here. */
  inputRef?: Ref<HTMLInputElement>;
}) {
  const [unit] = useLengthUnit();
  const [typed, setTyped] = useState<{ text: string; unit: LengthUnit; mm: number } | null>(null);
  const mm = valueMm ?? Number.NaN;
  const ownText = typed && same(typed.mm, mm) ? typed : null;
  const text = ownText && (ownText.unit === unit || !Number.isFinite(mm)) ? ownText.text : Number.isFinite(mm) ? lengthText(mm, unit) : '';
  return (
    <Field id={id} label={`${label} (${unit})`} hint={hint} error={error}>
      <Input
        {...controlA11y(id, { hint, error })}
        ref={inputRef}
        value={text}
        inputMode="decimal"
        autoComplete="off"
        onBlur={onBlur}
        onChange={(e) => {
          const next = toMillimetres(e.target.value, unit);
          setTyped({ text: e.target.value, unit, mm: next });
          onChangeMm(next);
        }}
      />
    </Field>
  );
}
