import { z } from 'zod';
import { limits } from './validations';

/**
 * The allow-list of TipTap (ProseMirror) node and mark types that notes and page bodies may
 * hold. The client's editor offers exactly these, the server validates stored JSON against
 * them, and the server's renderer uses the same list.
 */
export const ALLOWED_NODES = [
  'doc',
  'paragraph',
  'text',
  'heading',
  'bulletList',
  'orderedList',
  'listItem',
  'blockquote',
  'hardBreak',
  'horizontalRule',
] as const;
export const ALLOWED_MARKS = ['bold', 'italic', 'link', 'code'] as const;
export const HEADING_LEVELS = [2, 3, 4] as const;

/**
 * The site-relative paths a link may point at: a reference page ("/steels/aisi-d2",
 * "/abrasives/<slug>", "/methods/<slug>") or a result ("/results/12"), with an optional
 * "#section". Only a single leading slash followed by a known section, so "//host",
 * "/\\host", "/../" and query strings never match.
 */
const SITE_PATH_SOURCE = '\\/(?:(?:steels|abrasives|methods)\\/[a-z0-9]+(?:-[a-z0-9]+)*|results\\/[1-9][0-9]{0,9})(?:#[a-z0-9-]{1,80})?';

/** A site-relative link to a page or result, case-sensitive (slugs are lower-case). */
export const SITE_PATH = new RegExp(`^${SITE_PATH_SOURCE}$`);

/**
 * A link may point only at the web, at an e-mail address, or at a page of this site (SITE_PATH).
 * The scheme is matched in any case, the site path only in lower case (no `i` flag), so
 * "/Steels/X" is refused rather than stored as a link that can never resolve.
 */
export const SAFE_HREF = new RegExp(`^(?:(?:[Hh][Tt][Tt][Pp][Ss]?:\\/\\/|[Mm][Aa][Ii][Ll][Tt][Oo]:)[^\\s<>"]+|${SITE_PATH_SOURCE})$`);

/** The page a site-relative link points at, or null when `href` is not one (e.g. an https address). */
export function parseSitePath(href: string): { section: 'steels' | 'abrasives' | 'methods' | 'results'; key: string } | null {
  if (!SITE_PATH.test(href)) return null;
  const [, section, key] = href.split('#')[0].split('/');
  return { section: section as 'steels' | 'abrasives' | 'methods' | 'results', key };
}

export interface RichTextMark {
  type: (typeof ALLOWED_MARKS)[number];
  attrs?: { href?: string };
}
export interface RichTextNode {
  type: (typeof ALLOWED_NODES)[number];
  attrs?: { level?: number; start?: number };
  content?: RichTextNode[];
  marks?: RichTextMark[];
  text?: string;
}

const markSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('bold') }).strict(),
  z.object({ type: z.literal('italic') }).strict(),
  z.object({ type: z.literal('code') }).strict(),
  z
    .object({
      type: z.literal('link'),
      attrs: z
        .object({
          href: z.string().max(2000).regex(SAFE_HREF, 'links may use only http, https, mailto or a page path such as /steels/aisi-d2'),
        })
        .passthrough()
        .transform(({ href }) => ({ href })),
    })
    .strict(),
]);

const nodeSchema: z.ZodType<RichTextNode> = z.lazy(() =>
  z
    .object({
      type: z.enum(ALLOWED_NODES),
      attrs: z
        .object({
          level: z.number().int().optional(),
          start: z.number().int().min(0).max(100_000).optional(),
        })
        .passthrough()
        .transform(({ level, start }) => ({
          ...(level !== undefined ? { level } : {}),
          ...(start !== undefined ? { start } : {}),
        }))
        .optional(),
      content: z.array(nodeSchema).max(limits.richTextMaxNodes).optional(),
      marks: z.array(markSchema).max(8).optional(),
      text: z.string().max(limits.richTextMaxChars).optional(),
    })
    .strict()
    .superRefine((node, ctx) => {
      if (node.type === 'heading' && !HEADING_LEVELS.includes(node.attrs?.level as 2)) {
        ctx.addIssue({ code: 'custom', message: 'heading level must be 2, 3 or 4', path: ['attrs', 'level'] });
      }
      // ProseMirror throws on an empty text node, so '' is refused here rather than at render time.
      if (node.type === 'text' && (typeof node.text !== 'string' || node.text.length === 0)) {
        ctx.addIssue({ code: 'custom', message: 'a text node needs text', path: ['text'] });
      }
    }),
);

function measure(node: RichTextNode, depth: number, acc: { nodes: number; chars: number; depth: number }) {
  acc.nodes += 1;
  acc.chars += node.text?.length ?? 0;
  acc.depth = Math.max(acc.depth, depth);
  for (const child of node.content ?? []) measure(child, depth + 1, acc);
}

/** A TipTap document of allowed types, bounded in depth, node count and characters. */
export const richTextSchema = nodeSchema.superRefine((doc, ctx) => {
  if (doc.type !== 'doc') {
    ctx.addIssue({ code: 'custom', message: 'rich text must be a TipTap document (type "doc")' });
    return;
  }
  const acc = { nodes: 0, chars: 0, depth: 0 };
  measure(doc, 1, acc);
  if (acc.depth > limits.richTextMaxDepth) {
    ctx.addIssue({ code: 'custom', message: `rich text is nested too deeply (at most ${limits.richTextMaxDepth} levels)` });
  }
  if (acc.nodes > limits.richTextMaxNodes) {
    ctx.addIssue({ code: 'custom', message: `rich text has too many parts (at most ${limits.richTextMaxNodes})` });
  }
  if (acc.chars > limits.richTextMaxChars) {
    ctx.addIssue({ code: 'custom', message: `rich text is too long (at most ${limits.richTextMaxChars} characters)` });
  }
});

/** Nodes that end a block of text: a heading never runs into the paragraph after it. */
const TEXT_BLOCKS = new Set(['paragraph', 'heading', 'listItem', 'blockquote', 'codeBlock', 'tableCell', 'tableHeader']);

/**
 * Plain text of a document, for search, snippets and exports. Blocks are joined by a space, or
 * with `keepBlocks` by " · " where the block before ends without a full stop (a heading, a list
 * item), so "Heat treatment" and "Harden from 1 020 °C." read as two things, not one sentence.
 */
export function richTextToPlain(doc: RichTextNode | null | undefined, { keepBlocks = false }: { keepBlocks?: boolean } = {}): string {
  if (!doc) return '';
  const blocks: string[] = [];
  let current: string[] = [];
  const endBlock = () => {
    const text = current.join('').replace(/\s+/g, ' ').trim();
    if (text) blocks.push(text);
    current = [];
  };
  const walk = (n: RichTextNode) => {
    if (n.text) current.push(n.text);
    if (n.type === 'hardBreak') current.push(' ');
    for (const c of n.content ?? []) walk(c);
    if (TEXT_BLOCKS.has(n.type)) endBlock();
  };
  walk(doc);
  endBlock();
  if (!keepBlocks) return blocks.join(' ');
  return blocks.reduce((out, block) => (out ? `${out}${/[.!?:;…]$/.test(out) ? ' ' : ' · '}${block}` : block), '');
}
