import type { DesignationSystem, SteelCategory } from '@shared/vocabulary';
import type { RichTextNode } from '@shared/rich-text';
import { bold, doc, h2, italic, p, ul } from './rich-text-builders';

/**
 * Reference pages of standard steel grades for the demo. No brand names: only grades defined in
 * open standards. Composition ranges (wt %) are those of the standard named first in each
 * page's citations. Ranges marked R below were seen in a retrieved copy of the standard (as
 * collected in the project's published-values notes); ranges marked "(from memory)" were
 * recalled and should be checked against the standard before anyone relies on them.
 * Hardness ranges, heat treatment and behaviour on the wheel are common practice for knives,
 * not measurements.
 */

/** One composition limit: wt %; `min: null` means the standard gives a maximum only. */
export interface CompositionLimit {
  element: string;
  min: number | null;
  max: number;
}

/** A source behind a steel page, and which statements on the page it supports. */
export interface SteelCitation {
  title: string;
  organisation: string;
  /** Edition year, or null where the edition is not known. */
  year: number | null;
  standard?: string;
  url?: string;
  supports: string;
}

/** A steel reference page as the loader inserts it. */
export interface SeedSteel {
  slug: string;
  name: string;
  category: SteelCategory;
  designations: { system: DesignationSystem; code: string }[];
  /** Composition limits in wt %, from the standard cited first. */
  composition: CompositionLimit[];
  /** Typical working hardness for knives, HRC (common practice). */
  hardnessHrc: { min: number; max: number };
  body: RichTextNode;
  citations: SteelCitation[];
}

const el = (element: string, min: number | null, max: number): CompositionLimit => ({ element, min, max });

// Standards cited for compositions and designations. Editions are given only where known;
// a null year means the edition was not recorded.
const SAE_J403 = (supports: string): SteelCitation => ({
  title: 'Chemical Compositions of SAE Carbon Steels',
  organisation: 'SAE International',
  year: 2014,
  standard: 'SAE J403',
  supports,
});
const SAE_J404 = (supports: string): SteelCitation => ({
  title: 'Chemical Compositions of SAE Alloy Steels',
  organisation: 'SAE International',
  year: null,
  standard: 'SAE J404',
  supports,
});
const ASTM_A295 = (supports: string): SteelCitation => ({
  title: 'Standard Specification for High-Carbon Anti-Friction Bearing Steel',
  organisation: 'ASTM International',
  year: null,
  standard: 'ASTM A295',
  supports,
});
const ASTM_A681 = (supports: string): SteelCitation => ({
  title: 'Standard Specification for Tool Steels Alloy',
  organisation: 'ASTM International',
  year: null,
  standard: 'ASTM A681',
  supports,
});
const ASTM_A686 = (supports: string): SteelCitation => ({
  title: 'Standard Specification for Tool Steel, Carbon',
  organisation: 'ASTM International',
  year: null,
  standard: 'ASTM A686',
  supports,
});
const ASTM_A600 = (supports: string): SteelCitation => ({
  title: 'Standard Specification for Tool Steel High Speed',
  organisation: 'ASTM International',
  year: null,
  standard: 'ASTM A600',
  supports,
});
const ASTM_A276 = (supports: string): SteelCitation => ({
  title: 'Standard Specification for Stainless Steel Bars and Shapes',
  organisation: 'ASTM International',
  year: null,
  standard: 'ASTM A276',
  supports,
});
const EN_10088_1 = (supports: string): SteelCitation => ({
  title: 'Stainless steels — Part 1: List of stainless steels',
  organisation: 'CEN (European Committee for Standardization)',
  year: 2014,
  standard: 'EN 10088-1',
  supports,
});
const EN_ISO_4957 = (supports: string): SteelCitation => ({
  title: 'Tool steels',
  organisation: 'ISO / CEN',
  year: 2018,
  standard: 'EN ISO 4957',
  supports,
});
const EN_10132_4 = (supports: string): SteelCitation => ({
  title: 'Cold rolled narrow steel strip for heat treatment — Technical delivery conditions — Part 4: Spring steels and other applications',
  organisation: 'CEN (European Committee for Standardization)',
  year: null,
  standard: 'EN 10132-4',
  supports,
});
const EN_ISO_683_17 = (supports: string): SteelCitation => ({
  title: 'Heat-treated steels, alloy steels and free-cutting steels — Part 17: Ball and roller bearing steels',
  organisation: 'ISO / CEN',
  year: null,
  standard: 'EN ISO 683-17',
  supports,
});
const JIS = (standard: string, title: string, supports: string): SteelCitation => ({
  title,
  organisation: 'Japanese Industrial Standards Committee',
  year: null,
  standard,
  supports,
});

const COMMON_PRACTICE_NOTE = p(
  italic(
    'Heat-treatment figures on this page are common practice for blades, given as a starting point; follow the data sheet of the bar’s supplier and the instructions of your furnace.',
  ),
);

/** The demo's steel pages: 16 standard grades. */
export const steels: SeedSteel[] = [
  {
    slug: 'aisi-1095',
    name: 'AISI 1095',
    category: 'carbon',
    designations: [
      { system: 'AISI', code: '1095' },
      { system: 'SAE', code: '1095' },
      { system: 'UNS', code: 'G10950' },
    ],
    // R: SAE J403, as collected in published-values.md (C and Mn only).
    composition: [el('C', 0.9, 1.03), el('Mn', 0.3, 0.5)],
    hardnessHrc: { min: 57, max: 60 },
    body: doc(
      p(
        'AISI 1095 is a plain high-carbon steel: almost nothing but iron, carbon and a little manganese. It is one of the oldest knife steels in use, cheap, easy to forge and quick to take an edge, and it rusts readily if left wet.',
      ),
      h2('Heat treatment for blades'),
      p(
        'It is shallow hardening, so it needs a fast quench: a fast oil or brine from roughly 800 °C is usual, followed by a temper around 175–200 °C. Blades are commonly used at 57–60 HRC. The shallow hardening is also what lets smiths harden only the edge.',
      ),
      h2('On the wheel'),
      p(
        'Its carbides are small iron carbides in modest volume, so any abrasive cuts it quickly and it takes a very fine, keen apex. Because it grinds so easily, heat builds fast on a dry wheel; a temper colour at the edge means that part of the steel has softened.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [SAE_J403('composition ranges (C, Mn) and the AISI/SAE/UNS designations')],
  },
  {
    slug: 'aisi-1084',
    name: 'AISI 1084',
    category: 'carbon',
    designations: [
      { system: 'AISI', code: '1084' },
      { system: 'SAE', code: '1084' },
      { system: 'UNS', code: 'G10840' },
    ],
    // SAE J403 ranges (from memory).
    composition: [el('C', 0.8, 0.93), el('Mn', 0.6, 0.9)],
    hardnessHrc: { min: 57, max: 60 },
    body: doc(
      p(
        'AISI 1084 is a plain carbon steel close to the eutectoid composition, with a little more manganese than 1095. It is a common first steel for people learning to forge and heat treat, because it forgives small errors in temperature.',
      ),
      p(
        'Common practice is an oil quench from about 815 °C and a temper around 175–205 °C, giving 57–60 HRC on the blade. Being nearly eutectoid it has little carbide left after hardening, so the structure is fine and even.',
      ),
      p(
        'On the wheel it behaves like other simple carbon steels: it cuts fast on every abrasive, raises a burr readily and takes a fine edge. Light final passes matter more than the choice of wheel.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [SAE_J403('composition ranges (C, Mn) and the AISI/SAE/UNS designations')],
  },
  {
    slug: 'aisi-5160',
    name: 'AISI 5160',
    category: 'low-alloy',
    designations: [
      { system: 'AISI', code: '5160' },
      { system: 'SAE', code: '5160' },
      { system: 'UNS', code: 'G51600' },
    ],
    // SAE J404 ranges (from memory).
    composition: [el('C', 0.56, 0.64), el('Si', 0.15, 0.35), el('Mn', 0.75, 1.0), el('Cr', 0.7, 0.9)],
    hardnessHrc: { min: 55, max: 60 },
    body: doc(
      p(
        'AISI 5160 is a chromium spring steel with about 0.6 % carbon. It is chosen for choppers, machetes and large blades where toughness matters more than the last degree of edge holding.',
      ),
      p(
        'It is oil hardened from around 830 °C; the temper is chosen for the job, lower (around 175 °C) for a fine edge and higher (up to about 230 °C) for a blade that must take blows. Working hardness is commonly 55–60 HRC.',
      ),
      h2('On the wheel'),
      p(
        'With little carbide it grinds easily on any abrasive. The edge tends to roll rather than chip, so a slightly more obtuse angle is usual on heavy blades.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [SAE_J404('composition ranges and the AISI/SAE/UNS designations')],
  },
  {
    slug: 'aisi-52100',
    name: 'AISI 52100',
    category: 'low-alloy',
    designations: [
      { system: 'AISI', code: '52100' },
      { system: 'SAE', code: '52100' },
      { system: 'UNS', code: 'G52986' },
      { system: 'EN', code: '100Cr6' },
      { system: 'WNr', code: '1.3505' },
      { system: 'JIS', code: 'SUJ2' },
    ],
    // R: ASTM A295, as collected in published-values.md.
    composition: [
      el('C', 0.93, 1.05),
      el('Si', 0.15, 0.35),
      el('Mn', 0.25, 0.45),
      el('Cr', 1.35, 1.6),
      el('Mo', null, 0.1),
    ],
    hardnessHrc: { min: 60, max: 63 },
    body: doc(
      p(
        'AISI 52100 is a bearing steel: about 1 % carbon with 1.5 % chromium, made very clean for rolling contact. The same cleanliness and fine structure make it a well-liked knife steel. In Europe it is 100Cr6 (1.3505), in Japan SUJ2.',
      ),
      h2('Heat treatment for blades'),
      p(
        'Common practice is an oil quench from about 830–845 °C after careful normalising, and a temper between 150 and 200 °C, giving roughly 60–63 HRC. Many makers add a sub-zero step to reduce retained austenite.',
      ),
      h2('On the wheel'),
      p(
        'Its carbides are small chromium-bearing iron carbides in moderate volume, so it cuts readily on aluminium oxide as well as on CBN. It rewards a fine finish: the apex can be taken very thin without the coarse carbides that tear out of high-chromium steels.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A295('composition ranges'),
      EN_ISO_683_17('the EN designation 100Cr6 / 1.3505'),
      JIS('JIS G4805', 'High carbon chromium bearing steels', 'the JIS designation SUJ2'),
    ],
  },
  {
    slug: 'en-1-2235',
    name: '80CrV2 (1.2235)',
    category: 'low-alloy',
    designations: [
      { system: 'EN', code: '80CrV2' },
      { system: 'WNr', code: '1.2235' },
    ],
    // EN 10132-4 ranges (from memory).
    composition: [
      el('C', 0.75, 0.85),
      el('Si', 0.15, 0.35),
      el('Mn', 0.3, 0.5),
      el('Cr', 0.4, 0.6),
      el('V', 0.15, 0.25),
    ],
    hardnessHrc: { min: 57, max: 61 },
    body: doc(
      p(
        '80CrV2 is a European low-alloy steel with about 0.8 % carbon, a little chromium for hardenability and a small vanadium addition that keeps the grain fine. It is made as strip for saws and springs and is popular with smiths for tough, simple blades.',
      ),
      p(
        'Blades are usually oil quenched from about 800–830 °C and tempered around 175–200 °C, for 57–61 HRC. It forgives a little more than a plain carbon steel in the quench.',
      ),
      p(
        'On the wheel it is easy: low carbide volume, fast cutting on every abrasive and a clean burr. It takes a fine edge from a vitrified wheel as readily as from CBN.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [EN_10132_4('composition ranges and the designations 80CrV2 / 1.2235')],
  },
  {
    slug: 'aisi-w2',
    name: 'AISI W2',
    category: 'tool',
    designations: [
      { system: 'AISI', code: 'W2' },
      { system: 'UNS', code: 'T72302' },
    ],
    // ASTM A686 ranges (from memory). The standard subdivides the wide carbon range into
    // narrower classes that a purchaser orders.
    composition: [
      el('C', 0.85, 1.5),
      el('Si', 0.1, 0.4),
      el('Mn', 0.1, 0.4),
      el('Cr', null, 0.15),
      el('Mo', null, 0.1),
      el('V', 0.15, 0.35),
      el('W', null, 0.15),
    ],
    hardnessHrc: { min: 58, max: 63 },
    body: doc(
      p(
        'AISI W2 is a water-hardening carbon tool steel with a small vanadium addition. Bladesmiths value it for differential hardening: clay on the spine, a fast quench, and a visible boundary between the hard edge and the softer back.',
      ),
      ul(
        'Quench: water or brine from about 790–815 °C is traditional; a fast oil is gentler and cracks fewer blades.',
        'Temper: around 175–200 °C, leaving the edge at roughly 58–63 HRC.',
        'Wheel: little carbide, so it grinds easily and takes a very keen edge; keep it cool, because an overheated edge loses hardness.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [ASTM_A686('composition ranges and the designation W2 / T72302')],
  },
  {
    slug: 'aisi-o1',
    name: 'AISI O1',
    category: 'tool',
    designations: [
      { system: 'AISI', code: 'O1' },
      { system: 'UNS', code: 'T31501' },
      { system: 'EN', code: '100MnCrW4' },
      { system: 'WNr', code: '1.2510' },
    ],
    // R: ASTM A681, as collected in published-values.md.
    composition: [
      el('C', 0.85, 1.0),
      el('Si', 0.1, 0.5),
      el('Mn', 1.0, 1.4),
      el('Cr', 0.4, 0.7),
      el('V', null, 0.3),
      el('W', 0.4, 0.6),
    ],
    hardnessHrc: { min: 58, max: 62 },
    body: doc(
      p(
        'AISI O1 is an oil-hardening cold-work tool steel with manganese, chromium and a little tungsten. It is a classic for plane irons, chisels, gauges and knives, and is sold ground to size as flat stock. The nearest European grade is 100MnCrW4 (1.2510).',
      ),
      p(
        'Common practice is an oil quench from about 800–815 °C and a temper between 175 and 205 °C, for 58–62 HRC. It moves little in hardening, which is why toolmakers like it.',
      ),
      h2('On the wheel'),
      p(
        'The carbide volume is modest and the carbides are small, so aluminium-oxide wheels cut it well and it takes a very fine edge. Finer grits show clearly on it, which makes it a good steel for comparing finishing abrasives.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A681('composition ranges and the designation O1 / T31501'),
      EN_ISO_4957('the EN designation 100MnCrW4 / 1.2510'),
    ],
  },
  {
    slug: 'aisi-a2',
    name: 'AISI A2',
    category: 'tool',
    designations: [
      { system: 'AISI', code: 'A2' },
      { system: 'UNS', code: 'T30102' },
      { system: 'EN', code: 'X100CrMoV5' },
      { system: 'WNr', code: '1.2363' },
      { system: 'JIS', code: 'SKD12' },
    ],
    // R: ASTM A681, as collected in published-values.md.
    composition: [
      el('C', 0.95, 1.05),
      el('Si', 0.1, 0.5),
      el('Mn', 0.4, 1.0),
      el('Cr', 4.75, 5.5),
      el('Mo', 0.9, 1.4),
      el('V', 0.15, 0.5),
    ],
    hardnessHrc: { min: 58, max: 61 },
    body: doc(
      p(
        'AISI A2 is an air-hardening cold-work tool steel with about 5 % chromium and 1 % molybdenum. It sits between O1 and D2: more wear resistance than O1, more toughness than D2. Woodworkers meet it in chisels and plane irons.',
      ),
      p(
        'Common practice is to harden from about 940–970 °C in still air or between plates, usually in foil to limit scale, and temper around 175–205 °C for 58–61 HRC. It distorts very little.',
      ),
      h2('On the wheel'),
      p(
        'It carries more chromium carbide than O1, but the carbides are finer than those of D2. Aluminium-oxide wheels cut it at a moderate rate and need dressing more often; CBN cuts it without fuss.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A681('composition ranges and the designation A2 / T30102'),
      EN_ISO_4957('the EN designation X100CrMoV5 / 1.2363'),
      JIS('JIS G4404', 'Alloy tool steels', 'the JIS designation SKD12'),
    ],
  },
  {
    slug: 'aisi-d2',
    name: 'AISI D2',
    category: 'tool',
    designations: [
      { system: 'AISI', code: 'D2' },
      { system: 'UNS', code: 'T30402' },
      { system: 'WNr', code: '1.2379' },
      { system: 'EN', code: 'X153CrMoV12' },
      { system: 'JIS', code: 'SKD11' },
    ],
    // R: ASTM A681, as collected in published-values.md.
    composition: [
      el('C', 1.4, 1.6),
      el('Si', null, 0.6),
      el('Mn', null, 0.6),
      el('Cr', 11.0, 13.0),
      el('Mo', 0.7, 1.2),
      el('V', null, 1.1),
    ],
    hardnessHrc: { min: 58, max: 62 },
    body: doc(
      p(
        'AISI D2 is a high-carbon, high-chromium cold-work tool steel, air hardening, made for blanking dies and shear blades and widely used for knives. About twelve percent chromium sounds stainless, but much of it is bound in carbides: D2 stains less readily than carbon steel and will still rust.',
      ),
      h2('Heat treatment for blades'),
      p(
        'Common practice is to harden from about 1010–1030 °C with an air or plate quench, then temper either low, around 200 °C, for the most hardness, or near 500–540 °C where the steel hardens again on tempering. Knives are commonly used at 58–62 HRC.',
      ),
      h2('On the wheel'),
      p(
        'D2 holds a large volume of coarse chromium carbides, not far below the hardness of aluminium-oxide grains. Vitrified aluminium-oxide wheels therefore cut it slowly and glaze sooner; CBN and diamond, far harder than the carbides, cut it cleanly. At a coarse finish the large carbides can leave a ragged apex, and a finer finish or a small microbevel is the usual answer.',
      ),
      p(
        bold('Designations. '),
        'EN ISO 4957 lists the European counterpart X153CrMoV12 (1.2379) with slightly different molybdenum and vanadium limits; the composition shown here is that of ASTM A681.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A681('composition ranges and the designation D2 / T30402'),
      EN_ISO_4957('the EN designation X153CrMoV12 / 1.2379'),
      JIS('JIS G4404', 'Alloy tool steels', 'the JIS designation SKD11'),
    ],
  },
  {
    slug: 'aisi-m2',
    name: 'AISI M2',
    category: 'high-speed',
    designations: [
      { system: 'AISI', code: 'M2' },
      { system: 'UNS', code: 'T11302' },
      { system: 'EN', code: 'HS6-5-2C' },
      { system: 'WNr', code: '1.3343' },
      { system: 'JIS', code: 'SKH51' },
    ],
    // R: ASTM A600 (M2, regular carbon), as collected in published-values.md.
    composition: [
      el('C', 0.78, 0.88),
      el('Si', 0.2, 0.45),
      el('Mn', 0.15, 0.4),
      el('Cr', 3.75, 4.5),
      el('Mo', 4.5, 5.5),
      el('V', 1.75, 2.2),
      el('W', 5.5, 6.75),
    ],
    hardnessHrc: { min: 61, max: 65 },
    body: doc(
      p(
        'AISI M2 is the workhorse tungsten-molybdenum high-speed steel of drills and lathe tools. In edge tools it appears in turning tools, plane irons and some knives, where it holds its hardness even when the edge gets warm.',
      ),
      p(
        'Cutting tools are hardened from very high temperatures (about 1190–1220 °C) and tempered two or three times near 540–560 °C; blades are often hardened somewhat lower for toughness. Working hardness is commonly 61–65 HRC. This is a job for a salt bath or a vacuum furnace, not a forge.',
      ),
      h2('On the wheel'),
      p(
        'Its vanadium and tungsten carbides are harder than aluminium oxide, so vitrified aluminium-oxide wheels wear quickly on it and cut slowly. CBN is the usual choice for high-speed steel; diamond also cuts it. The steel resists softening from heat better than carbon steels, but a blued edge is still a damaged edge.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A600('composition ranges (M2, regular carbon) and the designation M2 / T11302'),
      EN_ISO_4957('the EN designation HS6-5-2C / 1.3343'),
      JIS('JIS G4403', 'High speed tool steels', 'the JIS designation SKH51'),
    ],
  },
  {
    slug: 'aisi-440c',
    name: 'AISI 440C',
    category: 'stainless',
    designations: [
      { system: 'AISI', code: '440C' },
      { system: 'UNS', code: 'S44004' },
      { system: 'JIS', code: 'SUS440C' },
    ],
    // R: ASTM A276, as collected in published-values.md.
    composition: [
      el('C', 0.95, 1.2),
      el('Si', null, 1.0),
      el('Mn', null, 1.0),
      el('Cr', 16.0, 18.0),
      el('Mo', null, 0.75),
    ],
    hardnessHrc: { min: 57, max: 60 },
    body: doc(
      p(
        'AISI 440C is the high-carbon member of the 440 family of martensitic stainless steels, made for bearings, valve parts and cutlery. Its European near-equivalent is X105CrMo17 (1.4125), which has its own page because the two standards set molybdenum differently.',
      ),
      h2('Heat treatment for blades'),
      p(
        'Common practice is to harden from about 1010–1065 °C, quench in air or oil, often add a sub-zero step, and temper at 150–200 °C, giving 57–60 HRC. ASTM A276 asks for at least 58 HRC in its heat-treatment response test after an air quench from 1020 °C.',
      ),
      h2('On the wheel'),
      p(
        'Like D2 it carries large primary chromium carbides, so it is among the more abrasion-resistant of the common stainless grades. Aluminium-oxide wheels cut it slowly and load; CBN and diamond cut it cleanly. Stainless steels tend to leave a tenacious burr, so light final passes and careful deburring pay off.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A276('composition ranges, the heat-treatment response requirement and the designation 440C / S44004'),
      JIS('JIS G4303', 'Stainless steel bars', 'the JIS designation SUS440C'),
    ],
  },
  {
    slug: 'aisi-440a',
    name: 'AISI 440A',
    category: 'stainless',
    designations: [
      { system: 'AISI', code: '440A' },
      { system: 'UNS', code: 'S44002' },
      { system: 'JIS', code: 'SUS440A' },
    ],
    // ASTM A276 ranges (from memory).
    composition: [
      el('C', 0.6, 0.75),
      el('Si', null, 1.0),
      el('Mn', null, 1.0),
      el('Cr', 16.0, 18.0),
      el('Mo', null, 0.75),
    ],
    hardnessHrc: { min: 55, max: 58 },
    body: doc(
      p(
        'AISI 440A is the lower-carbon member of the 440 family. With less carbon than 440C it forms fewer primary carbides, so it is a little more corrosion resistant and tougher, and it reaches a lower hardness.',
      ),
      p(
        'It is hardened much like 440C, from about 1010–1065 °C with a low temper around 150–200 °C, and used at roughly 55–58 HRC in pocket knives, kitchen knives and tools for wet work.',
      ),
      p(
        'On the wheel it is easier than 440C: fewer large carbides, so aluminium-oxide wheels cut it readily. Expect the stubborn stainless burr and finish with light passes.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [
      ASTM_A276('composition ranges and the designation 440A / S44002'),
      JIS('JIS G4303', 'Stainless steel bars', 'the JIS designation SUS440A'),
    ],
  },
  {
    slug: 'en-1-4116',
    name: 'X50CrMoV15 (1.4116)',
    category: 'stainless',
    designations: [
      { system: 'EN', code: 'X50CrMoV15' },
      { system: 'WNr', code: '1.4116' },
    ],
    // R: EN 10088, as collected in published-values.md.
    composition: [
      el('C', 0.45, 0.55),
      el('Si', null, 1.0),
      el('Mn', null, 1.0),
      el('Cr', 14.0, 15.0),
      el('Mo', 0.5, 0.8),
      el('V', 0.1, 0.2),
    ],
    hardnessHrc: { min: 54, max: 58 },
    body: doc(
      p(
        'X50CrMoV15 (1.4116) is the everyday steel of European kitchen knives: about 0.5 % carbon and 14–15 % chromium with small additions of molybdenum and vanadium. It resists corrosion well in a kitchen and is tough enough for heavy use.',
      ),
      p(
        'Makers usually harden it from about 1020–1060 °C and temper at 150–200 °C; kitchen knives are commonly 54–58 HRC, and the softer end is typical of mass-produced blades.',
      ),
      h2('On the wheel'),
      p(
        'Its carbide volume is low, so it grinds quickly on any abrasive. The difficulty is the burr: soft, ductile stainless burrs fold rather than break off. Light, alternating final passes and a strop or a fine stone are the usual remedy.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [EN_10088_1('composition ranges and the designations X50CrMoV15 / 1.4116')],
  },
  {
    slug: 'en-1-4125',
    name: 'X105CrMo17 (1.4125)',
    category: 'stainless',
    designations: [
      { system: 'EN', code: 'X105CrMo17' },
      { system: 'WNr', code: '1.4125' },
    ],
    // R: EN 10088, as collected in published-values.md.
    composition: [
      el('C', 0.95, 1.2),
      el('Si', null, 1.0),
      el('Mn', null, 1.0),
      el('Cr', 16.0, 18.0),
      el('Mo', 0.4, 0.8),
    ],
    hardnessHrc: { min: 57, max: 60 },
    body: doc(
      p(
        'X105CrMo17 (1.4125) is the European counterpart of AISI 440C. The carbon and chromium ranges are the same; EN 10088 asks for a molybdenum minimum where ASTM A276 gives only a maximum, so a bar can meet one standard and not the other.',
      ),
      p(
        'Heat treatment and working hardness follow 440C: hardening from about 1010–1065 °C, often a sub-zero step, a temper at 150–200 °C and 57–60 HRC on the blade.',
      ),
      p(
        'On the wheel it behaves as 440C does: large chromium carbides, slow on aluminium oxide, clean on CBN and diamond, with a burr that needs patience.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [EN_10088_1('composition ranges and the designations X105CrMo17 / 1.4125')],
  },
  {
    slug: 'en-1-4034',
    name: 'X46Cr13 (1.4034)',
    category: 'stainless',
    designations: [
      { system: 'EN', code: 'X46Cr13' },
      { system: 'WNr', code: '1.4034' },
    ],
    // EN 10088-1 ranges (from memory).
    composition: [el('C', 0.43, 0.5), el('Si', null, 1.0), el('Mn', null, 1.0), el('Cr', 12.5, 14.5)],
    hardnessHrc: { min: 53, max: 57 },
    body: doc(
      p(
        'X46Cr13 (1.4034) is a 13 % chromium martensitic stainless steel with a little under half a percent of carbon. It is used for budget kitchen knives, scissors and tools, and for surgical instruments.',
      ),
      p(
        'It is hardened from about 1000–1050 °C and tempered low, around 150–200 °C; blades are commonly 53–57 HRC.',
      ),
      p(
        'On the wheel it offers little resistance: few carbides, quick cutting, and a soft burr that needs gentle finishing passes. A slightly more obtuse angle helps the edge stand up at this hardness.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [EN_10088_1('composition ranges and the designations X46Cr13 / 1.4034')],
  },
  {
    slug: 'en-1-4110',
    name: 'X55CrMo14 (1.4110)',
    category: 'stainless',
    designations: [
      { system: 'EN', code: 'X55CrMo14' },
      { system: 'WNr', code: '1.4110' },
    ],
    // EN 10088-1 ranges (from memory).
    composition: [
      el('C', 0.48, 0.6),
      el('Si', null, 1.0),
      el('Mn', null, 1.0),
      el('Cr', 13.0, 15.0),
      el('Mo', 0.5, 0.8),
      el('V', null, 0.15),
    ],
    hardnessHrc: { min: 55, max: 58 },
    body: doc(
      p(
        'X55CrMo14 (1.4110) is a martensitic stainless steel close to X50CrMoV15 with slightly more carbon. It is found in kitchen and pocket knives that aim a little harder than the common kitchen grade.',
      ),
      p(
        'Hardening from about 1040–1070 °C with a temper around 150–200 °C is usual, for 55–58 HRC.',
      ),
      p(
        'On the wheel it behaves like the other low-carbide stainless steels: fast cutting, a ductile burr, and a clear gain from a fine last step.',
      ),
      COMMON_PRACTICE_NOTE,
    ),
    citations: [EN_10088_1('composition ranges and the designations X55CrMo14 / 1.4110')],
  },
];
