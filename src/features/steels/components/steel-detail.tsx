import { Link } from 'react-router-dom';
import { STEEL_CATEGORIES } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { Facts } from '@/components/ui/facts';
import { ServerHtml } from '@/components/ui/server-html';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatNumber, label } from '@/lib/format';
import type { SteelDetail as Steel } from '@/types/api';

function range(min: number | null, max: number | null): string {
  if (min !== null && max !== null) return min === max ? formatNumber(min, 3) : `${formatNumber(min, 3)}–${formatNumber(max, 3)}`;
  if (max !== null) return `≤ ${formatNumber(max, 3)}`;
  if (min !== null) return `≥ ${formatNumber(min, 3)}`;
  return '—';
}

/** A steel grade's reference page: designations, composition (wt %), hardness, notes and sources. */
export function SteelDetail({ steel }: { steel: Steel }) {
  return (
    <div className="flex flex-col gap-8">
      <Facts
        items={[
          { term: 'Category', value: label(STEEL_CATEGORIES, steel.category) },
          {
            term: 'Typical hardness',
            value: steel.hardnessHrc ? `${steel.hardnessHrc.min}–${steel.hardnessHrc.max} HRC` : '—',
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
            Designations
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

        <section aria-labelledby="composition">
          <h2 id="composition" className="mb-2 text-xl font-semibold">
            Composition
          </h2>
          {steel.composition.length ? (
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
          ) : (
            <p className="text-muted">No composition recorded.</p>
          )}
        </section>
      </div>

      {steel.bodyHtml?.trim() ? (
        <section aria-labelledby="about">
          <h2 id="about" className="mb-2 text-xl font-semibold">
            About this steel
          </h2>
          <ServerHtml html={steel.bodyHtml} className="max-w-3xl" />
        </section>
      ) : null}

      <section aria-labelledby="sources">
        <h2 id="sources" className="mb-2 text-xl font-semibold">
          Sources
        </h2>
        {steel.citations.length ? (
          <ol className="list-decimal space-y-2 pl-6">
            {steel.citations.map((c, i) => (
              <li key={`${c.title}-${i}`}>
                {c.url ? (
                  <a href={c.url} rel="noopener noreferrer nofollow">
                    {c.title}
                  </a>
                ) : (
                  <cite className="not-italic">{c.title}</cite>
                )}
                {[c.organisation, c.year].filter(Boolean).map((part) => `, ${part}`).join('')}
                {c.standard ? ` (${c.standard})` : ''}
                {c.supports ? <span className="block text-sm text-muted">Supports: {c.supports}</span> : null}
              </li>
            ))}
          </ol>
        ) : (
          <p className="text-muted">No sources cited yet.</p>
        )}
      </section>
    </div>
  );
}
