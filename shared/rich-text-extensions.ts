import StarterKit from '@tiptap/starter-kit';

/**
 * TipTap extensions matching the allow-list in rich-text.ts, shared by the client's editor and
 * the server's renderer so both accept and produce exactly the same nodes and marks.
 */
export const richTextExtensions = [
  StarterKit.configure({
    heading: { levels: [2, 3, 4] },
    codeBlock: false,
    strike: false,
    underline: false,
    dropcursor: false,
    gapcursor: false,
    link: {
      openOnClick: false,
      autolink: true,
      protocols: ['http', 'https', 'mailto'],
      HTMLAttributes: { rel: 'nofollow noopener noreferrer', target: null },
    },
  }),
];
