import { Abrasive, Method, Steel } from '../models';
import { onCellsChanged } from '../aggregates/comparison-cells';

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
}

/**
 * Page names change rarely and a stale name is harmless for a few seconds, so the pages are
 * read at most every few seconds, and again after any cell change (a new page can only enter
 * the comparison through an approved result, which refreshes a cell).
 */
const TTL_MS = 5000;
let cached: { at: number; value: Promise<Lookups> } | null = null;
onCellsChanged(() => {
  cached = null;
});

async function load(): Promise<Lookups> {
  const [steels, methods, abrasives] = await Promise.all([
    Steel.findAll({ attributes: ['id', 'slug', 'name', 'category', 'designations'], raw: true }),
    Method.findAll({ attributes: ['id', 'slug', 'name', 'version', 'replacesId'], raw: true }),
    Abrasive.findAll({ attributes: ['id', 'slug', 'name', 'material', 'bond'], raw: true }),
  ]);
  const s = (steels as unknown as (SteelInfo & { designations: unknown })[]).map((x) => ({
    ...x,
    // raw queries give JSON columns as text on SQLite
    designations: (typeof x.designations === 'string' ? JSON.parse(x.designations) : x.designations) as SteelInfo['designations'],
  }));
  const m = methods as unknown as MethodInfo[];
  return {
    steels: new Map(s.map((x) => [x.id, x])),
    steelBySlug: new Map(s.map((x) => [x.slug, x])),
    methods: new Map(m.map((x) => [x.id, x])),
    methodBySlug: new Map(m.map((x) => [x.slug, x])),
    abrasives: new Map((abrasives as unknown as AbrasiveInfo[]).map((x) => [x.id, x])),
  };
}

/** The reference pages the comparison names, read at most every 5 s. */
export function lookups(now = Date.now()): Promise<Lookups> {
  if (!cached || now - cached.at > TTL_MS) {
    const value = load();
    const entry = { at: now, value };
    cached = entry;
    value.catch(() => {
      if (cached === entry) cached = null;
    });
  }
  return cached.value;
}

/** Forgets the pages (after a page edit that must show at once). */
export function clearLookups(): void {
  cached = null;
}
