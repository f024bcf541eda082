import { SAFE_HREF, type RichTextMark, type RichTextNode } from '@shared/rich-text';

/**
 * Small builders for TipTap (ProseMirror JSON) documents, so the demo data's page bodies and
 * notes read as prose instead of nested objects. They produce only the node and mark types that
 * shared/rich-text.ts allows; `link` refuses anything but an https address.
 */

/** Inline content: plain strings become text nodes; nodes (text, hardBreak) pass through. */
export type Inline = string | RichTextNode;

function inline(parts: Inline[]): RichTextNode[] {
  return parts.map((part) => {
    if (typeof part !== 'string') return part;
    // ProseMirror rejects empty text nodes, so an empty string is a mistake in the data.
    if (part.length === 0) throw new Error('rich text: a text part must not be empty');
    return { type: 'text', text: part };
  });
}

/** A text node carrying the given marks. */
export function text(value: string, ...marks: RichTextMark[]): RichTextNode {
  if (value.length === 0) throw new Error('rich text: a text part must not be empty');
  return marks.length ? { type: 'text', text: value, marks } : { type: 'text', text: value };
}

/** Bold text. */
export const bold = (value: string): RichTextNode => text(value, { type: 'bold' });
/** Italic text. */
export const italic = (value: string): RichTextNode => text(value, { type: 'italic' });
/** Inline code (used for designations and grit grades typed as a person would type them). */
export const code = (value: string): RichTextNode => text(value, { type: 'code' });

/** A link; only https addresses are accepted in the demo data. */
export function link(label: string, href: string): RichTextNode {
  if (!href.startsWith('https://') || !SAFE_HREF.test(href)) {
    throw new Error(`rich text: link href must be an https address, got "${href}"`);
  }
  return text(label, { type: 'link', attrs: { href } });
}

/** A line break inside a paragraph. */
export const br = (): RichTextNode => ({ type: 'hardBreak' });
/** A horizontal rule between sections. */
export const hr = (): RichTextNode => ({ type: 'horizontalRule' });

/** A paragraph of inline parts. */
export function p(...parts: Inline[]): RichTextNode {
  return { type: 'paragraph', content: inline(parts) };
}

function heading(level: 2 | 3 | 4, parts: Inline[]): RichTextNode {
  return { type: 'heading', attrs: { level }, content: inline(parts) };
}
/** A level-2 heading (level 1 is the page title, shown outside the body). */
export const h2 = (...parts: Inline[]): RichTextNode => heading(2, parts);
/** A level-3 heading. */
export const h3 = (...parts: Inline[]): RichTextNode => heading(3, parts);
/** A level-4 heading. */
export const h4 = (...parts: Inline[]): RichTextNode => heading(4, parts);

/**
 * A list item: a string or an inline node becomes one paragraph; an array is one paragraph of
 * several inline parts; a block node (paragraph, nested list) is kept as it is.
 */
export type ListEntry = Inline | Inline[];

function listItem(entry: ListEntry): RichTextNode {
  if (Array.isArray(entry)) return { type: 'listItem', content: [p(...entry)] };
  if (typeof entry !== 'string' && (entry.type === 'paragraph' || entry.type === 'bulletList' || entry.type === 'orderedList')) {
    return { type: 'listItem', content: [entry] };
  }
  return { type: 'listItem', content: [p(entry)] };
}

/** A bulleted list. */
export function ul(...items: ListEntry[]): RichTextNode {
  return { type: 'bulletList', content: items.map(listItem) };
}

/** A numbered list, starting at 1. */
export function ol(...items: ListEntry[]): RichTextNode {
  return { type: 'orderedList', attrs: { start: 1 }, content: items.map(listItem) };
}

/** A block quote holding block nodes. */
export function quote(...blocks: RichTextNode[]): RichTextNode {
  return { type: 'blockquote', content: blocks };
}

/** A whole document. */
export function doc(...blocks: RichTextNode[]): RichTextNode {
  if (blocks.length === 0) throw new Error('rich text: a document needs at least one block');
  return { type: 'doc', content: blocks };
}
