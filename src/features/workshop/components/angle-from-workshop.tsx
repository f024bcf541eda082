import { useId, useState } from 'react';
import { angleFromSavedSetup, type AngleSource } from '@shared/workshop';
import { Field, Select, sentence } from '@/components/ui/field';
import { formatDegrees } from '@/lib/format';
import { formatLength, lengthsIn, useLengthUnit, type LengthUnit } from '@/lib/lengths';
import { useWorkshop, type WorkshopWheelView } from '../api/get-workshop';

/**
 * On the result form: choose one of your saved setups and one of your wheels, and the angle per
 * side is filled in from them, with the setting it rests on (today's gap for that wheel's latest
 * diameter) written underneath. Shown only to a member whose workshop has a setup and a wheel.
 */
export function AngleFromWorkshop({ onPick, currentDeg }: { onPick: (source: AngleSource, wheel: WorkshopWheelView) => void; currentDeg: number | undefined }) {
  const id = useId();
  const workshop = useWorkshop(true);
  const [unit] = useLengthUnit();
  const [setupId, setSetupId] = useState('');
  const [wheelId, setWheelId] = useState('');
  const w = workshop.data;
  const wheels = (w?.wheels ?? []).filter((x) => !x.retiredOn);
  if (!w || w.setups.length === 0 || wheels.length === 0) return null;
  const setup = w.setups.find((s) => String(s.id) === setupId);
  const wheel = wheels.find((x) => String(x.id) === wheelId);
  const source = setup && wheel ? angleFromSavedSetup(setup, wheel.id) : null;

  const choose = (nextSetup: string, nextWheel: string) => {
    setSetupId(nextSetup);
    setWheelId(nextWheel);
    const s = w.setups.find((x) => String(x.id) === nextSetup);
    const wh = wheels.find((x) => String(x.id) === nextWheel);
    const found = s && wh ? angleFromSavedSetup(s, wh.id) : null;
    if (found && 'perSideDeg' in found) onPick(found, wh!);
  };

  return (
    <div className="grid gap-3 rounded-md border border-rule p-3 sm:col-span-2 sm:grid-cols-2" role="group" aria-labelledby={`${id}-title`}>
      <p id={`${id}-title`} className="font-medium sm:col-span-2">
        From my workshop <span className="text-sm font-normal text-muted">optional: a saved setup on one of your wheels fills in the angle</span>
      </p>
      <Field id={`${id}-setup`} label="Saved setup">
        <Select id={`${id}-setup`} value={setupId} onChange={(e) => choose(e.target.value, wheelId)}>
          <option value="">Choose a setup…</option>
          {w.setups.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name} ({formatDegrees(s.perSideDeg)} per side)
            </option>
          ))}
        </Select>
      </Field>
      <Field id={`${id}-wheel`} label="On wheel">
        <Select id={`${id}-wheel`} value={wheelId} onChange={(e) => choose(setupId, e.target.value)}>
          <option value="">Choose a wheel…</option>
          {wheels.map((x) => (
            <option key={x.id} value={x.id}>
              {x.name}
            </option>
          ))}
        </Select>
      </Field>
      {source ? (
        <p className={`text-sm sm:col-span-2 ${'reason' in source ? 'text-danger' : ''}`} aria-live="polite">
          {'reason' in source
            ? `${sentence(lengthsIn(source.reason, unit))}: the angle was not filled in.`
            : describeSource(source, setup!.name, wheel!.name, unit) + (currentDeg === source.perSideDeg ? '' : ' You have since changed the angle by hand.')}
        </p>
      ) : null}
    </div>
  );
}

function describeSource(s: AngleSource, setupName: string, wheelName: string, unit: LengthUnit): string {
  return (
    `${formatDegrees(s.perSideDeg)} per side, from your setup “${setupName}” on “${wheelName}”: ` +
    `gap ${formatLength(s.gapMm, unit)} to the rim at its diameter today of ${formatLength(s.diameterMm, unit)}, ` +
    `bar ${formatLength(s.barDiameterMm, unit)}, projection ${formatLength(s.projectionMm, unit)}. It holds if the gap was set as your workshop says.`
  );
}
