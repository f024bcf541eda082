import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { wheelInputSchema, wheelMeasurementSchema } from '@shared/schemas/wheels';
import { useSession } from '@/lib/auth';
import { paths } from '@/config/paths';
import { formatDate, formatNumber } from '@/lib/format';
import { PageTitle } from '@/components/ui/page-title';
import { Button, buttonClasses } from '@/components/ui/button';
import { controlA11y, Field, Input, Select } from '@/components/ui/field';
import { describeError, Empty, ErrorState, Loading } from '@/components/ui/states';
import { SafetyCautions } from '@/features/tools/components/safety-cautions';
import { useAddWheel, useMeasureWheel, useWheels, type LoggedWheel } from '../api/wheels';
import { WearChart } from './wear-chart';

/** Field messages of a zod result, keyed by the first part of each issue's path. */
function issuesByField(result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) {
  const out: Record<string, string> = {};
  for (const issue of result.error?.issues ?? []) {
    const key = String(issue.path[0] ?? '');
    out[key] ??= issue.message;
  }
  return out;
}

const NAME_HINT = 'How you tell it apart, e.g. “left, vitrified 220”.';
const ANGLES_HINT = 'Separate several with commas.';
const today = () => new Date().toISOString().slice(0, 10);

/** Form to add a wheel to the log; checks each field with the server's own schema as you type. */
function AddWheelForm() {
  const add = useAddWheel();
  const [v, setV] = useState({ name: '', wears: 'yes', originalDiameterMm: '250', barDiameterMm: '12', projectionMm: '150', usualAnglesDeg: '15, 20' });
  const [touched, setTouched] = useState<Record<string, boolean>>({});
  const input = {
    name: v.name,
    wears: v.wears === 'yes',
    originalDiameterMm: Number(v.originalDiameterMm),
    barDiameterMm: Number(v.barDiameterMm),
    projectionMm: Number(v.projectionMm),
    usualAnglesDeg: v.usualAnglesDeg.split(/[,;\s]+/).filter(Boolean).map(Number),
  };
  const checked = wheelInputSchema.safeParse(input);
  const errors = issuesByField(checked);
  const show = (k: string) => (touched[k] ? errors[k] : undefined);
  const set = (k: keyof typeof v) => (e: { target: { value: string } }) => {
    setV({ ...v, [k]: e.target.value });
    setTouched({ ...touched, [k]: true });
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(Object.fromEntries(Object.keys(v).map((k) => [k, true])));
    if (checked.success)
      add.mutate(checked.data, {
        onSuccess: () => {
          setV({ ...v, name: '' });
          setTouched({});
        },
      });
  };
  const num = (k: 'originalDiameterMm' | 'barDiameterMm' | 'projectionMm', label: string, hint?: string) => (
    <Field id={`wheel-${k}`} label={label} hint={hint} error={show(k)}>
      <Input type="number" step="0.1" inputMode="decimal" value={v[k]} onChange={set(k)} {...controlA11y(`wheel-${k}`, { hint, error: show(k) })} />
    </Field>
  );
  return (
    <form onSubmit={submit} noValidate className="grid gap-4 rounded-md border border-rule bg-panel p-4 md:grid-cols-3" aria-labelledby="add-wheel-heading">
      <h2 id="add-wheel-heading" className="font-serif text-xl font-semibold md:col-span-3">Add a wheel</h2>
      <Field id="wheel-name" label="Name" hint={NAME_HINT} error={show('name')} className="md:col-span-2">
        <Input value={v.name} onChange={set('name')} {...controlA11y('wheel-name', { hint: NAME_HINT, error: show('name') })} />
      </Field>
      <Field id="wheel-wears" label="Does it wear smaller?">
        <Select value={v.wears} onChange={set('wears')} id="wheel-wears">
          <option value="yes">Yes (vitrified, natural stone)</option>
          <option value="no">No (plated CBN or diamond)</option>
        </Select>
      </Field>
      {num('originalDiameterMm', 'Diameter when new (mm)')}
      {num('barDiameterMm', 'Support bar diameter (mm)')}
      {num('projectionMm', 'Projection (mm)', 'From the bar’s axis to the edge, along the blade.')}
      <Field id="wheel-angles" label="Usual angles (° per side)" hint={ANGLES_HINT} error={show('usualAnglesDeg')} className="md:col-span-2">
        <Input value={v.usualAnglesDeg} onChange={set('usualAnglesDeg')} {...controlA11y('wheel-angles', { hint: ANGLES_HINT, error: show('usualAnglesDeg') })} />
      </Field>
      <div className="flex items-end">
        <Button type="submit" busy={add.isPending}>Add wheel</Button>
      </div>
      {add.error ? <p role="alert" className="text-danger md:col-span-3">{describeError(add.error)}</p> : null}
    </form>
  );
}

/** One wheel: its measurements, wear, and today's gaps for the usual angles. */
function WheelCard({ wheel }: { wheel: LoggedWheel }) {
  const measure = useMeasureWheel(wheel.id);
  const [measuredOn, setMeasuredOn] = useState(today());
  const [diameter, setDiameter] = useState('');
  const checked = wheelMeasurementSchema.safeParse({ measuredOn, diameterMm: Number(diameter) });
  const errors = diameter ? issuesByField(checked) : {};
  const id = `wheel-${wheel.id}`;
  return (
    <article className="rounded-md border border-rule bg-panel p-4" aria-labelledby={`${id}-title`}>
      <h2 id={`${id}-title`} className="font-serif text-xl font-semibold">{wheel.name}</h2>
      <p className="text-sm text-muted">
        {formatNumber(wheel.originalDiameterMm, 1)} mm when new · bar {formatNumber(wheel.barDiameterMm, 1)} mm · projection {formatNumber(wheel.projectionMm, 1)} mm
        {wheel.wears ? '' : ' · keeps its diameter (CBN or diamond): the gap does not drift'}
      </p>
      <div className="mt-4 grid gap-6 md:grid-cols-2">
        <div>
          <p>
            Now <strong>{formatNumber(wheel.currentDiameterMm, 1)} mm</strong>, worn {formatNumber(wheel.wearMm, 1)} mm
            {wheel.wearPer30DaysMm !== null ? `, about ${formatNumber(wheel.wearPer30DaysMm, 2)} mm per 30 days` : ''}.
          </p>
          <table className="mt-3 w-full text-sm">
            <caption className="text-left font-medium">Gap from bar to rim for your usual angles, on the wheel as it is now</caption>
            <thead>
              <tr className="text-left text-muted"><th className="py-1">Per side</th><th className="py-1">Gap</th></tr>
            </thead>
            <tbody>
              {wheel.gaps.map((g) => (
                <tr key={g.perSideDeg} className="border-t border-rule">
                  <td className="py-1">{formatNumber(g.perSideDeg, 1)}°</td>
                  <td className="py-1">{g.gapMm !== null ? `${formatNumber(g.gapMm, 1)} mm` : <span className="text-danger">{g.reason}</span>}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <div>
          <WearChart original={wheel.originalDiameterMm} series={wheel.series} />
          {wheel.series.length ? (
            <table className="mt-2 w-full text-sm">
              <caption className="text-left font-medium">Measured diameters</caption>
              <tbody>
                {wheel.series.map((m, i) => (
                  <tr key={`${m.measuredOn}-${i}`} className="border-t border-rule"><td className="py-1">{formatDate(m.measuredOn)}</td><td className="py-1 text-right">{formatNumber(m.diameterMm, 1)} mm</td></tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="text-sm text-muted">No measurements yet: measure the diameter across the wheel with calipers, with the machine stopped and unplugged.</p>
          )}
        </div>
      </div>
      <form
        className="mt-4 flex flex-wrap items-end gap-3"
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          if (checked.success) measure.mutate(checked.data, { onSuccess: () => setDiameter('') });
        }}
      >
        <Field id={`${id}-date`} label="Measured on" error={errors.measuredOn}>
          <Input type="date" value={measuredOn} onChange={(e) => setMeasuredOn(e.target.value)} {...controlA11y(`${id}-date`, { error: errors.measuredOn })} />
        </Field>
        <Field id={`${id}-diameter`} label="Measured diameter (mm)" error={errors.diameterMm}>
          <Input type="number" step="0.1" inputMode="decimal" value={diameter} onChange={(e) => setDiameter(e.target.value)} {...controlA11y(`${id}-diameter`, { error: errors.diameterMm })} />
        </Field>
        <Button type="submit" variant="secondary" busy={measure.isPending} disabled={!checked.success}>Record diameter</Button>
        {measure.error ? <p role="alert" className="w-full text-danger">{describeError(measure.error)}</p> : null}
      </form>
    </article>
  );
}

/** The wheel log: a member's wheels, how they wore, and the gap to set today. */
export default function WheelLogPage() {
  const session = useSession();
  const user = session.data?.user ?? null;
  const wheels = useWheels(!!user);
  return (
    <div className="flex flex-col gap-6">
      <PageTitle
        title="Wheel log"
        lead="A vitrified wheel gets smaller as it wears and is dressed, so the same bar setting gives a steeper angle. Log the diameters you measure and read off the gap that brings back your usual angles."
      >
        Wheel log
      </PageTitle>
      {session.isPending ? <Loading /> : null}
      {!session.isPending && !user ? (
        <Empty title="Sign in to keep a wheel log">
          <Link className={buttonClasses('primary')} to={paths.signIn.getHref(paths.tools.wheelLog.getHref())}>Sign in</Link>
        </Empty>
      ) : null}
      {user ? (
        <>
          {wheels.isPending ? <Loading label="Loading your wheels…" /> : null}
          {wheels.error ? <ErrorState error={wheels.error} onRetry={() => wheels.refetch()} /> : null}
          {wheels.data && wheels.data.items.length === 0 ? <Empty title="No wheels yet">Add the first one below.</Empty> : null}
          {wheels.data?.items.map((w) => <WheelCard key={w.id} wheel={w} />)}
          <AddWheelForm />
        </>
      ) : null}
      <SafetyCautions />
    </div>
  );
}
