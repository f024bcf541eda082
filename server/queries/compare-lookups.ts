import { Abrasive, Method, Steel } from '../models';
import { keptUntil } from './kept-until';
import { rawJson } from '../db/raw-values';

/** What the comparison needs to know of a steel page. */
export interface SteelInfo {
  id: number;
  slug: string;
  name: string;
  category: string;
  designations: { system: string; code: string }[];
}
/** What the comparison needs to know of a method page. */
export interface MethodInfo {
  id: number;
  slug: string;
  name: string;
  version: number;
  replacesId: number | null;
}
/** What the comparison needs to know of an abrasive page. */
export interface AbrasiveInfo {
  id: number;
  slug: string;
  name: string;
  material: string;
  bond: string;
}

/** The reference pages by id and slug. */
export interface Lookups {
  steels: Map<number, SteelInfo>;
  steelBySlug: Map<string, SteelInfo>;
  methods: Map<number, MethodInfo>;
  methodBySlug: Map<string, MethodInfo>;
  abrasives: Map<number, AbrasiveInfo>;
  /** Abrasive pages' names by slug (a result's progression steps name their abrasives by slug). */
  abrasiveNames: ReadonlyMap<string, string>;
}

/** The pages, read once and kept until a page changes or cells do (a new page can only enter the comparison through an approved result). */
const kept = keptUntil<'pages', Promise<Lookups>>('compareLookups');

async function load(): Promise<Lookups> {
  const [steels, methods, abrasives] = await Promise.all([
    Steel.findAll({ attributes: ['id', 'slug', 'name', 'category', 'designations'], raw: true }),
    Method.findAll({ attributes: ['id', 'slug', 'name', 'version', 'replacesId'], raw: true }),
    Abrasive.findAll({ attributes: ['id', 'slug', 'name', 'material', 'bond'], raw: true }),
  ]);
  const s = (steels as unknown as (SteelInfo & { designations: unknown })[]).map((x) => ({
    ...x,
    designations: rawJson<SteelInfo['designations']>(x.designations),
  }));
  const m = methods as unknown as MethodInfo[];
  return {
    steels: new Map(s.map((x) => [x.id, x])),
    steelBySlug: new Map(s.map((x) => [x.slug, x])),
    methods: new Map(m.map((x) => [x.id, x])),
    methodBySlug: new Map(m.map((x) => [x.slug, x])),
    abrasives: new Map((abrasives as unknown as AbrasiveInfo[]).map((x) => [x.id, x])),
    abrasiveNames: new Map((abrasives as unknown as AbrasiveInfo[]).map((x) => [x.slug, x.name])),
  };
}

/** The reference pages the comparison names, by id and slug. */
export function lookups(): Promise<Lookups> {
  return kept.share('pages', load);
}

/** Abrasive pages' names by slug, kept with the look-ups (dropped when a page changes): what presentResult names progression steps with. */
export async function abrasiveNames(): Promise<ReadonlyMap<string, string>> {
  return (await lookups()).abrasiveNames;
}

/** Forgets the pages, so the next comparison reads them again (the bench's cold reads). */
export function clearLookups(): void {
  kept.forget('pages');
}
