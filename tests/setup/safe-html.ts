import { Window } from 'happy-dom';

/** Elements the rich-text renderer may emit (server/rich-text/render.ts's allow-list). */
export const OUTPUT_TAGS = new Set(['p', 'h2', 'h3', 'h4', 'ul', 'ol', 'li', 'blockquote', 'br', 'hr', 'strong', 'em', 'code', 'a']);
/** Attributes it may emit, per element. */
export const OUTPUT_ATTRIBUTES: Record<string, Set<string>> = {
  a: new Set(['href', 'rel', 'class', 'data-broken', 'title']),
  ol: new Set(['start']),
};
const URL_ATTRIBUTES = ['href', 'src', 'action', 'formaction', 'xlink:href', 'background', 'poster', 'data'];
const SAFE_PROTOCOLS = new Set(['http:', 'https:', 'mailto:']);

// JavaScript evaluation and CSS loading are off by default in happy-dom 21; file loading too here.
const window = new Window({ settings: { disableJavaScriptFileLoading: true } });

/**
 * Problems that would let `html` run script in a browser, found by parsing it as a browser
 * would (happy-dom), never by pattern matching: any element outside the renderer's list (script,
 * iframe, svg, style, img, …), any attribute outside it (every on* handler, style, src, …),
 * and any URL attribute whose scheme is not http, https or mailto (javascript:, data:, vbscript:,
 * however encoded) or that leaves the site from a relative form ("//host").
 */
export function unsafeParts(html: string): string[] {
  const template = window.document.createElement('template');
  template.innerHTML = html;
  const problems: string[] = [];
  for (const el of Array.from(template.content.querySelectorAll('*'))) {
    const tag = el.tagName.toLowerCase();
    if (!OUTPUT_TAGS.has(tag)) problems.push(`element <${tag}>`);
    for (const attr of Array.from(el.attributes)) {
      const name = attr.name.toLowerCase();
      const value = attr.value ?? '';
      if (name.startsWith('on')) problems.push(`event handler ${name} on <${tag}>`);
      else if (!OUTPUT_ATTRIBUTES[tag]?.has(name)) problems.push(`attribute ${name} on <${tag}>`);
      if (URL_ATTRIBUTES.includes(name)) {
        let url: URL | null = null;
        try {
          url = new URL(value, 'https://edgeledger.invalid/');
        } catch {
          problems.push(`unparsable ${name}="${value}"`);
        }
        if (url && !SAFE_PROTOCOLS.has(url.protocol)) problems.push(`${url.protocol} URL in ${name} on <${tag}>`);
        if (url && /^\s*[/\\]{2}/.test(value)) problems.push(`protocol-relative ${name} on <${tag}>`);
      }
    }
  }
  return problems;
}

/** Every `…Html` string anywhere in a JSON value, with its path, for checking API responses. */
export function htmlFieldsOf(value: unknown, path = ''): { path: string; html: string }[] {
  if (Array.isArray(value)) return value.flatMap((v, i) => htmlFieldsOf(v, `${path}[${i}]`));
  if (value && typeof value === 'object') {
    return Object.entries(value).flatMap(([k, v]) =>
      typeof v === 'string' && /html$/i.test(k) ? [{ path: `${path}.${k}`, html: v }] : htmlFieldsOf(v, `${path}.${k}`),
    );
  }
  return [];
}
