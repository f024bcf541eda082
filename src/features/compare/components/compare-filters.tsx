import { useId, useState, type ReactNode } from 'react';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { toHrc, HARDNESS_SCALES, type HardnessScale } from '@shared/hardness';
import { bandInfo, formatEdgeUm } from '@shared/compare-view';
import { Field, Input, Select, PageOptions } from '@/components/ui/field';
import { ChipChooser } from '@/components/ui/chip-chooser';
import { PROGRESSION_MAX } from '@shared/progression';
import { Button } from '@/components/ui/button';
import { FILTER_KEYS, listOf, useCompareUrl, type FilterKey } from '../hooks/use-compare-url';

export interface CompareFiltersProps {
  methods: { slug: string; name: string; version: number | string }[];
  steels: { slug: string; name: string; category: string }[];
}

/** Band edges offered for the particle-size range: powers of two in µm, as the bands use. */
const EDGES_UM = Array.from({ length: 14 }, (_, i) => bandInfo(i - 2, 1).hiUm).reverse(); // 0.24 µm … 4 mm

/** A set of checkboxes that writes a comma list to one URL key. */
function CheckList({ legend, name, options, value, onChange, columns = 2 }: { legend: string; name: string; options: [string, string][]; value: string[]; onChange: (next: string[]) => void; columns?: number }) {
  const chosen = new Set(value);
  return (
    <fieldset className="min-w-0">
      <legend className="font-medium">
        {legend}
        {value.length ? <span className="ml-2 text-sm font-normal text-muted">({value.length} chosen)</span> : <span className="ml-2 text-sm font-normal text-muted">(all)</span>}
      </legend>
      <div className={`mt-1 grid max-h-44 gap-x-4 gap-y-1 overflow-y-auto rounded-md border border-rule bg-panel p-2 text-sm ${columns === 1 ? '' : 'sm:grid-cols-2'}`}>
        {options.map(([v, label]) => (
          <label key={v} className="flex items-center gap-2">
            <input
              type="checkbox"
              name={name}
              value={v}
              checked={chosen.has(v)}
              onChange={(e) => onChange(e.target.checked ? [...value, v] : value.filter((x) => x !== v))}
            />
            <span>{label}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

/** One end of the particle-size range: a band edge, or any size. */
function EdgeField({ id, label, value, onChange }: { id: string; label: string; value?: string; onChange: (next: string | undefined) => void }) {
  return (
    <Field id={id} label={label}>
      <Select id={id} value={value ?? ''} onChange={(e) => onChange(e.target.value || undefined)}>
        <option value="">any size</option>
        {EDGES_UM.map((um) => (
          <option key={um} value={String(um)}>
            {formatEdgeUm(um)} µm
          </option>
        ))}
      </Select>
    </Field>
  );
}

/** 0 to PROGRESSION_MAX steps, as the filter's options. */
const STEP_COUNTS = Array.from({ length: PROGRESSION_MAX + 1 }, (_, n) => [String(n), n === 0 ? 'none recorded' : `${n} step${n === 1 ? '' : 's'}`] as const);

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-3">
      <h2 className="text-sm font-semibold uppercase tracking-wide text-muted">{title}</h2>
      {children}
    </div>
  );
}

/**
 * The comparison's filters, each bound to the URL: method version, steels, steel category,
 * abrasive material, bond, grit band range and width, hardness (HRC; other scales converted),
 * angle per side, publishers only, and the posting dates.
 */
export function CompareFilters({ methods, steels }: CompareFiltersProps) {
  const { filters, update } = useCompareUrl();
  const id = useId();
  const set = (key: FilterKey, value: string | undefined) => update({ [key]: value });
  const any = FILTER_KEYS.some((k) => filters[k]);
  const [scale, setScale] = useState<HardnessScale>('HRC');
  const [hardness, setHardness] = useState<{ min: string; max: string }>({ min: '', max: '' });
  const [hardnessError, setHardnessError] = useState<string | undefined>();
  const [shown, setShown] = useState(false);

  // What a hardness box shows: the URL's HRC, or what was typed in another scale.
  const hardnessShown = (which: 'min' | 'max') => (scale === 'HRC' ? ((which === 'min' ? filters.hrcMin : filters.hrcMax) ?? '') : hardness[which]);

  // Hardness typed in another scale is converted to HRC (ASTM E140, shared/hardness.ts).
  const applyHardness = (which: 'min' | 'max', text: string) => {
    setHardness((h) => ({ ...h, [which]: text }));
    const key = which === 'min' ? 'hrcMin' : 'hrcMax';
    if (scale === 'HRC' || text === '') {
      setHardnessError(undefined);
      set(key, text || undefined);
      return;
    }
    try {
      const hrc = toHrc(Number(text), scale);
      setHardnessError(undefined);
      set(key, String(Math.round(hrc * 10) / 10));
    } catch (err) {
      setHardnessError(err instanceof Error ? err.message : 'not a hardness this table converts');
    }
  };

  const byCategory = [...steels].sort((a, b) => a.name.localeCompare(b.name));
  const active = FILTER_KEYS.filter((k) => filters[k] && k !== 'method').length;
  return (
    <div className="flex flex-col gap-2">
      {/* On a phone the filters fold away behind one button, so the results come first. */}
      <Button variant="secondary" className="self-start md:hidden" aria-expanded={shown} aria-controls={`${id}-form`} onClick={() => setShown(!shown)}>
        {shown ? 'Hide the filters' : `Filters${active ? ` (${active} set)` : ''}`}
      </Button>
      <form id={`${id}-form`} aria-label="Filter the comparison" onSubmit={(e) => e.preventDefault()} className={`grid gap-6 rounded-md border border-rule bg-panel p-4 lg:grid-cols-3 ${shown ? '' : 'max-md:hidden'}`}>
        <Group title="What was measured">
          <Field id={`${id}-method`} label="Method version" hint="Results are compared only within one version of a method.">
            <Select id={`${id}-method`} value={filters.method ?? ''} onChange={(e) => set('method', e.target.value || undefined)}>
              <option value="">The one with the most results</option>
              <PageOptions pages={methods} />
            </Select>
          </Field>
          <ChipChooser label="Steel" options={byCategory.map((s) => [s.slug, s.name] as const)} value={listOf(filters.steel)} onChange={(v) => set('steel', v.join(',') || undefined)} />
          <ChipChooser label="Category" options={Object.entries(STEEL_CATEGORIES)} value={listOf(filters.category)} onChange={(v) => set('category', v.join(',') || undefined)} />
        </Group>

        <Group title="Abrasive">
          <ChipChooser label="Abrasive material" options={Object.entries(ABRASIVE_MATERIALS)} value={listOf(filters.material)} onChange={(v) => set('material', v.join(',') || undefined)} />
          <CheckList legend="Bond" name="bond" options={Object.entries(BONDS)} value={listOf(filters.bond)} onChange={(v) => set('bond', v.join(',') || undefined)} />
          <div className="grid grid-cols-2 gap-3">
            <EdgeField id={`${id}-um-min`} label="Particles from" value={filters.umMin} onChange={(v) => set('umMin', v)} />
            <EdgeField id={`${id}-um-max`} label="to" value={filters.umMax} onChange={(v) => set('umMax', v)} />
          </div>
          <ChipChooser label="Progression passed through" noneMeans="any" options={Object.entries(ABRASIVE_MATERIALS)} value={listOf(filters.via)} onChange={(v) => set('via', v.join(',') || undefined)} hint="Results whose recorded steps before the final abrasive include one of these materials." />
          <ChipChooser label="Steps before the final abrasive" noneMeans="any number" options={STEP_COUNTS} value={listOf(filters.steps)} onChange={(v) => set('steps', v.join(',') || undefined)} />
          <Field id={`${id}-step`} label="Grit band width" hint="φ = −log2(d / 1 mm): a whole band doubles the particle size; a half band is √2 wide.">
            <Select id={`${id}-step`} value={filters.step ?? '1'} onChange={(e) => set('step', e.target.value === '1' ? undefined : e.target.value)}>
              <option value="1">Whole φ (e.g. 7.81–15.6 µm)</option>
              <option value="0.5">Half φ (e.g. 11–15.6 µm)</option>
            </Select>
          </Field>
        </Group>

        <Group title="The edges">
          <div className="grid grid-cols-3 gap-3">
            <Field id={`${id}-scale`} label="Scale">
              <Select id={`${id}-scale`} value={scale} onChange={(e) => setScale(e.target.value as HardnessScale)}>
                {HARDNESS_SCALES.map((s) => (
                  <option key={s}>{s}</option>
                ))}
              </Select>
            </Field>
            <Field id={`${id}-hrc-min`} label="Hardness from" error={hardnessError}>
              <Input id={`${id}-hrc-min`} type="number" inputMode="decimal" step="any" value={hardnessShown('min')} onChange={(e) => applyHardness('min', e.target.value)} />
            </Field>
            <Field id={`${id}-hrc-max`} label="to">
              <Input id={`${id}-hrc-max`} type="number" inputMode="decimal" step="any" value={hardnessShown('max')} onChange={(e) => applyHardness('max', e.target.value)} />
            </Field>
          </div>
          {scale !== 'HRC' && (filters.hrcMin || filters.hrcMax) ? (
            <p className="text-sm text-muted">
              Filtering on {filters.hrcMin ?? 'any'}–{filters.hrcMax ?? 'any'} HRC (converted per ASTM E140).
            </p>
          ) : null}
          <div className="grid grid-cols-2 gap-3">
            <Field id={`${id}-angle-min`} label="Angle per side from (°)">
              <Input id={`${id}-angle-min`} type="number" inputMode="decimal" step="any" min={0} max={90} value={filters.angleMin ?? ''} onChange={(e) => set('angleMin', e.target.value || undefined)} />
            </Field>
            <Field id={`${id}-angle-max`} label="to (°)">
              <Input id={`${id}-angle-max`} type="number" inputMode="decimal" step="any" min={0} max={90} value={filters.angleMax ?? ''} onChange={(e) => set('angleMax', e.target.value || undefined)} />
            </Field>
          </div>
          <div className="grid grid-cols-2 gap-3">
            <Field id={`${id}-from`} label="Posted from">
              <Input id={`${id}-from`} type="date" value={filters.postedFrom ?? ''} onChange={(e) => set('postedFrom', e.target.value || undefined)} />
            </Field>
            <Field id={`${id}-to`} label="to">
              <Input id={`${id}-to`} type="date" value={filters.postedTo ?? ''} onChange={(e) => set('postedTo', e.target.value || undefined)} />
            </Field>
          </div>
          <label className="flex items-center gap-2">
            <input type="checkbox" checked={filters.publisher === '1'} onChange={(e) => set('publisher', e.target.checked ? '1' : undefined)} />
            <span>Only results from verified publishers</span>
          </label>
          <div>
            <Button
              variant="quiet"
              disabled={!any}
              onClick={() => {
                setHardness({ min: '', max: '' });
                update(Object.fromEntries(FILTER_KEYS.map((k) => [k, undefined])));
              }}
            >
              Clear every filter
            </Button>
          </div>
        </Group>
      </form>
    </div>
  );
}
