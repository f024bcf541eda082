import { describe, expect, it } from 'vitest';
import { richTextToPlain, type RichTextNode } from '../../shared/rich-text';

/** A TipTap document: a heading, a paragraph, a list of two items, a paragraph with a hard break. */
const doc: RichTextNode = {
  type: 'doc',
  content: [
    { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Heat treatment' }] },
    { type: 'paragraph', content: [{ type: 'text', text: 'Harden from ' }, { type: 'text', marks: [{ type: 'bold' }], text: '1 020 °C' }, { type: 'text', text: ' in oil.' }] },
    { type: 'bulletList', content: [
      { type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Temper twice' }] }] },
      { type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Check the hardness' }] }] },
    ] },
    { type: 'paragraph', content: [{ type: 'text', text: 'Line one' }, { type: 'hardBreak' }, { type: 'text', text: 'line two.' }] },
  ],
};

describe('richTextToPlain', () => {
  it('joins blocks by a space by default', () => {
    expect(richTextToPlain(doc)).toBe('Heat treatment Harden from 1 020 °C in oil. Temper twice Check the hardness Line one line two.');
  });

  it('keeps block boundaries when asked: a heading or list item does not run into the next block', () => {
    expect(richTextToPlain(doc, { keepBlocks: true })).toBe('Heat treatment · Harden from 1 020 °C in oil. Temper twice · Check the hardness · Line one line two.');
  });

  it('gives nothing for no document', () => {
    expect(richTextToPlain(null, { keepBlocks: true })).toBe('');
  });
});
