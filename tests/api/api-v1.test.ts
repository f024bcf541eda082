import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { pageLinkHeader } from '../../server/presenters/page-links';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

/**
 * A Link header's links by relation, parsed as RFC 8288 §3 writes them:
 * `<URI-Reference>; rel="relation-type"`, links separated by commas.
 */
function linksOf(header: string | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const part of (header ?? '').split(/,\s*(?=<)/)) {
    const m = /^<([^>]*)>\s*;\s*rel="([^"]+)"$/.exec(part.trim());
    if (!m) throw new Error(`not an RFC 8288 link-value: ${part}`);
    out[m[2]] = m[1];
  }
  return out;
}

describe('the Link header of a page (RFC 8288)', () => {
  it('names first, prev, next and last, leaving out prev on the first page and next on the last', () => {
    // 45 items, 20 a page: pages 1, 2, 3 (counted by hand).
    expect(linksOf(pageLinkHeader('/api/v1/results?status=approved&page=2', { page: 2, pageSize: 20, total: 45 }))).toEqual({
      first: '/api/v1/results?status=approved&page=1',
      prev: '/api/v1/results?status=approved&page=1',
      next: '/api/v1/results?status=approved&page=3',
      last: '/api/v1/results?status=approved&page=3',
    });
    expect(Object.keys(linksOf(pageLinkHeader('/api/v1/results', { page: 1, pageSize: 20, total: 45 })))).toEqual(['first', 'next', 'last']);
    expect(Object.keys(linksOf(pageLinkHeader('/api/v1/results?page=3', { page: 3, pageSize: 20, total: 45 })))).toEqual(['first', 'prev', 'last']);
    // An empty list has one page; a page past the end points back to the last one.
    expect(linksOf(pageLinkHeader('/api/v1/results', { page: 1, pageSize: 20, total: 0 }))).toEqual({ first: '/api/v1/results?page=1', last: '/api/v1/results?page=1' });
    expect(linksOf(pageLinkHeader('/api/v1/results?page=9', { page: 9, pageSize: 20, total: 45 })).prev).toBe('/api/v1/results?page=3');
  });
});

describe('/api/v1', () => {
  it('answers every route, and the unversioned /api answers the same', async () => {
    const v1 = await request(server.url).get('/api/v1/steels').expect(200);
    const alias = await request(server.url).get('/api/steels').expect(200);
    expect(alias.body).toEqual(v1.body);
    expect((await request(server.url).get('/api/v1/no-such-route').expect(404)).body.error).toMatch(/API route/);
    expect((await request(server.url).get('/api/v1/session').expect(200)).body.csrfToken).toEqual(expect.any(String));
  });

  it('pages through the results list by its links alone, each result once', async () => {
    const seen = new Set<number>();
    let next: string | undefined = '/api/v1/results?status=approved';
    let pages = 0;
    let last = '';
    while (next) {
      const res = await request(server.url).get(next).expect(200);
      const links = linksOf(res.headers.link);
      expect(links.first).toMatch(/^\/api\/v1\/results\?status=approved&page=1$/);
      last = links.last;
      for (const r of res.body.items as { id: number }[]) {
        expect(seen.has(r.id)).toBe(false);
        seen.add(r.id);
      }
      if (pages === 0) expect(links.prev).toBeUndefined();
      next = links.next;
      pages += 1;
    }
    const first = await request(server.url).get('/api/v1/results?status=approved').expect(200);
    expect(seen.size).toBe(first.body.total);
    expect(last).toBe(`/api/v1/results?status=approved&page=${pages}`);
    expect(pages).toBe(Math.max(1, Math.ceil(first.body.total / first.body.pageSize)));
  });

  it('gives every paged list its links: the comparison (kept answers too), a cell, the audit log', async () => {
    for (let i = 0; i < 2; i++) {
      // The second asking is a kept answer (server/middleware/answer-cache.ts); it keeps its Link.
      const res = await request(server.url).get('/api/v1/compare?method=push-cut-test-v2&pageSize=5&page=2').expect(200);
      const links = linksOf(res.headers.link);
      expect(links.prev).toBe('/api/v1/compare?method=push-cut-test-v2&pageSize=5&page=1');
      expect(links.last).toBe(`/api/v1/compare?method=push-cut-test-v2&pageSize=5&page=${Math.max(1, Math.ceil(res.body.total / 5))}`);
    }
    const row = (await request(server.url).get('/api/v1/compare?method=push-cut-test-v2&pageSize=1').expect(200)).body.rows[0];
    const cell = await request(server.url).get(`/api/v1/compare/cell?method=push-cut-test-v2&cell=${encodeURIComponent(row.cell)}`).expect(200);
    expect(linksOf(cell.headers.link).first).toMatch(/\/api\/v1\/compare\/cell\?.*page=1$/);
    const admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
    const audit = await admin.agent.get('/api/v1/audit').expect(200);
    expect(linksOf(audit.headers.link)).toMatchObject({ first: '/api/v1/audit?page=1' });
  });
});
