// Placeholder signatures; the full implementation replaces this file.
import { ComputationError } from './computation-error';
export const GRIT_STANDARDS = ['fepa-f', 'fepa-p', 'jis', 'ansi', 'mesh', 'iso6106', 'um'] as const;
export type GritStandard = (typeof GRIT_STANDARDS)[number];
export interface ParsedGrit { standard: GritStandard; grade: string; micrometres: number; inferred: boolean }
export function parseGrit(text: string, standard?: GritStandard): ParsedGrit {
  const m = /^(\d+(?:\.\d+)?)\s*(µm|um)$/i.exec(text.trim());
  if (m) return { standard: 'um', grade: `${m[1]} µm`, micrometres: Number(m[1]), inferred: !standard };
  throw new ComputationError(`unknown grit "${text}"`, 'grade');
}
export function gritBand(um: number, step: 1 | 0.5 = 1): { loUm: number; hiUm: number } {
  const phi = -Math.log2(um / 1000);
  const lo = Math.floor(phi / step) * step;
  return { loUm: 1000 * 2 ** -(lo + step), hiUm: 1000 * 2 ** -lo };
}
