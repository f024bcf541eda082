/**
 * Grit designations and particle sizes.
 *
 * Every standard's grades are held as a ladder of representative particle sizes in micrometres
 * (µm). How a representative size is obtained differs by standard, and each table says so:
 * sieve-graded grits are defined by a set of sieve openings, microgrits by the median particle
 * diameter ds50 from sedimentation or electrical-resistance counting. Values marked R were seen in
 * a retrieved copy of the standard (or a faithful reproduction); values marked "(from memory)"
 * were recalled and should be checked against the standard before being relied on.
 *
 * Pure data and arithmetic: no I/O, no clock, no framework imports.
 */
import { ComputationError } from './computation-error';

export const GRIT_STANDARDS = ['fepa-f', 'fepa-p', 'jis', 'ansi', 'ansi-bonded', 'mesh', 'iso6106', 'um'] as const;
/** Identifier of a grit standard, as stored and sent by the API. */
export type GritStandard = (typeof GRIT_STANDARDS)[number];

/** Names of the standards as shown to people. */
export const GRIT_STANDARD_LABELS: Record<GritStandard, string> = {
  'fepa-f': 'FEPA F (bonded abrasives, ISO 8486)',
  'fepa-p': 'FEPA P (coated abrasives, ISO 6344)',
  jis: 'JIS R6001',
  ansi: 'ANSI B74.18 (coated abrasives)',
  'ansi-bonded': 'ANSI B74.12 / B74.10 (bonded abrasives, grinding wheels)',
  mesh: 'US mesh (ASTM E11 sieve opening)',
  iso6106: 'Diamond and CBN (ISO 6106)',
  um: 'Micrometres',
};

/** Short names of the standards, for tight spaces such as chart rows. */
export const GRIT_STANDARD_SHORT_LABELS: Record<GritStandard, string> = {
  'fepa-f': 'FEPA F',
  'fepa-p': 'FEPA P',
  jis: 'JIS',
  ansi: 'ANSI coated',
  'ansi-bonded': 'ANSI bonded',
  mesh: 'US mesh',
  iso6106: 'ISO 6106',
  um: 'µm',
};

/** How a grade's representative particle size was obtained. */
export type SizeBasis =
  | 'sieve-band' // geometric middle of the sieve band that must hold about 80 % of the grains
  | 'ds50' // median particle diameter (sedimentation or electrical-resistance counting)
  | 'average' // average particle size as tabulated for the grade
  | 'sieve-opening' // nominal opening of one test sieve
  | 'aperture-mean' // arithmetic mean of the two sieve apertures of a superabrasive range
  | 'stated'; // a size typed directly in micrometres

/** A grit as read from what a person typed. */
export interface ParsedGrit {
  /** The standard the grade belongs to. */
  standard: GritStandard;
  /** The grade in the standard's own notation, e.g. "F400", "#6000", "No. 400", "D46", "15 µm". */
  grade: string;
  /** Representative particle size in micrometres. */
  micrometres: number;
  /** True when no standard was named or chosen and one was assumed (a bare number read as JIS). */
  inferred: boolean;
  /** How `micrometres` was obtained. */
  basis?: SizeBasis;
  /** True where published copies of the standard disagree by a few micrometres (ANSI microgrits). */
  lowConfidence?: boolean;
}

interface GradeRow {
  grade: string;
  micrometres: number;
  basis: SizeBasis;
  lowConfidence?: boolean;
}

// ---------------------------------------------------------------------------------------------
// FEPA F (FEPA 42-1:2006 / ISO 8486-1 macrogrits, FEPA 42-2:2006 / ISO 8486-2 microgrits)
// ---------------------------------------------------------------------------------------------

/**
 * FEPA F macrogrit sieve sets, openings in µm: [sieve 1 (all grains pass), sieve 2, sieve 3,
 * sieve 4, sieve 5 (at most 3 % pass)]. About 80 % of the grains lie between sieve 4 and sieve 2.
 * The representative size of a macrogrit is taken as the geometric middle of that 80 % band,
 * √(sieve 2 × sieve 4): a sieve-graded grit has no single defined size, and the geometric middle
 * suits a size scale that is logarithmic.
 * R: F24–F220 rows seen in the FEPA 42-D-1986 edition (bands 97–100 % and 80 %); the sieve 3
 * openings of those rows and every other row are (from memory).
 */
const FEPA_F_MACRO_SIEVES: [number, [number, number, number, number, number]][] = [
  [4, [8000, 5600, 4750, 4000, 3350]], // (from memory)
  [5, [6700, 4750, 4000, 3350, 2800]], // (from memory)
  [6, [5600, 4000, 3350, 2800, 2360]], // (from memory)
  [7, [4750, 3350, 2800, 2360, 2000]], // (from memory)
  [8, [4000, 2800, 2360, 2000, 1700]], // (from memory)
  [10, [3350, 2360, 2000, 1700, 1400]], // (from memory)
  [12, [2800, 2000, 1700, 1400, 1180]], // (from memory)
  [14, [2360, 1700, 1400, 1180, 1000]], // (from memory)
  [16, [2000, 1400, 1180, 1000, 850]], // (from memory)
  [20, [1700, 1180, 1000, 850, 710]], // (from memory)
  [22, [1400, 1000, 850, 710, 600]], // (from memory)
  [24, [1180, 850, 710, 600, 500]], // R
  [30, [1000, 710, 600, 500, 425]], // (from memory)
  [36, [850, 600, 500, 425, 355]], // R
  [40, [710, 500, 425, 355, 300]], // (from memory)
  [46, [600, 425, 355, 300, 250]], // R
  [54, [500, 355, 300, 250, 212]], // (from memory)
  [60, [425, 300, 250, 212, 180]], // R
  [70, [355, 250, 212, 180, 150]], // (from memory)
  [80, [300, 212, 180, 150, 125]], // R
  [90, [250, 180, 150, 125, 106]], // (from memory)
  [100, [212, 150, 125, 106, 75]], // R
  [120, [180, 125, 106, 90, 63]], // R
  [150, [150, 106, 75, 63, 45]], // R
  [180, [125, 90, 75, 63, 53]], // R
  [220, [106, 75, 63, 53, 45]], // R
];

/** Representative size of a sieve-graded macrogrit: geometric middle of its 80 % band, µm. */
function sieveBandMiddle(sieves: readonly number[]): number {
  return Math.sqrt(sieves[1] * sieves[3]);
}

/**
 * FEPA F microgrits, ds50 by sedimentation, µm (FEPA 42-2:2006 / ISO 8486-2:2007), every value
 * (from memory); tolerances are ± a few tenths to 3 µm.
 */
const FEPA_F_MICRO_DS50: [number, number][] = [
  [230, 53.0],
  [240, 44.5],
  [280, 36.5],
  [320, 29.2],
  [360, 22.8],
  [400, 17.3],
  [500, 12.8],
  [600, 9.3],
  [800, 6.5],
  [1000, 4.5],
  [1200, 3.0],
  [1500, 2.0],
  [2000, 1.2],
];

// ---------------------------------------------------------------------------------------------
// FEPA P (ISO 6344-2:1998 macro, ISO 6344-3:2013 micro)
// ---------------------------------------------------------------------------------------------

/**
 * FEPA P grades, µm. Macrogrits P12–P220: average sizes derived from the sieve limits of
 * ISO 6344-2 (R, except P150–P220 (from memory)). Microgrits P240–P2500: ds50 per ISO 6344-3
 * (P400 and P600 R; the rest (from memory)).
 */
const FEPA_P: [number, number, SizeBasis][] = [
  [12, 1815, 'average'], // R
  [16, 1324, 'average'], // R
  [20, 1000, 'average'], // R
  [24, 764, 'average'], // R
  [30, 642, 'average'], // R
  [36, 538, 'average'], // R
  [40, 425, 'average'], // R
  [50, 336, 'average'], // R
  [60, 269, 'average'], // R
  [80, 201, 'average'], // R
  [100, 162, 'average'], // R
  [120, 125, 'average'], // R
  [150, 100, 'average'], // (from memory)
  [180, 82, 'average'], // (from memory)
  [220, 68, 'average'], // (from memory)
  [240, 58.5, 'ds50'], // (from memory)
  [280, 52.2, 'ds50'], // (from memory)
  [320, 46.2, 'ds50'], // (from memory)
  [360, 40.5, 'ds50'], // (from memory)
  [400, 35.0, 'ds50'], // R
  [500, 30.2, 'ds50'], // (from memory)
  [600, 25.8, 'ds50'], // R
  [800, 21.8, 'ds50'], // (from memory)
  [1000, 18.3, 'ds50'], // (from memory)
  [1200, 15.3, 'ds50'], // (from memory)
  [1500, 12.6, 'ds50'], // (from memory)
  [2000, 10.3, 'ds50'], // (from memory)
  [2500, 8.4, 'ds50'], // (from memory)
];

// ---------------------------------------------------------------------------------------------
// JIS R6001
// ---------------------------------------------------------------------------------------------

/**
 * JIS R6001 macrogrits use the same sieve sets as FEPA F for the sizes they share (R), so their
 * representative size is the FEPA sieve-band middle. The list of JIS macro grades is (from memory).
 */
const JIS_MACRO = [8, 10, 12, 14, 16, 20, 24, 30, 36, 46, 54, 60, 70, 80, 90, 100, 120, 150, 180, 220];

/** JIS R6001:1987 fine grits, ds50 by electrical resistance (JIS R6002), µm — R. */
const JIS_FINE_DS50: [number, number][] = [
  [240, 57.0],
  [280, 48.0],
  [320, 40.0],
  [360, 35.0],
  [400, 30.0],
  [500, 25.0],
  [600, 20.0],
  [700, 17.0],
  [800, 14.0],
  [1000, 11.5],
  [1200, 9.5],
  [1500, 8.0],
  [2000, 6.7],
  [2500, 5.5],
  [3000, 4.0],
  [4000, 3.0],
  [6000, 2.0],
  [8000, 1.2],
];

// ---------------------------------------------------------------------------------------------
// JIS R6001 coarse series, checked (R): the Unified Abrasives Manufacturers' Association's
// "National and International Size Standards" (uama.org, Abrasives 101) compares ANSI B74.12-2001,
// FEPA 43-1984 R1991 and JIS R6001-1987: for the macrogrit sizes each defines, the sieve
// requirements are identical; FEPA alone has F22 and F40; JIS lacks the four coarsest sizes 4, 5,
// 6 and 7. So JIS_MACRO above is FEPA F's macro series less 4, 5, 6, 7, 22 and 40, and each JIS
// coarse grade takes the FEPA sieve set of its number. What this covers: the list of coarse grades
// and that they share FEPA's sieves; the sieve openings themselves are as marked in
// FEPA_F_MACRO_SIEVES (R for F24–F220, the rest from memory), and editions after 1987 (which
// moved to the FEPA numbering in part) are not checked.
// ---------------------------------------------------------------------------------------------

// ---------------------------------------------------------------------------------------------
// ANSI B74.12 (bonded abrasives: grinding wheels) and B74.10 (bonded microgrits), US
// ---------------------------------------------------------------------------------------------

/**
 * ANSI B74.12 macrogrits: the FEPA F macro series less F22 and F40 (R, per the UAMA comparison
 * above), each with the FEPA sieve set of its number, so the same sieve-band middle.
 */
const ANSI_BONDED_MACRO = [4, 5, 6, 7, 8, 10, 12, 14, 16, 20, 24, 30, 36, 46, 54, 60, 70, 80, 90, 100, 120, 150, 180, 220];

/**
 * ANSI bonded microgrits (240 sieved under B74.12; 280 and finer graded under B74.10), median
 * size µm. (from memory, low confidence): each is tabulated about one FEPA F step coarser than the
 * FEPA grade of the same number, and quite unlike the coated B74.18 grade of the same number
 * (bonded 600 ≈ 12.8 µm, coated 600 ≈ 16 µm): a wheel marked "600" in the bonded system is
 * finer than the coated table says.
 */
const ANSI_BONDED_MICRO: [number, number][] = [
  [240, 53.0], // (from memory), low confidence
  [280, 44.5], // (from memory), low confidence
  [320, 36.5], // (from memory), low confidence
  [360, 29.2], // (from memory), low confidence
  [400, 22.8], // (from memory), low confidence
  [500, 17.3], // (from memory), low confidence
  [600, 12.8], // (from memory), low confidence
  [800, 9.3], // (from memory), low confidence
  [1000, 6.5], // (from memory), low confidence
  [1200, 4.5], // (from memory), low confidence
];

// ---------------------------------------------------------------------------------------------
// ANSI B74.18 (coated abrasives, US)
// ---------------------------------------------------------------------------------------------

/**
 * ANSI B74.18 average particle sizes, µm. Macrogrits 16–100 R; 12 and 120–220 (from memory).
 * Microgrits 240–1000 (from memory, low confidence: published copies disagree by a few µm).
 */
const ANSI: [number, number, boolean][] = [
  [12, 1842, false], // (from memory)
  [16, 1320, false], // R
  [20, 905, false], // R
  [24, 715, false], // R
  [30, 638, false], // R
  [36, 535, false], // R
  [40, 428, false], // R
  [50, 351, false], // R
  [60, 268, false], // R
  [80, 192, false], // R
  [100, 141, false], // R
  [120, 116, false], // (from memory)
  [150, 93, false], // (from memory)
  [180, 78, false], // (from memory)
  [220, 66, false], // (from memory)
  [240, 53.5, true], // (from memory), low confidence
  [280, 44.0, true], // (from memory), low confidence
  [320, 36.0, true], // (from memory), low confidence
  [360, 28.8, true], // (from memory), low confidence
  [400, 23.6, true], // (from memory), low confidence
  [500, 19.7, true], // (from memory), low confidence
  [600, 16.0, true], // (from memory), low confidence
  [800, 12.2, true], // (from memory), low confidence
  [1000, 9.2, true], // (from memory), low confidence
];

// ---------------------------------------------------------------------------------------------
// US standard sieves (ASTM E11-17; ISO 3310-1:2016 gives the same openings)
// ---------------------------------------------------------------------------------------------

/** Sieve designation number → nominal opening in µm. R except No. 4 and No. 5 (from memory). */
const ASTM_E11: [number, number][] = [
  [4, 4750], // (from memory)
  [5, 4000], // (from memory)
  [6, 3350],
  [7, 2800],
  [8, 2360],
  [10, 2000],
  [12, 1700],
  [14, 1400],
  [16, 1180],
  [18, 1000],
  [20, 850],
  [25, 710],
  [30, 600],
  [35, 500],
  [40, 425],
  [45, 355],
  [50, 300],
  [60, 250],
  [70, 212],
  [80, 180],
  [100, 150],
  [120, 125],
  [140, 106],
  [170, 90],
  [200, 75],
  [230, 63],
  [270, 53],
  [325, 45],
  [400, 38],
  [450, 32],
  [500, 25],
  [635, 20],
];

// ---------------------------------------------------------------------------------------------
// Superabrasives: diamond (D) and cubic boron nitride (B), ISO 6106:2013
// ---------------------------------------------------------------------------------------------

/**
 * ISO 6106 designations: number, US mesh pair, sieve apertures [upper, lower] in µm, wide range.
 * The designation number is the upper aperture + 1 for narrow and + 2 for wide ranges.
 * The representative size chosen here is the arithmetic mean of the two apertures, e.g. D/B107
 * (140/170 mesh, 106/90 µm) → 98 µm. Rows D/B301 down to D/B46 and D/B252 R; the coarser rows
 * (from memory).
 */
const ISO_6106: { n: number; mesh: [number, number]; apertures: [number, number]; wide: boolean }[] = [
  { n: 1182, mesh: [16, 20], apertures: [1180, 850], wide: true }, // (from memory)
  { n: 1181, mesh: [16, 18], apertures: [1180, 1000], wide: false }, // (from memory)
  { n: 1001, mesh: [18, 20], apertures: [1000, 850], wide: false }, // (from memory)
  { n: 852, mesh: [20, 30], apertures: [850, 600], wide: true }, // (from memory)
  { n: 851, mesh: [20, 25], apertures: [850, 710], wide: false }, // (from memory)
  { n: 711, mesh: [25, 30], apertures: [710, 600], wide: false }, // (from memory)
  { n: 602, mesh: [30, 40], apertures: [600, 425], wide: true }, // (from memory)
  { n: 601, mesh: [30, 35], apertures: [600, 500], wide: false }, // (from memory)
  { n: 501, mesh: [35, 40], apertures: [500, 425], wide: false }, // (from memory)
  { n: 427, mesh: [40, 50], apertures: [425, 300], wide: true }, // (from memory)
  { n: 426, mesh: [40, 45], apertures: [425, 355], wide: false }, // (from memory)
  { n: 356, mesh: [45, 50], apertures: [355, 300], wide: false }, // (from memory)
  { n: 301, mesh: [50, 60], apertures: [300, 250], wide: false }, // R
  { n: 252, mesh: [60, 80], apertures: [250, 180], wide: true }, // R
  { n: 251, mesh: [60, 70], apertures: [250, 212], wide: false }, // R
  { n: 213, mesh: [70, 80], apertures: [212, 180], wide: false }, // R
  { n: 181, mesh: [80, 100], apertures: [180, 150], wide: false }, // R
  { n: 151, mesh: [100, 120], apertures: [150, 125], wide: false }, // R
  { n: 126, mesh: [120, 140], apertures: [125, 106], wide: false }, // R
  { n: 107, mesh: [140, 170], apertures: [106, 90], wide: false }, // R
  { n: 91, mesh: [170, 200], apertures: [90, 75], wide: false }, // R
  { n: 76, mesh: [200, 230], apertures: [75, 63], wide: false }, // R
  { n: 64, mesh: [230, 270], apertures: [63, 53], wide: false }, // R
  { n: 54, mesh: [270, 325], apertures: [53, 45], wide: false }, // R
  { n: 46, mesh: [325, 400], apertures: [45, 38], wide: false }, // R
];

// ---------------------------------------------------------------------------------------------
// Ladders
// ---------------------------------------------------------------------------------------------

/** Plain micrometres accepted from 0.01 µm to 10 mm: beyond that it is not an abrasive grain. */
const UM_MIN = 0.01;
const UM_MAX = 10_000;

const fepaMacroByNumber = new Map(FEPA_F_MACRO_SIEVES.map(([n, s]) => [n, sieveBandMiddle(s)]));

function byCoarseFirst(rows: GradeRow[]): GradeRow[] {
  return [...rows].sort((a, b) => b.micrometres - a.micrometres);
}

const LADDERS: Record<Exclude<GritStandard, 'um'>, GradeRow[]> = {
  'fepa-f': byCoarseFirst([
    ...FEPA_F_MACRO_SIEVES.map(([n, s]) => ({ grade: `F${n}`, micrometres: sieveBandMiddle(s), basis: 'sieve-band' as const })),
    ...FEPA_F_MICRO_DS50.map(([n, um]) => ({ grade: `F${n}`, micrometres: um, basis: 'ds50' as const })),
  ]),
  'fepa-p': byCoarseFirst(FEPA_P.map(([n, um, basis]) => ({ grade: `P${n}`, micrometres: um, basis }))),
  jis: byCoarseFirst([
    ...JIS_MACRO.map((n) => {
      const um = fepaMacroByNumber.get(n);
      if (um === undefined) throw new Error(`JIS #${n} has no FEPA sieve set`); // a data error, caught by the tests
      return { grade: `#${n}`, micrometres: um, basis: 'sieve-band' as const };
    }),
    ...JIS_FINE_DS50.map(([n, um]) => ({ grade: `#${n}`, micrometres: um, basis: 'ds50' as const })),
  ]),
  ansi: byCoarseFirst(
    ANSI.map(([n, um, low]) => ({ grade: String(n), micrometres: um, basis: 'average' as const, ...(low ? { lowConfidence: true } : {}) })),
  ),
  'ansi-bonded': byCoarseFirst([
    ...ANSI_BONDED_MACRO.map((n) => ({ grade: String(n), micrometres: fepaMacroByNumber.get(n)!, basis: 'sieve-band' as const })),
    ...ANSI_BONDED_MICRO.map(([n, um]) => ({ grade: String(n), micrometres: um, basis: 'ds50' as const, lowConfidence: true })),
  ]),
  mesh: byCoarseFirst(ASTM_E11.map(([n, um]) => ({ grade: `No. ${n}`, micrometres: um, basis: 'sieve-opening' as const }))),
  iso6106: byCoarseFirst(
    ISO_6106.map((r) => ({ grade: `D/B${r.n}`, micrometres: (r.apertures[0] + r.apertures[1]) / 2, basis: 'aperture-mean' as const })),
  ),
};

/** The number in a grade as written by the standard ("F400" → 400, "No. 400" → 400, "#6000" → 6000). */
function gradeNumber(grade: string): number {
  return Number(/(\d+)/.exec(grade)![1]);
}

const LOOKUP: Record<Exclude<GritStandard, 'um'>, Map<number, GradeRow>> = Object.fromEntries(
  Object.entries(LADDERS).map(([standard, rows]) => [standard, new Map(rows.map((r) => [gradeNumber(r.grade), r]))]),
) as Record<Exclude<GritStandard, 'um'>, Map<number, GradeRow>>;

const ISO_6106_BY_MESH = new Map(ISO_6106.map((r) => [`${r.mesh[0]}/${r.mesh[1]}`, r]));
const ISO_6106_BY_NUMBER = new Map(ISO_6106.map((r) => [r.n, r]));

/**
 * The ISO 6106 size ranges of diamond (D) and CBN (B) grits, coarsest first: designation, US mesh
 * pair, the two sieve apertures in µm and whether the range is a wide one.
 */
export function superabrasiveRanges(): { designation: string; meshPair: string; upperUm: number; lowerUm: number; wide: boolean }[] {
  return ISO_6106.map((r) => ({
    designation: `D/B${r.n}`,
    meshPair: `${r.mesh[0]}/${r.mesh[1]}`,
    upperUm: r.apertures[0],
    lowerUm: r.apertures[1],
    wide: r.wide,
  }));
}

/**
 * Every grade of a standard with its representative size in µm, coarsest first (for a ladder chart
 * and for pickers). Plain micrometres have no grades: returns [].
 */
export function gradesOf(standard: GritStandard): { grade: string; micrometres: number }[] {
  assertStandard(standard);
  if (standard === 'um') return [];
  return LADDERS[standard].map((r) => ({ grade: r.grade, micrometres: r.micrometres }));
}

/**
 * The span of sizes, in µm, over which a standard has a nearest grade: from the finest to the
 * coarsest grade, widened at each end by half the step to the neighbouring grade (in log size),
 * so that a size just past the last grade still reads as that grade but one far past it does not.
 */
export function gradeSpan(standard: GritStandard): { minUm: number; maxUm: number } {
  assertStandard(standard);
  if (standard === 'um') return { minUm: UM_MIN, maxUm: UM_MAX };
  const rows = LADDERS[standard];
  const coarse = rows[0].micrometres;
  const fine = rows[rows.length - 1].micrometres;
  return {
    maxUm: coarse * Math.sqrt(coarse / rows[1].micrometres),
    minUm: fine / Math.sqrt(rows[rows.length - 2].micrometres / fine),
  };
}

/** The written range of a standard for error messages, e.g. "F4 to F2000". */
function rangeText(standard: Exclude<GritStandard, 'um'>): string {
  const rows = LADDERS[standard];
  const coarse = rows[0].grade;
  const fine = rows[rows.length - 1].grade;
  if (standard === 'mesh') return `No. ${gradeNumber(coarse)} to No. ${gradeNumber(fine)}`;
  return `${coarse} to ${fine}`;
}

/** What a grade of each standard is called in error messages, with its article. */
const STANDARD_NAMES_IN_ERRORS: Record<GritStandard, string> = {
  'fepa-f': 'an FEPA F grit',
  'fepa-p': 'an FEPA P grit',
  jis: 'a JIS R6001 grit',
  ansi: 'an ANSI B74.18 grit',
  'ansi-bonded': 'an ANSI B74.12 / B74.10 grit',
  mesh: 'an ASTM E11 sieve',
  iso6106: 'an ISO 6106 designation',
  um: 'a size in micrometres',
};

const RUNS_FROM_NAMES: Record<Exclude<GritStandard, 'um'>, string> = {
  'fepa-f': 'FEPA F',
  'fepa-p': 'FEPA P',
  jis: 'JIS R6001',
  ansi: 'ANSI B74.18',
  'ansi-bonded': 'ANSI B74.12 / B74.10',
  mesh: 'US mesh (ASTM E11)',
  iso6106: 'ISO 6106',
};

function assertStandard(standard: string): asserts standard is GritStandard {
  if (!(GRIT_STANDARDS as readonly string[]).includes(standard)) {
    throw new ComputationError(`"${standard}" is not a grit standard we know; choose one of ${GRIT_STANDARDS.join(', ')}`, 'standard');
  }
}

function assertMicrometres(um: number, field = 'micrometres'): void {
  if (typeof um !== 'number' || !Number.isFinite(um) || um <= 0) {
    throw new ComputationError(`a particle size must be a positive number of micrometres (got ${String(um)})`, field);
  }
}

// ---------------------------------------------------------------------------------------------
// Nearest grades
// ---------------------------------------------------------------------------------------------

/**
 * The grade of `standard` whose representative size is nearest to `um` micrometres, nearest by
 * ratio (distance in log size, as grit ladders are geometric). Null when `um` lies outside the
 * standard's span (see `gradeSpan`). For 'um' it returns the size itself, written in µm.
 */
export function nearestGrade(um: number, standard: GritStandard): { grade: string; micrometres: number } | null {
  assertMicrometres(um);
  assertStandard(standard);
  const span = gradeSpan(standard);
  if (um < span.minUm || um > span.maxUm) return null;
  if (standard === 'um') return { grade: formatMicrometres(um), micrometres: um };
  let best = LADDERS[standard][0];
  let bestDistance = Infinity;
  for (const row of LADDERS[standard]) {
    const distance = Math.abs(Math.log(row.micrometres / um));
    if (distance < bestDistance) {
      best = row;
      bestDistance = distance;
    }
  }
  return { grade: best.grade, micrometres: best.micrometres };
}

/** The nearest grade in every standard for a size in µm (null where the standard does not reach). */
export function nearestGrades(um: number): Record<GritStandard, string | null> {
  assertMicrometres(um);
  return Object.fromEntries(GRIT_STANDARDS.map((s) => [s, nearestGrade(um, s)?.grade ?? null])) as Record<GritStandard, string | null>;
}

/** The two grades either side of a number that is not a grade of the standard, for error hints. */
function neighboursText(standard: Exclude<GritStandard, 'um'>, n: number): string {
  const numbers = [...LOOKUP[standard].keys()].sort((a, b) => a - b);
  const below = numbers.filter((x) => x < n).pop();
  const above = numbers.find((x) => x > n);
  if (below === undefined || above === undefined) return '';
  return `; the nearest grades are ${LOOKUP[standard].get(below)!.grade} and ${LOOKUP[standard].get(above)!.grade}`;
}

// ---------------------------------------------------------------------------------------------
// Parsing
// ---------------------------------------------------------------------------------------------

const EXAMPLES = 'e.g. F400, P1500, #6000, JIS 1000, 400 mesh, D46, B126, 140/170 or 15 µm';

function notAGrade(standard: Exclude<GritStandard, 'um'>, typed: string, n: number, extra = ''): ComputationError {
  return new ComputationError(
    `"${typed}" is not ${STANDARD_NAMES_IN_ERRORS[standard]}${extra}; ` +
      `${RUNS_FROM_NAMES[standard]} runs from ${rangeText(standard)}${neighboursText(standard, n)}`,
    'grade',
  );
}

function lookup(standard: Exclude<GritStandard, 'um'>, n: number, typed: string, inferred: boolean): ParsedGrit {
  const row = LOOKUP[standard].get(n);
  if (!row) {
    if (standard === 'mesh' && n > 635) {
      // (common practice) stones sold as "1000 mesh" are usually graded by JIS.
      throw new ComputationError(
        `"${typed}" is finer than any ASTM E11 sieve (the finest, No. 635, opens 20 µm); ` +
          `stones marked "${n} mesh" are usually graded JIS: type "JIS ${n}" if that is what you mean`,
        'grade',
      );
    }
    throw notAGrade(standard, typed, n, inferred ? ' (a bare number is read as JIS, the usual marking on sharpening stones)' : '');
  }
  return {
    standard,
    grade: row.grade,
    micrometres: row.micrometres,
    inferred,
    basis: row.basis,
    ...(row.lowConfidence ? { lowConfidence: true } : {}),
  };
}

function fromMicrometres(raw: string, typed: string, inferred: boolean): ParsedGrit {
  const um = Number(raw.replace(',', '.'));
  if (!Number.isFinite(um) || um < UM_MIN || um > UM_MAX) {
    throw new ComputationError(`"${typed}" is outside the sizes we accept (${UM_MIN} µm to ${UM_MAX} µm)`, 'grade');
  }
  return { standard: 'um', grade: formatMicrometres(um), micrometres: um, inferred, basis: 'stated' };
}

function fromIso6106(prefix: string, n: number, typed: string): ParsedGrit {
  const row = ISO_6106_BY_NUMBER.get(n);
  if (!row) throw notAGrade('iso6106', typed, n);
  const letter = prefix.replace(/\s+/g, '').toUpperCase();
  return {
    standard: 'iso6106',
    grade: `${letter === 'D/B' ? 'D/B' : letter}${n}`,
    micrometres: (row.apertures[0] + row.apertures[1]) / 2,
    inferred: false,
    basis: 'aperture-mean',
  };
}

function fromMeshPair(a: number, b: number, typed: string): ParsedGrit {
  const [coarse, fine] = a < b ? [a, b] : [b, a];
  const row = ISO_6106_BY_MESH.get(`${coarse}/${fine}`);
  if (!row) {
    const pairs = ISO_6106.map((r) => `${r.mesh[0]}/${r.mesh[1]}`);
    throw new ComputationError(
      `"${typed}" is not an ISO 6106 mesh range; the ranges run from ${pairs[0]} to ${pairs[pairs.length - 1]} (e.g. 140/170, 325/400)`,
      'grade',
    );
  }
  return fromIso6106('D/B', row.n, typed);
}

type Reader = { pattern: RegExp; standard: GritStandard | null; read: (m: RegExpExecArray, typed: string, standard: GritStandard | null, inferred: boolean) => ParsedGrit };

const NUM = String.raw`(\d+)`;

/**
 * Numbers written with thousands separators, made plain: "1,000", "1 000" (any space, after
 * collapsing), "1'000", "12,500" → "1000", "12500". The first group has no leading zero (so "0,125"
 * stays a decimal comma); a space groups only after one or two digits, so "400 600" is not read as
 * 400600. The same separator throughout, exactly three digits a group.
 */
function withoutThousandsSeparators(text: string): string {
  const join = (_all: string, before: string, head: string, sep: string, rest: string) => before + head + rest.split(sep).join('');
  return text
    .replace(/(^|[^\d.,'])([1-9]\d{0,2})([,'])(\d{3}(?:\3\d{3})*)(?![\d,'])/g, join)
    .replace(/(^|[^\d.,'])([1-9]\d?)( )(\d{3}(?: \d{3})*)(?![\d])/g, join);
}
const DECIMAL = String.raw`(\d+(?:[.,]\d+)?|[.,]\d+)`;

/**
 * Readers in order. `standard` is the standard the text names itself; null for notations that
 * leave it open ("#400" and bare numbers), which follow the chosen standard.
 */
const READERS: Reader[] = [
  {
    pattern: new RegExp(String.raw`^${DECIMAL}\s*(?:µm|µ|um|microns?|micrometres?|micrometers?)$`, 'i'),
    standard: 'um',
    read: (m, typed) => fromMicrometres(m[1], typed, false),
  },
  {
    pattern: new RegExp(String.raw`^(?:fepa\s*-?\s*)?f\s*-?\s*${NUM}$`, 'i'),
    standard: 'fepa-f',
    read: (m, typed) => lookup('fepa-f', Number(m[1]), typed, false),
  },
  {
    pattern: new RegExp(String.raw`^(?:fepa\s*-?\s*)?p\s*-?\s*${NUM}$`, 'i'),
    standard: 'fepa-p',
    read: (m, typed) => lookup('fepa-p', Number(m[1]), typed, false),
  },
  {
    pattern: new RegExp(String.raw`^(d\s*/\s*b|d|b)\s*${NUM}$`, 'i'),
    standard: 'iso6106',
    read: (m, typed) => fromIso6106(m[1], Number(m[2]), typed),
  },
  {
    pattern: new RegExp(String.raw`^(?:(?:us\s*)?mesh\s*)?${NUM}\s*/\s*${NUM}(?:\s*(?:us\s*)?mesh)?$`, 'i'),
    standard: 'iso6106',
    read: (m, typed) => fromMeshPair(Number(m[1]), Number(m[2]), typed),
  },
  {
    pattern: new RegExp(String.raw`^(?:jis\s*(?:r\s*6001\s*)?#?\s*${NUM}|#?\s*${NUM}\s*jis)$`, 'i'),
    standard: 'jis',
    read: (m, typed) => lookup('jis', Number(m[1] ?? m[2]), typed, false),
  },
  {
    // Before ISO 6106's "B126": "B74.12 600" names the bonded standard.
    pattern: new RegExp(String.raw`^(?:(?:ansi\s*)?(?:b\s*74\.1[02]|bonded)\s*#?\s*${NUM}|(?:ansi\s*)?#?\s*${NUM}\s*(?:ansi\s*)?bonded)$`, 'i'),
    standard: 'ansi-bonded',
    read: (m, typed) => lookup('ansi-bonded', Number(m[1] ?? m[2]), typed, false),
  },
  {
    // "ANSI 600" without saying bonded reads as coated (B74.18) unless the bonded standard is chosen.
    pattern: new RegExp(String.raw`^(?:(?:ansi|cami)(?:\s*b\s*74\.18)?\s*#?\s*${NUM}|#?\s*${NUM}\s*(?:ansi|cami))$`, 'i'),
    standard: 'ansi',
    read: (m, typed, standard) => lookup(standard === 'ansi-bonded' ? 'ansi-bonded' : 'ansi', Number(m[1] ?? m[2]), typed, false),
  },
  {
    pattern: new RegExp(
      String.raw`^(?:(?:us\s*)?mesh\s*(?:no\.?\s*)?#?\s*${NUM}|#?\s*${NUM}\s*(?:us\s*)?mesh|no\.?\s*${NUM})$`,
      'i',
    ),
    standard: 'mesh',
    read: (m, typed) => lookup('mesh', Number(m[1] ?? m[2] ?? m[3]), typed, false),
  },
  {
    // "#400": the JIS way of writing a grit, but used loosely for others: follows a chosen standard.
    pattern: new RegExp(String.raw`^#\s*${NUM}$`),
    standard: null,
    read: (m, typed, standard) => readNumberIn(standard ?? 'jis', m[1], typed, false),
  },
  {
    // A bare number: read in the chosen standard, or as JIS (the usual marking on sharpening stones).
    pattern: new RegExp(String.raw`^${DECIMAL}$`),
    standard: null,
    read: (m, typed, standard) => readNumberIn(standard ?? 'jis', m[1], typed, standard === null),
  },
];

function readNumberIn(standard: GritStandard, raw: string, typed: string, inferred: boolean): ParsedGrit {
  if (standard === 'um') return fromMicrometres(raw, typed, inferred);
  if (!/^\d+$/.test(raw)) {
    throw new ComputationError(`"${typed}" is not ${STANDARD_NAMES_IN_ERRORS[standard]}: grades are whole numbers (a size with decimals needs "µm")`, 'grade');
  }
  const n = Number(raw);
  if (standard === 'iso6106') return fromIso6106('D/B', n, typed);
  return lookup(standard, n, typed, inferred);
}

/**
 * Read a grit as people type it: "F400", "P1500", "#6000" (JIS), "JIS 1000", "400 mesh" or
 * "No. 400" (ASTM E11 sieve), "ANSI 400", "D46", "B126", "140/170" (ISO 6106 mesh range),
 * "15 µm", "15um", "15 micron". A bare number is read in `standard` when one is given, otherwise
 * as JIS with `inferred: true`. A word "grit" before or after is ignored.
 * Throws ComputationError (field 'grade') for text that is not a grade of any standard, and when
 * the text names a different standard from the one chosen.
 */
export function parseGrit(text: string, standard?: GritStandard): ParsedGrit {
  if (standard !== undefined) assertStandard(standard);
  if (typeof text !== 'string') throw new ComputationError('type a grit, ' + EXAMPLES, 'grade');
  const typed = text.trim();
  const s = withoutThousandsSeparators(
    typed
      .replace(/[\u00b5\u03bc]/g, 'µ') // micro sign and Greek mu both mean micro
      .replace(/^grit\s+/i, '')
      .replace(/\s+grit$/i, '')
      .replace(/\s+/g, ' '),
  );
  if (s === '') throw new ComputationError('type a grit, ' + EXAMPLES, 'grade');
  for (const reader of READERS) {
    const m = reader.pattern.exec(s);
    if (!m) continue;
    const plainAnsiInBonded = reader.standard === 'ansi' && standard === 'ansi-bonded';
    if (standard !== undefined && reader.standard !== null && reader.standard !== standard && !plainAnsiInBonded) {
      throw new ComputationError(
        `"${typed}" is written as ${GRIT_STANDARD_SHORT_LABELS[reader.standard]}, but the standard chosen is ${GRIT_STANDARD_LABELS[standard]}; ` +
          `change the standard or type the grade without its prefix`,
        'grade',
      );
    }
    return reader.read(m, typed, standard ?? null, false);
  }
  throw new ComputationError(`"${typed}" is not a grit we can read; type ${EXAMPLES}`, 'grade');
}

// ---------------------------------------------------------------------------------------------
// Grit bands and formatting
// ---------------------------------------------------------------------------------------------

/**
 * The grit band holding a particle size: a class of whole (or, with step 0.5, half) units of
 * Krumbein's φ = −log2(d / 1 mm). Edges are exact powers of two in millimetres, e.g. 10 µm lies in
 * 7.8125–15.625 µm (φ 6 to 7). A size exactly on an edge belongs to the band below it in φ, i.e.
 * the band for which it is the coarse edge: bands are (loUm, hiUm].
 */
export function gritBand(um: number, step: 1 | 0.5 = 1): { loUm: number; hiUm: number } {
  assertMicrometres(um);
  if (step !== 1 && step !== 0.5) throw new ComputationError('a grit band is 1 or 0.5 φ wide', 'step');
  const phi = -Math.log2(um / 1000);
  const units = phi / step;
  // Snap sizes that sit on an edge up to rounding error, so 15.625 µm is the edge it is.
  const nearest = Math.round(units);
  const index = Math.abs(units - nearest) < 1e-9 ? nearest : Math.floor(units);
  const lowPhi = index * step;
  return { loUm: 1000 * 2 ** -(lowPhi + step), hiUm: 1000 * 2 ** -lowPhi };
}

/** The φ value of the coarse edge of a size's band (an integer for whole bands), for grouping keys. */
export function gritBandPhi(um: number, step: 1 | 0.5 = 1): number {
  const { hiUm } = gritBand(um, step);
  return -Math.log2(hiUm / 1000);
}

/** A size in µm written for people: whole µm from 100 µm up, otherwise three significant figures. */
export function formatMicrometres(um: number): string {
  const text = um >= 100 ? String(Math.round(um)) : String(Number(um.toPrecision(3)));
  return `${text} µm`;
}

/**
 * A grade written with its standard for people, e.g. "FEPA F400", "JIS #1000", "ANSI 400",
 * "US mesh No. 400", "D/B107 (140/170 mesh)", "15 µm".
 */
export function formatGrade(grit: { standard: GritStandard; grade: string }): string {
  switch (grit.standard) {
    case 'fepa-f':
    case 'fepa-p':
      return `FEPA ${grit.grade}`;
    case 'jis':
      return `JIS ${grit.grade}`;
    case 'ansi':
      return `ANSI ${grit.grade}`;
    case 'ansi-bonded':
      return `ANSI ${grit.grade} (bonded)`;
    case 'mesh':
      return `US mesh ${grit.grade}`;
    case 'iso6106': {
      const row = ISO_6106_BY_NUMBER.get(gradeNumber(grit.grade));
      return row ? `${grit.grade} (${row.mesh[0]}/${row.mesh[1]} mesh)` : grit.grade;
    }
    case 'um':
      return grit.grade;
  }
}
