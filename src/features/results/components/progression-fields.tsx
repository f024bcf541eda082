import { useFieldArray, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { PROGRESSION_MAX } from '@shared/progression';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, controlA11y } from '@/components/ui/field';
import type { AbrasiveSummary } from '@/types/api';
import type { ResultInput } from '@shared/schemas/result';
import { initialBoxes, type ProgressionFormStep, type ResultFormValues } from './result-form-values';

/**
 * The steps before the final abrasive: add, remove and reorder them with buttons (each a real
 * button, so the keyboard reaches them in order). A step's grit is optional (the abrasive's own
 * when empty), so is its angle.
 */
export function ProgressionFields({ control, register, errors, abrasives }: { control: Control<ResultFormValues, unknown, ResultInput>; register: UseFormRegister<ResultFormValues>; errors: FieldErrors<ResultFormValues>; abrasives: AbrasiveSummary[] }) {
  const { fields, append, remove, move } = useFieldArray({ control, name: 'progression' });
  return (
    <fieldset className="rounded-md border border-rule bg-panel px-4 pb-4 pt-2">
      <legend className="px-1 font-serif text-lg font-semibold">
        Progression <span className="ml-2 font-sans text-sm font-normal text-muted">optional: the steps before the final abrasive, coarse to fine</span>
      </legend>
      <ol className="mt-2 flex flex-col gap-3" aria-label="Steps before the final abrasive">
        {fields.map((field, i) => {
          const e = errors.progression?.[i];
          const abrasiveError = e?.abrasive?.message;
          const gritError = e?.gritGrade?.message;
          const angleError = e?.perSideDeg?.message;
          return (
            <li key={field.id} className="grid gap-3 rounded-md border border-rule p-3 sm:grid-cols-[2fr_1fr_1fr]">
              <Field id={`step-${i}-abrasive`} label={`Step ${i + 1}: abrasive`} error={abrasiveError}>
                <Select {...controlA11y(`step-${i}-abrasive`, { error: abrasiveError })} {...register(`progression.${i}.abrasive`)}>
                  <option value="">Choose an abrasive…</option>
                  {abrasives.map((a) => (
                    <option key={a.slug} value={a.slug}>
                      {a.name}
                    </option>
                  ))}
                </Select>
              </Field>
              <Field id={`step-${i}-grit`} label="Grit" aside="optional" error={gritError}>
                <Input {...controlA11y(`step-${i}-grit`, { error: gritError })} placeholder="e.g. F80, B126" {...register(`progression.${i}.gritGrade`)} />
              </Field>
              <Field id={`step-${i}-angle`} label="Angle per side, °" aside="optional" error={angleError}>
                <Input {...controlA11y(`step-${i}-angle`, { error: angleError })} type="number" inputMode="decimal" step={0.5} {...register(`progression.${i}.perSideDeg`, { valueAsNumber: true })} />
              </Field>
              <div className="flex flex-wrap gap-2 sm:col-span-3">
                <Button size="sm" variant="secondary" disabled={i === 0} onClick={() => move(i, i - 1)} aria-label={`Move step ${i + 1} earlier`}>
                  Earlier
                </Button>
                <Button size="sm" variant="secondary" disabled={i === fields.length - 1} onClick={() => move(i, i + 1)} aria-label={`Move step ${i + 1} later`}>
                  Later
                </Button>
                <Button size="sm" variant="quiet" onClick={() => remove(i)} aria-label={`Remove step ${i + 1}`}>
                  Remove
                </Button>
              </div>
            </li>
          );
        })}
      </ol>
      <div className="mt-3">
        <Button size="sm" variant="secondary" disabled={fields.length >= PROGRESSION_MAX} onClick={() => append(initialBoxes({ abrasive: '', gritGrade: '', perSideDeg: Number.NaN }) as ProgressionFormStep)}>
          Add a step{fields.length >= PROGRESSION_MAX ? ` (at most ${PROGRESSION_MAX})` : ''}
        </Button>
      </div>
    </fieldset>
  );
}
