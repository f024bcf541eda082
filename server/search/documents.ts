import { richTextToPlain } from '@shared/rich-text';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { Abrasive, Method, Result, Steel, User } from '../models';
import type { SearchDoc } from './search-index';

const label = (table: Record<string, string>, key: string) => table[key] ?? key;

/** A steel page as a search document: every designation is one of its names. */
export function steelDoc(steel: Steel): SearchDoc {
  return {
    key: `steel:${steel.slug}`,
    type: 'steel',
    slug: steel.slug,
    title: steel.name,
    names: [...steel.designations.map((d) => `${d.system} ${d.code} ${d.code}`), label(STEEL_CATEGORIES, steel.category)].join(' '),
    body: richTextToPlain(steel.body),
  };
}

/** An abrasive page as a search document. */
export function abrasiveDoc(abrasive: Abrasive): SearchDoc {
  return {
    key: `abrasive:${abrasive.slug}`,
    type: 'abrasive',
    slug: abrasive.slug,
    title: abrasive.name,
    names: [label(ABRASIVE_MATERIALS, abrasive.material), abrasive.material, label(BONDS, abrasive.bond), abrasive.gritGrade, `${Math.round(abrasive.gritUm)} µm`].join(' '),
    body: richTextToPlain(abrasive.body),
  };
}

/** A method page as a search document. */
export function methodDoc(method: Method): SearchDoc {
  return {
    key: `method:${method.slug}`,
    type: 'method',
    slug: method.slug,
    title: method.name,
    names: [method.instrument, method.medium, method.retentionMedium ?? '', `version ${method.version}`].join(' '),
    body: richTextToPlain(method.body),
  };
}

/** An approved result as a search document (needs steel, abrasive, author and method loaded). */
export function resultDoc(result: Result): SearchDoc {
  const steel = result.steel!;
  const abrasive = result.abrasive!;
  return {
    key: `result:${result.id}`,
    type: 'result',
    id: result.id,
    title: `${steel.name} at ${Math.round(result.hrc * 10) / 10} HRC on ${abrasive.name}, ${Math.round(result.perSideDeg * 10) / 10}° per side`,
    names: [
      ...steel.designations.map((d) => d.code),
      label(ABRASIVE_MATERIALS, result.material),
      result.material,
      result.gritGrade,
      `${Math.round(result.gritUm * 10) / 10} µm`,
      result.author?.handle ?? '',
      result.sharpnessMethod?.name ?? '',
    ].join(' '),
    body: `${Math.round(result.sharpnessMedianG)} g median. ${richTextToPlain(result.input.notes)}`.trim(),
  };
}

/** The includes a result needs to become a search document or to be presented. */
export const resultIncludes = [
  { model: Steel, as: 'steel' },
  { model: Abrasive, as: 'abrasive' },
  { model: User, as: 'author' },
  { model: Method, as: 'sharpnessMethod' },
  { model: Method, as: 'retentionMethod' },
];

/** Every document the index holds, read from the database. */
export async function* allSearchDocs(): AsyncGenerator<SearchDoc> {
  for (const s of await Steel.findAll()) yield steelDoc(s);
  for (const a of await Abrasive.findAll()) yield abrasiveDoc(a);
  for (const m of await Method.findAll()) yield methodDoc(m);
  const batch = 2000;
  for (let offset = 0; ; offset += batch) {
    const rows = await Result.findAll({ where: { status: 'approved' }, include: resultIncludes, order: [['id', 'ASC']], limit: batch, offset });
    for (const r of rows) yield resultDoc(r);
    if (rows.length < batch) break;
  }
}
