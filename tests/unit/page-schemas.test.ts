import { describe, expect, it } from 'vitest';
import { abrasiveEditSchema, methodEditSchema, normalizeFields, steelEditSchema, steelFieldsSchema } from '@shared/schemas/pages';
import { steels } from '../../seed/data/steels';
import { abrasives } from '../../seed/data/abrasives';
import { methods } from '../../seed/data/methods';

const issuePaths = (r: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) => (r.error?.issues ?? []).map((i) => i.path.join('.'));

describe('page field schemas', () => {
  it('accept every demo page as its first revision stores it', () => {
    for (const s of steels) {
      const { body: _b, slug: _s, ...fields } = s;
      const r = steelFieldsSchema.safeParse(normalizeFields('steel', fields));
      expect(r.success, `${s.slug}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
    }
    for (const a of abrasives) {
      const { body, slug: _s, ...fields } = a;
      const r = abrasiveEditSchema.safeParse({ ...normalizeFields('abrasive', fields), body, baseRevision: 1, summary: 'x' });
      expect(r.success, `${a.slug}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
    }
    for (const m of methods) {
      const { body, slug: _s, ...fields } = m;
      const r = methodEditSchema.safeParse({ ...normalizeFields('method', fields), body, baseRevision: 1, summary: 'x' });
      expect(r.success, `${m.slug}: ${JSON.stringify(r.error?.issues)}`).toBe(true);
    }
  });

  const d2 = () => {
    const { body, slug: _s, ...fields } = steels.find((s) => s.slug === 'aisi-d2')!;
    return { ...normalizeFields('steel', fields), body, baseRevision: 3, summary: 'Tidy' } as Record<string, unknown>;
  };

  it('name each bad field', () => {
    const r = steelEditSchema.safeParse({
      ...d2(),
      summary: ' ',
      designations: [{ system: 'AISI', code: 'D2' }, { system: 'AISI', code: 'd2' }],
      composition: [{ element: 'C', min: 1.6, max: 1.4 }, { element: 'C', min: null, max: 1 }],
      hardnessHrc: { min: 58, max: 80 },
      sources: { composition: 5 },
      citations: [{ title: 'x', supports: 'y', url: 'javascript:alert(1)' }],
    });
    expect(r.success).toBe(false);
    expect(issuePaths(r)).toEqual(
      expect.arrayContaining(['summary', 'designations.1.code', 'composition.0.min', 'hardnessHrc.max', 'citations.0.url']),
    );
  });

  it('checks a citation index and unknown fields', () => {
    expect(issuePaths(steelEditSchema.safeParse({ ...d2(), sources: { composition: 7 } }))).toEqual(['sources.composition']);
    expect(issuePaths(steelEditSchema.safeParse({ ...d2(), sources: { body: 0 } }))[0]).toMatch(/^sources/);
    expect(steelEditSchema.safeParse({ ...d2(), slug: 'renamed' }).success).toBe(false);
    expect(steelEditSchema.safeParse({ ...d2(), baseRevision: undefined }).success).toBe(false);
  });

  it('reads an abrasive grit in its standard, naming grit.grade when it cannot', () => {
    const { body, slug: _s, ...fields } = abrasives[0];
    const base = { ...normalizeFields('abrasive', fields), body, baseRevision: 1, summary: 'x' } as Record<string, unknown>;
    expect(issuePaths(abrasiveEditSchema.safeParse({ ...base, grit: { standard: 'fepa-f', grade: 'F9999' } }))).toEqual(['grit.grade']);
    expect(abrasiveEditSchema.safeParse({ ...base, grit: { standard: 'fepa-f', grade: 'F400' } }).success).toBe(true);
  });
});
