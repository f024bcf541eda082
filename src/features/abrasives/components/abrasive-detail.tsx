import { Link } from 'react-router-dom';
import { GRIT_STANDARD_SHORT_LABELS } from '@shared/grit';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { Caution } from '@/components/ui/caution';
import { Facts } from '@/components/ui/facts';
import { ServerHtml } from '@/components/ui/server-html';
import { formatMicrometres, formatNumber, label } from '@/lib/format';
import type { AbrasiveDetail as Abrasive } from '@/types/api';

function gritRangeText(range: Abrasive['gritRange']): string | null {
  if (!range) return null;
  if (typeof range === 'string') return range;
  return `${range.from} to ${range.to}`;
}

/** An abrasive type's reference page, with the usual cautions for powered wheels. */
export function AbrasiveDetail({ abrasive }: { abrasive: Abrasive }) {
  const isWheel = abrasive.form === 'wheel';
  const range = gritRangeText(abrasive.gritRange);
  return (
    <div className="flex flex-col gap-8">
      <Facts
        items={[
          { term: 'Material', value: label(ABRASIVE_MATERIALS, abrasive.material) },
          { term: 'Bond', value: label(BONDS, abrasive.bond) },
          { term: 'Form', value: label(ABRASIVE_FORMS, abrasive.form) },
          {
            term: 'Grit',
            value: (
              <>
                {abrasive.grit
                  ? `${abrasive.grit.grade} (${(GRIT_STANDARD_SHORT_LABELS as Record<string, string>)[abrasive.grit.standard] ?? abrasive.grit.standard})`
                  : '—'}
                {abrasive.gritUm ? ` ≈ ${formatMicrometres(abrasive.gritUm)} µm` : ''}
                {range ? <span className="block text-sm text-muted">Dressable across {range}</span> : null}
              </>
            ),
          },
          ...(abrasive.wheelDiameterMm
            ? [
                {
                  term: 'Size',
                  value: `Ø ${formatNumber(abrasive.wheelDiameterMm, 0)} mm${abrasive.widthMm ? ` × ${formatNumber(abrasive.widthMm, 0)} mm wide` : ''}`,
                },
              ]
            : []),
          {
            term: 'Wear',
            value: abrasive.wears
              ? 'Wears and shrinks in use: re-measure the diameter before setting an angle.'
              : 'Keeps its diameter in use.',
          },
          { term: 'Coolant', value: label(COOLANTS, abrasive.coolant) },
          { term: 'Side usable for flat bevels', value: abrasive.sideUsable ? 'yes' : 'no' },
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
          <ServerHtml html={abrasive.bodyHtml} className="max-w-3xl" />
        </section>
      ) : null}
    </div>
  );
}
