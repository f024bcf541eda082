import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Caution } from '@/components/ui/caution';
import { Facts } from '@/components/ui/facts';
import { formatGrams } from '@/lib/format';
import { WikiToolbar } from '@/features/wiki/components/wiki-toolbar';
import { ServerHtml } from '@/components/ui/server-html';
import { wikiHtmlClasses } from '@/features/wiki/components/wiki-html';
import { PageReferences, SourceMark } from '@/features/wiki/components/page-references';
import { MergedNote, useMergedRedirect } from '@/features/wiki/components/merged-redirect';
import type { WikiParts } from '@/features/wiki/types';
import type { MethodDetail as Method } from '@/types/api';

/** What the method page adds: the wiki parts and every version of the protocol. */
type MethodPage = Method & WikiParts & { versions?: { slug: string; name: string; version: number; current: boolean }[] };

/** A test method's page: instrument, test medium, readings per edge, retention protocol, its versions, text and references. */
export function MethodDetail({ method: data }: { method: Method }) {
  const method = data as MethodPage;
  const mergedFrom = useMergedRedirect('methods', method.slug);
  const mark = (field: string) => (method.citations ? <SourceMark sources={method.sources} field={field} citations={method.citations} /> : null);
  return (
    <div className="flex flex-col gap-8">
      <MergedNote from={mergedFrom} />
      {method.can ? <WikiToolbar section="methods" page={method} /> : null}
      <Facts
        items={[
          { term: 'Version', value: String(method.version) },
          ...(method.replacesSlug
            ? [{ term: 'Replaces', value: <Link to={paths.method.getHref(method.replacesSlug)}>the previous version</Link> }]
            : []),
          { term: 'Sharpness instrument', value: <>{method.instrument}{mark('instrument')}</> },
          { term: 'Test medium', value: <>{method.medium}{mark('medium')}</> },
          { term: 'Readings per edge', value: <>{String(method.readingsPerEdge)}{mark('readingsPerEdge')}</> },
          { term: 'Retention medium', value: <>{method.retentionMedium ?? 'no retention test'}{mark('retentionMedium')}</> },
          { term: 'Dull threshold', value: <>{method.thresholdG ? formatGrams(method.thresholdG) : '—'}{mark('thresholdG')}</> },
          ...(method.versions && method.versions.length > 1
            ? [
                {
                  term: 'Versions',
                  value: (
                    <ol className="flex flex-col gap-0.5">
                      {method.versions.map((v) => (
                        <li key={v.slug}>
                          {v.current ? (
                            <span aria-current="page">
                              Version {v.version} (this page)
                            </span>
                          ) : (
                            <Link to={paths.method.getHref(v.slug)}>Version {v.version}: {v.name}</Link>
                          )}
                        </li>
                      ))}
                    </ol>
                  ),
                },
              ]
            : []),
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
          <ServerHtml html={method.bodyHtml} className={`${wikiHtmlClasses} max-w-3xl`} />
        </section>
      ) : null}
      {method.citations ? <PageReferences citations={method.citations} /> : null}
    </div>
  );
}
