import type { WikiCitation } from '../types';

/** The id of a reference's list item, for links from the infobox. */
export const referenceAnchor = (index: number) => `ref-${index + 1}`;

/**
 * A superscript link from an infobox value to the reference it came from ("[1]"), or nothing
 * when the page names no source for that field.
 */
export function SourceMark({ sources, field, citations }: { sources: Record<string, number> | undefined; field: string; citations: WikiCitation[] }) {
  const index = sources?.[field];
  if (index === undefined || !citations[index]) return null;
  return (
    <sup className="ml-0.5">
      <a href={`#${referenceAnchor(index)}`} aria-label={`source: reference ${index + 1}, ${citations[index].title}`}>
        [{index + 1}]
      </a>
    </sup>
  );
}

/** A page's references, numbered as the infobox marks point at them. */
export function PageReferences({ citations }: { citations: WikiCitation[] }) {
  return (
    <section aria-labelledby="references">
      <h2 id="references" className="mb-2 text-xl font-semibold">
        References
      </h2>
      {citations.length ? (
        <ol className="list-decimal space-y-2 pl-6">
          {citations.map((c, i) => (
            <li key={`${c.title}-${i}`} id={referenceAnchor(i)}>
              {c.url ? (
                <a href={c.url} rel="noopener noreferrer nofollow">
                  {c.title}
                </a>
              ) : (
                <cite className="not-italic">{c.title}</cite>
              )}
              {[c.organisation, c.year ? String(c.year) : null].filter(Boolean).length ? `, ${[c.organisation, c.year].filter(Boolean).join(', ')}` : ''}
              {c.standard ? ` (${c.standard})` : ''}
              {c.supports ? <span className="block text-sm text-muted">Supports: {c.supports}</span> : null}
            </li>
          ))}
        </ol>
      ) : (
        <p className="text-muted">No references cited yet.</p>
      )}
    </section>
  );
}
