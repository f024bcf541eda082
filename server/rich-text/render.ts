import { generateHTML } from '@tiptap/html/server';
import sanitizeHtml from 'sanitize-html';
import { richTextExtensions } from '@shared/rich-text-extensions';
import { SAFE_HREF, SITE_PATH, type RichTextNode } from '@shared/rich-text';

/** Tags and attributes the renderer may emit; anything else is removed on the way out. */
const sanitizeOptions: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'h2', 'h3', 'h4', 'ul', 'ol', 'li', 'blockquote', 'br', 'hr', 'strong', 'em', 'code', 'a'],
  allowedAttributes: { a: ['href', 'rel', 'class', 'data-broken', 'title'], ol: ['start'] },
  // Only the two classes the link transform below sets; nothing from a document.
  allowedClasses: { a: ['page-link', 'page-link-broken'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowProtocolRelative: false,
};

export interface RenderOptions {
  /**
   * Whether a site-relative link ("/steels/aisi-d2") points at a page that exists. When given,
   * links it answers false for are marked broken (`class="page-link page-link-broken"`,
   * `data-broken="true"`); without it, site links are rendered unmarked.
   */
  linkExists?: (href: string) => boolean;
}

/**
 * The link transform: external links get rel="nofollow noopener noreferrer"; site paths get
 * class "page-link" (and the broken marks); any other href (which validation should already
 * have refused) loses its href, so a gap in the schema cannot become a live link.
 */
function linkTransform(options: RenderOptions): sanitizeHtml.Transformer {
  return (tagName, attribs): sanitizeHtml.Tag => {
    const href = attribs.href ?? '';
    if (SITE_PATH.test(href)) {
      const broken = options.linkExists ? !options.linkExists(href.split('#')[0]) : false;
      const marks: sanitizeHtml.Attributes = broken
        ? { class: 'page-link page-link-broken', 'data-broken': 'true', title: 'No page at this address yet' }
        : { class: 'page-link' };
      return { tagName, attribs: { href, ...marks } };
    }
    if (!SAFE_HREF.test(href)) return { tagName, attribs: {} };
    return { tagName, attribs: { href, rel: 'nofollow noopener noreferrer' } };
  };
}

const CACHE_SIZE = 1000;
const generated = new Map<string, string>();

/**
 * TipTap's server renderer builds a DOM (happy-dom) for every call, a few milliseconds even for
 * one line; page bodies are read far more often than edited, so its output is kept per
 * document in a small least-recently-used map. The output depends on the document alone.
 */
function cachedGenerateHTML(doc: RichTextNode): string {
  const key = JSON.stringify(doc);
  const hit = generated.get(key);
  if (hit !== undefined) {
    generated.delete(key);
    generated.set(key, hit);
    return hit;
  }
  const html = generateHTML(doc as Parameters<typeof generateHTML>[0], richTextExtensions);
  generated.set(key, html);
  if (generated.size > CACHE_SIZE) generated.delete(generated.keys().next().value!);
  return html;
}

/**
 * Renders a validated TipTap document to HTML with the shared extensions, then sanitises the
 * result again with the same allow-list, so a gap in either layer is closed by the other.
 */
export function renderRichText(doc: RichTextNode | null | undefined, options: RenderOptions = {}): string {
  if (!doc) return '';
  return plainParagraphsHtml(doc) ?? renderWithTipTap(doc, options);
}

const escapeText = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');

/**
 * The HTML of a document made only of unmarked paragraphs (what an imported notes cell or a
 * plain note becomes), identical to TipTap's output for it (checked by a property test) but
 * without building a DOM: TipTap takes about 5 ms a document, over 50 s for a 10 000-row import.
 * Null for any other document. The output is escaped text in <p> elements only, so it needs no
 * second sanitising pass.
 */
export function plainParagraphsHtml(doc: RichTextNode): string | null {
  if (doc.type !== 'doc') return null;
  const parts: string[] = [];
  for (const p of doc.content ?? []) {
    const text = p.content?.length === 1 ? p.content[0] : undefined;
    if (p.type !== 'paragraph' || !text || text.type !== 'text' || text.marks?.length || typeof text.text !== 'string') return null;
    parts.push(`<p>${escapeText(text.text)}</p>`);
  }
  return parts.join('');
}

/** The general path: TipTap's renderer with the shared extensions, then sanitize-html. */
export function renderWithTipTap(doc: RichTextNode, options: RenderOptions = {}): string {
  const html = cachedGenerateHTML(doc);
  return sanitizeHtml(html, { ...sanitizeOptions, transformTags: { a: linkTransform(options) } });
}
