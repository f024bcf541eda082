import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { limits } from '@shared/validations';
import type { SearchHit, SearchHitType } from '@/types/api';
import { Highlight } from './highlight';

/** The order and headings of the groups of hits. */
export const HIT_GROUPS: { type: SearchHitType; heading: string }[] = [
  { type: 'steel', heading: 'Steels' },
  { type: 'abrasive', heading: 'Abrasives' },
  { type: 'method', heading: 'Methods' },
  { type: 'result', heading: 'Results' },
  { type: 'cell', heading: 'Comparison cells' },
];

/** Where a hit leads: its reference page, or the result itself. */
export function hitHref(hit: SearchHit): string | null {
  switch (hit.type) {
    case 'steel':
      return hit.slug ? paths.steel.getHref(hit.slug) : null;
    case 'abrasive':
      return hit.slug ? paths.abrasive.getHref(hit.slug) : null;
    case 'method':
      return hit.slug ? paths.method.getHref(hit.slug) : null;
    case 'result':
      return hit.id !== undefined ? paths.result.getHref(hit.id) : null;
    case 'cell':
      // The comparison on that steel and material, with the cell's results open.
      return hit.cell ? paths.compare.getHref({ method: hit.cell.method, steel: hit.cell.ref.split(':')[0], material: hit.cell.ref.split(':')[1], cell: hit.cell.ref }) : null;
  }
}

/** In the "All" view, at most this many hits per section (the search brings each kind's best this many); its "show all" link has the rest. */
const HITS_PER_SECTION = limits.searchSectionBest;

/**
 * Hits grouped by type (steels, abrasives, methods, results, cells), each with its snippet. In
 * the "All" view (`typeHref` given) every type that has matches gets its section, with the true
 * number of matches, its best few hits and a "show all N" link to that type's own view, even
 * when none of its hits ranked among the best overall.
 */
export function SearchHits({ hits, query, facets, typeHref }: { hits: SearchHit[]; query: string; facets?: Record<SearchHitType, number>; typeHref?: (type: SearchHitType) => string }) {
  return (
    <div className="flex flex-col gap-8">
      {HIT_GROUPS.map(({ type, heading }) => {
        const all = hits.filter((h) => h.type === type);
        const total = facets?.[type] ?? all.length;
        if (total === 0 && all.length === 0) return null;
        const group = typeHref ? all.slice(0, HITS_PER_SECTION) : all;
        const more = total > group.length;
        return (
          <section key={type} aria-labelledby={`hits-${type}`}>
            <h2 id={`hits-${type}`} className="mb-2 text-xl font-semibold">
              {heading} <span className="font-sans text-base font-normal text-muted">({total})</span>
            </h2>
            {more ? (
              <p className="mb-2 text-sm text-muted">
                The best {group.length} of {total}
                {typeHref ? (
                  <>
                    {' · '}
                    <Link to={typeHref(type)}>
                      Show all {total} {heading.toLowerCase()}
                    </Link>
                  </>
                ) : null}
              </p>
            ) : null}
            {group.length === 0 ? null : (
              <ul className="divide-y divide-rule rounded-md border border-rule bg-panel">
                {group.map((hit) => {
                  const href = hitHref(hit);
                  return (
                    <li key={`${hit.type}-${hit.cell?.method ?? ''}-${hit.slug ?? hit.id}`} className="px-4 py-3">
                      {href ? (
                        <Link to={href} className="font-semibold">
                          <Highlight text={hit.title} query={query} />
                        </Link>
                      ) : (
                        <span className="font-semibold">{hit.title}</span>
                      )}
                      {hit.type === 'steel' && hit.slug ? (
                        <Link to={paths.decide.getHref(hit.slug)} className="ml-3 text-sm">
                          Choose an abrasive for it
                        </Link>
                      ) : null}
                      {hit.snippet ? (
                        <p className="mt-0.5 text-sm text-muted">
                          <Highlight text={hit.snippet} query={query} />
                        </p>
                      ) : null}
                    </li>
                  );
                })}
              </ul>
            )}
          </section>
        );
      })}
    </div>
  );
}
