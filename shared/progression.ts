/**
 * A result's progression: the ordered abrasive steps before its final abrasive, each
 * `{ abrasive, grit?, perSideDeg? }`, validated like the final step and stored with each step's
 * derived particle size. Also its CSV cell ("slug (grit, angle°) > slug > …") and the words
 * that name a progression. Pure: no I/O; page lookups are passed in.
 */
import { z } from 'zod';
import { gritInputSchema, slugSchema as slug } from './schemas/common';
import { ComputationError } from './computation-error';
import { GRIT_STANDARDS, formatMicrometres, parseGrit, type GritStandard } from './grit';
import { ABRASIVE_MATERIALS } from './vocabulary';

/** Most steps before the final abrasive. */
export const PROGRESSION_MAX = 8;


/** One step: an abrasive page, optionally the grit used (else the page's) and the angle per side. */
export const progressionStepSchema = z
  .object({
    abrasive: slug,
    grit: gritInputSchema.optional(),
    perSideDeg: z.number().gt(0, 'must be above 0°').max(60, 'must be at most 60° per side').optional(),
  })
  .strict();
export type ProgressionStep = z.infer<typeof progressionStepSchema>;

/** The steps before the final abrasive, in order: 1 to PROGRESSION_MAX of them. */
export const progressionSchema = z.array(progressionStepSchema).min(1, 'give at least one step, or leave the progression out').max(PROGRESSION_MAX, `at most ${PROGRESSION_MAX} steps`);

/**
 * Each step's grit must be readable, like the final step's: adds an issue at
 * `progression.N.grit.grade` through `report` for each that is not.
 */
export function checkProgressionGrits(steps: readonly ProgressionStep[] | undefined, report: (path: (string | number)[], message: string) => void): void {
  steps?.forEach((step, i) => {
    if (!step.grit) return;
    try {
      parseGrit(step.grit.grade, step.grit.standard);
    } catch (err) {
      if (!(err instanceof ComputationError)) throw err;
      report(['progression', i, 'grit', 'grade'], err.message);
    }
  });
}

/** What a step needs of its abrasive page. */
export interface StepAbrasive {
  name: string;
  material: string;
  gritStandard: string;
  gritGrade: string;
}

/** One stored step: what was entered with its page's material and the derived particle size. */
export interface DerivedStep {
  abrasive: string;
  material: string;
  gritStandard: GritStandard;
  gritGrade: string;
  gritUm: number;
  perSideDeg: number | null;
}

/** The stored form of the steps (the step's grit, else its page's labelled grit). Throws ComputationError. */
export function deriveProgression(steps: readonly ProgressionStep[] | undefined, pageOf: (slug: string) => StepAbrasive): DerivedStep[] {
  return (steps ?? []).map((step) => {
    const page = pageOf(step.abrasive);
    const grit = step.grit ?? { standard: page.gritStandard as GritStandard, grade: page.gritGrade };
    const parsed = parseGrit(grit.grade, grit.standard);
    return { abrasive: step.abrasive, material: page.material, gritStandard: parsed.standard, gritGrade: parsed.grade, gritUm: parsed.micrometres, perSideDeg: step.perSideDeg ?? null };
  });
}

/**
 * The columns a progression filter reads: the number of steps, and the materials met along the
 * way written ",cbn,diamond," so that "passed through CBN" is a LIKE '%,cbn,%' in any dialect.
 */
export function progressionColumns(steps: readonly DerivedStep[]): { progressionSteps: number; progressionMaterials: string } {
  const materials = [...new Set(steps.map((s) => s.material))].sort();
  return { progressionSteps: steps.length, progressionMaterials: materials.length ? `,${materials.join(',')},` : '' };
}

const materialLabel = (m: string) => ABRASIVE_MATERIALS[m as keyof typeof ABRASIVE_MATERIALS] ?? m;

/** A progression in words by material and size, e.g. "Aluminium oxide 125 µm → CBN 46 µm"; "" for none. */
export function progressionWords(steps: readonly Pick<DerivedStep, 'material' | 'gritUm'>[]): string {
  return steps.map((s) => `${materialLabel(s.material)} ${formatMicrometres(s.gritUm)}`).join(' → ');
}

/**
 * Where a progression goes back to a coarser size: each pair of neighbouring steps with a known size
 * (the final abrasive last; a step without one is skipped over) whose later one is coarser, i.e. has
 * the larger particle size. Going coarse to fine is common practice, so the form hints at these
 * without refusing them (a deliberate step back to a coarser stone is the member's call).
 */
export function coarserAfterFiner(sizesUm: readonly (number | null)[]): { earlier: number; later: number }[] {
  const found: { earlier: number; later: number }[] = [];
  let previous = -1;
  sizesUm.forEach((size, index) => {
    if (size === null) return;
    if (previous >= 0 && size > sizesUm[previous]!) found.push({ earlier: previous, later: index });
    previous = index;
  });
  return found;
}

/** One step as people read it: "cbn-wheel-b126 (ISO 6106 B126, 20°)". */
function stepCell(step: ProgressionStep): string {
  const parts: string[] = [];
  if (step.grit) parts.push(step.grit.standard ? `${step.grit.standard} ${step.grit.grade}` : step.grit.grade);
  if (step.perSideDeg !== undefined) parts.push(`${step.perSideDeg}°`);
  return parts.length ? `${step.abrasive} (${parts.join(', ')})` : step.abrasive;
}

/** The CSV cell of a progression: steps joined by " > "; empty for none. */
export function progressionCell(steps: readonly ProgressionStep[] | undefined): string {
  return (steps ?? []).map(stepCell).join(' > ');
}

const STEP = /^(.+?)\s*(?:\((.*)\))?$/;
const ANGLE = /^(\d+(?:[.,]\d+)?)\s*(?:°|deg|degrees?)$/i;

/**
 * A CSV cell → steps, with the problems found. Each step is an abrasive (slug or name, looked
 * up with `abrasiveOf`), optionally followed by "(grit, angle°)" in either order; the grit may
 * start with its standard ("jis 8000"). Steps are separated by ">".
 */
export function parseProgressionCell(text: string, abrasiveOf: (text: string) => string | null): { steps: ProgressionStep[]; issues: string[] } {
  const issues: string[] = [];
  const steps: ProgressionStep[] = [];
  const pieces = text.split('>').map((p) => p.trim());
  if (pieces.some((p) => !p)) return { steps, issues: ['a step is empty; separate steps with ">"'] };
  pieces.forEach((piece, i) => {
    const m = STEP.exec(piece)!;
    const slugOf = abrasiveOf(m[1].trim());
    if (!slugOf) {
      issues.push(`step ${i + 1}: no abrasive page matches "${m[1].trim().slice(0, 60)}" by slug or name`);
      return;
    }
    const step: ProgressionStep = { abrasive: slugOf };
    for (const part of (m[2] ?? '').split(',').map((p) => p.trim()).filter(Boolean)) {
      const angle = ANGLE.exec(part);
      if (angle) {
        step.perSideDeg = Number(angle[1].replace(',', '.'));
        continue;
      }
      const [first, ...rest] = part.split(/\s+/);
      const standard = GRIT_STANDARDS.find((s) => s === first.toLowerCase());
      step.grit = standard && rest.length ? { standard, grade: rest.join(' ') } : { grade: part };
    }
    steps.push(step);
  });
  return { steps, issues };
}
