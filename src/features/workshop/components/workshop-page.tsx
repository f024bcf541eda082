import { useState, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { BAR_MOUNTS, grinderInputSchema, jigInputSchema, retireWheelSchema, setupInputSchema, workshopWheelInputSchema } from '@shared/schemas/workshop';
import { wheelMeasurementSchema, type WheelMeasurementInput } from '@shared/schemas/wheels';
import { FEW } from '@shared/workshop';
import { COOLANTS, type Coolant } from '@shared/vocabulary';
import { useSession } from '@/lib/auth';
import { paths } from '@/config/paths';
import { formatDate, formatDegrees, formatNumber } from '@/lib/format';
import { PageTitle } from '@/components/ui/page-title';
import { buttonClasses } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { describeError, Empty, ErrorState, Loading } from '@/components/ui/states';
import { LengthUnitPicker } from '@/components/ui/length-unit-picker';
import { CoolantCaution, coolantWord } from './coolant-caution';
import { SafetyCautions } from '@/features/tools/components/safety-cautions';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { useWorkshop, type Workshop, type WorkshopWheelView } from '../api/get-workshop';
import { useAddToWorkshop } from '../api/add-to-workshop';
import { useMeasurement } from '../api/measurements';
import { useRetireWheel } from '../api/retire-wheel';
import { formatLength, lengthsIn, lengthText, toMillimetres, useLengthUnit, type LengthUnit } from '@/lib/lengths';
import { EntryForm, num, type EntryField } from './entry-form';

const today = () => new Date().toISOString().slice(0, 10);
const money = (amount: number, currency: string, digits = 2) => `${formatNumber(amount, digits)}\u00a0${currency}`;
const coolantName = (c: string | null) => (c ? (COOLANTS[c as Coolant] ?? c) : '—');

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

/** The price boxes of a grinder and a wheel, and what they become. */
const PRICE_FIELDS: EntryField[] = [
  { key: 'pricePaid', label: 'Price paid (optional)', inputMode: 'decimal' },
  { key: 'currency', label: 'Currency, e.g. EUR' },
];
const priceOf = (v: Record<string, string>) => ({ pricePaid: num(v.pricePaid), currency: v.currency.trim() || undefined });

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
                      <span className="text-danger">{lengthsIn(s.reason ?? '', unit)}</span>
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

/** What a sharpening on this wheel costs, what the figure rests on, and plainly when that is little. */
function costText(wheel: WorkshopWheelView): string {
  const { cost } = wheel;
  if (!cost || !wheel.currency) {
    if (wheel.pricePaid === null) return 'add the price you paid to see it';
    if (wheel.wears) return wheel.minDiameterMm === null ? 'needs the minimum usable diameter from the maker' : 'needs two measurements with the sharpenings counted between them';
    return 'no member has retired a wheel of this abrasive yet, so its life is unknown';
  }
  const head = `${money(cost.costPerSharpening, wheel.currency, 3)} over about ${formatNumber(cost.expectedSharpenings, 0)} sharpenings`;
  if (cost.basis === 'measured-wear') {
    const n = cost.measurements;
    return `${head}: the diameter lost per sharpening on this wheel alone (${cost.restsOn} sharpenings across ${n} measurements) against its usable range${
      cost.rough ? `. Only ${n < FEW ? `${n} measurements` : `${cost.restsOn} sharpenings`}: a rough estimate that will move as you log more` : ''
    }.`;
  }
  return `${head}: the median life of ${cost.restsOn} retired wheel${cost.restsOn === 1 ? '' : 's'} of this abrasive that members reported${
    cost.rough ? `. Only ${cost.restsOn}: a rough estimate` : ''
  }.`;
}

/** One wheel: diameter, rated speed, forecast, cost, and its log of measurements with edit and delete. */
function WheelCard({ wheel, workshop, unit }: { wheel: WorkshopWheelView; workshop: Workshop; unit: LengthUnit }) {
  const m = useMeasurement(wheel.id);
  const retire = useRetireWheel(wheel.id);
  const [editing, setEditing] = useState<WorkshopWheelView['measurements'][number] | null>(null);
  const grinder = workshop.grinders.find((g) => g.id === wheel.grinderId);
  const id = `wheel-${wheel.id}`;
  const logged = wheel.measurements.reduce((sum, x) => sum + x.sharpenings, 0);
  // Adding and correcting a measurement are one form; a correction starts from the entry's values.
  const save = {
    mutate: (input: WheelMeasurementInput, opts: { onSuccess: () => void }) =>
      editing ? m.edit.mutate({ id: editing.id, input }, { onSuccess: () => { opts.onSuccess(); setEditing(null); } }) : m.add.mutate(input, opts),
    isPending: m.add.isPending || m.edit.isPending,
    error: m.add.error ?? m.edit.error,
  };
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
          {costText(wheel)}
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
                  onClick={() => setEditing(x)}
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
      {m.remove.error ? (
        <p role="alert" className="mt-2 text-danger">
          {describeError(m.remove.error)}
        </p>
      ) : null}
      {wheel.retiredOn ? (
        <p className="mt-3 text-sm text-muted">
          Retired on {formatDate(wheel.retiredOn)} after {wheel.retiredAfterSharpenings ?? '—'} sharpenings.
        </p>
      ) : (
        <div className="mt-3 grid gap-3">
          <EntryForm
            key={`${editing?.id ?? 'new'}-${unit}`}
            title={editing ? `Correct the entry of ${editing.measuredOn}` : 'Log a measurement'}
            className="sm:grid-cols-2"
            fields={[
              { key: 'measuredOn', label: 'Date', type: 'date' },
              { key: 'diameterMm', label: `Diameter (${unit})`, inputMode: 'decimal' },
              { key: 'sharpenings', label: 'Sharpenings since', inputMode: 'numeric' },
              { key: 'dressed', label: 'Dressed', checkbox: true },
            ]}
            initial={
              editing
                ? { measuredOn: editing.measuredOn, diameterMm: lengthText(editing.diameterMm, unit), sharpenings: String(editing.sharpenings), dressed: editing.dressed ? 'true' : '' }
                : { measuredOn: today(), sharpenings: '0' }
            }
            build={(v) => ({ measuredOn: v.measuredOn, diameterMm: toMillimetres(v.diameterMm, unit), sharpenings: num(v.sharpenings), dressed: v.dressed === 'true' })}
            schema={wheelMeasurementSchema}
            send={save}
            submitLabel={editing ? 'Save the correction' : 'Log measurement'}
          />
          <details className="rounded-md border border-rule p-3">
            <summary className="cursor-pointer font-medium">Retire this wheel</summary>
            <EntryForm
              title={`Retire ${wheel.name}`}
              className="mt-2 border-0 p-0 sm:grid-cols-2"
              fields={[
                { key: 'retiredOn', label: 'Retired on', type: 'date' },
                { key: 'retiredAfterSharpenings', label: 'Sharpenings it gave', inputMode: 'numeric' },
              ]}
              initial={{ retiredOn: today(), retiredAfterSharpenings: String(logged) }}
              build={(v) => ({ retiredOn: v.retiredOn, retiredAfterSharpenings: num(v.retiredAfterSharpenings) })}
              schema={retireWheelSchema}
              send={retire}
              submitLabel="Retire the wheel"
            >
              <p className="col-span-full text-sm text-muted">
                It leaves the kit and its settings; the sharpenings it gave are counted, anonymously, in the cost per sharpening of other wheels of this
                abrasive.
              </p>
            </EntryForm>
          </details>
        </div>
      )}
    </article>
  );
}

/**
 * One sharpening on the whole kit (shared/workshop.ts `kitSharpeningCost`): the sum of the active
 * wheels' figures, the rule it rests on, the wheels left out and why, and plainly when it is rough.
 */
function KitPerSharpening({ workshop, name }: { workshop: Workshop; name: (id: number) => string }) {
  const { byCurrency, missing } = workshop.kit.perSharpening;
  const active = workshop.wheels.filter((w) => !w.retiredOn);
  if (active.length === 0) return null;
  const why = (m: (typeof missing)[number]) => {
    if (m.why === 'no-price') return 'no price paid';
    const wheel = active.find((w) => w.id === m.wheelId);
    if (wheel?.wears) return wheel.minDiameterMm === null ? 'no minimum diameter' : 'not two measurements with sharpenings between them yet';
    return 'no member has reported the life of a wheel of its abrasive yet';
  };
  return (
    <div className="mt-3 border-t border-rule pt-3">
      <h4 className="font-semibold">Per sharpening, the whole kit</h4>
      {byCurrency.length === 0 ? <p className="text-muted">No wheel has a figure yet: see each wheel’s card for what it needs.</p> : null}
      {byCurrency.map((c) => (
        <p key={c.currency}>
          {missing.length ? 'At least ' : ''}
          <strong>{money(c.costPerSharpening, c.currency, 2)}</strong> a sharpening, from {c.wheelIds.length} of {active.length} wheel
          {active.length === 1 ? '' : 's'} ({c.wheelIds.map((id) => `${name(id)} ${money(active.find((w) => w.id === id)!.cost!.costPerSharpening, c.currency, 3)}`).join(' + ')})
          {c.rough ? '. A rough estimate: it rests on few measurements or reports, as the wheels’ cards say' : ''}.
        </p>
      ))}
      {missing.length ? (
        <p className="mt-1">
          Not counted: {missing.map((m) => `${name(m.wheelId)} (${why(m)})`).join('; ')}.
        </p>
      ) : null}
      <p className="mt-1 text-sm text-muted">
        The rule: one sharpening takes the blade across every active wheel once, coarse to fine, so the kit’s figure is the sum of each wheel’s. Use
        fewer wheels and it costs less.
      </p>
    </div>
  );
}

/** The kit: what it cost against the machine, and where the coolant must change. */
function Kit({ workshop }: { workshop: Workshop }) {
  const name = (id: number) => workshop.wheels.find((w) => w.id === id)?.name ?? `wheel ${id}`;
  const { coolant } = workshop.kit;
  const changeText = (changes: typeof coolant.changes, order: number[]) =>
    changes.length === 0
      ? 'no change of coolant'
      : changes.map((c) => `after ${name(order[c.afterStep])}, change ${coolantWord(c.from)} for ${coolantWord(c.to)}`).join('; ');
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
        <p className="mt-2 text-sm text-muted">Totals are per currency, never converted. Each wheel’s own figure per sharpening, with what it rests on, is on its card.</p>
        <KitPerSharpening workshop={workshop} name={name} />
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
        <CoolantCaution />
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
  const [unit] = useLengthUnit();
  const addGrinder = useAddToWorkshop('grinders');
  const addWheel = useAddToWorkshop('wheels');
  const addJig = useAddToWorkshop('jigs');
  const addSetup = useAddToWorkshop('setups');
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
          <LengthUnitPicker />
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
                  <EntryForm
                    key={`grinder-${unit}`}
                    title="A grinder"
                    schema={grinderInputSchema}
                    send={addGrinder}
                    fields={[
                      { key: 'name', label: 'Name' },
                      { key: 'spindleRpm', label: 'Spindle speed (rpm)', inputMode: 'decimal' },
                      { key: 'barDiameterMm', label: `Support bar diameter (${unit})`, inputMode: 'decimal' },
                      { key: 'barMount', label: 'Where the bar mounts', options: BAR_MOUNTS, wide: true },
                      ...PRICE_FIELDS,
                    ]}
                    initial={{ barMount: 'with-rotation' }}
                    build={(v) => ({ name: v.name, spindleRpm: num(v.spindleRpm), barDiameterMm: len(v.barDiameterMm), barMount: v.barMount, ...priceOf(v) })}
                  />
                  {w.grinders.length ? (
                    <EntryForm
                      key={`wheel-${unit}`}
                      title="A wheel"
                      schema={workshopWheelInputSchema}
                      send={addWheel}
                      fields={[
                        { key: 'name', label: 'Name' },
                        { key: 'abrasive', label: 'Abrasive page', options: { '': 'Choose…', ...wheelAbrasives }, wide: true },
                        { key: 'grinderId', label: 'On grinder', options: grinderOptions },
                        { key: 'originalDiameterMm', label: `Diameter when new (${unit})`, inputMode: 'decimal' },
                        { key: 'minDiameterMm', label: `Minimum usable diameter (${unit}, from the maker)`, inputMode: 'decimal' },
                        { key: 'ratedSpeedMps', label: 'Rated maximum speed (m/s, on the wheel)', inputMode: 'decimal' },
                        { key: 'coolant', label: 'Coolant', options: { '': 'As on the abrasive page', ...COOLANTS }, wide: true },
                        { key: 'acquiredOn', label: 'Bought on', type: 'date' },
                        ...PRICE_FIELDS,
                      ]}
                      initial={{ grinderId: String(w.grinders[0].id) }}
                      build={(v) => ({
                        name: v.name,
                        abrasive: v.abrasive,
                        grinderId: num(v.grinderId),
                        originalDiameterMm: len(v.originalDiameterMm),
                        minDiameterMm: len(v.minDiameterMm),
                        ratedSpeedMps: num(v.ratedSpeedMps),
                        coolant: v.coolant || undefined,
                        acquiredOn: v.acquiredOn || undefined,
                        ...priceOf(v),
                      })}
                    />
                  ) : null}
                  <EntryForm
                    key={`jig-${unit}`}
                    title="A jig"
                    schema={jigInputSchema}
                    send={addJig}
                    fields={[{ key: 'name', label: 'Name' }, { key: 'offsetMm', label: `Blade-plane offset from the bar’s axis (${unit})`, inputMode: 'decimal' }]}
                    initial={{ offsetMm: '0' }}
                    build={(v) => ({ name: v.name, offsetMm: len(v.offsetMm) })}
                  />
                  <EntryForm
                    key={`setup-${unit}`}
                    title="A setup"
                    schema={setupInputSchema}
                    send={addSetup}
                    fields={[
                      { key: 'name', label: 'Name, e.g. “chef knife at 15°”' },
                      { key: 'jigId', label: 'Jig', options: jigOptions },
                      { key: 'projectionMm', label: `Projection (${unit})`, inputMode: 'decimal' },
                      { key: 'perSideDeg', label: 'Angle per side (°)', inputMode: 'decimal' },
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
