import { describe, expect, it } from 'vitest';
import { parseSitePath, richTextSchema, SAFE_HREF, SITE_PATH } from '@shared/rich-text';
import { renderRichText } from '../../server/rich-text/render';

const linked = (href: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'see', marks: [{ type: 'link', attrs: { href } }] }] }] });

describe('site-relative links', () => {
  it.each(['/steels/aisi-d2', '/abrasives/cbn-electroplated-wheel-250-b126', '/methods/push-cut-test-v2', '/results/12', '/steels/aisi-d2#heat-treatment'])('accepts %s', (href) => {
    expect(SAFE_HREF.test(href)).toBe(true);
    expect(SITE_PATH.test(href)).toBe(true);
    expect(richTextSchema.safeParse(linked(href)).success).toBe(true);
  });

  it.each([
    'javascript:alert(1)',
    'JAVASCRIPT:alert(1)',
    ' javascript:alert(1)',
    '//evil.example/steels/aisi-d2',
    '/\\evil.example',
    '///evil.example',
    '/steels/../admin',
    '/steels/aisi-d2?x=1',
    '/Steels/AISI-D2',
    '/admin',
    '/steels/',
    '/results/0',
    'data:text/html,<script>alert(1)</script>',
    'vbscript:msgbox(1)',
    '/steels/aisi-d2\n',
  ])('refuses %j', (href) => {
    expect(SAFE_HREF.test(href)).toBe(false);
    expect(richTextSchema.safeParse(linked(href)).success).toBe(false);
  });

  it('still accepts web and e-mail addresses in any case of scheme', () => {
    for (const href of ['https://www.astm.org/a0681-08.html', 'HTTP://example.org', 'mailto:someone@example.test']) expect(SAFE_HREF.test(href)).toBe(true);
  });

  it('tells which page a link points at', () => {
    expect(parseSitePath('/steels/aisi-d2#x')).toEqual({ section: 'steels', key: 'aisi-d2' });
    expect(parseSitePath('https://example.org/steels/aisi-d2')).toBeNull();
  });
});

describe('rendering links', () => {
  const exists = (href: string) => href === '/steels/aisi-d2';

  it('marks a link to a page that exists, without rel, and a broken one for the client to style', () => {
    expect(renderRichText(linked('/steels/aisi-d2') as never, { linkExists: exists })).toBe('<p><a href="/steels/aisi-d2" class="page-link">see</a></p>');
    expect(renderRichText(linked('/steels/no-such') as never, { linkExists: exists })).toBe(
      '<p><a href="/steels/no-such" class="page-link page-link-broken" data-broken="true" title="No page at this address yet">see</a></p>',
    );
    // Without a checker nothing is marked broken.
    expect(renderRichText(linked('/steels/no-such') as never)).toBe('<p><a href="/steels/no-such" class="page-link">see</a></p>');
  });

  it('keeps rel="nofollow noopener noreferrer" on web links', () => {
    expect(renderRichText(linked('https://example.org/') as never)).toBe('<p><a href="https://example.org/" rel="nofollow noopener noreferrer">see</a></p>');
  });

  it('drops the address of any other link that reaches the renderer unvalidated', () => {
    for (const href of ['javascript:alert(1)', '//evil.example', '/admin', '/\\evil.example']) {
      const html = renderRichText(linked(href) as never, { linkExists: () => true });
      expect(html, href).toBe('<p><a>see</a></p>');
    }
  });
});
