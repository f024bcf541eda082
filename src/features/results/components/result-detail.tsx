import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { GRIT_STANDARD_SHORT_LABELS } from '@shared/grit';
import { ABRASIVE_MATERIALS, BONDS, STATUS_LABELS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { formatLength, useLengthUnit } from '@/lib/lengths';
import { Badge } from '@/components/ui/badge';
import { ServerHtml } from '@/components/ui/server-html';
import { TableFrame, tdClass, thClass } from '@/components/ui/table-frame';
import {
  formatDate,
  formatDateTime,
  formatDegrees,
  formatGrams,
  formatGritBand,
  formatMicrometres,
  formatNumber,
  label,
} from '@/lib/format';
import type { Result } from '@/types/api';
import { StatusBadge } from './status-badge';

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-1 gap-0.5 border-b border-rule/70 py-2 sm:grid-cols-[12rem_1fr] sm:gap-4">
      <dt className="text-sm font-semibold text-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  );
}

// The server names a decision by the verb sent or by the state it led to; both read the same here.
const decisionWords: Record<string, string> = {
  approve: 'Approved',
  approved: 'Approved',
  return: 'Returned with a note',
  returned: 'Returned with a note',
  reject: 'Declined',
  rejected: 'Declined',
};

/** Everything about one result: what was entered, what was derived, its notes, state and trail. */
export function ResultDetail({
  result,
  headingLevel = 2,
  methodNames = {},
}: {
  result: Result;
  headingLevel?: 2 | 3;
  /** Names of methods by slug, for the retention method (the result carries only its slug). */
  methodNames?: Record<string, string>;
}) {
  const H = headingLevel === 2 ? 'h2' : 'h3';
  const angle = result.edgeAngle;
  const [unit] = useLengthUnit();
  const reviewNote =
    result.review?.note && (result.status === 'returned' || result.status === 'rejected') ? result.review : null;

  return (
    <div className="flex flex-col gap-8">
      <section aria-label="State" className="flex flex-col gap-3">
        <p className="flex flex-wrap items-center gap-2">
          <span className="text-muted">State:</span> <StatusBadge status={result.status} />
          <span className="text-sm text-muted">
            posted {formatDate(result.createdAt)} by <Link to={paths.profile.getHref(result.author.handle)}>{result.author.displayName}</Link> (@{result.author.handle})
          </span>
          {result.author.role === 'publisher' ? <Badge tone="accent">Publisher</Badge> : null}
        </p>
        {reviewNote ? (
          <div role="note" className="rounded-md border-l-4 border-caution bg-caution-soft px-4 py-3">
            <p className="font-semibold">
              {result.status === 'returned' ? 'The reviewer asks for changes' : 'Reason it was declined'}
            </p>
            <p className="mt-1 whitespace-pre-line">{reviewNote.note}</p>
            <p className="mt-1 text-sm text-muted">
              {reviewNote.by ? `@${reviewNote.by.handle}, ` : ''}
              {formatDateTime(reviewNote.at)}
            </p>
          </div>
        ) : null}
      </section>

      <section aria-labelledby={`measured-${result.id}`}>
        <H id={`measured-${result.id}`} className="mb-2 text-xl font-semibold">
          What was measured
        </H>
        <dl>
          <Row term="Steel">
            <Link to={paths.steel.getHref(result.steel)}>{result.steelName}</Link>
          </Row>
          <Row term="Hardness">
            {formatNumber(result.hardness.value, 1)} {result.hardness.scale}
            {result.hardness.scale !== 'HRC' ? ` (≈ ${formatNumber(result.derived.hrc, 1)} HRC)` : ''}
            {result.hardness.measured === undefined ? '' : result.hardness.measured ? ', measured' : ', as stated'}
          </Row>
          {result.heatTreatment ? <Row term="Heat treatment">{result.heatTreatment}</Row> : null}
          {result.progression?.length ? (
            <Row term="Progression">
              <ol className="list-decimal pl-5">
                {result.progression.map((s, i) => (
                  <li key={i}>
                    <Link to={paths.abrasive.getHref(s.abrasive)}>{s.abrasiveName}</Link>
                    <span className="text-muted">
                      {' '}
                      · {s.materialLabel}, {s.grit.grade} (≈ {formatMicrometres(s.gritUm)} µm){s.perSideDeg !== null ? `, ${formatNumber(s.perSideDeg, 1)}° per side` : ''}
                    </span>
                  </li>
                ))}
              </ol>
            </Row>
          ) : null}
          <Row term="Final abrasive">
            <Link to={paths.abrasive.getHref(result.abrasive)}>{result.abrasiveName}</Link>
            <span className="text-muted">
              {' '}
              · {label(ABRASIVE_MATERIALS, result.abrasiveMaterial)}, {label(BONDS, result.bond).toLowerCase()} bond
            </span>
          </Row>
          <Row term="Grit">
            {result.grit ? (
              <>
                {result.grit.grade}
                {result.grit.standard ? ` (${GRIT_STANDARD_SHORT_LABELS[result.grit.standard] ?? result.grit.standard})` : ''} → {formatMicrometres(result.derived.gritUm)} µm, band{' '}
                {formatGritBand(result.derived.gritBand)}
              </>
            ) : result.derived.gritUm ? (
              <>
                the abrasive’s own grit → {formatMicrometres(result.derived.gritUm)} µm, band {formatGritBand(result.derived.gritBand)}
              </>
            ) : (
              '—'
            )}
          </Row>
          <Row term="Edge angle">
            {formatDegrees(result.derived.perSideDeg)} per side, {formatDegrees(result.derived.inclusiveDeg)} inclusive
            {'setup' in angle ? (
              <span className="block text-sm text-muted">
                from a wheel setup: wheel Ø {formatLength(angle.setup.wheelDiameterMm, unit)}, bar Ø {formatLength(angle.setup.barDiameterMm, unit)}, gap{' '}
                {formatLength(angle.setup.gapMm, unit)}, projection {formatLength(angle.setup.projectionMm, unit)}
              </span>
            ) : null}
          </Row>
          <Row term="Sharpness">
            median {formatGrams(result.derived.sharpnessMedianG)} over {result.sharpness.readingsG.length} reading
            {result.sharpness.readingsG.length === 1 ? '' : 's'} ({result.sharpness.readingsG.map((g) => formatNumber(g, 1)).join(', ')} g), method{' '}
            <Link to={paths.method.getHref(result.sharpness.method)}>{result.sharpnessMethodName}</Link>
          </Row>
          <Row term="Edge retention">
            {result.retention ? (
              <>
                {formatNumber(result.retention.cuts, 0)} cuts, method{' '}
                <Link to={paths.method.getHref(result.retention.method)}>
                  {methodNames[result.retention.method] ?? result.retention.method}
                </Link>
              </>
            ) : (
              'not tested'
            )}
          </Row>
        </dl>
      </section>

      <section aria-labelledby={`notes-${result.id}`}>
        <H id={`notes-${result.id}`} className="mb-2 text-xl font-semibold">
          Notes
        </H>
        {result.notesHtml?.trim() ? (
          <ServerHtml html={result.notesHtml} className="max-w-3xl rounded-md border border-rule bg-panel px-5 py-4" />
        ) : (
          <p className="text-muted">No notes.</p>
        )}
      </section>

      {result.trail.length > 0 ? (
        <section aria-labelledby={`trail-${result.id}`}>
          <H id={`trail-${result.id}`} className="mb-2 text-xl font-semibold">
            Trail
          </H>
          <TableFrame label="Trail of state changes">
            <table className="w-full min-w-[36rem] border-collapse">
              <thead>
                <tr>
                  <th scope="col" className={thClass}>When</th>
                  <th scope="col" className={thClass}>Change</th>
                  <th scope="col" className={thClass}>By</th>
                  <th scope="col" className={thClass}>Note</th>
                </tr>
              </thead>
              <tbody>
                {result.trail.map((t, i) => (
                  <tr key={`${t.at}-${i}`}>
                    <td className={`${tdClass} whitespace-nowrap`}>{formatDateTime(t.at)}</td>
                    <td className={tdClass}>
                      {t.from ? `${STATUS_LABELS[t.from] ?? t.from} → ` : ''}
                      {STATUS_LABELS[t.to] ?? t.to}
                    </td>
                    <td className={tdClass}>{t.by ? `@${t.by.handle}` : '—'}</td>
                    <td className={`${tdClass} whitespace-pre-line`}>{t.note || '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
          {result.review ? (
            <p className="mt-2 text-sm text-muted">
              Last decision: {decisionWords[result.review.decision] ?? result.review.decision}
              {result.review.by ? ` by @${result.review.by.handle}` : ''}, {formatDateTime(result.review.at)}.
            </p>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
