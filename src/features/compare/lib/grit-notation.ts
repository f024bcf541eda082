import { GRIT_STANDARD_SHORT_LABELS, formatGrade, nearestGrade, type GritStandard } from '@shared/grit';

/** Notations a reader may label grit bands in (nearest grade beside the µm). */
export const NOTATIONS: GritStandard[] = ['jis', 'fepa-f', 'ansi', 'iso6106'];

/** The notation named in the URL, else JIS (the decision view's and the comparison's default). */
export function notationOf(param: string | undefined): GritStandard {
  return NOTATIONS.find((n) => n === param) ?? 'jis';
}

/** The nearest grade of a band's geometric middle in the chosen notation, e.g. "≈ JIS #1000". */
export function bandGrade(band: { loUm: number; hiUm: number }, notation: GritStandard): string {
  const centre = Math.sqrt(band.loUm * band.hiUm);
  const grade = nearestGrade(centre, notation);
  return grade ? `≈ ${formatGrade({ standard: notation, grade: grade.grade })}` : `outside ${GRIT_STANDARD_SHORT_LABELS[notation]}`;
}
