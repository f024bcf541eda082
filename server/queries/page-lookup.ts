import type { PageLookup } from '@shared/csv';
import { Abrasive, Method, Steel } from '../models';

/** Lower-case, without spaces, dots, hyphens or slashes: "EN 1.2379" and "en-12379" meet. */
const squash = (s: string) => s.toLowerCase().replace(/[\s.\-_/]+/g, '');

/**
 * A lookup of pages by what people write in an import file, read once per file: steels by
 * slug, any designation (with or without its system, e.g. "D2" or "AISI D2") or name;
 * abrasives by slug or name; methods by slug. A designation shared by two steels matches none.
 */
export async function loadPageLookup(): Promise<PageLookup> {
  const [steels, abrasives, methods] = await Promise.all([
    Steel.findAll({ attributes: ['slug', 'name', 'designations'] }),
    Abrasive.findAll({ attributes: ['slug', 'name'] }),
    Method.findAll({ attributes: ['slug'] }),
  ]);
  const steelNames = new Map<string, string | null>();
  const add = (map: Map<string, string | null>, key: string, slug: string) => {
    const k = squash(key);
    if (!k) return;
    const seen = map.get(k);
    map.set(k, seen === undefined || seen === slug ? slug : null);
  };
  for (const s of steels) {
    add(steelNames, s.name, s.slug);
    for (const d of s.designations) {
      add(steelNames, d.code, s.slug);
      add(steelNames, `${d.system} ${d.code}`, s.slug);
    }
  }
  const steelSlugs = new Set(steels.map((s) => s.slug));
  const abrasiveSlugs = new Set(abrasives.map((a) => a.slug));
  const abrasiveNames = new Map<string, string | null>();
  for (const a of abrasives) add(abrasiveNames, a.name, a.slug);
  const methodSlugs = new Set(methods.map((m) => m.slug));
  return {
    steel: (text) => (steelSlugs.has(text.trim().toLowerCase()) ? text.trim().toLowerCase() : (steelNames.get(squash(text)) ?? null)),
    abrasive: (text) => (abrasiveSlugs.has(text.trim().toLowerCase()) ? text.trim().toLowerCase() : (abrasiveNames.get(squash(text)) ?? null)),
    method: (text) => (methodSlugs.has(text.trim().toLowerCase()) ? text.trim().toLowerCase() : null),
  };
}
