import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { PROGRESSION_MAX, coarserAfterFiner } from '@shared/progression';
import { formatMicrometres } from '@/lib/format';
import { parseGrit } from '@shared/grit';
import type { Coolant } from '@shared/vocabulary';
import { progressionCoolant, type CoolantChange, type CoolantStep } from '@shared/workshop';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, controlA11y, PageOptions } from '@/components/ui/field';
import type { AbrasiveSummary } from '@/types/api';
import { CoolantCaution, coolantWord } from '@/features/workshop/components/coolant-caution';
import type { ResultInput } from '@shared/schemas/result';
import { initialBoxes, type ProgressionFormStep, type ResultFormValues } from './result-form-values';

/** Focuses the element with `id` once React has drawn the change that made or moved it. */
const focusSoon = (id: string) => requestAnimationFrame(() => document.getElementById(id)?.focus());

/**
 * The steps before the final abrasive: add, remove and reorder them with buttons (each a real
 * button, so the keyboard reaches them in order). The focus follows the step: onto a new step's
 * abrasive, onto the moved step's same button (its abrasive when that button is now disabled),
 * onto the next step (or "Add a step") after a removal. A step's grit is optional (the
 * abrasive's own when empty), so is its angle.
 */
export function ProgressionFields({ control, register, errors, abrasives }: { control: Control<ResultFormValues, unknown, ResultInput>; register: UseFormRegister<ResultFormValues>; errors: FieldErrors<ResultFormValues>; abrasives: AbrasiveSummary[] }) {
  const { fields, append, remove, move, replace } = useFieldArray({ control, name: 'progression' });
  const moveStep = (from: number, to: number) => {
    move(from, to);
    const stillUsable = to > from ? to < fields.length - 1 : to > 0;
    focusSoon(stillUsable ? `step-${to}-${to > from ? 'later' : 'earlier'}` : `step-${to}-abrasive`);
  };
  return (
    <fieldset className="rounded-md border border-rule bg-panel px-4 pb-4 pt-2">
      <legend className="px-1 font-serif text-lg font-semibold">
        Progression <span className="ml-2 font-sans text-sm font-normal text-muted">optional</span>
      </legend>
      <p className="mt-1 text-sm text-muted">The steps before the final abrasive, coarse to fine.</p>
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
                  <PageOptions pages={abrasives} />
                </Select>
              </Field>
              <Field id={`step-${i}-grit`} label="Grit" aside="optional" error={gritError}>
                <Input {...controlA11y(`step-${i}-grit`, { error: gritError })} placeholder="e.g. F80, B126" {...register(`progression.${i}.gritGrade`)} />
              </Field>
              <Field id={`step-${i}-angle`} label="Angle per side, °" aside="optional" error={angleError}>
                <Input {...controlA11y(`step-${i}-angle`, { error: angleError })} type="number" inputMode="decimal" step={0.5} {...register(`progression.${i}.perSideDeg`, { valueAsNumber: true })} />
              </Field>
              <div className="flex flex-wrap gap-2 sm:col-span-3">
                <Button id={`step-${i}-earlier`} size="sm" variant="secondary" disabled={i === 0} onClick={() => moveStep(i, i - 1)} aria-label={`Move step ${i + 1} earlier`}>
                  Earlier
                </Button>
                <Button id={`step-${i}-later`} size="sm" variant="secondary" disabled={i === fields.length - 1} onClick={() => moveStep(i, i + 1)} aria-label={`Move step ${i + 1} later`}>
                  Later
                </Button>
                <Button size="sm" variant="quiet" onClick={() => {
                    remove(i);
                    focusSoon(fields.length > 1 ? `step-${Math.min(i, fields.length - 2)}-abrasive` : 'progression-add');
                  }}
                  aria-label={`Remove step ${i + 1}`}>
                  Remove
                </Button>
              </div>
            </li>
          );
        })}
      </ol>
      <div className="mt-3">
        <Button
          id="progression-add"
          size="sm"
          variant="secondary"
          disabled={fields.length >= PROGRESSION_MAX}
          onClick={() => {
            append(initialBoxes({ abrasive: '', gritGrade: '', perSideDeg: Number.NaN }) as ProgressionFormStep, { shouldFocus: false });
            focusSoon(`step-${fields.length}-abrasive`);
          }}
        >
          Add a step{fields.length >= PROGRESSION_MAX ? ` (at most ${PROGRESSION_MAX})` : ''}
        </Button>
      </div>
      <ProgressionOrderHint control={control} abrasives={abrasives} />
      <ProgressionCoolant control={control} abrasives={abrasives} onReorder={replace} />
    </fieldset>
  );
}


/** A step's size for the coolant plan: its own grit when it parses, else its abrasive's. */
function sizeOf(gritGrade: string | undefined, abrasive: AbrasiveSummary): number | null {
  if (gritGrade?.trim()) {
    try {
      return parseGrit(gritGrade).micrometres;
    } catch {
      return abrasive.gritUm;
    }
  }
  return abrasive.gritUm;
}

/**
 * A soft hint where the steps go back to a coarser size (by each step's grit, else its abrasive's
 * own): coarse to fine is the usual order, but a deliberate step back is allowed, so nothing is refused.
 */
function ProgressionOrderHint({ control, abrasives }: { control: Control<ResultFormValues, unknown, ResultInput>; abrasives: AbrasiveSummary[] }) {
  const [progression, finalSlug, finalGrit] = useWatch({ control, name: ['progression', 'abrasive', 'grit.grade'] });
  const bySlug = new Map(abrasives.map((a) => [a.slug, a]));
  const steps = progression ?? [];
  if (steps.length === 0) return null;
  const sizeOfStep = (slug: string, grit: string | undefined) => {
    const abrasive = bySlug.get(slug);
    return abrasive ? sizeOf(grit, abrasive) : null;
  };
  const sizes = [...steps.map((s) => sizeOfStep(s.abrasive, s.gritGrade)), sizeOfStep(finalSlug, finalGrit)];
  const name = (i: number) => (i === steps.length ? 'the final abrasive' : `step ${i + 1}`);
  const pairs = coarserAfterFiner(sizes);
  if (pairs.length === 0) return null;
  return (
    <p className="mt-3 rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-sm" role="status">
      Coarse to fine is the usual order, but here{' '}
      {pairs
        .map(({ earlier, later }) => `${name(later)} (${formatMicrometres(sizes[later]!)}\u00a0µm) is coarser than ${name(earlier)} (${formatMicrometres(sizes[earlier]!)}\u00a0µm)`)
        .join('; ')}
      . Check the order (Earlier / Later), or keep it if you meant it.
    </p>
  );
}

/**
 * Where the trough must change along the progression and its final abrasive (plain water, water
 * with inhibitor, …, as each abrasive's page says), and, when another order of the steps changes it
 * less often while still going coarse to fine, that order with a button to use it.
 */
function ProgressionCoolant({ control, abrasives, onReorder }: { control: Control<ResultFormValues, unknown, ResultInput>; abrasives: AbrasiveSummary[]; onReorder: (steps: ResultFormValues['progression']) => void }) {
  const [progression, finalSlug] = useWatch({ control, name: ['progression', 'abrasive'] });
  const bySlug = new Map(abrasives.map((a) => [a.slug, a]));
  const steps = progression ?? [];
  const known = steps.map((s) => bySlug.get(s.abrasive));
  const final = bySlug.get(finalSlug);
  if (!final || steps.length === 0 || known.some((a) => !a)) return null;
  const asStep = (a: AbrasiveSummary, grit?: string): CoolantStep => ({ label: a.name, coolant: a.coolant as Coolant, micrometres: sizeOf(grit, a) });
  const plan = progressionCoolant(known.map((a, i) => asStep(a!, steps[i].gritGrade)), asStep(final));
  // The steps are listed just above: their numbers say which, without their long names again.
  const names = [...known.map((_, i) => `step ${i + 1}`), 'the final abrasive'];
  const changeText = (changes: CoolantChange[], order: number[]) =>
    changes.map((c) => `after ${names[order[c.afterStep]]}, from ${coolantWord(c.from)} to ${coolantWord(c.to)}`).join('; ');
  const fewer = plan.suggestedChanges.length < plan.changes.length;
  const identity = steps.map((_, i) => i);
  return (
    <div className="mt-4 rounded-md border border-rule p-3 text-sm" aria-live="polite" aria-label="Coolant along the progression">
      <p className="font-medium">Coolant in the trough</p>
      <p>
        {plan.changes.length === 0
          ? `One coolant throughout: ${coolantWord(final.coolant as Coolant)}.`
          : `Change it ${plan.changes.length === 1 ? 'once' : `${plan.changes.length} times`}: ${changeText(plan.changes, [...identity, steps.length])}.`}
      </p>
      {fewer ? (
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <p>
            Fewer changes, still coarse to fine: {plan.suggestedOrder.map((i) => `step ${i + 1}`).join(', ')}, then the final abrasive (
            {plan.suggestedChanges.length === 0 ? 'no change' : changeText(plan.suggestedChanges, [...plan.suggestedOrder, steps.length])}).
          </p>
          <Button size="sm" variant="secondary" onClick={() => onReorder(plan.suggestedOrder.map((i) => steps[i]) as ResultFormValues['progression'])}>
            Use this order
          </Button>
        </div>
      ) : null}
      <CoolantCaution className="mt-2 text-muted" />
    </div>
  );
}
