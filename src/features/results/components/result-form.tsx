import { lazy, Suspense, useMemo, useState, type ReactNode } from 'react';
import { ProgressionFields } from './progression-fields';
import { Controller, useForm, useWatch, type FieldError, type FieldErrors, type Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { GRIT_STANDARD_LABELS, GRIT_STANDARD_SHORT_LABELS, GRIT_STANDARDS, gritBand, parseGrit, type GritStandard } from '@shared/grit';
import { HARDNESS_SCALE_LABELS, HARDNESS_SCALES, toHrc } from '@shared/hardness';
import { angleFromSetup } from '@shared/geometry';
import { median } from '@shared/stats';
import { limits } from '@shared/validations';
import { ABRASIVE_MATERIALS, isRetentionMethod } from '@shared/vocabulary';
import { ApiError } from '@/lib/api-client';
import { friendlyZodMessages } from '@/lib/zod-messages';
import { formatDegrees, formatGrams, formatGritBand, formatMicrometres, formatNumber, label } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { controlA11y, Field, Input, Select, sentence, PageOptions } from '@/components/ui/field';
import { describeError, Loading } from '@/components/ui/states';
import { LengthBox } from '@/components/ui/length-box';
import { LengthUnitPicker } from '@/components/ui/length-unit-picker';
import { lengthsIn, useLengthUnit } from '@/lib/lengths';
import { AngleFromWorkshop } from '@/features/workshop/components/angle-from-workshop';
import type { AbrasiveSummary, MethodSummary, Result, ResultEdit, SteelSummary } from '@/types/api';
import type { ResultStatus } from '@shared/schemas/result';
import { resultInputSchema, useCreateResult, type ResultInput } from '../api/create-result';
import { useEditResult } from '../api/edit-result';
import { useSaveDraft } from '../api/save-draft';
import {
  emptyResultForm,
  fromResultInput,
  flattenErrors,
  formFieldFor,
  parseReadings,
  readingMessage,
  initialBoxes,
  toResultInput,
  type ResultFormValues,
} from './result-form-values';

// The editor is about as large as the rest of the app together: it loads only when this form shows.
const NotesEditor = lazy(() => import('./notes-editor'));

const zodForm = zodResolver(resultInputSchema, { error: friendlyZodMessages });

function setPath(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split('.');
  let node = target;
  keys.slice(0, -1).forEach((k) => {
    node[k] = (node[k] as Record<string, unknown>) ?? {};
    node = node[k] as Record<string, unknown>;
  });
  node[keys[keys.length - 1]] = value;
}

/**
 * zodResolver over the shared schema, fed with the form's values translated to the API input;
 * its errors are moved back onto the boxes the person typed in (e.g. a bad third reading is
 * shown under the readings box), and errors of the angle mode not in use are dropped.
 */
const resultResolver: Resolver<ResultFormValues, unknown, ResultInput> = async (values, context, options) => {
  const out = await zodForm(toResultInput(values) as ResultInput, context, options as never);
  if (Object.keys(out.errors).length === 0) return { values: out.values as ResultInput, errors: {} };
  const errors: Record<string, unknown> = {};
  const seen = new Set<string>();
  for (const { path, error } of flattenErrors(out.errors)) {
    const field = formFieldFor(path, values.angleMode);
    if (!field || seen.has(field)) continue;
    if (values.angleMode === 'perSide' && field.startsWith('edgeAngle.setup')) continue;
    if (values.angleMode === 'setup' && field === 'edgeAngle.perSideDeg') continue;
    seen.add(field);
    const ref = (options.fields as Record<string, { ref?: unknown } | undefined>)[field]?.ref;
    setPath(errors, field, { type: error.type, message: readingMessage(path, error.message ?? 'invalid'), ref });
  }
  if (seen.size === 0) errors.root = { type: 'schema', message: 'Some entries are not valid.' };
  return { values: {}, errors: errors as FieldErrors<ResultFormValues> };
};

/** Runs a computation for a live preview; a refusal becomes a message instead of a value. */
function attempt<T>(run: () => T): { value: T; error?: undefined } | { value?: undefined; error: string } {
  try {
    return { value: run() };
  } catch (err) {
    return { error: err instanceof Error ? err.message : 'cannot be computed' };
  }
}

function Preview({ id, children, tone = 'muted' }: { id: string; children: ReactNode; tone?: 'muted' | 'caution' }) {
  return (
    <p id={id} aria-live="polite" className={`text-sm ${tone === 'caution' ? 'text-caution' : 'text-muted'}`}>
      {children}
    </p>
  );
}

function Fieldset({ legend, children, aside }: { legend: string; children: ReactNode; aside?: string }) {
  return (
    <fieldset className="rounded-md border border-rule bg-panel px-4 pb-4 pt-2">
      <legend className="px-1 font-serif text-lg font-semibold">
        {legend}
        {aside ? <span className="ml-2 font-sans text-sm font-normal text-muted">{aside}</span> : null}
      </legend>
      <div className="mt-2 grid gap-4 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

/** The submit button's words for the result's state. */
function submitLabel(status: ResultStatus | undefined, duplicate: boolean): string {
  if (status === 'approved') return 'Send correction for review';
  if (status === 'returned') return 'Resubmit for review';
  if (status === 'pending') return 'Save changes';
  if (duplicate) return 'Post it anyway';
  return 'Submit for review';
}

export interface ResultFormProps {
  steels: SteelSummary[];
  abrasives: AbrasiveSummary[];
  methods: MethodSummary[];
  onCreated: (result: Result) => void;
  /** The result being edited (its author's edit, resubmission or correction); a new one when absent. */
  editing?: { id: number; status: ResultStatus; input: ResultInput };
  /** Told after an edit or a saved draft, with the outcome. */
  onEdited?: (edit: ResultEdit) => void;
  /** Told when a new result was kept as a draft. */
  onDraftCreated?: (result: Result) => void;
  /** Asked before posting: the author's earlier results this one repeats (POST /api/me/duplicate-check). */
  findDuplicates?: (input: ResultInput) => Promise<{ id: number; status: string }[]>;
}

/**
 * The new-result form: one measured edge. It validates as the person types with the same
 * schema the server uses, previews the derived values (HRC, µm and grit band, angle, median
 * reading) and, if the server still refuses something, shows its words under the right box.
 */
export function ResultForm({ steels, abrasives, methods, onCreated, editing, onEdited, onDraftCreated, findDuplicates }: ResultFormProps) {
  const create = useCreateResult();
  const edit = useEditResult();
  const draft = useSaveDraft();
  const busy = create.isPending || edit.isPending || draft.isPending;
  // Drafts: a new result or a draft can be kept as a draft; anything already submitted cannot.
  const draftable = !editing || editing.status === 'draft';
  const [draftSaved, setDraftSaved] = useState<string | null>(null);
  const [unplaced, setUnplaced] = useState<string[]>([]);
  // Earlier results of one's own that this one repeats; posting again needs a second press.
  const [duplicates, setDuplicates] = useState<{ id: number; status: string }[] | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitted, isValid },
  } = useForm<ResultFormValues, unknown, ResultInput>({
    mode: 'onChange',
    resolver: resultResolver,
    defaultValues: initialBoxes(editing ? fromResultInput(editing.input) : emptyResultForm),
  });

  const values = useWatch({ control });
  const angleMode = values.angleMode ?? 'perSide';
  const [unit] = useLengthUnit();
  const abrasive = abrasives.find((a) => a.slug === values.abrasive);
  // Only methods that define a retention medium count cuts; the others measure sharpness.
  const retentionMethods = methods.filter(isRetentionMethod);
  const sharpnessMethods = methods.filter((m) => !isRetentionMethod(m));

  const hrcPreview = useMemo(() => {
    const v = values.hardness?.value;
    const scale = values.hardness?.scale ?? 'HRC';
    if (v === undefined || Number.isNaN(v) || v <= 0) return null;
    const r = attempt(() => toHrc(v, scale));
    if (r.error !== undefined) return { error: r.error };
    if (scale === 'HRC') return null;
    return Number.isFinite(r.value)
      ? { text: `≈ ${formatNumber(r.value, 1)} HRC (ASTM E140 conversion for steel)` }
      : { error: 'no HRC equivalent for this value' };
  }, [values.hardness?.value, values.hardness?.scale]);

  const gritPreview = useMemo(() => {
    const grade = values.grit?.grade?.trim();
    if (!grade) return null;
    const r = attempt(() => parseGrit(grade, (values.grit?.standard || undefined) as GritStandard | undefined));
    if (r.error !== undefined) return { error: r.error };
    const band = gritBand(r.value.micrometres);
    return {
      text: `${r.value.grade}${r.value.inferred ? ` (read as ${GRIT_STANDARD_SHORT_LABELS[r.value.standard] ?? r.value.standard})` : ''} ≈ ${formatMicrometres(r.value.micrometres)} µm, grit band ${formatGritBand(band)}`,
    };
  }, [values.grit?.grade, values.grit?.standard]);

  const setup = values.edgeAngle?.setup;
  const anglePreview = useMemo(() => {
    if (angleMode === 'perSide') {
      const deg = values.edgeAngle?.perSideDeg;
      return deg !== undefined && Number.isFinite(deg) ? { text: `${formatDegrees(deg * 2)} inclusive` } : null;
    }
    if (!setup) return null;
    const nums = [setup.wheelDiameterMm, setup.barDiameterMm, setup.gapMm, setup.projectionMm];
    if (nums.some((n) => n === undefined || Number.isNaN(n))) return null;
    const r = attempt(() => angleFromSetup(setup as Required<typeof setup>));
    if (r.error !== undefined) return { error: r.error };
    if (!Number.isFinite(r.value.perSideDeg)) return { error: 'the blade cannot touch the wheel with these measurements' };
    return { text: `${formatDegrees(r.value.perSideDeg)} per side, ${formatDegrees(r.value.inclusiveDeg)} inclusive` };
  }, [angleMode, values.edgeAngle?.perSideDeg, setup]);

  const readings = parseReadings(values.sharpness?.readingsText ?? '');
  const goodReadings = readings.filter((n) => Number.isFinite(n) && n > 0);
  const readingsPreview =
    goodReadings.length > 0 && goodReadings.length === readings.length
      ? `${goodReadings.length} reading${goodReadings.length === 1 ? '' : 's'}, median ${formatGrams(median(goodReadings), 1)}`
      : null;

  const showServerIssues = (err: unknown) => {
        if (!(err instanceof ApiError) || err.status !== 400) return;
        const leftOver: string[] = [];
        for (const issue of err.issues) {
          const field = formFieldFor(issue.path, angleMode);
          const message = readingMessage(issue.path, issue.message);
          if (field) setError(field, { type: 'server', message }, { shouldFocus: leftOver.length === 0 });
          else leftOver.push(issue.path ? `${issue.path}: ${issue.message}` : issue.message);
        }
        setUnplaced(leftOver);
  };

  const onSubmit = async (input: ResultInput) => {
    setUnplaced([]);
    setDraftSaved(null);
    if (editing) {
      edit.mutate({ id: editing.id, input }, { onSuccess: (done) => onEdited?.(done), onError: showServerIssues });
      return;
    }
    if (findDuplicates && duplicates === null) {
      const found = await findDuplicates(input).catch(() => []);
      if (found.length) return setDuplicates(found);
    }
    setDuplicates(null);
    create.mutate(input, { onSuccess: onCreated, onError: showServerIssues });
  };

  const onSaveDraft = (input: ResultInput) => {
    setUnplaced([]);
    const saved = (when: string) => setDraftSaved(`Draft saved at ${when}. It stays on your page, not on the review desk, until you submit it.`);
    const at = () => new Date().toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
    if (editing) {
      edit.mutate({ id: editing.id, input, keepDraft: true }, { onSuccess: (done) => { saved(at()); onEdited?.(done); }, onError: showServerIssues });
    } else {
      draft.mutate(input, { onSuccess: (result) => onDraftCreated?.(result), onError: showServerIssues });
    }
  };

  const err = (e: FieldError | undefined) => e?.message;
  const steelError = err(errors.steel);
  const hvError = err(errors.hardness?.value);
  const scaleError = err(errors.hardness?.scale);
  const heatError = err(errors.heatTreatment);
  const abrasiveError = err(errors.abrasive);
  const standardError = err(errors.grit?.standard);
  const gradeError = err(errors.grit?.grade);
  const perSideError = err(errors.edgeAngle?.perSideDeg);
  const setupErrors = errors.edgeAngle?.setup;
  const setupGroupError = err(setupErrors as FieldError | undefined);
  const methodError = err(errors.sharpness?.method);
  const readingsError = err(errors.sharpness?.readingsText);
  const retMethodError = err(errors.retention?.method);
  const cutsError = err(errors.retention?.cuts);
  const notesError = err(errors.notes as FieldError | undefined);
  const fieldErrorCount = flattenErrors(errors).length;

  // The setup's boxes hold mm and show the one mm/inch choice; a limit the schema states
  // ("must be at most 2000") is a length in mm, written in that unit too.
  const setupField = (name: 'wheelDiameterMm' | 'barDiameterMm' | 'gapMm' | 'projectionMm', text: string, hint: string) => {
    const e = err(setupErrors?.[name]);
    return (
      <Controller
        control={control}
        name={`edgeAngle.setup.${name}`}
        render={({ field }) => (
          <LengthBox
            id={`result-setup-${name}`}
            label={text}
            hint={hint}
            error={e && lengthsIn(e.replace(/(\d+(?:\.\d+)?)$/, '$1 mm'), unit)}
            valueMm={field.value}
            onChangeMm={field.onChange}
            onBlur={field.onBlur}
            inputRef={field.ref}
          />
        )}
      />
    );
  };

  return (
    <form noValidate onSubmit={handleSubmit(onSubmit)} aria-label={editing ? `Edit result ${editing.id}` : 'New result'} className="flex flex-col gap-6">
      {isSubmitted && fieldErrorCount > 0 ? (
        <div role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-4 py-3">
          <p className="font-semibold text-danger">
            {fieldErrorCount === 1 ? 'One entry needs attention' : `${fieldErrorCount} entries need attention`}; each is marked below.
          </p>
        </div>
      ) : null}

      <Fieldset legend="Steel">
        <Field id="result-steel" label="Steel" error={steelError} className="sm:col-span-2">
          <Select {...controlA11y('result-steel', { error: steelError })} {...register('steel')}>
            <option value="">Choose a steel…</option>
            <PageOptions pages={steels} />
          </Select>
        </Field>
        <Field
          id="result-hardness"
          label="Hardness"
          hint={hrcPreview && 'text' in hrcPreview ? hrcPreview.text : 'As measured or as stated by whoever heat-treated it.'}
          error={hvError}
        >
          <Input
            {...controlA11y('result-hardness', { hint: true, error: hvError })}
            type="number"
            step="any"
            inputMode="decimal"
            {...register('hardness.value', { valueAsNumber: true })}
          />
        </Field>
        <Field id="result-scale" label="Hardness scale" error={scaleError}>
          <Select {...controlA11y('result-scale', { error: scaleError })} {...register('hardness.scale')}>
            {HARDNESS_SCALES.map((s) => (
              <option key={s} value={s}>
                {HARDNESS_SCALE_LABELS[s] ?? s}
              </option>
            ))}
          </Select>
        </Field>
        {hrcPreview && 'error' in hrcPreview ? (
          <div className="sm:col-span-2">
            <Preview id="result-hardness-preview" tone="caution">
              {sentence(hrcPreview.error)}
            </Preview>
          </div>
        ) : null}
        <div className="flex items-center gap-2 sm:col-span-2">
          <input id="result-measured" type="checkbox" className="h-4 w-4 accent-accent" {...register('hardness.measured')} />
          <label htmlFor="result-measured">I measured the hardness myself</label>
        </div>
        <Field id="result-heat" label="Heat treatment" aside="optional" error={heatError} className="sm:col-span-2">
          <Input
            {...controlA11y('result-heat', { error: heatError })}
            maxLength={500}
            placeholder="e.g. hardened 1030 °C, tempered twice at 200 °C"
            {...register('heatTreatment')}
          />
        </Field>
      </Fieldset>

      <ProgressionFields control={control} register={register} errors={errors} abrasives={abrasives} />

      <Fieldset legend="Final abrasive and grit">
        <Field
          id="result-abrasive"
          label="Final abrasive"
          hint={
            abrasive
              ? `${label(ABRASIVE_MATERIALS, abrasive.material)}${abrasive.grit ? `, ${abrasive.grit.grade}` : ''}${abrasive.gritUm ? ` (≈ ${formatMicrometres(abrasive.gritUm)} µm)` : ''}`
              : 'The last abrasive the edge saw before it was measured.'
          }
          error={abrasiveError}
          className="sm:col-span-2"
        >
          <Select {...controlA11y('result-abrasive', { hint: true, error: abrasiveError })} {...register('abrasive')}>
            <option value="">Choose an abrasive…</option>
            <PageOptions pages={abrasives} />
          </Select>
        </Field>
        <Field id="result-grit-standard" label="Grit standard" aside="optional" error={standardError}>
          <Select {...controlA11y('result-grit-standard', { error: standardError })} {...register('grit.standard')}>
            <option value="">Work it out from the grade</option>
            {GRIT_STANDARDS.map((s) => (
              <option key={s} value={s}>
                {GRIT_STANDARD_LABELS[s] ?? s}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          id="result-grit-grade"
          label="Grit grade"
          aside="optional"
          hint={
            gritPreview && 'text' in gritPreview
              ? gritPreview.text
              : 'e.g. F400, P1000, #1000, D46, 140/170 or 15 µm. Leave empty to use the abrasive’s own grit.'
          }
          error={gradeError}
        >
          <Input
            {...controlA11y('result-grit-grade', { hint: true, error: gradeError })}
            maxLength={40}
            autoComplete="off"
            {...register('grit.grade')}
          />
        </Field>
        {gritPreview && 'error' in gritPreview && !gradeError ? (
          <div className="sm:col-span-2">
            <Preview id="result-grit-preview" tone="caution">
              {sentence(gritPreview.error)}
            </Preview>
          </div>
        ) : null}
      </Fieldset>

      <fieldset className="rounded-md border border-rule bg-panel px-4 pb-4 pt-2">
        <legend className="px-1 font-serif text-lg font-semibold">Edge angle</legend>
        <div role="radiogroup" aria-label="How the angle is given" className="mt-2 flex flex-wrap gap-x-6 gap-y-2">
          <label className="flex items-center gap-2">
            <input type="radio" value="perSide" className="h-4 w-4 accent-accent" {...register('angleMode')} />
            Degrees per side
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="setup" className="h-4 w-4 accent-accent" {...register('angleMode')} />
            From my wheel setup
          </label>
        </div>
        <div className="mt-4 grid gap-4 sm:grid-cols-2">
          <AngleFromWorkshop
            currentDeg={values.edgeAngle?.perSideDeg}
            onPick={(source, wheel) => {
              const opts = { shouldValidate: true, shouldDirty: true };
              setValue('angleMode', 'perSide', opts);
              setValue('edgeAngle.perSideDeg', source.perSideDeg, opts);
              // The wheel is the final abrasive unless the person chose another already.
              if (!values.abrasive && wheel.abrasive && abrasives.some((a) => a.slug === wheel.abrasive!.slug)) setValue('abrasive', wheel.abrasive.slug, opts);
            }}
          />
          {angleMode === 'perSide' ? (
            <Field
              id="result-per-side"
              label="Angle per side (°)"
              hint={anglePreview && 'text' in anglePreview ? anglePreview.text : 'Half the inclusive angle.'}
              error={perSideError}
            >
              <Input
                {...controlA11y('result-per-side', { hint: true, error: perSideError })}
                type="number"
                step="any"
                inputMode="decimal"
                {...register('edgeAngle.perSideDeg', { valueAsNumber: true })}
              />
            </Field>
          ) : (
            <>
              <div className="sm:col-span-2">
                <LengthUnitPicker />
              </div>
              {setupField('wheelDiameterMm', 'Wheel diameter', 'Measure the wheel today: a vitrified wheel shrinks as it wears.')}
              {setupField('barDiameterMm', 'Support bar diameter', 'The round bar the blade’s jig rests on.')}
              {setupField('gapMm', 'Gap, bar to rim', 'Shortest distance from the bar to the wheel’s surface.')}
              {setupField('projectionMm', 'Projection', 'From the bar’s axis to the edge, along the blade.')}
              <div className="sm:col-span-2">
                {setupGroupError ? (
                  <p id="result-setup-error" className="text-sm font-medium text-danger">
                    {sentence(setupGroupError)}
                  </p>
                ) : anglePreview ? (
                  <Preview id="result-setup-preview" tone={'error' in anglePreview ? 'caution' : 'muted'}>
                    {'text' in anglePreview ? `Angle from this setup: ${anglePreview.text}` : sentence(lengthsIn(anglePreview.error, unit))}
                  </Preview>
                ) : (
                  <Preview id="result-setup-preview">Fill in all four to see the angle.</Preview>
                )}
              </div>
            </>
          )}
        </div>
      </fieldset>

      <Fieldset legend="Sharpness">
        <Field id="result-method" label="Sharpness method" error={methodError}>
          <Select {...controlA11y('result-method', { error: methodError })} {...register('sharpness.method')}>
            <option value="">Choose a method…</option>
            <PageOptions pages={sharpnessMethods} />
          </Select>
        </Field>
        <Field
          id="result-readings"
          label="Readings (g)"
          hint={
            readingsPreview ??
            `Grams of force to cut the test medium, one per test; separate them with commas or spaces (up to ${limits.readingsMax}).`
          }
          error={readingsError}
        >
          <Input
            {...controlA11y('result-readings', { hint: true, error: readingsError })}
            inputMode="decimal"
            autoComplete="off"
            placeholder="e.g. 142, 150, 138"
            {...register('sharpness.readingsText')}
          />
        </Field>
        <p className="text-sm text-muted sm:col-span-2">
          Test sharpness with the instrument and its test medium, never on skin.
        </p>
      </Fieldset>

      <Fieldset legend="Edge retention" aside="optional">
        <Field id="result-retention-method" label="Retention method" error={retMethodError}>
          <Select {...controlA11y('result-retention-method', { error: retMethodError })} {...register('retention.method')}>
            <option value="">Not tested</option>
            <PageOptions pages={retentionMethods} />
          </Select>
        </Field>
        <Field id="result-cuts" label="Cuts until dull" hint="Cuts counted before the method’s threshold was reached." error={cutsError}>
          <Input
            {...controlA11y('result-cuts', { hint: true, error: cutsError })}
            type="number"
            step="1"
            min="0"
            inputMode="numeric"
            {...register('retention.cuts', { valueAsNumber: true })}
          />
        </Field>
      </Fieldset>

      <div className="flex flex-col gap-1">
        <label htmlFor="result-notes" className="font-serif text-lg font-semibold">
          Notes <span className="font-sans text-sm font-normal text-muted">optional</span>
        </label>
        <p id="result-notes-hint" className="text-sm text-muted">
          How the edge was made and measured: progression, passes, deburring, anything unusual.
        </p>
        <Controller
          control={control}
          name="notes"
          render={({ field }) => (
            <Suspense fallback={<Loading label="Loading the editor…" />}>
              <NotesEditor
                id="result-notes"
                value={field.value}
                onChange={field.onChange}
                onBlur={field.onBlur}
                describedBy={notesError ? 'result-notes-hint result-notes-error' : 'result-notes-hint'}
                invalid={Boolean(notesError)}
              />
            </Suspense>
          )}
        />
        {notesError ? (
          <p id="result-notes-error" className="text-sm font-medium text-danger">
            {sentence(notesError)}
          </p>
        ) : null}
      </div>

      {create.isError ? (
        <div role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-4 py-3">
          <p className="font-semibold text-danger">The result was not saved.</p>
          <p>
            {create.error instanceof ApiError && create.error.status === 400
              ? `${create.error.error}${unplaced.length ? '' : ' The boxes concerned are marked.'}`
              : describeError(create.error)}
          </p>
          {unplaced.length ? (
            <ul className="mt-1 list-disc pl-5">
              {unplaced.map((u) => (
                <li key={u}>{u}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}

      {duplicates?.length ? (
        <div role="alert" className="rounded-md border border-caution/40 bg-caution-soft px-4 py-3">
          <p className="font-semibold">You have posted this before</p>
          <p>
            Same steel, abrasive, grit, angle and readings as your result{duplicates.length === 1 ? '' : 's'}{' '}
            {duplicates.map((d, i) => (
              <span key={d.id}>
                {i ? ', ' : ''}
                <a href={`/results/${d.id}`}>#{d.id}</a>
              </span>
            ))}
            . Press “Post it anyway” if this is a new measurement.
          </p>
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={create.isPending || edit.isPending}>
          {busy ? 'Saving…' : submitLabel(editing?.status, !!duplicates?.length)}
        </Button>
        {draftable ? (
          <Button type="button" variant="secondary" busy={draft.isPending} onClick={handleSubmit(onSaveDraft)}>
            Save as draft
          </Button>
        ) : null}
        <p className="min-w-0 basis-full text-sm text-muted sm:basis-auto sm:flex-1">
          {isValid ? 'Ready to submit.' : 'Fields are checked as you type.'}{' '}
          {editing?.status === 'approved'
            ? 'The published version stays in the comparison until a moderator approves your correction.'
            : 'A moderator reviews each result before it is published.'}
        </p>
      </div>
      <p role="status" aria-live="polite" className="text-sm text-accent-strong">
        {draftSaved}
      </p>
    </form>
  );
}
