import { Link } from 'react-router-dom';
import { GRIT_STANDARD_SHORT_LABELS } from '@shared/grit';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { Caution } from '@/components/ui/caution';
import { Facts } from '@/components/ui/facts';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import { formatGrams, formatMicrometres, label } from '@/lib/format';
import { WikiToolbar } from '@/features/wiki/components/wiki-toolbar';
import { ServerHtml } from '@/components/ui/server-html';
import { wikiHtmlClasses } from '@/features/wiki/components/wiki-html';
import { PageReferences, SourceMark } from '@/features/wiki/components/page-references';
import { MergedNote, useMergedRedirect } from '@/features/wiki/components/merged-redirect';
import type { WikiParts } from '@/features/wiki/types';
import type { AbrasiveDetail as Abrasive } from '@/types/api';
import { PricesPaid } from '@/features/workshop/components/prices-paid';
import { formatLength, useLengthUnit } from '@/lib/lengths';

/** What the abrasive page adds: the wiki parts, a price note and its results grouped by steel. */
type AbrasivePage = Omit<Abrasive, 'revision'> & WikiParts & {
  priceNote?: string | null;
  results?: { count: number; groups: { key: string; label: string; n: number; bestG: number; medianG: number }[] };
};

function gritRangeText(range: Abrasive['gritRange']): string | null {
  if (!range) return null;
  if (typeof range === 'string') return range;
  return `${range.from} to ${range.to}`;
}

/**
 * An abrasive type's reference page, with the usual cautions for powered wheels, the wiki's
 * controls, its results by steel, the text and its references.
 */
export function AbrasiveDetail({ abrasive: data }: { abrasive: Abrasive }) {
  const abrasive = data as unknown as AbrasivePage;
  const isWheel = abrasive.form === 'wheel';
  const range = gritRangeText(abrasive.gritRange);
  const mergedFrom = useMergedRedirect('abrasives', abrasive.slug);
  const [unit] = useLengthUnit();
  const mark = (field: string) => (abrasive.citations ? <SourceMark sources={abrasive.sources} field={field} citations={abrasive.citations} /> : null);
  return (
    <div className="flex flex-col gap-8">
      <MergedNote from={mergedFrom} />
      {abrasive.can ? <WikiToolbar section="abrasives" page={abrasive} /> : null}
      <Facts
        items={[
          { term: 'Material', value: <>{label(ABRASIVE_MATERIALS, abrasive.material)}{mark('material')}</> },
          { term: 'Bond', value: <>{label(BONDS, abrasive.bond)}{mark('bond')}</> },
          { term: 'Form', value: <>{label(ABRASIVE_FORMS, abrasive.form)}{mark('form')}</> },
          {
            term: 'Grit',
            value: (
              <>
                {abrasive.grit
                  ? `${abrasive.grit.grade} (${(GRIT_STANDARD_SHORT_LABELS as Record<string, string>)[abrasive.grit.standard] ?? abrasive.grit.standard})`
                  : '—'}
                {abrasive.gritUm ? ` ≈ ${formatMicrometres(abrasive.gritUm)} µm` : ''}
                {mark('grit')}
                {range ? <span className="block text-sm text-muted">Dressable across {range}</span> : null}
              </>
            ),
          },
          ...(abrasive.wheelDiameterMm
            ? [
                {
                  term: 'Size',
                  value: `Ø ${formatLength(abrasive.wheelDiameterMm, unit, false, unit === 'in' ? 2 : 0)}${abrasive.widthMm ? ` × ${formatLength(abrasive.widthMm, unit, false, unit === 'in' ? 2 : 0)} wide` : ''}`,
                },
              ]
            : []),
          {
            term: 'Wear',
            value: abrasive.wears
              ? 'Wears and shrinks in use: re-measure the diameter before setting an angle.'
              : 'Keeps its diameter in use.',
          },
          { term: 'Coolant', value: <>{label(COOLANTS, abrasive.coolant)}{mark('coolant')}</> },
          { term: 'Side usable for flat bevels', value: <>{abrasive.sideUsable ? 'yes' : 'no'}{mark('sideUsable')}</> },
          ...(abrasive.priceNote ? [{ term: 'Price', value: <>{abrasive.priceNote}{mark('priceNote')}</> }] : []),
          {
            term: 'Results',
            value:
              abrasive.resultCount > 0 ? (
                <Link to={paths.results.getHref({ abrasive: abrasive.slug })}>
                  {abrasive.resultCount} published result{abrasive.resultCount === 1 ? '' : 's'}
                </Link>
              ) : (
                'none published yet'
              ),
          },
        ]}
      />

      {isWheel ? (
        <Caution title="Safety at the wheel">
          <ul className="list-disc space-y-0.5 pl-5">
            <li>Wear eye protection and keep the guards on.</li>
            <li>The wheel’s rated speed must be higher than the machine’s speed.</li>
            <li>Never run a cracked or chipped wheel; check it before mounting.</li>
            <li>Keep electrics away from the water trough.</li>
            {abrasive.coolant === 'water-inhibitor' || abrasive.coolant === 'oil' ? (
              <li>Read the safety data sheet of the coolant or additive.</li>
            ) : null}
          </ul>
          <p className="mt-1">Follow the instructions of the machine and wheel makers and your local regulations.</p>
        </Caution>
      ) : null}

      {abrasive.bodyHtml?.trim() ? (
        <section aria-labelledby="about">
          <h2 id="about" className="mb-2 text-xl font-semibold">
            About this abrasive
          </h2>
          <ServerHtml html={abrasive.bodyHtml} className={`${wikiHtmlClasses} max-w-3xl`} />
        </section>
      ) : null}

      {abrasive.results && abrasive.results.groups.length ? (
        <section aria-labelledby="results-by-steel">
          <h2 id="results-by-steel" className="mb-2 text-xl font-semibold">
            Published results by steel
          </h2>
          <TableFrame label="Published results on this abrasive by steel">
            <table className="w-full border-collapse">
              <thead>
                <tr>
                  <th scope="col" className={thClass}>Steel</th>
                  <th scope="col" className={`${thClass} text-right`}>Results</th>
                  <th scope="col" className={`${thClass} text-right`}>Best (lowest) reading</th>
                  <th scope="col" className={`${thClass} text-right`}>Median reading</th>
                </tr>
              </thead>
              <tbody>
                {abrasive.results.groups.map((g) => (
                  <tr key={g.key}>
                    <td className={tdClass}>
                      <Link to={paths.steel.getHref(g.key)}>{g.label}</Link>
                    </td>
                    <td className={`${tdClass} text-right tabular-nums`}>{g.n}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatGrams(g.bestG)}</td>
                    <td className={`${tdClass} text-right tabular-nums`}>{formatGrams(g.medianG)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
        </section>
      ) : null}

      <PricesPaid abrasive={abrasive.slug} />

      {abrasive.citations ? <PageReferences citations={abrasive.citations} /> : null}
    </div>
  );
}
