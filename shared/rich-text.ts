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

/** A link may point only at the web or at an e-mail address. */
export const SAFE_HREF = /^(https?:\/\/|mailto:)[^\s<>"]+$/i;

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
          href: z.string().max(2000).regex(SAFE_HREF, 'links may use only http, https or mailto'),
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
      if (node.type === 'text' && typeof node.text !== 'string') {
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

/** Plain text of a document, for search and snippets. */
export function richTextToPlain(doc: RichTextNode | null | undefined): string {
  if (!doc) return '';
  const out: string[] = [];
  const walk = (n: RichTextNode) => {
    if (n.text) out.push(n.text);
    for (const c of n.content ?? []) walk(c);
    if (n.type === 'paragraph' || n.type === 'heading' || n.type === 'listItem') out.push(' ');
  };
  walk(doc);
  return out.join('').replace(/\s+/g, ' ').trim();
}
