import { COOLANTS, type Coolant } from '@shared/vocabulary';

/** A coolant in running text: "water with corrosion inhibitor". */
export const coolantWord = (c: Coolant | string) => (COOLANTS[c as Coolant] ?? c).toLowerCase();

/** The cautions wherever the product says where the trough must change (the kit, a result's progression, the decision view). */
export function CoolantCaution({ className = 'mt-2 text-sm text-muted' }: { className?: string }) {
  return (
    <p className={className}>
      Empty and rinse the trough between coolants. Read the safety data sheet of any additive, follow the wheel and machine makers’ instructions on
      which coolant each wheel may run in, and your local regulations on disposing of used coolant.
    </p>
  );
}
