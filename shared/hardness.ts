// Placeholder signatures; the full implementation replaces this file.
export const HARDNESS_SCALES = ['HRC', 'HV', 'HBW', 'HRA'] as const;
export type HardnessScale = (typeof HARDNESS_SCALES)[number];
export function toHrc(value: number, scale: HardnessScale): number {
  return scale === 'HRC' ? value : NaN;
}
