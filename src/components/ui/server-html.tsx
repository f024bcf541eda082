/**
 * Renders HTML that the server produced from stored TipTap JSON with the shared allow-list
 * (notes of a result, bodies of reference pages). This is the only component that sets
 * inner HTML: the client never renders HTML it made up or received from a person.
 */
export function ServerHtml({ html, label, className = '' }: { html: string; label?: string; className?: string }) {
  if (!html.trim()) return null;
  return <div className={`rich-text ${className}`} aria-label={label} dangerouslySetInnerHTML={{ __html: html }} />;
}
