import { lazy, Suspense } from 'react';
import { Link } from 'react-router-dom';
import { ABRASIVE_MATERIALS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { Facts } from '@/components/ui/facts';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatGrams, formatGritBand, formatNumber, label } from '@/lib/format';
import { FEW_RESULTS } from '@shared/compare-view';
import { WikiToolbar } from '@/features/wiki/components/wiki-toolbar';
import { ServerHtml } from '@/components/ui/server-html';
import { wikiHtmlClasses } from '@/features/wiki/components/wiki-html';
import { PageReferences, SourceMark } from '@/features/wiki/components/page-references';
import { MergedNote, useMergedRedirect } from '@/features/wiki/components/merged-redirect';
import type { WikiParts } from '@/features/wiki/types';
import type { SteelDetail as Steel } from '@/types/api';

const CompositionChart = lazy(() => import('./composition-chart'));

type MethodName = { slug: string; name: string };
/** What the steel page adds to the steel: the wiki parts, its results by method, material and grit band, its common progressions. */
type SteelPage = Omit<Steel, 'revision' | 'citations'> & WikiParts & {
  results?: {
    count: number;
    groups: { method: MethodName; material: string; band: { loUm: number; hiUm: number; words: string }; n: number; testers: number; bestG: number; medianG: number }[];
    progressions: { method: MethodName; words: string; steps: number; n: number; testers: number; medianG: number }[];
  };
};

/** The rows of one method, in the order given (the server sorts within each method). */
function byMethod<T extends { method: MethodName }>(list: readonly T[]): [MethodName, T[]][] {
  const out = new Map<string, [MethodName, T[]]>();
  for (const g of list) {
    const entry = out.get(g.method.slug) ?? [g.method, []];
    entry[1].push(g);
    out.set(g.method.slug, entry);
  }
  return [...out.values()];
}

function range(min: number | null, max: number | null): string {
  if (min !== null && max !== null) return min === max ? formatNumber(min, 3) : `${formatNumber(min, 3)}–${formatNumber(max, 3)}`;
  if (max !== null) return `≤ ${formatNumber(max, 3)}`;
  if (min !== null) return `≥ ${formatNumber(min, 3)}`;
  return '—';
}

/**
 * A steel grade's reference page: the wiki's controls, designations, composition (wt %) as a
 * table and a chart, typical hardness, the approved results by method, material and grit band, the common progressions, the text and
 * its references (infobox values marked with the reference they came from).
 */
export function SteelDetail({ steel: data }: { steel: Steel }) {
  const steel = data as SteelPage;
  const mergedFrom = useMergedRedirect('steels', steel.slug);
  const mark = (field: string) => <SourceMark sources={steel.sources} field={field} citations={steel.citations} />;
  return (
    <div className="flex flex-col gap-8">
      <MergedNote from={mergedFrom} />
      {steel.can ? <WikiToolbar section="steels" page={steel} /> : null}
      <Facts
        items={[
          { term: 'Category', value: <>{label(STEEL_CATEGORIES, steel.category)}{mark('category')}</> },
          {
            term: 'Typical hardness',
            value: (
              <>
                {steel.hardnessHrc ? `${steel.hardnessHrc.min}–${steel.hardnessHrc.max} HRC` : '—'}
                {mark('hardnessHrc')}
              </>
            ),
          },
          {
            term: 'Results',
            value:
              steel.resultCount > 0 ? (
                <span className="flex flex-wrap gap-x-4">
                  <Link to={paths.results.getHref({ steel: steel.slug })}>
                    {steel.resultCount} published result{steel.resultCount === 1 ? '' : 's'}
                  </Link>
                  <Link to={paths.compare.getHref({ steel: steel.slug })}>Compare on this steel</Link>
                </span>
              ) : (
                'none published yet'
              ),
          },
        ]}
      />

      <div className="grid gap-8 lg:grid-cols-2">
        <section aria-labelledby="designations">
          <h2 id="designations" className="mb-2 text-xl font-semibold">
            Designations{mark('designations')}
          </h2>
          {steel.designations.length ? (
            <TableFrame label="Designations">
              <table className="w-full border-collapse">
                <thead>
                  <tr>
                    <th scope="col" className={thClass}>Standard</th>
                    <th scope="col" className={thClass}>Designation</th>
                  </tr>
                </thead>
                <tbody>
                  {steel.designations.map((d) => (
                    <tr key={`${d.system}-${d.code}`}>
                      <td className={tdClass}>{d.system}</td>
                      <td className={tdClass}>{d.code}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableFrame>
          ) : (
            <p className="text-muted">No designations recorded.</p>
          )}
        </section>

        <section aria-labelledby="composition" className="flex flex-col gap-3">
          <h2 id="composition" className="text-xl font-semibold">
            Composition{mark('composition')}
          </h2>
          {steel.composition.length ? (
            <>
              <TableFrame label="Composition in percent by weight">
                <table className="w-full border-collapse">
                  <thead>
                    <tr>
                      <th scope="col" className={thClass}>Element</th>
                      <th scope="col" className={`${thClass} text-right`}>wt %</th>
                    </tr>
                  </thead>
                  <tbody>
                    {steel.composition.map((c) => (
                      <tr key={c.element}>
                        <td className={tdClass}>{c.element}</td>
                        <td className={`${tdClass} text-right tabular-nums`}>{range(c.min, c.max)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </TableFrame>
              <Suspense fallback={null}>
                <CompositionChart composition={steel.composition} />
              </Suspense>
            </>
          ) : (
            <p className="text-muted">No composition recorded.</p>
          )}
        </section>
      </div>

      {steel.results && steel.results.groups.length ? (
        <section aria-labelledby="results-by-band" className="flex flex-col gap-3">
          <h2 id="results-by-band" className="text-xl font-semibold">
            Published results by method, abrasive material and grit band
          </h2>
          <p className="max-w-3xl text-sm text-muted">
            Readings are the force to sever the test medium, in grams: lower is keener. A method’s readings are compared only with its own, and each grit band (a doubling of particle size) stands apart, so a fine strop is never pooled with a coarse wheel of the same material.
          </p>
          {byMethod(steel.results.groups).map(([method, groups]) => (
            <TableFrame key={method.slug} label={`Results on this steel measured with ${method.name}`}>
              <table className="w-full border-collapse">
                <caption className="px-3 py-2 text-left font-medium">
                  <Link to={paths.method.getHref(method.slug)}>{method.name}</Link>
                </caption>
                <thead>
                  <tr>
                    <th scope="col" className={thClass}>Abrasive material</th>
                    <th scope="col" className={thClass}>Grit band</th>
                    <th scope="col" className={`${thClass} text-right`}>Results</th>
                    <th scope="col" className={`${thClass} text-right`}>Best reading</th>
                    <th scope="col" className={`${thClass} text-right`}>Median reading</th>
                    <th scope="col" className={thClass}><span className="sr-only">Comparison</span></th>
                  </tr>
                </thead>
                <tbody>
                  {groups.map((g) => (
                    <tr key={`${g.material}|${g.band.loUm}`}>
                      <td className={tdClass}>{label(ABRASIVE_MATERIALS, g.material)}</td>
                      <td className={tdClass}>
                        {formatGritBand(g.band)} <span className="text-muted">({g.band.words})</span>
                      </td>
                      <td className={`${tdClass} text-right tabular-nums`}>
                        {g.n}
                        {g.n < FEW_RESULTS || g.testers === 1 ? <span className="block text-xs text-caution">{g.testers === 1 ? 'one tester' : 'few results'}</span> : null}
                      </td>
                      <td className={`${tdClass} text-right tabular-nums`}>{formatGrams(g.bestG)}</td>
                      <td className={`${tdClass} text-right tabular-nums`}>{formatGrams(g.medianG)}</td>
                      <td className={tdClass}>
                        <Link to={paths.compare.getHref({ steel: steel.slug, material: g.material, method: method.slug, umMin: String(g.band.loUm), umMax: String(g.band.hiUm) })}>Compare</Link>
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </TableFrame>
          ))}
        </section>
      ) : null}

      {steel.results?.progressions.length ? (
        <section aria-labelledby="common-progressions" className="flex flex-col gap-3">
          <h2 id="common-progressions" className="text-xl font-semibold">
            Most common progressions on this steel
          </h2>
          <p className="max-w-3xl text-sm text-muted">The steps recorded before the final abrasive, then the final abrasive, by material and particle size; the median is of the results that followed that progression exactly, under one method.</p>
          <ol className="flex flex-col gap-2">
            {steel.results.progressions.map((p) => (
              <li key={`${p.method.slug}|${p.words}`} className="rounded-md border border-rule bg-panel px-3 py-2">
                <p className="font-medium break-words">{p.words}</p>
                <p className="text-sm text-muted">
                  Median {formatGrams(p.medianG)} from {p.n} result{p.n === 1 ? '' : 's'} by {p.testers} tester{p.testers === 1 ? '' : 's'} · {p.method.name}
                  {p.n < FEW_RESULTS ? ' · few results: a hint, not evidence' : ''}
                </p>
              </li>
            ))}
          </ol>
        </section>
      ) : null}

      {steel.bodyHtml?.trim() ? (
        <section aria-labelledby="about">
          <h2 id="about" className="mb-2 text-xl font-semibold">
            About this steel
          </h2>
          <ServerHtml html={steel.bodyHtml} className={`${wikiHtmlClasses} max-w-3xl`} />
        </section>
      ) : null}

      <PageReferences citations={steel.citations} />
    </div>
  );
}
