import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Caution } from '@/components/ui/caution';
import { Facts } from '@/components/ui/facts';
import { ServerHtml } from '@/components/ui/server-html';
import { formatGrams } from '@/lib/format';
import type { MethodDetail as Method } from '@/types/api';

/** A test method's page: instrument, test medium, readings per edge, retention protocol. */
export function MethodDetail({ method }: { method: Method }) {
  return (
    <div className="flex flex-col gap-8">
      <Facts
        items={[
          { term: 'Version', value: String(method.version) },
          ...(method.replacesSlug
            ? [{ term: 'Replaces', value: <Link to={paths.method.getHref(method.replacesSlug)}>the previous version</Link> }]
            : []),
          { term: 'Sharpness instrument', value: method.instrument },
          { term: 'Test medium', value: method.medium },
          { term: 'Readings per edge', value: String(method.readingsPerEdge) },
          { term: 'Retention medium', value: method.retentionMedium ?? 'no retention test' },
          { term: 'Dull threshold', value: method.thresholdG ? formatGrams(method.thresholdG) : '—' },
          {
            term: 'Results',
            value: <Link to={paths.compare.getHref({ method: method.slug })}>Compare results measured this way</Link>,
          },
        ]}
      />
      <Caution title="Testing edges safely">
        Test sharpness with the instrument and its test medium, never on skin. Clamp or hold the blade as the
        instrument’s maker describes.
      </Caution>
      {method.bodyHtml?.trim() ? (
        <section aria-labelledby="protocol">
          <h2 id="protocol" className="mb-2 text-xl font-semibold">
            Protocol
          </h2>
          <ServerHtml html={method.bodyHtml} className="max-w-3xl" />
        </section>
      ) : null}
    </div>
  );
}
