import type { AbrasiveForm, AbrasiveMaterial, Bond, Coolant } from '@shared/vocabulary';
import type { GritStandard } from '@shared/grit';
import type { RichTextNode } from '@shared/rich-text';
import { doc, p } from './rich-text-builders';

/**
 * Generic abrasive product types for the demo: no makers' names, only what a wheel or stone is
 * made of and how it is graded. Descriptions of cutting behaviour are common practice.
 */

/** An abrasive page as the loader inserts it. */
export interface SeedAbrasive {
  slug: string;
  name: string;
  material: AbrasiveMaterial;
  bond: Bond;
  form: AbrasiveForm;
  /** The grade as sold (or as dressed, for a dressable stone), in its own standard. */
  grit: { standard: GritStandard; grade: string };
  /** For dressable stones: the span of grades the surface can be dressed to, coarse to fine. */
  gritRange?: { from: string; to: string };
  /** Nominal outside diameter in mm; null for stones, belts and compounds. */
  wheelDiameterMm: number | null;
  /** Wheel or stone width (belt width) in mm; null where it does not apply. */
  widthMm: number | null;
  /** True when the abrasive body wears away in use (vitrified wheels, stones). */
  wears: boolean;
  coolant: Coolant;
  /** True when the maker allows flat bevels to be ground on the side of the wheel. */
  sideUsable: boolean;
  body: RichTextNode;
}

// One sentence of the usual cautions for every powered wheel, deferring to the maker.
const WHEEL_CAUTION =
  'Before use: check that the wheel’s rated speed exceeds the machine’s, keep the guards on, wear eye protection, never run a cracked or chipped wheel, mind electricity near the water trough, and follow the maker’s instructions and local regulations.';

const BELT_CAUTION =
  'Before use: check the belt’s rated speed and direction arrow, keep the guard and tool rest in place, wear eye protection, keep dust extraction running, and follow the machine maker’s instructions and local regulations.';

const DRESSABLE_JIS = { from: '220', to: '1000' };

/** The demo's abrasive pages: 13 generic types. */
export const abrasives: SeedAbrasive[] = [
  {
    slug: 'alox-vitrified-wheel-250-coarse',
    name: '250 mm vitrified aluminium-oxide wheel, dressed coarse (JIS 220)',
    material: 'aluminium-oxide',
    bond: 'vitrified',
    form: 'wheel',
    grit: { standard: 'jis', grade: '220' },
    gritRange: DRESSABLE_JIS,
    wheelDiameterMm: 250,
    widthMm: 50,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'A slow-turning, water-cooled vitrified aluminium-oxide wheel of the kind supplied with many horizontal-axis wet grinders, graded about JIS 220. Dressed with a coarse pass of a diamond dresser it cuts fast and leaves a toothy edge; a grading stone or a slow, fine dressing pass makes the same wheel cut finer, roughly as far as JIS 1000.',
      ),
      p(
        'The wheel wears and shrinks with every dressing, so a bar setting that gave a given angle on a new wheel gives a steeper one later: measure the diameter now and then and recompute the setting.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'alox-vitrified-wheel-250-fine-dressed',
    name: '250 mm vitrified aluminium-oxide wheel, dressed fine (about JIS 1000)',
    material: 'aluminium-oxide',
    bond: 'vitrified',
    form: 'wheel',
    grit: { standard: 'jis', grade: '1000' },
    gritRange: DRESSABLE_JIS,
    wheelDiameterMm: 250,
    widthMm: 50,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'The same coarse vitrified wheel after a fine dressing or a few minutes with the fine face of a grading stone. Its surface grains are blunted and levelled, so it cuts slower and behaves roughly like a JIS 1000 stone until it is dressed coarse again. Results on this page should say which grade the wheel was dressed to.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'alox-vitrified-wheel-250-jis4000',
    name: '250 mm fine vitrified aluminium-oxide wheel (JIS 4000)',
    material: 'aluminium-oxide',
    bond: 'vitrified',
    form: 'wheel',
    grit: { standard: 'jis', grade: '4000' },
    wheelDiameterMm: 250,
    widthMm: 50,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'A fine vitrified wheel for the same water-cooled grinders, graded about JIS 4000, used after a coarse wheel to refine the bevel before honing. It removes little steel and wears slowly, but it still wears: recheck the diameter when setting angles.',
      ),
      p(
        'It is easily glazed by high-carbide steels; a light dressing restores the cut. Keep it wet while running.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'cbn-electroplated-wheel-250-b126',
    name: '250 mm CBN wheel, electroplated (B126)',
    material: 'cbn',
    bond: 'electroplated',
    form: 'wheel',
    grit: { standard: 'iso6106', grade: 'B126' },
    wheelDiameterMm: 250,
    widthMm: 50,
    wears: false,
    coolant: 'water-inhibitor',
    sideUsable: true,
    body: doc(
      p(
        'A single layer of cubic boron nitride grains, size B126, plated in nickel onto a steel hub. It cuts tool steels and high-speed steels quickly without dressing, and because the layer is only one grain deep the diameter stays the same for the life of the wheel: an angle setting does not drift.',
      ),
      p(
        'Used wet, the steel hub needs a corrosion inhibitor in the water; read the additive’s safety data sheet. The plated sides can be used for flat bevels on this type.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'cbn-resin-wheel-250-b46',
    name: '250 mm CBN wheel, resin bond (B46)',
    material: 'cbn',
    bond: 'resin',
    form: 'wheel',
    grit: { standard: 'iso6106', grade: 'B46' },
    wheelDiameterMm: 250,
    widthMm: 40,
    wears: false,
    coolant: 'water-inhibitor',
    sideUsable: false,
    body: doc(
      p(
        'CBN grains of size B46 held in a resin rim several millimetres deep. The resin lets the grains cushion slightly, so the finish is smoother than a plated wheel of the same size. The bond wears very slowly; for angle setting its diameter can be treated as constant, but check it now and then.',
      ),
      p(
        'Only the rim is abrasive. Use water with a corrosion inhibitor, and read the additive’s safety data sheet.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'diamond-electroplated-wheel-250-d46',
    name: '250 mm diamond wheel, electroplated (D46)',
    material: 'diamond',
    bond: 'electroplated',
    form: 'wheel',
    grit: { standard: 'iso6106', grade: 'D46' },
    wheelDiameterMm: 250,
    widthMm: 50,
    wears: false,
    coolant: 'water-inhibitor',
    sideUsable: true,
    body: doc(
      p(
        'A single plated layer of diamond, size D46, on a steel hub. Diamond cuts the hardest carbides, such as vanadium carbides, readily. On plain steels diamond wears faster than CBN, especially when it runs hot, so keep it wet and let the wheel do the work.',
      ),
      p(
        'Like other plated wheels it keeps its diameter, and the sides of this type may be used for flat bevels. Use water with a corrosion inhibitor and read the additive’s safety data sheet.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'diamond-resin-wheel-250-15um',
    name: '250 mm diamond wheel, resin bond (about 15 µm)',
    material: 'diamond',
    bond: 'resin',
    form: 'wheel',
    grit: { standard: 'um', grade: '15 µm' },
    wheelDiameterMm: 250,
    widthMm: 40,
    wears: false,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'Micron-sized diamond, about 15 µm, in a resin rim: a finishing wheel for high-carbide steels after a coarser CBN or diamond wheel. Sizes this fine are graded by sedimentation rather than sieves, and makers’ ranges differ, so compare by particle size rather than by the number printed on the label.',
      ),
      p(
        'The resin rim wears very slowly; for angle setting the diameter can be treated as constant.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'sic-vitrified-wheel-200-f220',
    name: '200 mm vitrified silicon-carbide wheel (F220)',
    material: 'silicon-carbide',
    bond: 'vitrified',
    form: 'wheel',
    grit: { standard: 'fepa-f', grade: 'F220' },
    wheelDiameterMm: 200,
    widthMm: 40,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'A 200 mm water-cooled wheel of silicon carbide, grit F220. Silicon carbide is harder and more friable than aluminium oxide, so it stays sharp on hard steels but wears faster and needs truing more often.',
      ),
      p(
        'Because it wears, its diameter, and with it the angle from a fixed bar setting, changes noticeably over its life.',
      ),
      p(WHEEL_CAUTION),
    ),
  },
  {
    slug: 'ceramic-alumina-belt-p120',
    name: 'Ceramic-alumina grinding belt, 50 mm wide (P120)',
    material: 'ceramic-alumina',
    bond: 'resin',
    form: 'belt',
    grit: { standard: 'fepa-p', grade: 'P120' },
    wheelDiameterMm: null,
    widthMm: 50,
    wears: true,
    coolant: 'dry',
    sideUsable: false,
    body: doc(
      p(
        'A coated belt of microcrystalline ceramic alumina, graded P120, resin bonded to a cloth backing. The grains fracture into fresh points as they wear, so the belt keeps cutting under pressure; it is a shaping and bevelling belt more than a finishing one.',
      ),
      p(
        'Run dry, the edge heats quickly: dip the blade often, and keep the apex away from the belt’s last pass until the final light strokes.',
      ),
      p(BELT_CAUTION),
    ),
  },
  {
    slug: 'alox-bench-stone-jis1000',
    name: 'Bench stone, vitrified aluminium oxide (JIS 1000)',
    material: 'aluminium-oxide',
    bond: 'vitrified',
    form: 'bench-stone',
    grit: { standard: 'jis', grade: '1000' },
    wheelDiameterMm: null,
    widthMm: 70,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'A flat, water-soaked bench stone of vitrified aluminium oxide graded JIS 1000: the middle step of most hand progressions. It dishes as it wears, so flatten it on a lapping plate or a coarse diamond plate regularly.',
      ),
      p(
        'Keep fingers behind the edge and stroke away from the hand that holds the stone.',
      ),
    ),
  },
  {
    slug: 'alox-bench-stone-jis6000',
    name: 'Finishing stone, vitrified aluminium oxide (JIS 6000)',
    material: 'aluminium-oxide',
    bond: 'vitrified',
    form: 'bench-stone',
    grit: { standard: 'jis', grade: '6000' },
    wheelDiameterMm: null,
    widthMm: 70,
    wears: true,
    coolant: 'water',
    sideUsable: false,
    body: doc(
      p(
        'A fine finishing stone graded JIS 6000, used wet after a JIS 1000 stone. It removes the scratches of the previous step and refines the apex; a few light edge-trailing strokes at the end help remove the burr.',
      ),
      p('Flatten it now and then, and keep fingers behind the edge.'),
    ),
  },
  {
    slug: 'natural-whetstone-fine-5um',
    name: 'Fine natural whetstone (about 5 µm)',
    material: 'natural-stone',
    bond: 'none',
    form: 'bench-stone',
    grit: { standard: 'um', grade: '5 µm' },
    wheelDiameterMm: null,
    widthMm: 50,
    wears: true,
    coolant: 'oil',
    sideUsable: false,
    body: doc(
      p(
        'A generic fine natural stone, quarried rather than made, whose cutting particles are roughly 5 µm. Natural stones vary from bed to bed and even within one stone, so a grade for them is an estimate; record which stone you used.',
      ),
      p(
        'Many are used with a light honing oil, some with water; follow whatever the stone was prepared for, and keep fingers behind the edge.',
      ),
    ),
  },
  {
    slug: 'leather-strop-diamond-1um',
    name: 'Leather strop with 1 µm diamond compound',
    material: 'diamond',
    bond: 'none',
    form: 'compound',
    grit: { standard: 'um', grade: '1 µm' },
    wheelDiameterMm: null,
    widthMm: 50,
    wears: false,
    coolant: 'dry',
    sideUsable: false,
    body: doc(
      p(
        'A flat leather strop charged with 1 µm diamond paste or spray. Stropping with the edge trailing removes the last of the burr and polishes the apex. Leather gives slightly under pressure, so a light touch keeps the edge from rounding.',
      ),
      p(
        'Always stroke spine first, with the edge trailing, and keep the free hand clear of the strop’s far end. Read the compound’s safety data sheet.',
      ),
    ),
  },
];
