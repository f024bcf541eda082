import { diffArrays, diffWordsWithSpace } from 'diff';
import type { RichTextNode } from './rich-text';
import { formatGrade, GRIT_STANDARDS, type GritStandard } from './grit';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS, STEEL_CATEGORIES } from './vocabulary';
import { EDITABLE_FIELDS, FIELD_LABELS, normalizeFields, type PageContent, type PageType } from './schemas/pages';

/**
 * Differences between two revisions of a reference page: which fields changed, each shown as
 * lines side by side with the changed words marked, and the body's text likewise (one line per
 * paragraph, heading or list item). Also the three-way merge that lets a second editor keep
 * their changes when someone saved first. Pure: plain data in, plain data out.
 */

/** A run of text in one column of a diff row: unchanged, or added (right) / removed (left). */
export interface DiffSegment {
  text: string;
  change: 'same' | 'added' | 'removed';
}

/** One row of a side-by-side diff; a column is null where the line does not exist on that side. */
export interface DiffRow {
  kind: 'same' | 'changed' | 'added' | 'removed';
  before: DiffSegment[] | null;
  after: DiffSegment[] | null;
}

/** One changed field. */
export interface FieldDiff {
  field: string;
  label: string;
  rows: DiffRow[];
}

/** The whole comparison of two revisions. */
export interface PageDiff {
  /** Names of the changed fields, 'body' last when the body changed. */
  changed: string[];
  fields: FieldDiff[];
  /** Every line of the body, unchanged ones included (a view may fold them). */
  body: DiffRow[];
}

/** JSON with object keys sorted, so two equal values give the same text whatever their key order. */
export function canonicalJson(value: unknown): string {
  const sort = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(sort);
    if (v && typeof v === 'object') {
      return Object.fromEntries(
        Object.keys(v as Record<string, unknown>)
          .filter((k) => (v as Record<string, unknown>)[k] !== undefined)
          .sort()
          .map((k) => [k, sort((v as Record<string, unknown>)[k])]),
      );
    }
    return v;
  };
  return JSON.stringify(sort(value) ?? null);
}

const same = (a: unknown, b: unknown) => canonicalJson(a) === canonicalJson(b);
const label = (table: Record<string, string>, key: unknown) => (typeof key === 'string' ? (table[key] ?? key) : '');
const num = (x: unknown) => (typeof x === 'number' ? String(x) : '—');

/** A field's value as lines of text for people (lists one item per line). */
export function fieldLines(field: string, value: unknown): string[] {
  if (value === null || value === undefined) return [];
  switch (field) {
    case 'category':
      return [label(STEEL_CATEGORIES, value)];
    case 'material':
      return [label(ABRASIVE_MATERIALS, value)];
    case 'bond':
      return [label(BONDS, value)];
    case 'form':
      return [label(ABRASIVE_FORMS, value)];
    case 'coolant':
      return [label(COOLANTS, value)];
    case 'wears':
    case 'sideUsable':
      return [value ? 'yes' : 'no'];
    case 'designations':
      return (value as { system: string; code: string }[]).map((d) => `${d.system} ${d.code}`);
    case 'composition':
      return (value as { element: string; min: number | null; max: number }[]).map((l) => (l.min === null ? `${l.element} ≤ ${l.max} %` : `${l.element} ${l.min}–${l.max} %`));
    case 'hardnessHrc': {
      const h = value as { min: number; max: number };
      return [`${num(h.min)}–${num(h.max)} HRC`];
    }
    case 'grit': {
      const g = value as { standard: string; grade: string };
      const known = (GRIT_STANDARDS as readonly string[]).includes(g.standard);
      return [known ? formatGrade({ standard: g.standard as GritStandard, grade: g.grade }) : `${g.standard} ${g.grade}`];
    }
    case 'gritRange': {
      const r = value as { from: string; to: string };
      return [`${r.from} to ${r.to}`];
    }
    case 'citations':
      return (value as { title: string; organisation?: string; year?: number | null; standard?: string; url?: string; supports: string }[]).map((c, i) =>
        [`[${i + 1}] ${c.title}`, c.organisation, c.year ? String(c.year) : '', c.standard, c.url, c.supports ? `supports: ${c.supports}` : '']
          .filter(Boolean)
          .join(' · '),
      );
    case 'sources':
      return Object.entries(value as Record<string, number>)
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([f, i]) => `${FIELD_LABELS[f] ?? f} ← reference [${i + 1}]`);
    default:
      return [typeof value === 'string' ? value : typeof value === 'number' ? String(value) : canonicalJson(value)];
  }
}

function inlineText(nodes: RichTextNode[] | undefined): string[] {
  // hardBreak splits a block into several lines.
  const lines = [''];
  for (const n of nodes ?? []) {
    if (n.type === 'hardBreak') lines.push('');
    else if (n.type === 'text') {
      const link = n.marks?.find((m) => m.type === 'link');
      lines[lines.length - 1] += link?.attrs?.href ? `${n.text ?? ''} (→ ${link.attrs.href})` : (n.text ?? '');
    } else lines[lines.length - 1] += inlineText(n.content).join(' ');
  }
  return lines;
}

/** A body as lines of text: one per paragraph, heading ("## …"), list item ("• …", "1. …") or quote ("> …"). */
export function bodyLines(doc: RichTextNode | null | undefined): string[] {
  const out: string[] = [];
  const walk = (node: RichTextNode, prefix: string) => {
    switch (node.type) {
      case 'doc':
        for (const c of node.content ?? []) walk(c, prefix);
        return;
      case 'paragraph':
        for (const line of inlineText(node.content)) out.push(prefix + line);
        return;
      case 'heading':
        for (const line of inlineText(node.content)) out.push(`${prefix}${'#'.repeat(node.attrs?.level ?? 2)} ${line}`);
        return;
      case 'horizontalRule':
        out.push(`${prefix}———`);
        return;
      case 'blockquote':
        for (const c of node.content ?? []) walk(c, `${prefix}> `);
        return;
      case 'bulletList':
      case 'orderedList': {
        let n = node.attrs?.start ?? 1;
        for (const item of node.content ?? []) {
          const marker = node.type === 'bulletList' ? '• ' : `${n++}. `;
          const before = out.length;
          for (const c of item.content ?? []) walk(c, prefix + '   ');
          // The first line of an item carries its marker in place of the indent.
          if (out.length > before) out[before] = prefix + marker + out[before].slice(prefix.length + 3);
        }
        return;
      }
      default:
        for (const line of inlineText(node.content)) out.push(prefix + line);
    }
  };
  if (doc) walk(doc, '');
  return out;
}

function wordRow(before: string, after: string): DiffRow {
  const parts = diffWordsWithSpace(before, after);
  const left: DiffSegment[] = [];
  const right: DiffSegment[] = [];
  for (const p of parts) {
    if (p.added) right.push({ text: p.value, change: 'added' });
    else if (p.removed) left.push({ text: p.value, change: 'removed' });
    else {
      left.push({ text: p.value, change: 'same' });
      right.push({ text: p.value, change: 'same' });
    }
  }
  return { kind: 'changed', before: left, after: right };
}

/**
 * Two lists of lines aligned side by side: unchanged lines opposite each other, a removed run
 * paired line by line with the added run that replaces it (with the changed words marked),
 * and the rest as lone removed or added lines.
 */
export function sideBySide(before: string[], after: string[]): DiffRow[] {
  const rows: DiffRow[] = [];
  const changes = diffArrays(before, after);
  for (let i = 0; i < changes.length; i++) {
    const c = changes[i];
    if (!c.added && !c.removed) {
      for (const line of c.value) rows.push({ kind: 'same', before: [{ text: line, change: 'same' }], after: [{ text: line, change: 'same' }] });
      continue;
    }
    if (c.removed) {
      const next = changes[i + 1];
      const added = next?.added ? next.value : [];
      if (next?.added) i += 1;
      const pairs = Math.min(c.value.length, added.length);
      for (let k = 0; k < pairs; k++) rows.push(wordRow(c.value[k], added[k]));
      for (const line of c.value.slice(pairs)) rows.push({ kind: 'removed', before: [{ text: line, change: 'removed' }], after: null });
      for (const line of added.slice(pairs)) rows.push({ kind: 'added', before: null, after: [{ text: line, change: 'added' }] });
      continue;
    }
    for (const line of c.value) rows.push({ kind: 'added', before: null, after: [{ text: line, change: 'added' }] });
  }
  return rows;
}

/** Names of the fields (and 'body') whose values differ between two contents of a page. */
export function changedFields(type: PageType, a: PageContent, b: PageContent): string[] {
  const fa = normalizeFields(type, a.fields);
  const fb = normalizeFields(type, b.fields);
  const changed: string[] = EDITABLE_FIELDS[type].filter((f) => !same(fa[f], fb[f]));
  if (!same(a.body ?? null, b.body ?? null)) changed.push('body');
  return changed;
}

/** The differences between an older (`before`) and a newer (`after`) content of a page. */
export function diffRevisions(type: PageType, before: PageContent, after: PageContent): PageDiff {
  const fa = normalizeFields(type, before.fields);
  const fb = normalizeFields(type, after.fields);
  const changed = changedFields(type, before, after);
  const fields = changed
    .filter((f) => f !== 'body')
    .map((field) => ({ field, label: FIELD_LABELS[field] ?? field, rows: sideBySide(fieldLines(field, fa[field]), fieldLines(field, fb[field])) }));
  return { changed, fields, body: sideBySide(bodyLines(before.body), bodyLines(after.body)) };
}

/**
 * Three-way merge of two edits made from the same `base`: a field (or the body) changed on one
 * side only takes that side's value; changed on both sides to the same value is fine; changed
 * on both sides differently is a conflict, left at `theirs` (the saved one) in `content`.
 * Citations and the sources pointing into them merge as one unit.
 */
export function mergeEdits(type: PageType, base: PageContent, mine: PageContent, theirs: PageContent): { content: PageContent; conflicts: string[] } {
  const fb = normalizeFields(type, base.fields);
  const fm = normalizeFields(type, mine.fields);
  const ft = normalizeFields(type, theirs.fields);
  const fields: Record<string, unknown> = {};
  const conflicts: string[] = [];
  const pick = (name: string, b: unknown, m: unknown, t: unknown) => {
    const mineChanged = !same(b, m);
    const theirsChanged = !same(b, t);
    if (mineChanged && theirsChanged && !same(m, t)) conflicts.push(name);
    return mineChanged && !theirsChanged ? m : t;
  };
  // Sources point into the citation list by position, so the two travel together.
  for (const f of EDITABLE_FIELDS[type]) if (f !== 'citations' && f !== 'sources') fields[f] = pick(f, fb[f], fm[f], ft[f]);
  const refs = pick(
    'citations',
    { citations: fb.citations, sources: fb.sources },
    { citations: fm.citations, sources: fm.sources },
    { citations: ft.citations, sources: ft.sources },
  ) as { citations: unknown; sources: unknown };
  fields.citations = refs.citations;
  fields.sources = refs.sources;
  const body = pick('body', base.body ?? null, mine.body ?? null, theirs.body ?? null) as RichTextNode | null;
  return { content: { fields, body }, conflicts };
}
