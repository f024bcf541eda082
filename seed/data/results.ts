import type { ResultInput } from '@shared/schemas/result';
import type { RichTextNode } from '@shared/rich-text';
import { steels, type SeedSteel } from './steels';
import { abrasives, type SeedAbrasive } from './abrasives';
import { methods, type SeedMethod } from './methods';
import { members } from './members';
import { doc, p, ul } from './rich-text-builders';

/**
 * Invented demo results. Every figure here comes from a small simulation with a fixed-seed
 * pseudo-random generator, so the data is the same on every run; none of it is a measurement.
 * The simulation only needs to look plausible: finer abrasives give lower push-cut readings,
 * harder and higher-carbide steels count more cuts in the retention test, each tester has a
 * bias, and several testers work on the same steel × abrasive so comparison cells replicate.
 */

/** One demo result: its author's handle, review state, age, the reviewer's note, and the posted input. */
export interface SeedResult {
  /** Handle of the member who posted it (never the admin). */
  author: string;
  status: 'pending' | 'approved' | 'returned' | 'rejected';
  /** How many days before loading the result was posted; the loader turns it into a date. */
  daysAgo: number;
  /** The moderator's note for a returned result, or the reason for a rejected one. */
  reviewNote?: string;
  input: ResultInput;
}

/** Number of results generated. */
export const RESULT_COUNT = 300;
/** Fixed seed of the generator, so every run yields the same data. */
export const RESULT_SEED = 0x2f6b_1e09;
/** The progressions' own generator seed. */
const PROGRESSION_SEED = 0x5eed_0016;

/** mulberry32: a tiny, well-known 32-bit PRNG; good enough for demo data, never for security. */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

class Rng {
  private readonly next: () => number;
  constructor(seed: number) {
    this.next = mulberry32(seed);
  }
  unit(): number {
    return this.next();
  }
  between(lo: number, hi: number): number {
    return lo + (hi - lo) * this.next();
  }
  int(lo: number, hi: number): number {
    return Math.floor(this.between(lo, hi + 1));
  }
  chance(probability: number): boolean {
    return this.next() < probability;
  }
  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)];
  }
  weighted<T>(items: readonly { item: T; weight: number }[]): T {
    const total = items.reduce((s, x) => s + x.weight, 0);
    let r = this.next() * total;
    for (const x of items) {
      r -= x.weight;
      if (r < 0) return x.item;
    }
    return items[items.length - 1].item;
  }
  /** Standard normal deviate (Box–Muller). */
  normal(): number {
    const u = 1 - this.next();
    const v = this.next();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }
}

const round = (x: number, step: number) => Math.round(x / step) * step;
const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
const deg = (rad: number) => (rad * 180) / Math.PI;
const rad = (d: number) => (d * Math.PI) / 180;

// ---- Simulation inputs (they shape invented numbers only; the app derives its own values) ----

/**
 * Representative particle size, µm, of each grade the demo uses, so the simulated readings
 * follow particle size. JIS fine grits: JIS R6001 ds50 (published-values.md, R); macrogrits and
 * ISO 6106 sizes: geometric middle of the sieve band (published-values.md, R); micron grades:
 * the stated size.
 */
const PARTICLE_UM: Record<string, number> = {
  'jis:220': Math.sqrt(53 * 75),
  'jis:320': 40,
  'jis:600': 20,
  'jis:800': 14,
  'jis:1000': 11.5,
  'jis:4000': 3,
  'jis:6000': 2,
  'iso6106:B126': Math.sqrt(125 * 106),
  'iso6106:B46': Math.sqrt(45 * 38),
  'iso6106:D46': Math.sqrt(45 * 38),
  'fepa-f:F220': Math.sqrt(53 * 75),
  'fepa-p:P120': 125,
  'um:15 µm': 15,
  'um:5 µm': 5,
  'um:1 µm': 1,
};

function particleUm(standard: string, grade: string): number {
  const um = PARTICLE_UM[`${standard}:${grade}`];
  if (um === undefined) throw new Error(`results: no simulated particle size for grit ${standard} ${grade}`);
  return um;
}

/**
 * Per steel: the centre of its simulated retention counts (cuts) and how much a coarse finish
 * raises its push-cut readings (large hard carbides leave a ragged apex; common practice).
 */
const STEEL_TRAITS: Record<string, { weight: number; retentionCuts: number; carbideFactor: number }> = {
  'aisi-1095': { weight: 2, retentionCuts: 150, carbideFactor: 0.96 },
  'aisi-1084': { weight: 1, retentionCuts: 140, carbideFactor: 0.96 },
  'aisi-5160': { weight: 1, retentionCuts: 120, carbideFactor: 0.98 },
  'aisi-52100': { weight: 3, retentionCuts: 200, carbideFactor: 0.95 },
  'en-1-2235': { weight: 1, retentionCuts: 150, carbideFactor: 0.96 },
  'aisi-w2': { weight: 1, retentionCuts: 160, carbideFactor: 0.95 },
  'aisi-o1': { weight: 2, retentionCuts: 180, carbideFactor: 0.96 },
  'aisi-a2': { weight: 2, retentionCuts: 230, carbideFactor: 1.0 },
  'aisi-d2': { weight: 6, retentionCuts: 310, carbideFactor: 1.06 },
  'aisi-m2': { weight: 2, retentionCuts: 330, carbideFactor: 1.04 },
  'aisi-440c': { weight: 2, retentionCuts: 250, carbideFactor: 1.05 },
  'aisi-440a': { weight: 1, retentionCuts: 170, carbideFactor: 1.0 },
  'en-1-4116': { weight: 2, retentionCuts: 130, carbideFactor: 1.02 },
  'en-1-4125': { weight: 1, retentionCuts: 250, carbideFactor: 1.05 },
  'en-1-4034': { weight: 1, retentionCuts: 100, carbideFactor: 1.03 },
  'en-1-4110': { weight: 1, retentionCuts: 150, carbideFactor: 1.02 },
};

/** How often each abrasive is chosen; CBN and diamond wheels are the demo's busiest pages. */
const ABRASIVE_WEIGHTS: Record<string, number> = {
  'alox-vitrified-wheel-250-coarse': 2,
  'alox-vitrified-wheel-250-fine-dressed': 2,
  'alox-vitrified-wheel-250-jis4000': 2,
  'cbn-electroplated-wheel-250-b126': 5,
  'cbn-resin-wheel-250-b46': 4,
  'diamond-electroplated-wheel-250-d46': 4,
  'diamond-resin-wheel-250-15um': 3,
  'sic-vitrified-wheel-200-f220': 1,
  'ceramic-alumina-belt-p120': 1,
  'alox-bench-stone-jis1000': 1,
  'alox-bench-stone-jis6000': 1,
  'natural-whetstone-fine-5um': 1,
  'leather-strop-diamond-1um': 1,
};

/** Grades a dressable wheel may have been dressed to, for the results posted on it. */
const DRESSED_GRADES: Record<string, string[]> = {
  'alox-vitrified-wheel-250-coarse': ['220', '220', '220', '320'],
  'alox-vitrified-wheel-250-fine-dressed': ['1000', '1000', '800', '600'],
};

/**
 * Invented testers' habits: how often they post, their instrument's bias, their usual angle
 * per side (degrees), how often hardness is measured rather than stated, and how often they
 * run the retention test.
 */
const TESTERS: Record<string, { weight: number; bias: number; usualAngle: number; measured: number; retention: number }> = {
  'fennick-lane-sharpening': { weight: 6, bias: 1.04, usualAngle: 17, measured: 0.5, retention: 0.25 },
  'little-tern-lab': { weight: 6, bias: 0.97, usualAngle: 15, measured: 1, retention: 0.8 },
  'grey-hone': { weight: 1.5, bias: 1.02, usualAngle: 20, measured: 0.6, retention: 0.2 },
  'bevel-and-burr': { weight: 1.5, bias: 0.99, usualAngle: 15, measured: 0.4, retention: 0.2 },
  'hollow-grind-hal': { weight: 2, bias: 1.06, usualAngle: 23, measured: 0.1, retention: 0.1 },
  'marta-whets': { weight: 2, bias: 1.03, usualAngle: 17, measured: 0.2, retention: 0.2 },
  'kitchen-line-jo': { weight: 2, bias: 0.95, usualAngle: 15, measured: 0.1, retention: 0.3 },
  'woodcarver-lin': { weight: 1.5, bias: 1.06, usualAngle: 12, measured: 0.1, retention: 0.1 },
  'tarn-and-tang': { weight: 2, bias: 1.0, usualAngle: 18, measured: 0.8, retention: 0.4 },
  'slow-stone': { weight: 1.5, bias: 0.93, usualAngle: 16, measured: 0.2, retention: 0.2 },
  'burr-hunter': { weight: 2.5, bias: 1.01, usualAngle: 17, measured: 0.3, retention: 0.7 },
  'fen-bladesmith': { weight: 1.5, bias: 1.07, usualAngle: 20, measured: 0.7, retention: 0.3 },
  'microbevel-max': { weight: 2, bias: 0.98, usualAngle: 14, measured: 0.2, retention: 0.3 },
  'ridge-and-heel': { weight: 2, bias: 1.05, usualAngle: 22, measured: 0.3, retention: 0.2 },
};

/**
 * HRC → HV rows of ASTM E140 Table 1 (published-values.md, R), linearly interpolated, only to
 * give some results a Vickers value that converts back into the steel's range.
 */
const HRC_HV: [number, number][] = [
  [50, 513],
  [55, 595],
  [58, 653],
  [60, 697],
  [62, 746],
  [64, 800],
  [66, 865],
];

function hrcToHvApprox(hrc: number): number {
  for (let i = 1; i < HRC_HV.length; i++) {
    const [h0, v0] = HRC_HV[i - 1];
    const [h1, v1] = HRC_HV[i];
    if (hrc >= h0 && hrc <= h1) return v0 + ((hrc - h0) / (h1 - h0)) * (v1 - v0);
  }
  throw new Error(`results: HRC ${hrc} outside the interpolation rows`);
}

/** Typical heat-treatment lines per steel, as a tester might write them (common practice). */
const HEAT_TREATMENTS: Record<string, string[]> = {
  'aisi-1095': ['Fast oil quench from 800 °C, tempered twice at 190 °C', 'Brine quench from 790 °C, tempered at 200 °C'],
  'aisi-1084': ['Oil quench from 815 °C, tempered twice at 200 °C'],
  'aisi-5160': ['Oil quench from 830 °C, tempered twice at 200 °C', 'Oil quench from 830 °C, tempered at 230 °C for toughness'],
  'aisi-52100': ['Normalised, oil quench from 840 °C, sub-zero, tempered at 175 °C'],
  'en-1-2235': ['Oil quench from 820 °C, tempered twice at 190 °C'],
  'aisi-w2': ['Clayed, water quench from 790 °C, tempered at 190 °C'],
  'aisi-o1': ['Oil quench from 810 °C, tempered twice at 190 °C'],
  'aisi-a2': ['Air hardened in foil from 955 °C, tempered twice at 200 °C'],
  'aisi-d2': [
    'Plate quench from 1020 °C, tempered twice at 200 °C',
    'Air hardened from 1010 °C, tempered three times at 520 °C',
    'Hardness and heat treatment as stated by the blade’s maker',
  ],
  'aisi-m2': ['Vacuum hardened from 1180 °C, tempered three times at 550 °C'],
  'aisi-440c': ['Hardened from 1040 °C, sub-zero, tempered at 175 °C'],
  'aisi-440a': ['Hardened from 1040 °C, tempered at 175 °C'],
  'en-1-4116': ['As supplied by the knife’s maker; heat treatment not known'],
  'en-1-4125': ['Hardened from 1050 °C, sub-zero, tempered at 160 °C'],
  'en-1-4034': ['As supplied by the knife’s maker; heat treatment not known'],
  'en-1-4110': ['Hardened from 1060 °C, tempered at 170 °C'],
};

const RETURN_NOTES = [
  'Please say whether the hardness was measured on this blade or taken from the maker’s statement.',
  'Please add which grade the wheel was dressed to before this edge.',
  'The angle looks unusual for this kind of blade; please check the figure and say how it was set.',
  'Please confirm that the readings were taken straight after the last abrasive step, before any stropping.',
];
const MISSING_READING_NOTE =
  'Method version 2 asks for five readings along the edge and four are listed; please add the missing reading or say why it was skipped.';
const REJECT_REASONS = [
  'Duplicate of a result this tester already posted for the same blade and session.',
  'The steel could not be identified from the description; please post again once the grade is known.',
  'The edge was tried on skin before the tester, so the readings do not follow the method; test on the test medium only.',
];
const UNITS_REJECT_REASON =
  'The readings look like newtons rather than grams; please post a new result with the readings in grams.';

type NoteContext = { abrasive: SeedAbrasive; steel: SeedSteel; setup: boolean };

/** Short invented notes; some are written for a kind of abrasive, some fit any result. */
const NOTES: { fits: (c: NoteContext) => boolean; make: (c: NoteContext) => RichTextNode }[] = [
  {
    fits: (c) => c.abrasive.bond === 'vitrified' && c.abrasive.form === 'wheel',
    make: () => doc(p('Dressed the wheel with one slow pass before this edge. The scratch pattern came out even along the bevel.')),
  },
  {
    fits: (c) => c.abrasive.bond === 'vitrified' && c.abrasive.form === 'wheel',
    make: () =>
      doc(
        p('Steps on the wheel:'),
        ul('Raised a burr along the whole edge', 'Light alternating passes to shrink the burr', 'Finished with two edge-trailing passes on a felt block'),
      ),
  },
  {
    fits: (c) => c.abrasive.material === 'cbn' || c.abrasive.material === 'diamond',
    make: () => doc(p('No dressing needed. Kept the pressure light over the last passes; the burr was small and came off cleanly.')),
  },
  {
    fits: (c) => (c.abrasive.material === 'cbn' || c.abrasive.material === 'diamond') && c.abrasive.form === 'wheel',
    make: (c) =>
      doc(
        p(`Progression on ${c.steel.name}:`),
        ul('Coarse CBN wheel to set the bevel', 'This wheel for the final passes', 'Burr removed on card, not on the strop'),
      ),
  },
  {
    fits: (c) => c.abrasive.form === 'bench-stone',
    make: () => doc(p('Flattened the stone before the session. Finished with about twenty light edge-trailing strokes per side.')),
  },
  {
    fits: (c) => c.abrasive.form === 'compound',
    make: () => doc(p('Came to the strop from a JIS 6000 stone; about thirty light passes per side, edge trailing.')),
  },
  {
    fits: (c) => c.abrasive.form === 'belt',
    make: () => doc(p('Dipped the blade in water after every pass to keep the apex cool.')),
  },
  {
    fits: (c) => c.setup,
    make: () => doc(p('Angle set from the bar gap and projection, both measured with a steel rule; wheel diameter measured before the session.')),
  },
  {
    fits: () => true,
    make: () => doc(p('The reading nearest the tip was the highest of the set; the tip may need another pass.')),
  },
  {
    fits: () => true,
    make: () => doc(p('Second blade from the same bar as my earlier result on this steel.')),
  },
];

// ---- Generator ----

function lookup<T extends { slug: string }>(items: T[], slug: string, what: string): T {
  const found = items.find((x) => x.slug === slug);
  if (!found) throw new Error(`results: unknown ${what} "${slug}"`);
  return found;
}

/**
 * A bar setting on the wheel that gives a per-side angle between 12° and 20°, using the model of
 * DESIGN.md: d = R + gap + bar radius, sin α = (d² − R² − L²) / (2RL), valid for
 * d − R ≤ L ≤ √(d² − R²). The projection L is chosen, the gap computed and rounded to 0.5 mm,
 * and the angle checked again after rounding.
 */
function wheelSetup(rng: Rng, abrasive: SeedAbrasive) {
  const nominal = abrasive.wheelDiameterMm;
  if (nominal === null) throw new Error(`results: ${abrasive.slug} has no diameter for a wheel setup`);
  // A vitrified wheel has usually been dressed down a little from new.
  const wheelDiameterMm = abrasive.wears ? round(nominal - rng.between(0, 12), 0.5) : nominal;
  const barDiameterMm = 12;
  const R = wheelDiameterMm / 2;
  const r = barDiameterMm / 2;
  for (let attempt = 0; attempt < 100; attempt++) {
    const target = rng.between(12, 20);
    const L = Math.round(rng.between(120, 175));
    const d0 = Math.sqrt(R * R + L * L + 2 * R * L * Math.sin(rad(target)));
    const gapMm = round(d0 - R - r, 0.5);
    const d = R + gapMm + r;
    const s = (d * d - R * R - L * L) / (2 * R * L);
    const angle = deg(Math.asin(clamp(s, -1, 1)));
    if (gapMm > 0 && d - R <= L && L <= Math.sqrt(d * d - R * R) && angle >= 12 && angle <= 20) {
      return { setup: { wheelDiameterMm, barDiameterMm, gapMm, projectionMm: L }, perSideDeg: angle };
    }
  }
  throw new Error(`results: no valid wheel setup found for ${abrasive.slug}`);
}

function pickDistinct<T>(rng: Rng, items: { item: T; weight: number }[], n: number): T[] {
  const pool = [...items];
  const out: T[] = [];
  while (out.length < n && pool.length) {
    const chosen = rng.weighted(pool);
    out.push(chosen);
    pool.splice(
      pool.findIndex((x) => x.item === chosen),
      1,
    );
  }
  return out;
}

/**
 * The demo's results: 300 invented results, the same on every call. About 85 % approved, the
 * rest pending, returned (with a note) or rejected (with a reason).
 */
export function generateResults(): SeedResult[] {
  const rng = new Rng(RESULT_SEED);

  const posters = new Set(members.filter((m) => m.role !== 'admin').map((m) => m.handle));
  for (const handle of Object.keys(TESTERS)) {
    if (!posters.has(handle)) throw new Error(`results: tester "${handle}" is not a member who may post results`);
  }
  const steelChoices = steels.map((s) => {
    const traits = STEEL_TRAITS[s.slug];
    if (!traits) throw new Error(`results: no simulation traits for steel "${s.slug}"`);
    return { item: s, weight: traits.weight };
  });
  const abrasiveChoices = abrasives.map((a) => {
    const weight = ABRASIVE_WEIGHTS[a.slug];
    if (weight === undefined) throw new Error(`results: no weight for abrasive "${a.slug}"`);
    return { item: a, weight };
  });
  const testerChoices = Object.entries(TESTERS).map(([handle, t]) => ({ item: handle, weight: t.weight }));
  const v1 = lookup(methods, 'push-cut-test-v1', 'method');
  const v2 = lookup(methods, 'push-cut-test-v2', 'method');
  const retentionMethod = lookup(methods, 'card-cut-retention-v1', 'method');

  const results: SeedResult[] = [];
  // One comparison cell (steel × abrasive) tested by `testers` people, each posting up to
  // `perTester` results.
  const cell = (steel: SeedSteel, abrasive: SeedAbrasive, testers: number, perTester: number) => {
    for (const author of pickDistinct(rng, testerChoices, testers)) {
      const count = rng.int(1, perTester);
      for (let i = 0; i < count && results.length < RESULT_COUNT; i++) {
        results.push(makeResult(rng, author, steel, abrasive, rng.chance(0.2) ? v1 : v2, retentionMethod));
      }
    }
  };
  // First every page gets a replicated cell, so no steel or abrasive page is left empty; then
  // cells are drawn by weight until the count is reached.
  for (const abrasive of abrasives) cell(rng.weighted(steelChoices), abrasive, 2, 1);
  for (const steel of steels) cell(steel, rng.weighted(abrasiveChoices), 2, 1);
  while (results.length < RESULT_COUNT) {
    cell(rng.weighted(steelChoices), rng.weighted(abrasiveChoices), rng.chance(0.15) ? 1 : rng.int(2, 4), 3);
  }
  addProgressions(results);
  return results;
}

/**
 * The usual routes to a finish in the invented data, coarse to fine, by abrasive: each result
 * with a progression takes the steps of one of them that are well coarser than its final
 * abrasive, so results on one steel share a few progressions, as people who sharpen alike do.
 * The weights make the first the most common (an invented share, not a survey).
 */
const ROUTES: { steps: string[]; weight: number }[] = [
  // a coarse vitrified wheel to set the bevel, a CBN wheel, a fine diamond wheel (then, often, a strop with compound)
  { steps: ['alox-vitrified-wheel-250-coarse', 'cbn-resin-wheel-250-b46', 'diamond-resin-wheel-250-15um'], weight: 5 },
  // coarse and fine CBN, then the dressed vitrified wheel
  { steps: ['cbn-electroplated-wheel-250-b126', 'cbn-resin-wheel-250-b46', 'alox-vitrified-wheel-250-fine-dressed'], weight: 3 },
  // a belt, then bench stones by hand
  { steps: ['ceramic-alumina-belt-p120', 'alox-bench-stone-jis1000', 'alox-bench-stone-jis6000'], weight: 2 },
  // silicon carbide, then the vitrified wheels fine and finer
  { steps: ['sic-vitrified-wheel-200-f220', 'alox-vitrified-wheel-250-fine-dressed', 'alox-vitrified-wheel-250-jis4000'], weight: 1 },
];

/**
 * Gives about six results in ten the steps that led to their final abrasive: one of the usual
 * routes, keeping the steps at least 1.5 × coarser than the final abrasive, the last sometimes at
 * a slightly lower angle. Drawn from a generator of its own, so the results themselves stay as
 * they were before progressions.
 */
function addProgressions(results: SeedResult[]): void {
  const rng = new Rng(PROGRESSION_SEED);
  const umOf = new Map(abrasives.map((a) => [a.slug, particleUm(a.grit.standard, a.grit.grade)]));
  for (const slug of ROUTES.flatMap((route) => route.steps)) if (!umOf.has(slug)) throw new Error(`results: a route names an unknown abrasive ${slug}`);
  for (const r of results) {
    if (!rng.chance(0.6)) continue;
    const final = abrasives.find((a) => a.slug === r.input.abrasive)!;
    const finalUm = particleUm(r.input.grit?.standard ?? final.grit.standard, r.input.grit?.grade ?? final.grit.grade);
    const routes = ROUTES.map((route) => ({ item: route.steps.filter((slug) => umOf.get(slug)! > 1.5 * finalUm), weight: route.weight })).filter((route) => route.item.length > 0);
    if (!routes.length) continue;
    const chosen = rng.weighted(routes);
    const lowered = rng.chance(0.3);
    r.input.progression = chosen.map((slug, i) => (i === chosen.length - 1 && lowered ? { abrasive: slug, perSideDeg: 15 } : { abrasive: slug }));
  }
}

function makeResult(
  rng: Rng,
  author: string,
  steel: SeedSteel,
  abrasive: SeedAbrasive,
  method: SeedMethod,
  retentionMethod: SeedMethod,
): SeedResult {
  const tester = TESTERS[author];
  const traits = STEEL_TRAITS[steel.slug];
  const { min, max } = steel.hardnessHrc;

  // Hardness: mostly HRC inside the steel's range; some in HV, chosen away from the range's ends
  // so that converting back stays inside it.
  let hrc: number;
  let hardness: ResultInput['hardness'];
  if (rng.chance(author === 'little-tern-lab' ? 0.35 : 0.12)) {
    hrc = rng.between(min + 0.5, max - 0.5);
    hardness = { value: round(hrcToHvApprox(hrc), 5), scale: 'HV', measured: true };
  } else {
    hrc = round(rng.between(min, max), 0.5);
    hardness = { value: hrc, scale: 'HRC', measured: rng.chance(tester.measured) };
  }

  const dressed = DRESSED_GRADES[abrasive.slug];
  const grit = { standard: abrasive.grit.standard, grade: dressed ? rng.pick(dressed) : abrasive.grit.grade };
  const sizeUm = particleUm(grit.standard, grit.grade);

  // Angle: usually stated per side; sometimes given as the wheel setup it came from.
  let edgeAngle: ResultInput['edgeAngle'];
  let perSideDeg: number;
  const useSetup = abrasive.form === 'wheel' && abrasive.wheelDiameterMm !== null && rng.chance(0.15);
  if (useSetup) {
    const s = wheelSetup(rng, abrasive);
    edgeAngle = { setup: s.setup };
    perSideDeg = s.perSideDeg;
  } else {
    perSideDeg = round(clamp(tester.usualAngle + 1.5 * rng.normal(), 10, 25), 0.5);
    edgeAngle = { perSideDeg };
  }

  // Push-cut readings: finer particles, keener edge; large carbides count mostly at coarse finishes.
  const coarseness = clamp(Math.log10(sizeUm + 1) / 2, 0, 1);
  const carbide = 1 + (traits.carbideFactor - 1) * coarseness;
  const glazing = (abrasive.material === 'aluminium-oxide' || abrasive.material === 'silicon-carbide') && traits.carbideFactor >= 1.04 ? 1.06 : 1;
  const medianG =
    (85 + 100 * Math.log10(sizeUm)) * carbide * glazing * tester.bias * (1 + 0.012 * (perSideDeg - 17)) * (1 + 0.05 * rng.normal());
  let readingsG = Array.from({ length: method.readingsPerEdge }, () =>
    Math.max(40, Math.round(medianG * (1 + 0.07 * rng.normal()))),
  );

  // Retention: harder and higher-carbide steels last longer; cuts are counted in blocks of 10.
  let retention: ResultInput['retention'];
  if (rng.chance(tester.retention)) {
    const mid = (min + max) / 2;
    const cuts =
      traits.retentionCuts *
      (1 + 0.06 * (hrc - mid)) *
      (1 + 0.1 * Math.log10(sizeUm)) *
      (1 + 0.01 * (perSideDeg - 17)) *
      Math.exp(0.18 * rng.normal());
    retention = { method: retentionMethod.slug, cuts: clamp(round(cuts, 10), 50, 600) };
  }

  const heatTreatment = rng.chance(0.5) ? rng.pick(HEAT_TREATMENTS[steel.slug] ?? []) : undefined;

  let notes: RichTextNode | undefined;
  if (rng.chance(0.25)) {
    const ctx: NoteContext = { abrasive, steel, setup: useSetup };
    notes = rng.pick(NOTES.filter((n) => n.fits(ctx))).make(ctx);
  }

  // Review state. Results on the old method version are old, so none of them is still pending.
  const isV1 = method.version === 1;
  const roll = rng.unit();
  let status: SeedResult['status'];
  let daysAgo: number;
  let reviewNote: string | undefined;
  if (roll < 0.85 || (isV1 && roll < 0.96)) {
    status = 'approved';
    daysAgo = isV1 ? rng.int(400, 720) : rng.int(7, 390);
  } else if (isV1 || roll >= 0.96) {
    status = 'rejected';
    daysAgo = isV1 ? rng.int(400, 720) : rng.int(5, 200);
    if (rng.chance(0.3)) {
      reviewNote = UNITS_REJECT_REASON;
      // Readings entered in newtons: grams × 0.00981, to two decimals.
      readingsG = readingsG.map((g) => Math.round(g * 0.981) / 100);
    } else {
      reviewNote = rng.pick(REJECT_REASONS);
    }
  } else if (roll < 0.92) {
    status = 'pending';
    daysAgo = rng.int(0, 9);
  } else {
    status = 'returned';
    daysAgo = rng.int(2, 30);
    if (readingsG.length === 5 && rng.chance(0.5)) {
      readingsG = readingsG.slice(0, 4);
      reviewNote = MISSING_READING_NOTE;
    } else {
      reviewNote = rng.pick(RETURN_NOTES);
    }
  }

  const input: ResultInput = {
    steel: steel.slug,
    hardness,
    ...(heatTreatment ? { heatTreatment } : {}),
    abrasive: abrasive.slug,
    grit,
    edgeAngle,
    sharpness: { method: method.slug, readingsG },
    ...(retention ? { retention } : {}),
    ...(notes ? { notes } : {}),
  };
  return { author, status, daysAgo, ...(reviewNote ? { reviewNote } : {}), input };
}
