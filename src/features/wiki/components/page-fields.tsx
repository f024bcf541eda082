import { useId } from 'react';
import { useFieldArray, useFormContext, useWatch, type FieldError } from 'react-hook-form';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS, DESIGNATION_SYSTEMS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { GRIT_STANDARD_LABELS, GRIT_STANDARDS, formatMicrometres, parseGrit, type GritStandard } from '@shared/grit';
import { FIELD_LABELS, SOURCE_FIELDS, type PageType } from '@shared/schemas/pages';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input, Select, Textarea } from '@/components/ui/field';
import type { PageFormValues } from './page-form-values';

/** Register options for a number box whose blank means "not given" (null). */
const optionalNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v)) };
/** Register options for a required number box. */
const requiredNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v)) };

/** The error at a dotted path of the form's errors. */
function useError(path: string): string | undefined {
  const { formState } = useFormContext<PageFormValues>();
  let node: unknown = formState.errors;
  for (const key of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[key];
  return (node as FieldError | undefined)?.message;
}

function TextField({ name, label, hint, multiline, aside }: { name: string; label: string; hint?: string; multiline?: boolean; aside?: string }) {
  const id = useId();
  const { register } = useFormContext<PageFormValues>();
  const error = useError(name);
  const a11y = controlA11y(id, { hint, error });
  return (
    <Field id={id} label={label} hint={hint} error={error} aside={aside}>
      {multiline ? <Textarea {...a11y} {...register(name)} rows={3} /> : <Input {...a11y} {...register(name)} />}
    </Field>
  );
}

function NumberField({ name, label, hint, optional, step = 'any' }: { name: string; label: string; hint?: string; optional?: boolean; step?: string }) {
  const id = useId();
  const { register } = useFormContext<PageFormValues>();
  const error = useError(name);
  return (
    <Field id={id} label={label} hint={hint} error={error} aside={optional ? 'optional' : undefined}>
      <Input {...controlA11y(id, { hint, error })} type="number" inputMode="decimal" step={step} {...register(name, optional ? optionalNumber : requiredNumber)} />
    </Field>
  );
}

function SelectField({ name, label, options }: { name: string; label: string; options: Record<string, string> }) {
  const id = useId();
  const { register } = useFormContext<PageFormValues>();
  const error = useError(name);
  return (
    <Field id={id} label={label} error={error}>
      <Select {...controlA11y(id, { error })} {...register(name)}>
        {Object.entries(options).map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </Select>
    </Field>
  );
}

function CheckField({ name, label }: { name: string; label: string }) {
  const { register } = useFormContext<PageFormValues>();
  return (
    <label className="flex items-center gap-2 font-medium">
      <input type="checkbox" {...register(name)} className="h-4 w-4" /> {label}
    </label>
  );
}

function Legend({ children }: { children: string }) {
  return <legend className="mb-2 text-lg font-semibold">{children}</legend>;
}

function Designations() {
  const { control, register } = useFormContext<PageFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'designations' });
  const listError = useError('designations');
  return (
    <fieldset className="flex flex-col gap-2">
      <Legend>Designations</Legend>
      <p className="text-sm text-muted">Each standard’s name for this grade, e.g. AISI D2, WNr 1.2379. Search finds the page under every one.</p>
      {fields.map((f, i) => (
        <DesignationRow key={f.id} index={i} onRemove={() => remove(i)} register={register} />
      ))}
      {listError ? <p className="text-sm font-medium text-danger">{listError}</p> : null}
      <div>
        <Button variant="secondary" size="sm" onClick={() => append({ system: 'AISI', code: '' })}>
          Add a designation
        </Button>
      </div>
    </fieldset>
  );
}

function DesignationRow({ index, onRemove, register }: { index: number; onRemove: () => void; register: ReturnType<typeof useFormContext<PageFormValues>>['register'] }) {
  const id = useId();
  const error = useError(`designations.${index}.code`);
  return (
    <div className="grid grid-cols-[8rem_1fr_auto] items-start gap-2">
      <Select aria-label={`Standard of designation ${index + 1}`} {...register(`designations.${index}.system`)}>
        {DESIGNATION_SYSTEMS.map((s) => (
          <option key={s} value={s}>
            {s}
          </option>
        ))}
      </Select>
      <div>
        <Input aria-label={`Designation ${index + 1}`} {...controlA11y(id, { error })} {...register(`designations.${index}.code`)} />
        {error ? <p id={`${id}-error`} className="text-sm font-medium text-danger">{error}</p> : null}
      </div>
      <Button variant="quiet" size="sm" onClick={onRemove} aria-label={`Remove designation ${index + 1}`}>
        Remove
      </Button>
    </div>
  );
}

function Composition() {
  const { control, register } = useFormContext<PageFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'composition' });
  return (
    <fieldset className="flex flex-col gap-2">
      <Legend>Composition (wt %)</Legend>
      <p className="text-sm text-muted">The limits of the standard cited for them; leave the minimum blank where the standard gives a maximum only.</p>
      <div className="grid grid-cols-[6rem_1fr_1fr_auto] gap-2 text-sm font-semibold text-muted" aria-hidden="true">
        <span>Element</span>
        <span>Min %</span>
        <span>Max %</span>
        <span />
      </div>
      {fields.map((f, i) => (
        <CompositionRow key={f.id} index={i} onRemove={() => remove(i)} register={register} />
      ))}
      <div>
        <Button variant="secondary" size="sm" onClick={() => append({ element: '', min: null, max: undefined })}>
          Add an element
        </Button>
      </div>
    </fieldset>
  );
}

function CompositionRow({ index, onRemove, register }: { index: number; onRemove: () => void; register: ReturnType<typeof useFormContext<PageFormValues>>['register'] }) {
  const errors = [useError(`composition.${index}.element`), useError(`composition.${index}.min`), useError(`composition.${index}.max`)].filter(Boolean);
  return (
    <div className="flex flex-col gap-1">
      <div className="grid grid-cols-[6rem_1fr_1fr_auto] gap-2">
        <Input aria-label={`Element ${index + 1}`} {...register(`composition.${index}.element`)} aria-invalid={errors.length ? true : undefined} />
        <Input aria-label={`Minimum of element ${index + 1} (wt %)`} type="number" step="any" {...register(`composition.${index}.min`, optionalNumber)} />
        <Input aria-label={`Maximum of element ${index + 1} (wt %)`} type="number" step="any" {...register(`composition.${index}.max`, requiredNumber)} />
        <Button variant="quiet" size="sm" onClick={onRemove} aria-label={`Remove element ${index + 1}`}>
          Remove
        </Button>
      </div>
      {errors.length ? <p className="text-sm font-medium text-danger">{errors.join('; ')}</p> : null}
    </div>
  );
}

/** The steel fields: name, category, designations, composition, typical hardness. */
export function SteelFields() {
  return (
    <div className="flex flex-col gap-5">
      <TextField name="name" label="Name" />
      <SelectField name="category" label="Category" options={STEEL_CATEGORIES} />
      <Designations />
      <Composition />
      <fieldset>
        <Legend>Typical hardness for blades (HRC)</Legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberField name="hardnessHrc.min" label="From (HRC)" optional />
          <NumberField name="hardnessHrc.max" label="To (HRC)" optional />
        </div>
      </fieldset>
    </div>
  );
}

function GritPreview() {
  const [standard, grade] = useWatch<PageFormValues>({ name: ['grit.standard', 'grit.grade'] }) as [GritStandard, string];
  let text: string;
  try {
    text = grade ? `${grade} ≈ ${formatMicrometres(parseGrit(grade, standard).micrometres)}` : '';
  } catch (err) {
    text = err instanceof Error ? err.message : '';
  }
  return text ? (
    <p className="text-sm text-muted" aria-live="polite">
      {text}
    </p>
  ) : null;
}

/** The abrasive fields: what it is, its grit, size, wear, coolant and price. */
export function AbrasiveFields() {
  return (
    <div className="flex flex-col gap-5">
      <TextField name="name" label="Name" hint="Generic words only, never a maker’s or product name." />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField name="material" label="Material" options={ABRASIVE_MATERIALS} />
        <SelectField name="bond" label="Bond" options={BONDS} />
        <SelectField name="form" label="Form" options={ABRASIVE_FORMS} />
      </div>
      <fieldset>
        <Legend>Grit</Legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField name="grit.standard" label="Grit standard" options={Object.fromEntries(GRIT_STANDARDS.map((s) => [s, GRIT_STANDARD_LABELS[s]]))} />
          <div className="flex flex-col gap-1">
            <TextField name="grit.grade" label="Grit grade" />
            <GritPreview />
          </div>
          <TextField name="gritRange.from" label="Dressable from (coarsest)" aside="optional" />
          <TextField name="gritRange.to" label="Dressable to (finest)" aside="optional" />
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField name="wheelDiameterMm" label="Diameter (mm)" optional />
        <NumberField name="widthMm" label="Width (mm)" optional />
      </div>
      <div className="flex flex-wrap gap-6">
        <CheckField name="wears" label="Wears in use (the diameter shrinks)" />
        <CheckField name="sideUsable" label="The maker allows grinding on its side" />
      </div>
      <SelectField name="coolant" label="Coolant" options={COOLANTS} />
      <TextField name="priceNote" label="Price, if known" aside="optional" hint="Free text with the year, e.g. “about 150 EUR in 2025”." />
    </div>
  );
}

/** The method fields: instrument, medium, readings, retention. */
export function MethodFields() {
  return (
    <div className="flex flex-col gap-5">
      <TextField name="name" label="Name" />
      <p className="text-sm text-muted">A changed protocol is a new version with its own page; edit here only to clarify this version.</p>
      <TextField name="instrument" label="Instrument" multiline />
      <TextField name="medium" label="Test medium" multiline />
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField name="readingsPerEdge" label="Readings per edge" step="1" />
        <NumberField name="thresholdG" label="Retention threshold (g)" optional />
      </div>
      <TextField name="retentionMedium" label="Retention medium" aside="optional" multiline />
    </div>
  );
}

/** The fields of a page type. */
export function TypeFields({ type }: { type: PageType }) {
  if (type === 'steel') return <SteelFields />;
  if (type === 'abrasive') return <AbrasiveFields />;
  return <MethodFields />;
}

function CitationRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-md border border-rule bg-paper/60 p-3">
      <legend className="px-1 font-semibold">Reference [{index + 1}]</legend>
      <TextField name={`citations.${index}.title`} label="Title" />
      <div className="grid gap-3 sm:grid-cols-[1fr_8rem]">
        <TextField name={`citations.${index}.organisation`} label="Author or organisation" />
        <NumberField name={`citations.${index}.year`} label="Year" optional step="1" />
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField name={`citations.${index}.standard`} label="Standard number" aside="optional" hint="e.g. ASTM A681" />
        <TextField name={`citations.${index}.url`} label="Web address" aside="optional" />
      </div>
      <TextField name={`citations.${index}.supports`} label="What it supports" hint="Which statements on the page this source backs, e.g. “composition ranges”." />
      <div>
        <Button variant="quiet" size="sm" onClick={onRemove}>
          Remove reference [{index + 1}]
        </Button>
      </div>
    </fieldset>
  );
}

/** The page's references, and which infobox value came from which of them. */
export function CitationsFields({ type }: { type: PageType }) {
  const { control, register, getValues, setValue } = useFormContext<PageFormValues>();
  const { fields, append, remove } = useFieldArray({ control, name: 'citations' });
  const citations = (useWatch<PageFormValues>({ name: 'citations' }) as PageFormValues['citations']) ?? [];
  const removeAt = (i: number) => {
    // Sources point at references by position: drop those at i, shift those after it.
    const sources = { ...(getValues('sources') ?? {}) };
    for (const [field, v] of Object.entries(sources)) {
      if (v === '') continue;
      const n = Number(v);
      if (n === i) sources[field] = '';
      else if (n > i) sources[field] = String(n - 1);
    }
    setValue('sources', sources);
    remove(i);
  };
  return (
    <div className="flex flex-col gap-4">
      {fields.map((f, i) => (
        <CitationRow key={f.id} index={i} onRemove={() => removeAt(i)} />
      ))}
      <div>
        <Button variant="secondary" size="sm" onClick={() => append({ title: '', organisation: '', year: null, standard: '', url: '', supports: '' })}>
          Add a reference
        </Button>
      </div>
      {citations.length ? (
        <fieldset className="flex flex-col gap-2">
          <Legend>Where the infobox values come from</Legend>
          <div className="grid gap-3 sm:grid-cols-2">
            {SOURCE_FIELDS[type].map((field) => (
              <label key={field} className="flex flex-col gap-1 text-sm font-medium">
                {FIELD_LABELS[field] ?? field}
                <Select {...register(`sources.${field}`)}>
                  <option value="">no reference</option>
                  {citations.map((c, i) => (
                    <option key={i} value={String(i)}>
                      [{i + 1}] {c.title || 'untitled'}
                    </option>
                  ))}
                </Select>
              </label>
            ))}
          </div>
          <SourcesError />
        </fieldset>
      ) : null}
    </div>
  );
}

function SourcesError() {
  const { formState } = useFormContext<PageFormValues>();
  const errors = formState.errors.sources as Record<string, FieldError> | FieldError | undefined;
  if (!errors) return null;
  const messages = 'message' in errors && typeof errors.message === 'string' ? [errors.message] : Object.values(errors as Record<string, FieldError>).map((e) => e?.message);
  return <p className="text-sm font-medium text-danger">{messages.filter(Boolean).join('; ')}</p>;
}
