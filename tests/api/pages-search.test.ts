import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

interface Hit {
  type: string;
  slug?: string;
  title: string;
  snippet: string;
  highlights: [number, number][];
  titleHighlights: [number, number][];
  group?: string;
}
const search = async (q: string, type?: string) => {
  const res = await request(server.url).get(`/api/search?q=${encodeURIComponent(q)}${type ? `&type=${type}` : ''}`).expect(200);
  return res.body as { hits: Hit[]; facets: Record<string, number>; groups: Record<string, Record<string, number>> };
};

describe('search over the reference pages', () => {
  it('finds the same steel page under each of its designations (AISI, WNr, EN, JIS, UNS)', async () => {
    for (const q of ['D2', 'AISI D2', '1.2379', 'X153CrMoV12', 'x153crmov12', 'SKD11', 'T30402', '12379']) {
      expect((await search(q, 'steel')).hits[0]?.slug, q).toBe('aisi-d2');
    }
    for (const q of ['52100', '100Cr6', '1.3505', 'SUJ2']) expect((await search(q, 'steel')).hits[0]?.slug, q).toBe('aisi-52100');
  });

  it('tolerates typing slips in longer terms: swapped digits, one wrong letter', async () => {
    // "52010" is 52100 with two neighbouring digits swapped; "1.2397" likewise for 1.2379.
    expect((await search('52010', 'steel')).hits[0]?.slug).toBe('aisi-52100');
    expect((await search('1.2397', 'steel')).hits[0]?.slug).toBe('aisi-d2');
    expect((await search('chromiun', 'steel')).hits.length).toBeGreaterThan(0);
    // Short terms stay exact: "D3" is not D2.
    expect((await search('D3', 'steel')).hits.map((h) => h.slug)).not.toContain('aisi-d2');
  });

  it('matches the last term as a prefix, as people type', async () => {
    expect((await search('bearing ste', 'steel')).hits.map((h) => h.slug)).toContain('aisi-52100');
  });

  it('counts hits per type and per category or material, whatever the type filter', async () => {
    const all = await search('steel');
    const steelsOnly = await search('steel', 'steel');
    expect(steelsOnly.facets).toEqual(all.facets);
    expect(steelsOnly.hits.every((h) => h.type === 'steel')).toBe(true);
    expect(all.facets.steel).toBeGreaterThanOrEqual(10);
    const categories = all.groups.steel;
    expect(Object.values(categories).reduce((a, b) => a + b, 0)).toBe(all.facets.steel);
    expect(Object.keys(categories)).toEqual(expect.arrayContaining(['carbon', 'tool', 'stainless']));
    const cbn = await search('cbn', 'abrasive');
    expect(cbn.groups.abrasive.cbn).toBeGreaterThan(0);
    expect(cbn.hits.every((h) => h.group !== undefined)).toBe(true);
  });

  it('gives snippets with the offsets of the matched words', async () => {
    const { hits } = await search('carbides vitrified', 'steel');
    expect(hits.length).toBeGreaterThan(0);
    for (const h of hits) {
      expect(h.highlights.length).toBeGreaterThan(0);
      for (const [start, end] of h.highlights) expect(h.snippet.slice(start, end).toLowerCase()).toMatch(/^(carbides?|vitrified\w*)$/);
    }
    const d2 = (await search('1.2379', 'steel')).hits[0];
    expect(d2.highlights.map(([s, e]) => d2.snippet.slice(s, e))).toContain('1.2379');
    const title = (await search('AISI', 'steel')).hits[0];
    expect(title.titleHighlights.map(([s, e]) => title.title.slice(s, e))).toEqual(['AISI']);
  });
});

describe('search follows edits without a restart', () => {
  it('finds a new designation, a renamed page and new body text as soon as the edit is live', async () => {
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const page = (await request(server.url).get('/api/steels/aisi-m2').expect(200)).body;
    expect((await search('W6Mo5Cr4V2', 'steel')).hits.map((h) => h.slug)).not.toContain('aisi-m2');
    const fields = ['name', 'category', 'designations', 'composition', 'hardnessHrc', 'citations', 'sources'];
    const edit = {
      ...Object.fromEntries(fields.map((k) => [k, page[k]])),
      // GB/T 9943 designation of the same grade (from memory).
      designations: [...page.designations, { system: 'GB', code: 'W6Mo5Cr4V2' }],
      name: 'AISI M2 high-speed steel',
      body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Molybdenum high-speed steel; tungstenlike wear on the wheel.' }] }] },
      baseRevision: page.revision,
      summary: 'GB designation, name, text',
    };
    const res = await mod.agent.put('/api/steels/aisi-m2').set('X-CSRF-Token', mod.csrf).send(edit);
    expect(res.status).toBe(200);
    expect((await search('W6Mo5Cr4V2', 'steel')).hits[0]?.slug).toBe('aisi-m2');
    expect((await search('tungstenlike')).hits.map((h) => h.slug)).toEqual(['aisi-m2']);
    // Results on the steel carry its new name in their titles.
    const results = await search('M2 high-speed', 'result');
    expect(results.hits.length).toBeGreaterThan(0);
    expect(results.hits[0].title).toMatch(/AISI M2 high-speed steel/);
  });

  it('does not show a member’s proposal in search until it is approved', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const page = (await request(server.url).get('/api/methods/push-cut-test-v1').expect(200)).body;
    const fields = ['name', 'instrument', 'medium', 'readingsPerEdge', 'retentionMedium', 'thresholdG', 'citations', 'sources'];
    const body = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Superseded; kept for older results filamentwise.' }] }] };
    const res = await member.agent
      .put('/api/methods/push-cut-test-v1')
      .set('X-CSRF-Token', member.csrf)
      .send({ ...Object.fromEntries(fields.map((k) => [k, page[k]])), body, baseRevision: page.revision, summary: 'Shorter' });
    expect(res.status).toBe(202);
    expect((await search('filamentwise')).hits).toHaveLength(0);
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    await mod.agent.post(`/api/page-revisions/${res.body.revision.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    expect((await search('filamentwise')).hits.map((h) => h.slug)).toEqual(['push-cut-test-v1']);
  });
});
