import { describe, expect, it } from 'vitest';
import { resultInputSchema } from '@shared/schemas/result';
import { richTextSchema, type RichTextNode } from '@shared/rich-text';
import { toHrc } from '@shared/hardness';
import {
  ABRASIVE_FORMS,
  ABRASIVE_MATERIALS,
  BONDS,
  COOLANTS,
  DESIGNATION_SYSTEMS,
  STEEL_CATEGORIES,
} from '@shared/vocabulary';
import { DEMO_NOTICE } from '../../seed/data/notice';
import { members } from '../../seed/data/members';
import { steels } from '../../seed/data/steels';
import { abrasives } from '../../seed/data/abrasives';
import { methods } from '../../seed/data/methods';
import { generateResults, RESULT_COUNT } from '../../seed/data/results';

// ---------------------------------------------------------------------------------------------
// Composition limits, wt %, transcribed from the standards independently of the data module.
// R: seen in a retrieved copy of the standard, as collected in
// /work/shared/reference/published-values.md ("Steel compositions" table; the edition is not
// recorded there). "(from memory)": recalled, to be checked against the standard.
// [min, max]; min null means the standard gives a maximum only.
// ---------------------------------------------------------------------------------------------
type Limits = Record<string, [number | null, number]>;
const STANDARD_COMPOSITIONS: { slug: string; standard: string; mark: 'R' | '(from memory)'; limits: Limits }[] = [
  { slug: 'aisi-1095', standard: 'SAE J403', mark: 'R', limits: { C: [0.9, 1.03], Mn: [0.3, 0.5] } },
  { slug: 'aisi-1084', standard: 'SAE J403', mark: '(from memory)', limits: { C: [0.8, 0.93], Mn: [0.6, 0.9] } },
  {
    slug: 'aisi-5160',
    standard: 'SAE J404',
    mark: '(from memory)',
    limits: { C: [0.56, 0.64], Mn: [0.75, 1.0], Si: [0.15, 0.35], Cr: [0.7, 0.9] },
  },
  {
    slug: 'aisi-52100',
    standard: 'ASTM A295',
    mark: 'R',
    limits: { C: [0.93, 1.05], Cr: [1.35, 1.6], Mo: [null, 0.1], Mn: [0.25, 0.45], Si: [0.15, 0.35] },
  },
  {
    slug: 'en-1-2235',
    standard: 'EN 10132-4',
    mark: '(from memory)',
    limits: { C: [0.75, 0.85], Si: [0.15, 0.35], Mn: [0.3, 0.5], Cr: [0.4, 0.6], V: [0.15, 0.25] },
  },
  {
    slug: 'aisi-w2',
    standard: 'ASTM A686',
    mark: '(from memory)',
    limits: { C: [0.85, 1.5], Mn: [0.1, 0.4], Si: [0.1, 0.4], Cr: [null, 0.15], Mo: [null, 0.1], V: [0.15, 0.35], W: [null, 0.15] },
  },
  {
    slug: 'aisi-o1',
    standard: 'ASTM A681',
    mark: 'R',
    limits: { C: [0.85, 1.0], Cr: [0.4, 0.7], V: [null, 0.3], W: [0.4, 0.6], Mn: [1.0, 1.4], Si: [0.1, 0.5] },
  },
  {
    slug: 'aisi-a2',
    standard: 'ASTM A681',
    mark: 'R',
    limits: { C: [0.95, 1.05], Cr: [4.75, 5.5], Mo: [0.9, 1.4], V: [0.15, 0.5], Mn: [0.4, 1.0], Si: [0.1, 0.5] },
  },
  {
    slug: 'aisi-d2',
    standard: 'ASTM A681',
    mark: 'R',
    limits: { C: [1.4, 1.6], Cr: [11.0, 13.0], Mo: [0.7, 1.2], V: [null, 1.1], Mn: [null, 0.6], Si: [null, 0.6] },
  },
  {
    slug: 'aisi-m2',
    standard: 'ASTM A600',
    mark: 'R',
    limits: {
      C: [0.78, 0.88],
      Cr: [3.75, 4.5],
      Mo: [4.5, 5.5],
      V: [1.75, 2.2],
      W: [5.5, 6.75],
      Mn: [0.15, 0.4],
      Si: [0.2, 0.45],
    },
  },
  {
    slug: 'aisi-440c',
    standard: 'ASTM A276',
    mark: 'R',
    limits: { C: [0.95, 1.2], Cr: [16.0, 18.0], Mo: [null, 0.75], Mn: [null, 1.0], Si: [null, 1.0] },
  },
  {
    slug: 'aisi-440a',
    standard: 'ASTM A276',
    mark: '(from memory)',
    limits: { C: [0.6, 0.75], Cr: [16.0, 18.0], Mo: [null, 0.75], Mn: [null, 1.0], Si: [null, 1.0] },
  },
  {
    slug: 'en-1-4116',
    standard: 'EN 10088-1',
    mark: 'R',
    limits: { C: [0.45, 0.55], Cr: [14.0, 15.0], Mo: [0.5, 0.8], V: [0.1, 0.2], Mn: [null, 1.0], Si: [null, 1.0] },
  },
  {
    slug: 'en-1-4125',
    standard: 'EN 10088-1',
    mark: 'R',
    limits: { C: [0.95, 1.2], Cr: [16.0, 18.0], Mo: [0.4, 0.8], Mn: [null, 1.0], Si: [null, 1.0] },
  },
  {
    slug: 'en-1-4034',
    standard: 'EN 10088-1',
    mark: '(from memory)',
    limits: { C: [0.43, 0.5], Cr: [12.5, 14.5], Mn: [null, 1.0], Si: [null, 1.0] },
  },
  {
    slug: 'en-1-4110',
    standard: 'EN 10088-1',
    mark: '(from memory)',
    limits: { C: [0.48, 0.6], Cr: [13.0, 15.0], Mo: [0.5, 0.8], V: [null, 0.15], Mn: [null, 1.0], Si: [null, 1.0] },
  },
];

const compositionRows = STANDARD_COMPOSITIONS.flatMap(({ slug, standard, mark, limits }) =>
  Object.entries(limits).map(([element, [min, max]]) => ({ slug, standard, mark, element, min, max })),
);

function allStrings(value: unknown, out: string[] = []): string[] {
  if (typeof value === 'string') out.push(value);
  else if (Array.isArray(value)) value.forEach((v) => allStrings(v, out));
  else if (value && typeof value === 'object') Object.values(value).forEach((v) => allStrings(v, out));
  return out;
}

function links(node: RichTextNode, out: string[] = []): string[] {
  for (const mark of node.marks ?? []) if (mark.type === 'link') out.push(mark.attrs?.href ?? '');
  for (const child of node.content ?? []) links(child, out);
  return out;
}

const results = generateResults();
const steelBySlug = new Map(steels.map((s) => [s.slug, s]));
const abrasiveBySlug = new Map(abrasives.map((a) => [a.slug, a]));
const methodBySlug = new Map(methods.map((m) => [m.slug, m]));
const memberByHandle = new Map(members.map((m) => [m.handle, m]));
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

describe('steel compositions against their standards', () => {
  it.each(compositionRows)('$slug $element: $min–$max wt % per $standard, $mark', ({ slug, standard, element, min, max }) => {
    const steel = steelBySlug.get(slug);
    expect(steel, `steel page ${slug}`).toBeDefined();
    expect(steel!.citations[0]?.standard, `${slug} cites ${standard} first`).toBe(standard);
    const limit = steel!.composition.find((c) => c.element === element);
    expect(limit, `${slug} lists ${element}`).toBeDefined();
    expect(limit!.min).toBe(min);
    expect(limit!.max).toBe(max);
  });

  it('lists exactly the elements of its standard, every steel having a reference row', () => {
    for (const steel of steels) {
      const row = STANDARD_COMPOSITIONS.find((r) => r.slug === steel.slug);
      expect(row, `reference composition for ${steel.slug}`).toBeDefined();
      expect(steel.composition.map((c) => c.element).sort()).toEqual(Object.keys(row!.limits).sort());
      for (const c of steel.composition) expect(c.min === null || c.min <= c.max, `${steel.slug} ${c.element}`).toBe(true);
    }
  });
});

describe('reference pages', () => {
  it('has at least 15 steels, about 12 abrasives and 3 methods', () => {
    expect(steels.length).toBeGreaterThanOrEqual(15);
    expect(abrasives.length).toBeGreaterThanOrEqual(11);
    expect(methods.length).toBe(3);
  });

  it('uses unique slugs in kebab case', () => {
    for (const list of [steels, abrasives, methods]) {
      const slugs = list.map((x) => x.slug);
      expect(new Set(slugs).size).toBe(slugs.length);
      for (const s of slugs) expect(s).toMatch(/^[a-z0-9]+(?:-[a-z0-9]+)*$/);
    }
  });

  it('gives every designation to one steel only', () => {
    const seen = new Map<string, string>();
    for (const steel of steels) {
      for (const d of steel.designations) {
        expect(DESIGNATION_SYSTEMS).toContain(d.system);
        const key = `${d.system} ${d.code}`.toLowerCase();
        expect(seen.get(key), `${key} on ${steel.slug} and ${seen.get(key)}`).toBeUndefined();
        seen.set(key, steel.slug);
      }
    }
    // A code such as 1.4125 must not reach a second steel under another system either
    // (AISI 1095 and SAE 1095 on one page are the same grade, so codes repeat only within a page).
    const pageOfCode = new Map<string, string>();
    for (const steel of steels) {
      for (const d of steel.designations) {
        const code = d.code.toLowerCase();
        const other = pageOfCode.get(code);
        expect(other === undefined || other === steel.slug, `${d.code} on ${steel.slug} and ${other}`).toBe(true);
        pageOfCode.set(code, steel.slug);
      }
    }
  });

  it('puts the D2 designations on the D2 page (AISI D2, UNS T30402, WNr 1.2379, EN X153CrMoV12, JIS SKD11)', () => {
    const d2 = steelBySlug.get('aisi-d2')!;
    expect(d2.designations).toEqual(
      expect.arrayContaining([
        { system: 'AISI', code: 'D2' },
        { system: 'UNS', code: 'T30402' },
        { system: 'WNr', code: '1.2379' },
        { system: 'EN', code: 'X153CrMoV12' },
        { system: 'JIS', code: 'SKD11' },
      ]),
    );
  });

  it('uses the vocabulary keys and sensible hardness ranges for steels', () => {
    for (const s of steels) {
      expect(Object.keys(STEEL_CATEGORIES)).toContain(s.category);
      // Working hardness of knives lies roughly in 50–67 HRC (common practice).
      expect(s.hardnessHrc.min).toBeGreaterThanOrEqual(50);
      expect(s.hardnessHrc.max).toBeLessThanOrEqual(67);
      expect(s.hardnessHrc.min).toBeLessThan(s.hardnessHrc.max);
      expect(s.citations.length).toBeGreaterThan(0);
    }
  });

  it('uses the vocabulary keys for abrasives, and wear follows the bond', () => {
    for (const a of abrasives) {
      expect(Object.keys(ABRASIVE_MATERIALS)).toContain(a.material);
      expect(Object.keys(BONDS)).toContain(a.bond);
      expect(Object.keys(ABRASIVE_FORMS)).toContain(a.form);
      expect(Object.keys(COOLANTS)).toContain(a.coolant);
      // Vitrified wheels and stones wear; plated and metal-bond superabrasives keep their size (common practice).
      if (a.bond === 'vitrified') expect(a.wears, a.slug).toBe(true);
      if (a.bond === 'electroplated' || a.bond === 'metal') expect(a.wears, a.slug).toBe(false);
      if (a.form === 'wheel') expect(a.wheelDiameterMm, a.slug).toBeGreaterThan(0);
      else expect(a.wheelDiameterMm, a.slug).toBeNull();
    }
  });

  it('says the usual cautions on every powered wheel and belt page', () => {
    for (const a of abrasives.filter((x) => x.form === 'wheel' || x.form === 'belt')) {
      const text = allStrings(a.body).join(' ');
      expect(text, a.slug).toMatch(/eye protection/);
      expect(text, a.slug).toMatch(/maker’s instructions/);
    }
  });

  it('links method versions and keeps the skin caution on every method', () => {
    const v2 = methodBySlug.get('push-cut-test-v2')!;
    const v1 = methodBySlug.get(v2.replacesSlug!)!;
    expect(v1.version).toBeLessThan(v2.version);
    expect(v1.readingsPerEdge).toBe(3);
    expect(v2.readingsPerEdge).toBe(5);
    for (const m of methods) {
      if (m.replacesSlug) expect(methodBySlug.has(m.replacesSlug)).toBe(true);
      expect(allStrings(m.body).join(' '), m.slug).toMatch(/never on skin/);
      expect((m.retentionMedium === null) === (m.thresholdG === null), m.slug).toBe(true);
    }
  });

  it('stores every body as an allowed TipTap document with https links only', () => {
    const bodies = [...steels, ...abrasives, ...methods].map((x) => ({ slug: x.slug, body: x.body }));
    for (const { slug, body } of bodies) {
      const parsed = richTextSchema.safeParse(body);
      expect(parsed.success, `${slug}: ${parsed.success ? '' : JSON.stringify(parsed.error.issues)}`).toBe(true);
      for (const href of links(body)) expect(href).toMatch(/^https:\/\//);
    }
  });
});

describe('members', () => {
  it('has one admin, one or two moderators, two publishers, the rest members', () => {
    const byRole = (role: string) => members.filter((m) => m.role === role).length;
    expect(byRole('admin')).toBe(1);
    expect(byRole('moderator')).toBeGreaterThanOrEqual(1);
    expect(byRole('moderator')).toBeLessThanOrEqual(2);
    expect(byRole('publisher')).toBe(2);
    expect(members.length).toBeGreaterThanOrEqual(12);
  });

  it('uses unique kebab-case handles and example.test addresses', () => {
    expect(new Set(members.map((m) => m.handle)).size).toBe(members.length);
    for (const m of members) {
      expect(m.handle).toMatch(/^[a-z0-9]+(?:-[a-z0-9]+)*$/);
      expect(m.email).toBe(`${m.handle}@example.test`);
    }
  });
});

describe('results', () => {
  it('are the same on every run and number 300', () => {
    expect(results.length).toBe(RESULT_COUNT);
    expect(generateResults()).toEqual(results);
  });

  it('each pass the result input schema', () => {
    const failures = results
      .map((r, i) => ({ i, parsed: resultInputSchema.safeParse(r.input) }))
      .filter((x) => !x.parsed.success)
      .map((x) => `#${x.i}: ${JSON.stringify(x.parsed.error?.issues)}`);
    expect(failures).toEqual([]);
  });

  it('reference existing steels, abrasives, methods and posting members', () => {
    for (const r of results) {
      expect(steelBySlug.has(r.input.steel), r.input.steel).toBe(true);
      expect(abrasiveBySlug.has(r.input.abrasive), r.input.abrasive).toBe(true);
      const sharp = methodBySlug.get(r.input.sharpness.method);
      expect(sharp?.retentionMedium, r.input.sharpness.method).toBeNull();
      if (r.input.retention) expect(methodBySlug.get(r.input.retention.method)?.retentionMedium).toBeTruthy();
      const author = memberByHandle.get(r.author);
      expect(author, r.author).toBeDefined();
      expect(author!.role).not.toBe('admin');
    }
  });

  it('are about 85 % approved, and every returned or rejected one carries a note', () => {
    const count = (s: string) => results.filter((r) => r.status === s).length;
    expect(count('approved') / results.length).toBeGreaterThan(0.8);
    expect(count('approved') / results.length).toBeLessThan(0.9);
    for (const s of ['pending', 'returned', 'rejected']) expect(count(s), s).toBeGreaterThan(0);
    for (const r of results) {
      if (r.status === 'returned' || r.status === 'rejected') expect(r.reviewNote, r.status).toBeTruthy();
      else expect(r.reviewNote).toBeUndefined();
      expect(r.daysAgo).toBeGreaterThanOrEqual(0);
    }
  });

  it('keep hardness inside the steel’s range (HRC) or between 500 and 900 HV', () => {
    for (const r of results) {
      const { value, scale } = r.input.hardness;
      const range = steelBySlug.get(r.input.steel)!.hardnessHrc;
      expect(['HRC', 'HV']).toContain(scale);
      if (scale === 'HRC') {
        expect(value).toBeGreaterThanOrEqual(range.min);
        expect(value).toBeLessThanOrEqual(range.max);
      } else {
        expect(value).toBeGreaterThanOrEqual(500);
        expect(value).toBeLessThanOrEqual(900);
        // Converted per ASTM E140 Table 1 (shared/hardness.ts), the value lands in the steel's range.
        const hrc = toHrc(value, 'HV');
        expect(hrc, `${value} HV on ${r.input.steel}`).toBeGreaterThanOrEqual(range.min);
        expect(hrc, `${value} HV on ${r.input.steel}`).toBeLessThanOrEqual(range.max);
      }
    }
    expect(results.some((r) => r.input.hardness.scale === 'HV')).toBe(true);
  });

  it('have 3–6 readings and angles of 10–25° per side', () => {
    for (const r of results) {
      expect(r.input.sharpness.readingsG.length).toBeGreaterThanOrEqual(3);
      expect(r.input.sharpness.readingsG.length).toBeLessThanOrEqual(6);
      if ('perSideDeg' in r.input.edgeAngle) {
        expect(r.input.edgeAngle.perSideDeg).toBeGreaterThanOrEqual(10);
        expect(r.input.edgeAngle.perSideDeg).toBeLessThanOrEqual(25);
      }
    }
  });

  // Bevel angle on a wheel, DESIGN.md model: sin α = (d² − R² − L²) / (2RL), d = R + gap + bar radius,
  // valid for d − R ≤ L ≤ √(d² − R²). Worked example from published-values.md ("Geometry of a bevel
  // ground on a wheel", derived two independent ways): R 100, d 250, L 200 → 18.2100°.
  const bevelDeg = (R: number, d: number, L: number) => (Math.asin((d * d - R * R - L * L) / (2 * R * L)) * 180) / Math.PI;

  it('give wheel setups that are geometrically valid and yield 12–20° per side', () => {
    expect(bevelDeg(100, 250, 200)).toBeCloseTo(18.21, 3);
    expect(bevelDeg(125, 300, 220)).toBeCloseTo(28.1819, 3);
    const setups = results.flatMap((r) => ('setup' in r.input.edgeAngle ? [{ r, s: r.input.edgeAngle.setup }] : []));
    expect(setups.length).toBeGreaterThanOrEqual(5);
    for (const { r, s } of setups) {
      const abrasive = abrasiveBySlug.get(r.input.abrasive)!;
      expect(abrasive.form).toBe('wheel');
      expect(s.wheelDiameterMm).toBeLessThanOrEqual(abrasive.wheelDiameterMm!);
      if (!abrasive.wears) expect(s.wheelDiameterMm).toBe(abrasive.wheelDiameterMm);
      const R = s.wheelDiameterMm / 2;
      const d = R + s.gapMm + s.barDiameterMm / 2;
      const L = s.projectionMm;
      expect(L).toBeGreaterThanOrEqual(d - R);
      expect(L).toBeLessThanOrEqual(Math.sqrt(d * d - R * R));
      const angle = bevelDeg(R, d, L);
      expect(angle).toBeGreaterThanOrEqual(12);
      expect(angle).toBeLessThanOrEqual(20);
    }
  });

  it('read lower on fine abrasives than on coarse ones, within 40–400 g for grams', () => {
    const approved = results.filter((r) => r.status === 'approved');
    const medianOf = (slug: string) =>
      median(approved.filter((r) => r.input.abrasive === slug).map((r) => median(r.input.sharpness.readingsG)));
    expect(medianOf('leather-strop-diamond-1um')).toBeLessThan(medianOf('alox-bench-stone-jis1000'));
    expect(medianOf('alox-bench-stone-jis1000')).toBeLessThan(medianOf('cbn-electroplated-wheel-250-b126'));
    for (const r of approved) {
      const m = median(r.input.sharpness.readingsG);
      expect(m).toBeGreaterThan(40);
      expect(m).toBeLessThan(400);
    }
  });

  it('count cuts in blocks of 10 and more on high-carbide steels', () => {
    const withCuts = results.filter((r) => r.input.retention);
    expect(withCuts.length).toBeGreaterThan(30);
    for (const r of withCuts) {
      expect(r.input.retention!.cuts % 10).toBe(0);
      expect(r.input.retention!.cuts).toBeGreaterThanOrEqual(50);
      expect(r.input.retention!.cuts).toBeLessThanOrEqual(600);
    }
    const cutsOf = (slug: string) => median(withCuts.filter((r) => r.input.steel === slug).map((r) => r.input.retention!.cuts));
    expect(cutsOf('aisi-d2')).toBeGreaterThan(cutsOf('aisi-1095'));
  });

  it('replicate comparison cells and give D2, a CBN and a diamond abrasive many approved results', () => {
    const approved = results.filter((r) => r.status === 'approved');
    const testers = new Map<string, Set<string>>();
    for (const r of approved) {
      const key = `${r.input.steel}|${r.input.abrasive}`;
      testers.set(key, (testers.get(key) ?? new Set()).add(r.author));
    }
    const replicated = [...testers.values()].filter((s) => s.size >= 2).length;
    expect(replicated).toBeGreaterThanOrEqual(20);
    const count = (pred: (r: (typeof results)[number]) => boolean) => approved.filter(pred).length;
    expect(count((r) => r.input.steel === 'aisi-d2')).toBeGreaterThanOrEqual(30);
    expect(count((r) => abrasiveBySlug.get(r.input.abrasive)!.material === 'cbn')).toBeGreaterThanOrEqual(30);
    expect(count((r) => abrasiveBySlug.get(r.input.abrasive)!.material === 'diamond')).toBeGreaterThanOrEqual(30);
    expect(count((r) => r.input.abrasive === 'cbn-electroplated-wheel-250-b126')).toBeGreaterThanOrEqual(20);
    expect(count((r) => r.input.abrasive === 'diamond-electroplated-wheel-250-d46')).toBeGreaterThanOrEqual(20);
  });

  it('use the version 2 sharpness method mostly, and version 1 for some older results', () => {
    const v1 = results.filter((r) => r.input.sharpness.method === 'push-cut-test-v1');
    const v2 = results.filter((r) => r.input.sharpness.method === 'push-cut-test-v2');
    expect(v2.length).toBeGreaterThan(v1.length * 2);
    expect(v1.length).toBeGreaterThan(0);
    for (const r of v1) expect(r.input.sharpness.readingsG.length).toBe(3);
  });

  it('share a few progressions, coarse to fine, so a steel’s most common ones are more than one result each', () => {
    const withSteps = results.filter((r) => r.input.progression?.length);
    expect(withSteps.length).toBeGreaterThan(results.length / 3);
    const grit = (slug: string) => abrasives.find((a) => a.slug === slug)!.grit;
    for (const r of withSteps) expect(r.input.progression!.every((s) => s.abrasive !== r.input.abrasive), `result by ${r.author}`).toBe(true);
    // The same steel, method and route to the same final abrasive, counted.
    const routes = new Map<string, number>();
    for (const r of withSteps) {
      const key = [r.input.steel, r.input.sharpness.method, ...r.input.progression!.map((s) => s.abrasive), r.input.abrasive, r.input.grit?.grade ?? grit(r.input.abrasive).grade].join('|');
      routes.set(key, (routes.get(key) ?? 0) + 1);
    }
    const steelsWithRepeat = new Set([...routes].filter(([, n]) => n > 1).map(([key]) => key.split('|')[0]));
    expect(steelsWithRepeat.size).toBeGreaterThan(steels.length / 2);
    expect(steelsWithRepeat.has('aisi-d2')).toBe(true);
  });
});

describe('demo wording', () => {
  it('has a notice saying the data is invented and not real measurements', () => {
    expect(DEMO_NOTICE).toMatch(/invented/);
    expect(DEMO_NOTICE).toMatch(/not real measurements/);
    expect(DEMO_NOTICE.split(/[.!?](\s|$)/).filter((s) => s && s.trim()).length).toBe(1);
  });

  const strings = allStrings([DEMO_NOTICE, members, steels, abrasives, methods, results]);

  // Product names are kept out by review, not by a list of them here (such a list would itself
  // put them in the repository); what a test can check is that nothing is marked as a trade mark.
  it('carries no trade-mark signs', () => {
    expect(strings.filter((s) => /[™®]/.test(s))).toEqual([]);
  });
});
