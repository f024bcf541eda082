import { Op, QueryTypes } from 'sequelize';
import { richTextToPlain, type RichTextNode } from '@shared/rich-text';

import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { Abrasive, Method, PAGE_TEXT_COLUMNS, Result, Steel, User } from '../models';
import type { SearchDoc } from './search-index';
import { allCellDocs } from '../aggregates/cell-search';
import { abrasiveOwner, memberOwner, methodOwner, steelOwner, type SearchOwner } from './owners';
import { dialectSql } from '../db/dialect';

/** Bodies keep their block boundaries, so a snippet never runs a heading into its paragraph. */
const BLOCKS = { keepBlocks: true };

const label = (table: Record<string, string>, key: string) => table[key] ?? key;

/** A steel page as a search document: every designation is one of its names. */
export function steelDoc(steel: Steel, aliases: string[] = []): SearchDoc {
  return {
    key: `steel:${steel.slug}`,
    type: 'steel',
    slug: steel.slug,
    title: steel.name,
    names: [...steel.designations.map((d) => `${d.system} ${d.code} ${d.code}`), label(STEEL_CATEGORIES, steel.category), ...aliases].join(' '),
    body: richTextToPlain(steel.body, BLOCKS),
    group: steel.category,
  };
}

/** An abrasive page as a search document. */
export function abrasiveDoc(abrasive: Abrasive, aliases: string[] = []): SearchDoc {
  return {
    key: `abrasive:${abrasive.slug}`,
    type: 'abrasive',
    slug: abrasive.slug,
    title: abrasive.name,
    names: [label(ABRASIVE_MATERIALS, abrasive.material), abrasive.material, label(BONDS, abrasive.bond), abrasive.gritGrade, `${Math.round(abrasive.gritUm)} µm`, ...aliases].join(' '),
    body: richTextToPlain(abrasive.body, BLOCKS),
    group: abrasive.material,
  };
}

/** A method page as a search document. */
export function methodDoc(method: Method, aliases: string[] = []): SearchDoc {
  return {
    key: `method:${method.slug}`,
    type: 'method',
    slug: method.slug,
    title: method.name,
    names: [method.instrument, method.medium, method.retentionMedium ?? '', `version ${method.version}`, ...aliases].join(' '),
    body: richTextToPlain(method.body, BLOCKS),
  };
}

/** What of a result its search document holds. */
type ResultFacts = Pick<Result, 'id' | 'hrc' | 'perSideDeg' | 'sharpnessMedianG'> & { input: { notes?: RichTextNode } };

/**
 * An approved result as a search document (needs steel, abrasive, author and method loaded). Its
 * own words are its notes; its steel, abrasive at its grit, method and author lend it
 * theirs (see SearchIndex), so a query on a grade or a material matches the result too. Its
 * title ("AISI D2 on <abrasive> · 61 HRC · 15° per side · median 142 g · @handle") is made
 * from its owners' labels and its figures when it is shown (`titleOf`).
 */
export function resultDoc(result: ResultFacts, owners: SearchOwner[] = resultOwners(result as Result)): SearchDoc {
  return {
    key: `result:${result.id}`,
    type: 'result',
    id: result.id,
    names: '',
    body: richTextToPlain(result.input.notes, BLOCKS),
    owners,
    figures: { hrc: result.hrc, perSideDeg: result.perSideDeg, medianG: result.sharpnessMedianG },
  };
}

/** The owners a result takes its words from (needs steel, abrasive, author and method loaded). */
function resultOwners(result: Result): SearchOwner[] {
  const method = result.sharpnessMethod;
  return [
    steelOwner(result.steel!),
    abrasiveOwner(result.abrasive!, result),
    ...(method ? [methodOwner(method)] : []),
    ...(result.author ? [memberOwner(result.author)] : []),
  ];
}

/** The includes a result needs to become a search document or to be presented. */
export const resultIncludes = [
  { model: Steel, as: 'steel', attributes: { exclude: PAGE_TEXT_COLUMNS } },
  { model: Abrasive, as: 'abrasive', attributes: { exclude: PAGE_TEXT_COLUMNS } },
  { model: User, as: 'author' },
  { model: Method, as: 'sharpnessMethod', attributes: { exclude: PAGE_TEXT_COLUMNS } },
  { model: Method, as: 'retentionMethod', attributes: { exclude: PAGE_TEXT_COLUMNS } },
];

/** Every document the index holds, read from the database. */
export async function* allSearchDocs(): AsyncGenerator<SearchDoc> {
  // A page merged into another is not a document of its own: its names live on in the survivor's.
  const steels = await Steel.findAll();
  const steelAliases = mergedAliases(steels);
  for (const s of steels) if (!s.mergedIntoId) yield steelDoc(s, steelAliases.get(s.id));
  const abrasives = await Abrasive.findAll();
  const abrasiveAliases = mergedAliases(abrasives);
  for (const a of abrasives) if (!a.mergedIntoId) yield abrasiveDoc(a, abrasiveAliases.get(a.id));
  const methods = await Method.findAll();
  const methodAliases = mergedAliases(methods);
  for (const m of methods) if (!m.mergedIntoId) yield methodDoc(m, methodAliases.get(m.id));
  yield* approvedResultDocs();
  yield* allCellDocs();
}

/** The names (and, for steels, designations) of pages merged into each page, by survivor id. */
function mergedAliases(pages: (Steel | Abrasive | Method)[]): Map<number, string[]> {
  const byId = new Map(pages.map((p) => [p.id, p]));
  const finalOf = (p: Steel | Abrasive | Method) => {
    let current = p;
    for (let hops = 0; current.mergedIntoId && byId.has(current.mergedIntoId) && hops < 20; hops++) current = byId.get(current.mergedIntoId)!;
    return current;
  };
  const aliases = new Map<number, string[]>();
  for (const p of pages) {
    if (!p.mergedIntoId) continue;
    const survivor = finalOf(p);
    const names = [p.name, ...('designations' in p ? p.designations.map((d) => `${d.system} ${d.code}`) : [])];
    aliases.set(survivor.id, [...(aliases.get(survivor.id) ?? []), ...names]);
  }
  return aliases;
}

/**
 * The search document of one reference page as it now stands, with the names of pages merged
 * into it; null when the page itself was merged into another (it has no document then).
 */
export async function pageSearchDoc(type: 'steel' | 'abrasive' | 'method', id: number): Promise<SearchDoc | null> {
  const model = (type === 'steel' ? Steel : type === 'abrasive' ? Abrasive : Method) as typeof Steel;
  const page = (await model.findByPk(id)) as Steel | Abrasive | Method | null;
  if (!page || page.mergedIntoId) return null;
  // Merges are rare and chains short: read every page of the type to follow them.
  const aliases = mergedAliases((await model.findAll()) as (Steel | Abrasive | Method)[]).get(page.id);
  if (type === 'steel') return steelDoc(page as Steel, aliases);
  if (type === 'abrasive') return abrasiveDoc(page as Abrasive, aliases);
  return methodDoc(page as Method, aliases);
}

/** Search documents of the approved results that refer to a page (their titles carry its name). */
export async function resultDocsOfPage(type: 'steel' | 'abrasive' | 'method', id: number): Promise<SearchDoc[]> {
  const where = type === 'steel' ? { steelId: id } : type === 'abrasive' ? { abrasiveId: id } : { [Op.or]: [{ sharpnessMethodId: id }, { retentionMethodId: id }] };
  const rows = await Result.findAll({ where: { ...where, status: 'approved' }, include: resultIncludes, order: [['id', 'ASC']] });
  return rows.map((r) => resultDoc(r));
}

/**
 * Every approved result's document, read in pages of 5000 by id (keyset, so each page costs the
 * same) with only the columns a document needs (of the submission, only its notes), the pages it
 * names looked up from maps. Reading them through the model with full includes carried each
 * page's rich-text body into every row (measured at 100 000 results: 276 s that way, against a
 * few seconds). The statement is each dialect's own (`server/db/dialect.ts`).
 */
async function* approvedResultDocs(): AsyncGenerator<SearchDoc> {
  const [steels, abrasives, methods, users] = await Promise.all([
    Steel.findAll({ attributes: ['id', 'name', 'designations'] }),
    Abrasive.findAll({ attributes: ['id', 'name'] }),
    Method.findAll({ attributes: ['id', 'name', 'version'] }),
    User.findAll({ attributes: ['id', 'handle'] }),
  ]);
  // Plain copies of the pages, and each owner built once: a getter or a join per row adds up.
  const steel = new Map(steels.map((s) => [s.id, { id: s.id, name: s.name, designations: s.designations }]));
  const abrasive = new Map(abrasives.map((a) => [a.id, { id: a.id, name: a.name }]));
  const method = new Map(methods.map((m) => [m.id, { id: m.id, name: m.name, version: m.version }]));
  const user = new Map(users.map((u) => [u.id, { id: u.id, handle: u.handle }]));
  const owners = new Map<string, SearchOwner>();
  const once = (key: string, build: () => SearchOwner) => owners.get(key) ?? owners.set(key, build()).get(key)!;
  const batch = 5000;
  type Row = Pick<Result, 'id' | 'steelId' | 'abrasiveId' | 'authorId' | 'sharpnessMethodId' | 'material' | 'hrc' | 'perSideDeg' | 'gritGrade' | 'gritUm' | 'sharpnessMedianG'> & { notes: string | null };
  const columns = ['id', 'steelId', 'abrasiveId', 'authorId', 'sharpnessMethodId', 'material', 'hrc', 'perSideDeg', 'gritGrade', 'gritUm', 'sharpnessMedianG'].map((c) => `"${c}"`).join(', ');
  const page = (after: number) =>
    Result.sequelize!.query<Row>(
      dialectSql(Result.sequelize!).approvedResultsPage(columns, batch),
      { type: QueryTypes.SELECT, replacements: { after } },
    );
  for (let next: Promise<Row[]> | null = page(0); next; ) {
    const rows: Row[] = await next;
    // SQLite reads the next page on its own thread while this one becomes documents.
    next = rows.length === batch ? page(rows[rows.length - 1].id) : null;
    for (const r of rows) {
      const s = steel.get(r.steelId)!;
      const a = abrasive.get(r.abrasiveId)!;
      const m = method.get(r.sharpnessMethodId);
      const u = user.get(r.authorId);
      const resultOwners = [
        once(`s${r.steelId}`, () => steelOwner(s)),
        once(`a${r.abrasiveId}:${r.gritGrade}`, () => abrasiveOwner(a, r)),
        ...(m ? [once(`m${m.id}`, () => methodOwner(m))] : []),
        ...(u ? [once(`u${u.id}`, () => memberOwner(u))] : []),
      ];
      const notes = r.notes ? (JSON.parse(r.notes) as RichTextNode) : undefined;
      yield resultDoc({ id: r.id, hrc: r.hrc, perSideDeg: r.perSideDeg, sharpnessMedianG: r.sharpnessMedianG, input: { notes } }, resultOwners);
    }
  }
}
