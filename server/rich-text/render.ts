import { generateHTML } from '@tiptap/html/server';
import sanitizeHtml from 'sanitize-html';
import { richTextExtensions } from '@shared/rich-text-extensions';
import type { RichTextNode } from '@shared/rich-text';

/** Tags and attributes the renderer may emit; anything else is removed on the way out. */
const sanitizeOptions: sanitizeHtml.IOptions = {
  allowedTags: ['p', 'h2', 'h3', 'h4', 'ul', 'ol', 'li', 'blockquote', 'br', 'hr', 'strong', 'em', 'code', 'a'],
  allowedAttributes: { a: ['href', 'rel'], ol: ['start'] },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowProtocolRelative: false,
  transformTags: { a: sanitizeHtml.simpleTransform('a', { rel: 'nofollow noopener noreferrer' }) },
};

/**
 * Renders a validated TipTap document to HTML with the shared extensions, then sanitises the
 * result again with the same allow-list, so a gap in either layer is closed by the other.
 */
export function renderRichText(doc: RichTextNode | null | undefined): string {
  if (!doc) return '';
  const html = generateHTML(doc as Parameters<typeof generateHTML>[0], richTextExtensions);
  return sanitizeHtml(html, sanitizeOptions);
}
