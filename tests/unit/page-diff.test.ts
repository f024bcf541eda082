import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { diffArrays } from 'diff';
import { bodyLines, canonicalJson, changedFields, diffRevisions, mergeEdits, sideBySide, type DiffRow } from '@shared/page-diff';
import type { PageContent } from '@shared/schemas/pages';

const text = (t: string) => ({ type: 'text' as const, text: t });
const para = (t: string) => ({ type: 'paragraph' as const, content: [text(t)] });
const doc = (...content: object[]) => ({ type: 'doc' as const, content }) as PageContent['body'];

/** The text of one column of a side-by-side diff, line by line (null columns left out). */
const column = (rows: DiffRow[], side: 'before' | 'after') => rows.filter((r) => r[side]).map((r) => r[side]!.map((s) => s.text).join(''));

const steelFields = (changes: Record<string, unknown> = {}) => ({
  name: 'AISI D2',
  category: 'tool',
  designations: [{ system: 'AISI', code: 'D2' }, { system: 'WNr', code: '1.2379' }],
  composition: [{ element: 'C', min: 1.4, max: 1.6 }, { element: 'V', min: null, max: 1.1 }],
  hardnessHrc: { min: 58, max: 62 },
  citations: [{ title: 'Standard Specification for Tool Steels Alloy', organisation: 'ASTM International', year: null, standard: 'ASTM A681', supports: 'composition' }],
  sources: {},
  ...changes,
});

describe('bodyLines', () => {
  it('gives one line per block, marking headings, list items and quotes', () => {
    const body = doc(
      { type: 'heading', attrs: { level: 2 }, content: [text('On the wheel')] },
      para('CBN cuts it cleanly.'),
      { type: 'bulletList', content: [{ type: 'listItem', content: [para('coarse')] }, { type: 'listItem', content: [para('fine')] }] },
      { type: 'orderedList', attrs: { start: 3 }, content: [{ type: 'listItem', content: [para('third')] }] },
      { type: 'blockquote', content: [para('quoted')] },
      { type: 'paragraph', content: [text('one'), { type: 'hardBreak' }, text('two')] },
      { type: 'paragraph', content: [{ type: 'text', text: 'D2', marks: [{ type: 'link', attrs: { href: '/steels/aisi-d2' } }] }] },
    );
    expect(bodyLines(body)).toEqual(['## On the wheel', 'CBN cuts it cleanly.', '• coarse', '• fine', '3. third', '> quoted', 'one', 'two', 'D2 (→ /steels/aisi-d2)']);
    expect(bodyLines(null)).toEqual([]);
  });
});

describe('sideBySide', () => {
  it('pairs a replaced line with its replacement and marks the changed words', () => {
    const rows = sideBySide(['Heat slowly.', 'Quench in oil.', 'Temper twice.'], ['Heat slowly.', 'Quench in warm oil.', 'Temper twice.', 'Test hardness.']);
    expect(rows.map((r) => r.kind)).toEqual(['same', 'changed', 'same', 'added']);
    expect(rows[1].after!.filter((s) => s.change === 'added').map((s) => s.text.trim())).toEqual(['warm']);
    expect(rows[1].before!.some((s) => s.change === 'removed')).toBe(false);
    expect(rows[3]).toEqual({ kind: 'added', before: null, after: [{ text: 'Test hardness.', change: 'added' }] });
  });

  it('keeps both texts whole in their columns, for any lines (property, fast-check)', () => {
    const line = fc.string({ maxLength: 12 }).map((s) => s.replace(/\n/g, ' '));
    fc.assert(
      fc.property(fc.array(line, { maxLength: 8 }), fc.array(line, { maxLength: 8 }), (a, b) => {
        const rows = sideBySide(a, b);
        expect(column(rows, 'before')).toEqual(a);
        expect(column(rows, 'after')).toEqual(b);
        // As many unchanged rows as the diff package finds common lines.
        const common = diffArrays(a, b).filter((c) => !c.added && !c.removed).reduce((n, c) => n + c.value.length, 0);
        expect(rows.filter((r) => r.kind === 'same').length).toBe(common);
      }),
    );
  });
});

describe('diffRevisions', () => {
  it('lists only changed fields, with lines people read, and the body side by side', () => {
    const before = { fields: steelFields(), body: doc(para('Old text.')) };
    const after = { fields: steelFields({ composition: [{ element: 'C', min: 1.45, max: 1.6 }, { element: 'V', min: null, max: 1.1 }], sources: { composition: 0 } }), body: doc(para('New text.')) };
    const d = diffRevisions('steel', before, after);
    expect(d.changed).toEqual(['composition', 'sources', 'body']);
    expect(d.fields[0]).toMatchObject({ field: 'composition', label: 'Composition (wt %)' });
    expect(column(d.fields[0].rows, 'before')).toEqual(['C 1.4–1.6 %', 'V ≤ 1.1 %']);
    expect(column(d.fields[0].rows, 'after')).toEqual(['C 1.45–1.6 %', 'V ≤ 1.1 %']);
    expect(column(d.fields[1].rows, 'after')).toEqual(['Composition (wt %) ← reference [1]']);
    expect(d.body).toHaveLength(1);
    expect(d.body[0].kind).toBe('changed');
  });

  it('ignores fields a page type does not edit and fills those an older revision lacks', () => {
    const first = { fields: { slug: 'x', name: 'W', material: 'cbn', bond: 'electroplated', form: 'wheel', grit: { standard: 'iso6106', grade: 'B126' }, wheelDiameterMm: 200, widthMm: 40, wears: false, coolant: 'dry', sideUsable: true }, body: null };
    const second = { fields: { ...first.fields, slug: undefined, gritRange: null, priceNote: null, citations: [], sources: {} }, body: null };
    expect(changedFields('abrasive', first, second)).toEqual([]);
    expect(changedFields('abrasive', first, { ...second, fields: { ...second.fields, wears: true } })).toEqual(['wears']);
  });

  it('compares values whatever the key order', () => {
    expect(canonicalJson({ a: 1, b: { d: [1, { f: 1, e: 2 }], c: 2 } })).toBe(canonicalJson({ b: { c: 2, d: [1, { e: 2, f: 1 }] }, a: 1 }));
  });
});

describe('mergeEdits', () => {
  const base = { fields: steelFields(), body: doc(para('Base.')) };

  it('takes each side’s changes when they touch different fields', () => {
    const mine = { fields: steelFields({ hardnessHrc: { min: 59, max: 63 } }), body: base.body };
    const theirs = { fields: steelFields({ name: 'AISI D2 tool steel' }), body: doc(para('Theirs.')) };
    const { content, conflicts } = mergeEdits('steel', base, mine, theirs);
    expect(conflicts).toEqual([]);
    expect(content.fields).toMatchObject({ name: 'AISI D2 tool steel', hardnessHrc: { min: 59, max: 63 } });
    expect(content.body).toEqual(theirs.body);
  });

  it('reports a field both changed differently, keeping the saved value', () => {
    const mine = { fields: steelFields({ hardnessHrc: { min: 59, max: 63 } }), body: doc(para('Mine.')) };
    const theirs = { fields: steelFields({ hardnessHrc: { min: 57, max: 61 } }), body: doc(para('Theirs.')) };
    const { content, conflicts } = mergeEdits('steel', base, mine, theirs);
    expect(conflicts).toEqual(['hardnessHrc', 'body']);
    expect(content.fields.hardnessHrc).toEqual({ min: 57, max: 61 });
  });

  it('accepts the same change made on both sides', () => {
    const same = { fields: steelFields({ category: 'high-speed' }), body: base.body };
    expect(mergeEdits('steel', base, same, same).conflicts).toEqual([]);
  });

  it('moves citations and the sources pointing into them together', () => {
    const extra = { title: 'Tool steels', organisation: 'ISO / CEN', year: 2018, standard: 'EN ISO 4957', supports: 'EN designation' };
    const mine = { fields: steelFields({ citations: [...steelFields().citations, extra], sources: { designations: 1 } }), body: base.body };
    const theirs = { fields: steelFields({ citations: [] }), body: base.body };
    expect(mergeEdits('steel', base, mine, theirs).conflicts).toEqual(['citations']);
    const onlyMine = mergeEdits('steel', base, mine, base);
    expect(onlyMine.content.fields).toMatchObject({ sources: { designations: 1 } });
    expect((onlyMine.content.fields.citations as unknown[]).length).toBe(2);
  });
});
