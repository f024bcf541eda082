import { Link } from 'react-router-dom';
import { priceReportInputSchema } from '@shared/schemas/workshop';
import { FEW } from '@shared/workshop';
import { paths } from '@/config/paths';
import { useUser } from '@/lib/auth';
import { formatDate, formatNumber } from '@/lib/format';
import { usePriceReports, useReportPrice } from '../api/price-reports';
import { EntryForm, num } from './entry-form';

const today = () => new Date().toISOString().slice(0, 10);

/** How much a median of n prices says, in words. */
function howMuch(n: number): string {
  if (n === 1) return 'one report: one person’s price, not a typical one';
  return n < FEW ? `only ${n} reports: a rough guide` : `${n} reports`;
}

/**
 * On an abrasive page: the prices members paid, as the median and n per currency and condition
 * (never converted, no reporter or shop named), and for a signed-in member a form to report one.
 */
export function PricesPaid({ abrasive }: { abrasive: string }) {
  const user = useUser();
  const prices = usePriceReports(abrasive);
  const report = useReportPrice();
  const groups = prices.data?.groups ?? [];
  return (
    <section aria-labelledby="prices-paid" className="flex flex-col gap-3">
      <h2 id="prices-paid" className="text-xl font-semibold">
        Prices members paid
      </h2>
      {prices.isError ? <p className="text-danger">The prices could not be loaded.</p> : null}
      {prices.data && groups.length === 0 ? <p className="text-muted">No prices reported yet.</p> : null}
      {groups.length ? (
        <ul className="flex max-w-3xl flex-col gap-2" aria-label="Median price paid by currency and condition">
          {groups.map((g) => (
            <li key={`${g.currency}-${g.condition}`} className="rounded-md border border-rule bg-panel px-4 py-2">
              <strong className="font-semibold">
                {g.condition === 'new' ? 'New' : 'Used'}: {formatNumber(g.medianPrice, 2)}&nbsp;{g.currency}
              </strong>{' '}
              <span>median, n = {g.n} ({howMuch(g.n)})</span>
              <span className="block text-sm text-muted">
                Paid {g.from === g.to ? `on ${formatDate(g.from)}` : `between ${formatDate(g.from)} and ${formatDate(g.to)}`}
              </span>
            </li>
          ))}
        </ul>
      ) : null}
      <p className="text-sm text-muted">Each currency on its own, never converted. Prices change with time and place; no shop is named.</p>
      {user ? (
        <EntryForm
          title="Report a price you paid"
          className="w-full max-w-3xl sm:grid-cols-2"
          schema={priceReportInputSchema}
          send={report}
          fields={[
            { key: 'price', label: 'Price paid', inputMode: 'decimal' },
            { key: 'currency', label: 'Currency, e.g. EUR' },
            { key: 'paidOn', label: 'Paid on', type: 'date' },
            { key: 'condition', label: 'Bought', options: { new: 'New', used: 'Used' } },
          ]}
          initial={{ paidOn: today(), condition: 'new' }}
          build={(v) => ({ abrasive, price: num(v.price), currency: v.currency.trim(), paidOn: v.paidOn, condition: v.condition })}
          submitLabel="Report the price"
        />
      ) : (
        <p className="text-sm">
          <Link to={paths.signIn.getHref(paths.abrasive.getHref(abrasive))}>Sign in</Link> to report a price you paid.
        </p>
      )}
    </section>
  );
}
