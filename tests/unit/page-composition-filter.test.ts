import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatCompositionFilter, matchesComposition, matchesFilter, parseCompositionFilter, FILTER_ELEMENTS, type ElementFilter } from '@shared/composition-filter';
import { ComputationError } from '@shared/computation-error';

// AISI D2 limits as ASTM A681 gives them (the demo page's values, marked R in seed/data/steels.ts).
const D2 = [
  { element: 'C', min: 1.4, max: 1.6 },
  { element: 'Si', min: null, max: 0.6 },
  { element: 'Cr', min: 11.0, max: 13.0 },
  { element: 'Mo', min: 0.7, max: 1.2 },
  { element: 'V', min: null, max: 1.1 },
];
// AISI 52100 as ASTM A295 gives it (marked R there too): C 0.93–1.05 %.
const B52100 = [{ element: 'C', min: 0.93, max: 1.05 }, { element: 'Cr', min: 1.35, max: 1.6 }];

describe('parseCompositionFilter', () => {
  it.each([
    ['C ≥ 1 %, V ≥ 2 %', [{ element: 'C', op: '>=', value: 1 }, { element: 'V', op: '>=', value: 2 }]],
    ['cr>=12; mo<=1', [{ element: 'Cr', op: '>=', value: 12 }, { element: 'Mo', op: '<=', value: 1 }]],
    ['C ≥ 1,5 % and W = 0.5', [{ element: 'C', op: '>=', value: 1.5 }, { element: 'W', op: '=', value: 0.5 }]],
    ['V 2–4 %', [{ element: 'V', op: 'between', from: 2, to: 4 }]],
    ['Cr 12-14, C < .5', [{ element: 'Cr', op: 'between', from: 12, to: 14 }, { element: 'C', op: '<', value: 0.5 }]],
    ['  ', []],
  ])('reads %j', (input, expected) => {
    expect(parseCompositionFilter(input)).toEqual(expected);
  });

  it.each([
    ['Zz > 1', /Zz is not an element/],
    ['C ≥', /not an element filter/],
    ['C ≥ 150 %', /above 100 %/],
    ['V 4–2 %', /from the lower to the higher/],
  ])('refuses %j, naming the field', (input, message) => {
    expect(() => parseCompositionFilter(input)).toThrow(message);
    try {
      parseCompositionFilter(input);
    } catch (err) {
      expect(err).toBeInstanceOf(ComputationError);
      expect((err as ComputationError).field).toBe('composition');
    }
  });

  it('reads back what it writes (property, fast-check)', () => {
    const value = fc.integer({ min: 0, max: 10_000 }).map((n) => n / 100);
    const filter: fc.Arbitrary<ElementFilter> = fc.oneof(
      fc.record({ element: fc.constantFrom(...FILTER_ELEMENTS), op: fc.constantFrom('>=', '<=', '>', '<', '=' as const), value }),
      fc.tuple(fc.constantFrom(...FILTER_ELEMENTS), value, value).map(([element, a, b]) => ({ element, op: 'between' as const, from: Math.min(a, b), to: Math.max(a, b) })),
    );
    fc.assert(fc.property(fc.array(filter, { maxLength: 5 }), (filters) => {
      expect(parseCompositionFilter(formatCompositionFilter(filters))).toEqual(filters);
    }));
  });
});

describe('matching a composition', () => {
  it('compares the middle of the range by default', () => {
    expect(matchesComposition(D2, parseCompositionFilter('C ≥ 1 %, Cr ≥ 11'))).toBe(true);
    // V is given as a maximum of 1.1 %, so its middle is 0.55 %.
    expect(matchesComposition(D2, parseCompositionFilter('C ≥ 1 %, V ≥ 2 %'))).toBe(false);
    expect(matchesFilter(D2, { element: 'V', op: 'between', from: 0.5, to: 0.6 })).toBe(true);
    // 52100's middle carbon is 0.99 %: just below 1 %.
    expect(matchesFilter(B52100, { element: 'C', op: '>=', value: 1 })).toBe(false);
    // An element the page does not list counts as none.
    expect(matchesFilter(B52100, { element: 'V', op: '<=', value: 0 })).toBe(true);
    expect(matchesComposition(B52100, [])).toBe(true);
  });

  it('on the range basis asks whether the standard’s range reaches the bound', () => {
    expect(matchesFilter(B52100, { element: 'C', op: '>=', value: 1 }, 'range')).toBe(true);
    expect(matchesFilter(D2, { element: 'V', op: '>=', value: 1 }, 'range')).toBe(true);
    expect(matchesFilter(D2, { element: 'V', op: '>=', value: 1.2 }, 'range')).toBe(false);
    expect(matchesFilter(D2, { element: 'C', op: 'between', from: 1.55, to: 2 }, 'range')).toBe(true);
    expect(matchesFilter(D2, { element: 'C', op: '=', value: 1.7 }, 'range')).toBe(false);
  });
});
