import { describe, expect, it } from 'vitest';
import { matchedSpans, SearchIndex, transpositions, type SearchDoc } from '../../server/search/search-index';

const docs: SearchDoc[] = [
  { key: 'steel:aisi-52100', type: 'steel', slug: 'aisi-52100', title: 'AISI 52100', names: 'AISI 52100 SAE 52100 EN 100Cr6 WNr 1.3505 JIS SUJ2', body: 'A bearing steel, very clean for rolling contact.', group: 'low-alloy' },
  { key: 'steel:aisi-d2', type: 'steel', slug: 'aisi-d2', title: 'AISI D2', names: 'AISI D2 WNr 1.2379 EN X153CrMoV12 JIS SKD11', body: 'A high-carbon, high-chromium tool steel with coarse carbides.', group: 'tool' },
  { key: 'abrasive:cbn', type: 'abrasive', slug: 'cbn', title: 'CBN wheel B126', names: 'CBN electroplated B126', body: 'Cuts carbides cleanly.', group: 'cbn' },
];

const index = async () => {
  const s = new SearchIndex();
  await s.rebuild(docs);
  return s;
};

describe('transpositions', () => {
  it('swaps each pair of neighbouring characters once', () => {
    expect(transpositions('52010').sort()).toEqual(['25010', '50210', '52001', '52100'].sort());
    expect(transpositions('aab')).toEqual(['aba']);
    expect(transpositions('aa')).toEqual([]);
  });
});

describe('SearchIndex', () => {
  it('finds a swapped-digit typo of a five-character term, but keeps short terms exact', async () => {
    const s = await index();
    expect(s.search('52010').hits.map((h) => h.slug)).toEqual(['aisi-52100']);
    expect(s.search('1.2397').hits.map((h) => h.slug)).toEqual(['aisi-d2']);
    expect(s.search('D3').hits).toEqual([]);
  });

  it('ranks an exact match above a typo match', async () => {
    const s = new SearchIndex();
    await s.rebuild([
      { key: 'steel:a', type: 'steel', slug: 'a', title: 'Grade 52100', names: '', body: '' },
      { key: 'steel:b', type: 'steel', slug: 'b', title: 'Grade 52010', names: '', body: '' },
    ]);
    expect(s.search('52010').hits.map((h) => h.slug)).toEqual(['b', 'a']);
  });

  it('prefix-matches only the last term', async () => {
    const s = await index();
    expect(s.search('bear').hits.map((h) => h.slug)).toEqual(['aisi-52100']);
    expect(s.search('bear steel').hits).toEqual([]);
    expect(s.search('bearing ste').hits.map((h) => h.slug)).toEqual(['aisi-52100']);
  });

  it('counts facets by type and by group, and filters hits by type only', async () => {
    const s = await index();
    const r = s.search('carbides', 'abrasive');
    expect(r.facets).toMatchObject({ steel: 1, abrasive: 1 });
    expect(r.groups).toEqual({ steel: { tool: 1 }, abrasive: { cbn: 1 } });
    expect(r.hits.map((h) => h.slug)).toEqual(['cbn']);
  });

  it('marks matched words by offset in the snippet and the title', async () => {
    const s = await index();
    const [hit] = s.search('coarse carbides').hits;
    expect(hit.highlights.map(([a, b]) => hit.snippet.slice(a, b))).toEqual(['coarse', 'carbides']);
    const [titled] = s.search('d2').hits;
    expect(titled.titleHighlights.map(([a, b]) => titled.title.slice(a, b))).toEqual(['D2']);
  });

  it('follows upserts and removals at once', async () => {
    const s = await index();
    s.upsert({ ...docs[1], body: 'Now with a wobbleword.' });
    expect(s.search('wobbleword').hits.map((h) => h.slug)).toEqual(['aisi-d2']);
    expect(s.search('coarse').hits).toEqual([]);
    s.remove('steel:aisi-d2');
    expect(s.search('wobbleword').hits).toEqual([]);
    expect(s.size).toBe(2);
  });
});

describe('matchedSpans', () => {
  it('matches dotted designations whole, also by their parts', () => {
    expect(matchedSpans('WNr 1.2379 and EN X153CrMoV12', ['12379'])).toEqual([[4, 10]]);
    expect(matchedSpans('WNr 1.2379', ['1.2379'])).toEqual([[4, 10]]);
    expect(matchedSpans('Steel, steels.', ['steel'])).toEqual([[0, 5]]);
  });
});
