import { fn, col, Op, type Transaction } from 'sequelize';
import { parseSitePath, type RichTextNode } from '@shared/rich-text';
import { normalizeFields, type PageContent, type PageType } from '@shared/schemas/pages';
import { median } from '@shared/stats';
import { commonProgressions, groupByMethodAndBand, type MethodBandGroup, type ProgressionGroup, type SteelResultRow } from '@shared/steel-results';
import { changedFields } from '@shared/page-diff';
import { Abrasive, Method, PAGE_TEXT_COLUMNS, PageEvent, PageRevision, Result, Steel, User } from '../models';
import { notFound } from '../errors';
import { keptUntil } from './kept-until';

import type { PageModel } from '../models/reference-pages';

export type { PageModel };

/** The model class of each page type. */
export const PAGE_MODELS = { steel: Steel, abrasive: Abrasive, method: Method } as const;

/** What a page type is called in messages ("Steel page was not found."). */
export const PAGE_WHAT: Record<PageType, string> = { steel: 'Steel page', abrasive: 'Abrasive page', method: 'Method page' };

/** The result columns that refer to a page of each type. */
export const RESULT_COLUMNS: Record<PageType, ('steelId' | 'abrasiveId' | 'sharpnessMethodId' | 'retentionMethodId')[]> = {
  steel: ['steelId'],
  abrasive: ['abrasiveId'],
  method: ['sharpnessMethodId', 'retentionMethodId'],
};

/**
 * Figures over the approved results (counts per page, a page's summary), kept until a commit
 * changes which results are approved or what they say: every such write changes comparison
 * cells, which clears this (KEPT.figures). Each costs a pass over thousands of rows (a steel page
 * spent 90 ms of its 100 on it at 100 000 results); a page read then costs a map look-up.
 */
const overApproved = keptUntil<string, Promise<unknown>>('figures');

function cachedOverApproved<T>(key: string, compute: () => Promise<T>): Promise<T> {
  return overApproved.share(key, compute) as Promise<T>;
}

/** Approved result counts per steel or abrasive id. */
export function approvedCounts(by: 'steelId' | 'abrasiveId'): Promise<Map<number, number>> {
  return cachedOverApproved(`counts:${by}`, async () => {
    const rows = (await Result.findAll({ where: { status: 'approved' }, attributes: [by, [fn('COUNT', col('id')), 'n']], group: [by], raw: true })) as unknown as Record<string, number>[];
    return new Map(rows.map((r) => [Number(r[by]), Number(r.n)]));
  });
}

// Lists leave out pages merged into another: their slugs only redirect.
const notMerged = { mergedIntoId: null };
// Lists show summaries: no bodies or references.
const summary = { exclude: PAGE_TEXT_COLUMNS };
export const listSteels = () => Steel.findAll({ where: notMerged, attributes: summary, order: [['name', 'ASC']] });
export const listAbrasives = () => Abrasive.findAll({ where: notMerged, attributes: summary, order: [['material', 'ASC'], ['gritUm', 'DESC']] });
export const listMethods = () => Method.findAll({ where: notMerged, attributes: summary, order: [['name', 'ASC'], ['version', 'ASC']] });

/** One page by slug, or 404. Finds merged pages too (callers decide whether to redirect). */
export async function findPage<T extends typeof Steel | typeof Abrasive | typeof Method>(model: T, slug: string, what: string, transaction?: Transaction): Promise<InstanceType<T>> {
  const page = await (model as typeof Steel).findOne({ where: { slug }, transaction });
  if (!page) throw notFound(what);
  return page as InstanceType<T>;
}

/** One page of `type` by slug, or 404. */
export function findPageOfType(type: PageType, slug: string, transaction?: Transaction): Promise<PageModel> {
  return findPage(PAGE_MODELS[type] as typeof Steel, slug, PAGE_WHAT[type], transaction);
}

/** The page a merged page finally redirects to (following a chain), or null when `page` is not merged. */
export async function survivorOf(type: PageType, page: PageModel): Promise<PageModel | null> {
  let current: PageModel = page;
  for (let hops = 0; current.mergedIntoId && hops < 20; hops++) {
    const next = (await (PAGE_MODELS[type] as typeof Steel).findByPk(current.mergedIntoId)) as PageModel | null;
    if (!next) break;
    current = next;
  }
  return current === page ? null : current;
}

const revisionIncludes = [
  { model: User, as: 'author' },
  { model: User, as: 'reviewer' },
  ...(['base', 'revertedFrom', 'appliedFrom'] as const).map((as) => ({ model: PageRevision, as, attributes: ['id', 'number'] })),
];

/** Every revision of a page, newest first, with author and reviewer. */
export function revisionsOf(type: PageType, pageId: number): Promise<PageRevision[]> {
  return PageRevision.findAll({ where: { pageType: type, pageId }, include: revisionIncludes, order: [['id', 'DESC']] });
}

/** One revision of a page, or 404 when it does not exist or belongs to another page. */
export async function findRevisionOf(type: PageType, pageId: number, id: number, transaction?: Transaction): Promise<PageRevision> {
  const revision = await PageRevision.findByPk(id, { include: revisionIncludes, transaction });
  if (!revision || revision.pageType !== type || revision.pageId !== pageId) throw notFound('Revision');
  return revision;
}

/** The number on its page of the revision with this id (a page's current revision), or null. */
export async function revisionNumberOf(id: number | null, transaction?: Transaction): Promise<number | null> {
  if (id === null) return null;
  return (await PageRevision.findByPk(id, { attributes: ['number'], transaction }))?.number ?? null;
}

/** Page-level actions (protect, merge) on a page, newest first. */
export function eventsOf(type: PageType, pageId: number): Promise<PageEvent[]> {
  return PageEvent.findAll({ where: { pageType: type, pageId }, include: [{ model: User, as: 'actor' }], order: [['id', 'DESC']] });
}

/** A revision's content: its fields reduced to the editable ones of its page type, and its body. */
export function contentOf(revision: PageRevision): PageContent {
  return { fields: normalizeFields(revision.pageType, revision.fields), body: revision.body };
}

/** Proposed revisions waiting for review, oldest first, each with its page's slug and name. */
export async function proposedRevisions(limit = 200): Promise<{ revision: PageRevision; page: PageModel | null }[]> {
  const revisions = await PageRevision.findAll({ where: { status: 'proposed' }, include: revisionIncludes, order: [['createdAt', 'ASC'], ['id', 'ASC']], limit });
  const pages = new Map<string, PageModel>();
  for (const type of ['steel', 'abrasive', 'method'] as const) {
    const ids = revisions.filter((r) => r.pageType === type).map((r) => r.pageId);
    if (!ids.length) continue;
    for (const p of (await (PAGE_MODELS[type] as typeof Steel).findAll({ where: { id: { [Op.in]: ids } } })) as PageModel[]) pages.set(`${type}:${p.id}`, p);
  }
  return revisions.map((revision) => ({ revision, page: pages.get(`${revision.pageType}:${revision.pageId}`) ?? null }));
}

/** How many proposals wait on each page of a type, by page id. */
export async function proposalCounts(type: PageType): Promise<Map<number, number>> {
  const rows = (await PageRevision.findAll({ where: { pageType: type, status: 'proposed' }, attributes: ['pageId', [fn('COUNT', col('id')), 'n']], group: ['pageId'], raw: true })) as unknown as { pageId: number; n: number }[];
  return new Map(rows.map((r) => [Number(r.pageId), Number(r.n)]));
}

/** Every site link ("/steels/…", "/results/12") in the given documents. */
function siteLinks(docs: (RichTextNode | null | undefined)[]): { section: string; key: string }[] {
  const out: { section: string; key: string }[] = [];
  const walk = (n: RichTextNode) => {
    for (const m of n.marks ?? []) {
      const target = m.type === 'link' && m.attrs?.href ? parseSitePath(m.attrs.href) : null;
      if (target) out.push(target);
    }
    for (const c of n.content ?? []) walk(c);
  };
  for (const d of docs) if (d) walk(d);
  return out;
}

/**
 * A checker telling which site links in `docs` lead somewhere: a page of that section with
 * that slug (a merged page counts, since it redirects), or an approved result. One query per
 * section that the documents link to.
 */
export async function linkCheckerFor(docs: (RichTextNode | null | undefined)[]): Promise<(href: string) => boolean> {
  const links = siteLinks(docs);
  const known = new Set<string>();
  const bySection = new Map<string, string[]>();
  for (const l of links) bySection.set(l.section, [...(bySection.get(l.section) ?? []), l.key]);
  const models = { steels: Steel, abrasives: Abrasive, methods: Method } as const;
  for (const [section, keys] of bySection) {
    if (section === 'results') {
      const ids = keys.map(Number);
      for (const r of await Result.findAll({ where: { id: { [Op.in]: ids }, status: 'approved' }, attributes: ['id'] })) known.add(`/results/${r.id}`);
      continue;
    }
    const model = models[section as keyof typeof models] as typeof Steel;
    for (const p of await model.findAll({ where: { slug: { [Op.in]: keys } }, attributes: ['slug'] })) known.add(`/${section}/${p.slug}`);
  }
  return (href) => known.has(href.split('#')[0]);
}

/** Approved results on an abrasive page, grouped by steel. */
export interface ResultGroup {
  key: string;
  label: string;
  /** Number of approved results. */
  n: number;
  /** Lowest (keenest) median sharpness reading of one result, grams. */
  bestG: number;
  /** Median of the results' median readings, grams. */
  medianG: number;
}

/**
 * The approved results on an abrasive, grouped by steel, most results first: count, best and
 * median sharpness in grams. (A steel's page groups by method and grit band: steelResults.)
 */
export async function abrasiveResults(abrasiveId: number): Promise<{ count: number; groups: ResultGroup[] }> {
  const { count, groups } = await cachedOverApproved(`summary:abrasive:${abrasiveId}`, async () => {
    const rows = (await Result.findAll({ where: { status: 'approved', abrasiveId }, attributes: ['steelId', 'sharpnessMedianG'], raw: true })) as unknown as { steelId: number; sharpnessMedianG: number }[];
    const bySteel = new Map<number, number[]>();
    for (const r of rows) bySteel.set(r.steelId, [...(bySteel.get(r.steelId) ?? []), r.sharpnessMedianG]);
    return { count: rows.length, groups: [...bySteel].map(([steelId, values]) => ({ steelId, n: values.length, bestG: Math.min(...values), medianG: Math.round(median(values) * 10) / 10 })) };
  });
  // Steel names are read each time: a rename does not change the results.
  const steels = new Map(groups.length ? (await Steel.findAll({ where: { id: { [Op.in]: groups.map((g) => g.steelId) } }, attributes: ['id', 'slug', 'name'] })).map((s) => [s.id, s]) : []);
  const list = groups.map(({ steelId, ...g }) => ({ ...g, key: steels.get(steelId)?.slug ?? String(steelId), label: steels.get(steelId)?.name ?? String(steelId) }));
  list.sort((a, b) => b.n - a.n || a.label.localeCompare(b.label));
  return { count, groups: list };
}

/** A steel's approved results by method, material and grit band, and its most common progressions, with the methods' names. */
export interface SteelResults {
  count: number;
  groups: (MethodBandGroup & { method: { slug: string; name: string } })[];
  progressions: (ProgressionGroup & { method: { slug: string; name: string } })[];
}

/** The approved results on a steel grouped by method and grit band (not all grits pooled per material), and its most common progressions. */
export async function steelResults(steelId: number): Promise<SteelResults> {
  const { count, groups, progressions } = await cachedOverApproved(`steel-results:${steelId}`, async () => {
    const rows = (await Result.findAll({
      where: { status: 'approved', steelId },
      attributes: ['sharpnessMethodId', 'material', 'gritPhi', 'gritUm', 'sharpnessMedianG', 'authorId', 'progression'],
      raw: true,
    })) as unknown as SteelResultRow[];
    // raw JSON columns come back as text on SQLite
    for (const r of rows) if (typeof r.progression === 'string') r.progression = JSON.parse(r.progression) as SteelResultRow['progression'];
    return { count: rows.length, groups: groupByMethodAndBand(rows), progressions: commonProgressions(rows) };
  });
  // Method names are read each time: a rename does not change the results.
  const ids = [...new Set([...groups, ...progressions].map((g) => g.methodId))];
  const methods = new Map((await Method.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'slug', 'name'] })).map((m) => [m.id, { slug: m.slug, name: m.name }]));
  const named = <T extends { methodId: number }>(g: T) => ({ ...g, method: methods.get(g.methodId) ?? { slug: String(g.methodId), name: String(g.methodId) } });
  return { count, groups: groups.map(named), progressions: progressions.map(named) };
}

/**
 * The review desk's page edits: every proposed revision, oldest first, with its page, the
 * fields changed against the revision it started from and the number of the page's current
 * revision (presentDeskRevision shows them).
 */
export async function reviewDeskRevisions() {
  const queue = await proposedRevisions();
  const baseIds = [...new Set(queue.map((q) => q.revision.baseRevisionId).filter((id): id is number => id !== null))];
  const bases = new Map((await PageRevision.findAll({ where: { id: { [Op.in]: baseIds } } })).map((b) => [b.id, b]));
  const currentIds = [...new Set(queue.map((q) => q.page?.currentRevisionId).filter((id): id is number => typeof id === 'number'))];
  const numbers = new Map((await PageRevision.findAll({ where: { id: { [Op.in]: currentIds } }, attributes: ['id', 'number'] })).map((r) => [r.id, r.number]));
  return queue.map(({ revision, page }) => {
    const base = revision.baseRevisionId ? bases.get(revision.baseRevisionId) : undefined;
    const changed = base ? changedFields(revision.pageType, contentOf(base), contentOf(revision)) : [];
    return { revision, page, changed, currentNumber: page?.currentRevisionId ? (numbers.get(page.currentRevisionId) ?? null) : null };
  });
}

/** Every method page without its texts (for version chains and the slugs they name). */
export function methodsWithoutBodies(): Promise<Method[]> {
  return Method.findAll({ attributes: { exclude: PAGE_TEXT_COLUMNS } });
}

/** A page revision by id, or null. */
export function revisionById(id: number): Promise<PageRevision | null> {
  return PageRevision.findByPk(id);
}

/** A page of a type by id, or null. */
export async function pageById(type: PageType, id: number): Promise<PageModel | null> {
  return (await (PAGE_MODELS[type] as typeof Method).findByPk(id)) as PageModel | null;
}
