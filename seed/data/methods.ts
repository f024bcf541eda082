import type { RichTextNode } from '@shared/rich-text';
import { bold, doc, h2, ol, p, ul } from './rich-text-builders';

/**
 * The demo's test protocols. They are Edgeledger's own invented methods, written for the demo;
 * the retention method follows the idea of the ISO 8442-5 card-cutting test without claiming
 * to be that standard.
 */

/** A method page as the loader inserts it. */
export interface SeedMethod {
  slug: string;
  name: string;
  version: number;
  /** Slug of the method version this one replaces, or null for a first version. */
  replacesSlug: string | null;
  instrument: string;
  medium: string;
  /** Sharpness readings taken on each edge. */
  readingsPerEdge: number;
  /** What the retention part of the protocol cuts, or null when it has none. */
  retentionMedium: string | null;
  /** Retention ends when the sharpness reading passes this force, in grams; null if none. */
  thresholdG: number | null;
  body: RichTextNode;
}

const SKIN_CAUTION = p(
  bold('Safety. '),
  'Test sharpness only with the instrument and its test medium, never on skin or hair. Handle freshly sharpened edges with the edge pointing away from you, clamp the blade in the tester rather than holding it, and follow the tester maker’s instructions.',
);

const INSTRUMENT =
  'Push-cut sharpness tester: a force gauge that lowers the edge at a steady rate onto a tensioned test medium and records the peak force, in grams, at which the medium parts';
const MEDIUM = 'Standard synthetic test filament supplied for the tester, held at the tester’s fixed tension; a fresh length for every reading';

/** The demo's three methods: push-cut sharpness v1 and v2, and card-cut retention v1. */
export const methods: SeedMethod[] = [
  {
    slug: 'push-cut-test-v1',
    name: 'Push-cut sharpness test, version 1',
    version: 1,
    replacesSlug: null,
    instrument: INSTRUMENT,
    medium: MEDIUM,
    readingsPerEdge: 3,
    retentionMedium: null,
    thresholdG: null,
    body: doc(
      p(
        'Measures how much force an edge needs to sever a standard test medium, straight after sharpening. Lower readings mean a keener edge. This first version takes three readings per edge and has been replaced by version 2; results keep the version they were measured with.',
      ),
      h2('Procedure'),
      ol(
        'Sharpen the edge and wipe it clean and dry; do not strop or test it on anything else after the last abrasive step.',
        'Clamp the blade in the tester with the edge square to the test medium.',
        'Fit a fresh length of test medium at the tester’s tension.',
        'Lower the edge at the tester’s set rate until the medium parts; record the peak force in grams.',
        'Repeat with fresh medium at three points: near the heel, the middle and near the tip.',
        'Report the three readings in the order taken.',
      ),
      SKIN_CAUTION,
    ),
  },
  {
    slug: 'push-cut-test-v2',
    name: 'Push-cut sharpness test, version 2',
    version: 2,
    replacesSlug: 'push-cut-test-v1',
    instrument: INSTRUMENT,
    medium: MEDIUM,
    readingsPerEdge: 5,
    retentionMedium: null,
    thresholdG: null,
    body: doc(
      p(
        'Version 2 of the push-cut test. Three readings proved too few to tell a uniform edge from one with a dull patch, so this version takes five readings spaced evenly along the edge and adds a check of the tester before each session.',
      ),
      h2('What changed from version 1'),
      ul(
        'Five readings per edge instead of three, evenly spaced from heel to tip and at least 10 mm apart.',
        'A check of the tester with its reference weight before each session, noted with the results.',
        'Readings within 5 mm of the heel or tip are not taken, because the edge geometry changes there.',
      ),
      h2('Procedure'),
      ol(
        'Check the tester against its reference weight; if it reads outside the maker’s tolerance, stop and recalibrate.',
        'Sharpen the edge and wipe it clean and dry; do not strop or test it on anything else after the last abrasive step.',
        'Clamp the blade with the edge square to the test medium.',
        'At each of five evenly spaced points, fit a fresh length of medium, lower the edge at the set rate and record the peak force in grams.',
        'Report the five readings in the order taken, heel to tip; the median is computed by Edgeledger.',
      ),
      SKIN_CAUTION,
    ),
  },
  {
    slug: 'card-cut-retention-v1',
    name: 'Card-cutting retention test, version 1',
    version: 1,
    replacesSlug: null,
    instrument: 'Motorised cutting rig that strokes the blade through a card stack at a fixed load and stroke length, with the push-cut sharpness tester of version 2 for the sharpness checks',
    medium: MEDIUM,
    readingsPerEdge: 3,
    retentionMedium: 'Silica-loaded test card of the kind described in ISO 8442-5, cut from a stack in single strokes',
    thresholdG: 500,
    body: doc(
      p(
        'Counts how many cuts an edge makes through test card before it dulls past a set force. It follows the idea of the ISO 8442-5 card-cutting test (a blade stroked through abrasive-loaded card under set load and speed) but counts cuts to a sharpness threshold instead of measuring card depth.',
      ),
      h2('Procedure'),
      ol(
        'Sharpen the edge and take the push-cut readings of version 2 as the starting sharpness.',
        'Clamp the blade in the rig at the rig’s fixed load, with the card stack squared beneath it.',
        'Run the rig in blocks of 10 cuts.',
        'After each block, take three push-cut readings at the middle of the cutting zone.',
        'Stop when the median of the three readings passes 500 g; report the number of cuts made up to that block.',
      ),
      p(
        'Fit the rig’s guards before running it, keep hands out of the stroke, and switch it off at the mains before changing the card stack.',
      ),
      SKIN_CAUTION,
    ),
  },
];
