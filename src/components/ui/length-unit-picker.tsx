import { useId } from 'react';
import { useLengthUnit, type LengthUnit } from '@/lib/lengths';
import { Select } from './field';

/** "Lengths in millimetres / inches": the one choice every screen with lengths reads (src/lib/lengths.ts). */
export function LengthUnitPicker() {
  const id = useId();
  const [unit, setUnit] = useLengthUnit();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <label htmlFor={id} className="font-semibold">
        Lengths in
      </label>
      <div className="w-44">
        <Select id={id} value={unit} onChange={(e) => setUnit(e.target.value as LengthUnit)}>
          <option value="mm">millimetres</option>
          <option value="in">inches</option>
        </Select>
      </div>
    </div>
  );
}
