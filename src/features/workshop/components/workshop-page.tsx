import { useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { BAR_MOUNTS, grinderInputSchema, jigInputSchema, setupInputSchema, workshopWheelInputSchema } from '@shared/schemas/workshop';
import { wheelMeasurementSchema } from '@shared/schemas/wheels';
import { COOLANTS, type Coolant } from '@shared/vocabulary';
import { useSession } from '@/lib/auth';
import { paths } from '@/config/paths';
import { formatDate, formatDegrees, formatNumber } from '@/lib/format';
import { PageTitle } from '@/components/ui/page-title';
import { Button, buttonClasses } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { Field, Input, Select } from '@/components/ui/field';
import { describeError, Empty, ErrorState, Loading } from '@/components/ui/states';
import { SafetyCautions } from '@/features/tools/components/safety-cautions';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { useWorkshop, type Workshop, type WorkshopWheelView } from '../api/get-workshop';
import { useAddToWorkshop } from '../api/add-to-workshop';
import { useMeasurement } from '../api/measurements';
import { formatLength, toMillimetres, useLengthUnit, type LengthUnit } from '../lengths';

const today = () => new Date().toISOString().slice(0, 10);
const money = (amount: number, currency: string, digits = 2) => `${formatNumber(amount, digits)}\u00a0${currency}`;
const coolantName = (c: string | null) => (c ? (COOLANTS[c as Coolant] ?? c) : '—');

/** First message per field of a zod result. */
function issuesOf(result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of result.error?.issues ?? []) out[String(issue.path[0] ?? '')] ??= issue.message;
  return out;
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex min-w-0 flex-col gap-4">
      <h2 id={id} className="text-2xl font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** A small form: text boxes and selects, checked with the server's schema before sending. */
function AddForm({
  title,
  fields,
  build,
  schema,
  kind,
}: {
  title: string;
  fields: { key: string; label: string; options?: Record<string, string>; initial?: string; type?: string }[];
  build: (v: Record<string, string>) => Record<string, unknown>;
  schema: { safeParse: (x: unknown) => { success: boolean; data?: unknown; error?: { issues: { path: PropertyKey[]; message: string }[] } } };
  kind: 'grinders' | 'jigs' | 'setups' | 'wheels';
}) {
  const add = useAddToWorkshop(kind);
  const initial = Object.fromEntries(fields.map((f) => [f.key, f.initial ?? '']));
  const [v, setV] = useState<Record<string, string>>(initial);
  const [tried, setTried] = useState(false);
  const checked = schema.safeParse(build(v));
  const errors = tried ? issuesOf(checked) : {};
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTried(true);
    if (checked.success) add.mutate(checked.data as never, { onSuccess: () => { setV(initial); setTried(false); } });
  };
  const slug = title.toLowerCase().replace(/[^a-z]+/g, '-');
  return (
    <form onSubmit={submit} noValidate className="grid min-w-0 content-start gap-3 self-start rounded-md border border-rule bg-panel p-4 sm:grid-cols-2" aria-label={title}>
      <h3 className="text-lg font-semibold sm:col-span-2">{title}</h3>
      {fields.map((f) => (
        <Field key={f.key} id={`${slug}-${f.key}`} label={f.label} error={errors[f.key]}>
          {f.options ? (
            <Select id={`${slug}-${f.key}`} value={v[f.key]} onChange={(e) => setV({ ...v, [f.key]: e.target.value })}>
              {Object.entries(f.options).map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </Select>
          ) : (
            <Input id={`${slug}-${f.key}`} type={f.type ?? 'text'} value={v[f.key]} onChange={(e) => setV({ ...v, [f.key]: e.target.value })} />
          )}
        </Field>
      ))}
      <div className="flex items-end">
        <Button type="submit" variant="secondary" busy={add.isPending}>
          Add
        </Button>
      </div>
      {add.error ? (
        <p role="alert" className="text-danger sm:col-span-2">
          {describeError(add.error)}
        </p>
      ) : null}
    </form>
  );
}

const num = (text: string) => (text.trim() === '' ? undefined : Number(text.replace(',', '.')));

/** What to set today: each setup, the wheels that share a setting, and how far a worn wheel's setting moved. */
function SettingsToday({ workshop, unit }: { workshop: Workshop; unit: LengthUnit }) {
  const wheelName = (id: number) => workshop.wheels.find((w) => w.id === id)?.name ?? `wheel ${id}`;
  if (workshop.setups.length === 0) return <p className="text-muted">Save a setup below to see the gap to set on each wheel.</p>;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      {workshop.setups.map((setup) => {
        const jig = workshop.jigs.find((j) => j.id === setup.jigId);
        return (
          <article key={setup.id} className="min-w-0 rounded-md border border-rule bg-panel p-4" aria-label={`Setup ${setup.name}`}>
            <h3 className="text-lg font-semibold">{setup.name}</h3>
            <p className="text-sm text-muted">
              {formatDegrees(setup.perSideDeg)} per side · projection {formatLength(setup.projectionMm, unit)}
              {jig ? ` · ${jig.name} (offset ${formatLength(jig.offsetMm, unit)})` : ''}
            </p>
            <ul className="mt-3 flex flex-col gap-3">
              {setup.settings.map((s) => (
                <li key={s.wheelIds.join('-')} className="border-t border-rule pt-2">
                  <p>
                    {s.gapMm !== null ? (
                      <>
                        Set the gap to <strong className="text-lg">{formatLength(s.gapMm, unit)}</strong>
                      </>
                    ) : (
                      <span className="text-danger">{s.reason}</span>
                    )}
                  </p>
                  <p className="text-sm">
                    {s.wheelIds.map(wheelName).join(', ')} · {formatLength(s.diameterMm, unit)} today
                    {s.wheelIds.length > 1 ? ': these wheels have the same diameter and share this one setting' : ''}
                  </p>
                  {s.movedFromNew.map((m) => (
                    <p key={m.wheelId} className="text-sm text-caution">
                      {wheelName(m.wheelId)} has worn: the setting moved {formatLength(m.movedMm, unit, true)} from {formatLength(m.gapWhenNewMm, unit)} when new.
                    </p>
                  ))}
                </li>
              ))}
              {setup.settings.length === 0 ? <li className="text-sm text-muted">No wheel on a grinder yet.</li> : null}
            </ul>
          </article>
        );
      })}
    </div>
  );
}

/** One wheel: diameter, rated speed, forecast, cost, and its log of measurements with edit and delete. */
function WheelCard({ wheel, workshop, unit }: { wheel: WorkshopWheelView; workshop: Workshop; unit: LengthUnit }) {
  const m = useMeasurement(wheel.id);
  const [measuredOn, setMeasuredOn] = useState(today());
  const [diameter, setDiameter] = useState('');
  const [sharpenings, setSharpenings] = useState('0');
  const [dressed, setDressed] = useState(false);
  const [editing, setEditing] = useState<number | null>(null);
  const input = { measuredOn, diameterMm: toMillimetres(diameter, unit), sharpenings: Number(sharpenings), dressed };
  const checked = wheelMeasurementSchema.safeParse(input);
  const grinder = workshop.grinders.find((g) => g.id === wheel.grinderId);
  const id = `wheel-${wheel.id}`;
  const error = m.add.error ?? m.edit.error ?? m.remove.error;
  return (
    <article className="min-w-0 rounded-md border border-rule bg-panel p-4" aria-labelledby={`${id}-title`}>
      <h3 id={`${id}-title`} className="text-lg font-semibold">
        {wheel.name}
      </h3>
      <p className="text-sm text-muted">
        {wheel.abrasive ? <Link to={paths.abrasive.getHref(wheel.abrasive.slug)}>{wheel.abrasive.name}</Link> : 'No abrasive page'}
        {wheel.abrasive ? ` · ${wheel.abrasive.grit}` : ''} · on {grinder?.name ?? '—'} · {coolantName(wheel.coolant)}
        {wheel.abrasive?.sideUsable ? ' · side may be used for flat bevels' : ''}
      </p>
      <dl className="mt-3 grid grid-cols-[7rem_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="text-muted">Now</dt>
        <dd>
          <strong>{formatLength(wheel.currentDiameterMm, unit)}</strong> ({formatLength(wheel.originalDiameterMm, unit)} new
          {wheel.minDiameterMm !== null ? `, ${formatLength(wheel.minDiameterMm, unit)} minimum` : ''})
        </dd>
        <dt className="text-muted">Rim speed</dt>
        <dd className={wheel.speed?.overspeed ? 'text-danger' : ''}>
          {wheel.speed ? `${formatNumber(wheel.speed.speedMps, 2)} m/s of ${formatNumber(wheel.speed.ratedSpeedMps, 1)} m/s rated` : '—'}
        </dd>
        <dt className="text-muted">Replace around</dt>
        <dd>
          {wheel.forecast
            ? `${formatDate(wheel.forecast.onDate)} (wearing ${formatLength(wheel.forecast.mmPer30Days, unit)} per 30 days, from ${wheel.forecast.points} measurements)`
            : wheel.wears
              ? 'needs two dated measurements and a minimum diameter'
              : 'keeps its diameter'}
        </dd>
        <dt className="text-muted">Per sharpening</dt>
        <dd>
          {wheel.cost && wheel.currency
            ? `${money(wheel.cost.costPerSharpening, wheel.currency, 3)} over about ${formatNumber(wheel.cost.expectedSharpenings, 0)} sharpenings; ${
                wheel.cost.basis === 'measured-wear'
                  ? `estimated from ${wheel.cost.restsOn} sharpenings counted on this wheel alone`
                  : `from ${wheel.cost.restsOn} retired wheel${wheel.cost.restsOn === 1 ? '' : 's'} members reported`
              }`
            : 'not enough to estimate yet'}
        </dd>
      </dl>
      {wheel.measurements.length ? (
      <table className="mt-3 w-full text-sm">
        <caption className="text-left font-medium">Log</caption>
        <thead>
          <tr className="text-left text-muted">
            <th className="py-1">Date</th>
            <th className="py-1">Diameter</th>
            <th className="py-1">Sharp.</th>
            <th className="py-1">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {wheel.measurements.map((x) => (
            <tr key={x.id} className="border-t border-rule">
              <td className="py-1">{formatDate(x.measuredOn)}</td>
              <td className="py-1">
                {formatLength(x.diameterMm, unit)}
                {x.dressed ? ' · dressed' : ''}
              </td>
              <td className="py-1">{x.sharpenings}</td>
              <td className="py-1 text-right whitespace-nowrap">
                <button
                  type="button"
                  className="underline"
                  onClick={() => {
                    setEditing(x.id);
                    setMeasuredOn(x.measuredOn);
                    setDiameter(formatNumber(unit === 'in' ? x.diameterMm / 25.4 : x.diameterMm, 3).replace(/,/g, ''));
                    setSharpenings(String(x.sharpenings));
                    setDressed(x.dressed);
                  }}
                >
                  Edit
                </button>{' '}
                <button type="button" className="underline text-danger" onClick={() => m.remove.mutate(x.id)}>
                  Delete
                </button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      ) : (
        <p className="mt-3 text-sm text-muted">No measurements yet: measure across the wheel with calipers, the machine stopped and unplugged.</p>
      )}
      <form
        className="mt-3 grid grid-cols-2 items-end gap-3"
        noValidate
        aria-label={`Log a measurement of ${wheel.name}`}
        onSubmit={(e) => {
          e.preventDefault();
          if (!checked.success) return;
          const done = { onSuccess: () => { setDiameter(''); setSharpenings('0'); setDressed(false); setEditing(null); } };
          if (editing !== null) m.edit.mutate({ id: editing, input: checked.data }, done);
          else m.add.mutate(checked.data, done);
        }}
      >
        <Field id={`${id}-date`} label="Date">
          <Input id={`${id}-date`} type="date" value={measuredOn} onChange={(e) => setMeasuredOn(e.target.value)} />
        </Field>
        <Field id={`${id}-diameter`} label={`Diameter (${unit})`} error={diameter && !checked.success ? issuesOf(checked).diameterMm : undefined}>
          <Input id={`${id}-diameter`} inputMode="decimal" value={diameter} onChange={(e) => setDiameter(e.target.value)} />
        </Field>
        <Field id={`${id}-sharpenings`} label="Sharpenings since">
          <Input id={`${id}-sharpenings`} inputMode="numeric" value={sharpenings} onChange={(e) => setSharpenings(e.target.value)} />
        </Field>
        <label className="flex items-center gap-2 pb-2 text-sm">
          <input type="checkbox" checked={dressed} onChange={(e) => setDressed(e.target.checked)} /> Dressed
        </label>
        <div className="col-span-2">
          <Button type="submit" variant="secondary" busy={m.add.isPending || m.edit.isPending} disabled={!checked.success}>
            {editing !== null ? 'Save the correction' : 'Log measurement'}
          </Button>
        </div>
        {error ? (
          <p role="alert" className="col-span-2 text-danger">
            {describeError(error)}
          </p>
        ) : null}
      </form>
    </article>
  );
}

/** The kit: what it cost against the machine, and where the coolant must change. */
function Kit({ workshop }: { workshop: Workshop }) {
  const name = (id: number) => workshop.wheels.find((w) => w.id === id)?.name ?? `wheel ${id}`;
  const { coolant } = workshop.kit;
  const changeText = (changes: typeof coolant.changes, order: number[]) =>
    changes.length === 0
      ? 'no change of coolant'
      : changes.map((c) => `after ${name(order[c.afterStep])}, change ${coolantName(c.from).toLowerCase()} for ${coolantName(c.to).toLowerCase()}`).join('; ');
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <div className="min-w-0 rounded-md border border-rule bg-panel p-4">
        <h3 className="text-lg font-semibold">What it cost</h3>
        {workshop.kit.totals.length === 0 ? <p className="text-muted">Add the prices you paid to see totals.</p> : null}
        {workshop.kit.totals.map((t) => (
          <p key={t.currency}>
            {t.wheelCount} wheel{t.wheelCount === 1 ? '' : 's'}: <strong>{money(t.wheelsTotal, t.currency, 0)}</strong>
            {t.machinesTotal > 0 ? ` against ${money(t.machinesTotal, t.currency, 0)} for the machine${workshop.grinders.length > 1 ? 's' : ''} (${formatNumber(t.wheelsTotal / t.machinesTotal, 2)} times)` : ''}
          </p>
        ))}
        <p className="mt-2 text-sm text-muted">Totals are per currency, never converted. Costs per sharpening are on each wheel, with what they rest on.</p>
      </div>
      <div className="min-w-0 rounded-md border border-rule bg-panel p-4">
        <h3 className="text-lg font-semibold">Coolant in the trough</h3>
        <p>
          Coarse to fine: {coolant.order.map(name).join(' → ') || '—'}; {changeText(coolant.changes, coolant.order)}.
        </p>
        {coolant.suggestedChanges.length < coolant.changes.length ? (
          <p className="mt-2">
            Fewer changes, still coarse to fine: {coolant.suggestedOrder.map(name).join(' → ')} ({changeText(coolant.suggestedChanges, coolant.suggestedOrder)}).
          </p>
        ) : null}
        <p className="mt-2 text-sm text-muted">
          Empty and rinse the trough between coolants. Read the safety data sheet of any inhibitor and follow the wheel maker’s instructions on
          which coolant it may run in.
        </p>
      </div>
    </div>
  );
}

/** My workshop: grinders, wheels, jigs and setups, private to the member. */
export default function WorkshopPage() {
  const session = useSession();
  const user = session.data?.user ?? null;
  const workshop = useWorkshop(!!user);
  const abrasives = useAbrasives();
  const [unit, setUnit] = useLengthUnit();
  const w = workshop.data;
  const wheelAbrasives = Object.fromEntries((abrasives.data?.items ?? []).filter((a) => a.form === 'wheel').map((a) => [a.slug, a.name]));
  const grinderOptions = Object.fromEntries((w?.grinders ?? []).map((g) => [String(g.id), g.name]));
  const jigOptions = { '': 'No jig', ...Object.fromEntries((w?.jigs ?? []).map((j) => [String(j.id), j.name])) };
  const len = (text: string) => (text.trim() === '' ? undefined : toMillimetres(text, unit));
  return (
    <div className="flex flex-col gap-10">
      <PageTitle
        title="My workshop"
        lead="Your grinders, wheels, jigs and saved setups: the gap to set today on each wheel, what your kit costs per sharpening, and where the coolant must change. Only you can see this page."
      >
        My workshop
      </PageTitle>
      {session.isPending ? <Loading /> : null}
      {!session.isPending && !user ? (
        <Empty title="Sign in to keep your workshop">
          <Link className={buttonClasses('primary')} to={paths.signIn.getHref(paths.workshop.getHref())}>
            Sign in
          </Link>
        </Empty>
      ) : null}
      {user ? (
        <>
          <div className="flex flex-wrap items-center gap-3">
            <label htmlFor="length-unit" className="font-semibold">
              Lengths in
            </label>
            <div className="w-44">
              <Select id="length-unit" value={unit} onChange={(e) => setUnit(e.target.value as LengthUnit)}>
                <option value="mm">millimetres</option>
                <option value="in">inches</option>
              </Select>
            </div>
          </div>
          {workshop.isPending ? <Loading label="Loading your workshop…" /> : null}
          {workshop.error ? <ErrorState error={workshop.error} onRetry={() => workshop.refetch()} /> : null}
          {w ? (
            <>
              <Section id="today" title="What to set today">
                <SettingsToday workshop={w} unit={unit} />
              </Section>
              <Section id="wheels" title="Wheels">
                {w.wheels.length === 0 ? <p className="text-muted">No wheels yet: add a grinder, then a wheel from the abrasive pages.</p> : null}
                <div className="grid gap-4 lg:grid-cols-2">
                  {w.wheels.map((wheel) => (
                    <WheelCard key={wheel.id} wheel={wheel} workshop={w} unit={unit} />
                  ))}
                </div>
                <Caution title="Rated speed">
                  A wheel’s rated maximum speed must be higher than its rim speed on your machine; this page refuses a wheel that would run faster.
                  Never run a cracked or chipped wheel. Follow the machine’s and the wheel’s instructions and your local regulations.
                </Caution>
              </Section>
              <Section id="kit" title="The kit">
                <Kit workshop={w} />
              </Section>
              <Section id="add" title="Add to the workshop">
                <div className="grid gap-4 lg:grid-cols-2">
                  <AddForm
                    kind="grinders"
                    title="A grinder"
                    schema={grinderInputSchema}
                    fields={[
                      { key: 'name', label: 'Name' },
                      { key: 'spindleRpm', label: 'Spindle speed (rpm)' },
                      { key: 'barDiameterMm', label: `Support bar diameter (${unit})` },
                      { key: 'barMount', label: 'Where the bar mounts', options: BAR_MOUNTS, initial: 'with-rotation' },
                      { key: 'pricePaid', label: 'Price paid (optional)' },
                      { key: 'currency', label: 'Currency, e.g. EUR' },
                    ]}
                    build={(v) => ({
                      name: v.name,
                      spindleRpm: num(v.spindleRpm),
                      barDiameterMm: len(v.barDiameterMm),
                      barMount: v.barMount,
                      pricePaid: num(v.pricePaid),
                      currency: v.currency.trim() || undefined,
                    })}
                  />
                  {w.grinders.length ? (
                    <AddForm
                      kind="wheels"
                      title="A wheel"
                      schema={workshopWheelInputSchema}
                      fields={[
                        { key: 'name', label: 'Name' },
                        { key: 'abrasive', label: 'Abrasive page', options: { '': 'Choose…', ...wheelAbrasives } },
                        { key: 'grinderId', label: 'On grinder', options: grinderOptions, initial: String(w.grinders[0].id) },
                        { key: 'originalDiameterMm', label: `Diameter when new (${unit})` },
                        { key: 'minDiameterMm', label: `Minimum usable diameter (${unit}, from the maker)` },
                        { key: 'ratedSpeedMps', label: 'Rated maximum speed (m/s, on the wheel)' },
                        { key: 'coolant', label: 'Coolant', options: { '': 'As on the abrasive page', ...COOLANTS } },
                        { key: 'acquiredOn', label: 'Bought on', type: 'date' },
                        { key: 'pricePaid', label: 'Price paid (optional)' },
                        { key: 'currency', label: 'Currency, e.g. EUR' },
                      ]}
                      build={(v) => ({
                        name: v.name,
                        abrasive: v.abrasive,
                        grinderId: num(v.grinderId),
                        originalDiameterMm: len(v.originalDiameterMm),
                        minDiameterMm: len(v.minDiameterMm),
                        ratedSpeedMps: num(v.ratedSpeedMps),
                        coolant: v.coolant || undefined,
                        acquiredOn: v.acquiredOn || undefined,
                        pricePaid: num(v.pricePaid),
                        currency: v.currency.trim() || undefined,
                      })}
                    />
                  ) : null}
                  <AddForm
                    kind="jigs"
                    title="A jig"
                    schema={jigInputSchema}
                    fields={[
                      { key: 'name', label: 'Name' },
                      { key: 'offsetMm', label: `Blade-plane offset from the bar’s axis (${unit})`, initial: '0' },
                    ]}
                    build={(v) => ({ name: v.name, offsetMm: len(v.offsetMm) })}
                  />
                  <AddForm
                    kind="setups"
                    title="A setup"
                    schema={setupInputSchema}
                    fields={[
                      { key: 'name', label: 'Name, e.g. “chef knife at 15°”' },
                      { key: 'jigId', label: 'Jig', options: jigOptions },
                      { key: 'projectionMm', label: `Projection (${unit})` },
                      { key: 'perSideDeg', label: 'Angle per side (°)' },
                    ]}
                    build={(v) => ({ name: v.name, jigId: v.jigId ? Number(v.jigId) : null, projectionMm: len(v.projectionMm), perSideDeg: num(v.perSideDeg) })}
                  />
                </div>
              </Section>
            </>
          ) : null}
        </>
      ) : null}
      <SafetyCautions />
    </div>
  );
}
