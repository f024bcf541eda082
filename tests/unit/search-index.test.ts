import { describe, expect, it } from 'vitest';
import { matchedSpans, SearchIndex, tokenizeQuery, transpositions, type SearchDoc } from '../../server/search/search-index';
import type { SearchOwner } from '../../server/search/owners';

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

  it('follows upserts and removals at once, answers given before included', async () => {
    const s = await index();
    expect(s.search('coarse').hits.map((h) => h.slug)).toEqual(['aisi-d2']);
    expect(s.search('wobbleword').hits).toEqual([]);
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

describe('results and the pages they refer to', () => {
  const d2 = { key: 'steel:1', words: 'AISI D2 D2 1.2379 SKD11', label: 'AISI D2' };
  const cbn = { key: 'abrasive:7:B126', words: 'CBN wheel B126 cubic boron nitride cbn B126 126 µm', label: 'CBN wheel B126' };
  const diamond = { key: 'abrasive:8:D46', words: 'Diamond plate D46 diamond D46 46 µm', label: 'Diamond plate D46' };
  const member = { key: 'member:4', words: 'grey-hone', label: 'grey-hone' };
  const figures = { hrc: 61.04, perSideDeg: 14.95, medianG: 142.4 };
  const result = (id: number, owners: SearchOwner[], notes = ''): SearchDoc => ({ key: `result:${id}`, type: 'result', id, names: '', body: notes, owners, figures });
  const withResults = async () => {
    const s = new SearchIndex();
    await s.rebuild([...docs, result(1, [d2, cbn], 'Burr came off cleanly'), result(2, [d2, diamond]), result(3, [d2, cbn])]);
    return s;
  };

  it('matches a result through its owners, every term through one of them or its own words', async () => {
    const s = await withResults();
    expect(s.search('d2 cbn', 'result').hits.map((h) => h.id).sort()).toEqual([1, 3]);
    expect(s.search('skd11 diamond', 'result').hits.map((h) => h.id)).toEqual([2]);
    expect(s.search('cbn burr', 'result').hits.map((h) => h.id)).toEqual([1]);
    expect(s.search('diamond burr', 'result').hits).toEqual([]);
    // The result's own title is not indexed: its words are its owners'.
    expect(s.search('result').facets.result).toBe(0);
  });

  it('counts every matching result in the facet and shows at most the limit', async () => {
    const s = await withResults();
    const r = s.search('d2', 'result', 2);
    expect(r.facets.result).toBe(3);
    expect(r.hits).toHaveLength(2);
  });

  it('brings each kind’s own best few beside the best overall when no kind is asked for', async () => {
    const s = new SearchIndex();
    // Seven results on D2; two name it in their notes too, so they rank first among results.
    const many = [1, 2, 3, 4, 5, 6, 7].map((id) => result(id, [d2, id % 2 ? cbn : diamond], id === 4 || id === 6 ? 'D2 again' : ''));
    await s.rebuild([...docs, ...many]);
    const all = s.search('d2', undefined, 1);
    expect(all.facets).toMatchObject({ steel: 1, result: 7 });
    // the best overall is the steel's page; the results still show their best five, as their own search ranks them
    expect(all.hits[0].slug).toBe('aisi-d2');
    const results = all.hits.filter((h) => h.type === 'result').map((h) => h.id);
    expect(results).toHaveLength(5);
    expect(results).toEqual(s.search('d2', 'result', 5).hits.map((h) => h.id));
    expect(results.slice(0, 2).sort()).toEqual([4, 6]);
    // best first throughout, each hit once
    expect(all.hits.map((h) => h.score)).toEqual([...all.hits.map((h) => h.score)].sort((a, b) => b - a));
    expect(new Set(all.hits.map((h) => `${h.type}:${h.id ?? h.slug}`)).size).toBe(all.hits.length);
    // a kind asked for brings that kind only, at most the limit
    expect(s.search('d2', 'result', 2).hits.map((h) => h.type)).toEqual(['result', 'result']);
  });

  it('ranks a result on the page asked for above one that only names it in its notes, and one that does both first', async () => {
    const s = new SearchIndex();
    await s.rebuild([result(1, [d2, diamond], 'Finished after a CBN wheel'), result(2, [d2, cbn]), result(3, [d2, cbn], 'CBN wheel, coarse, then fine')]);
    expect(s.search('cbn', 'result').hits.map((h) => h.id)).toEqual([3, 2, 1]);
  });

  it('follows a renamed owner, a moved result and a removed one at once', async () => {
    const s = await withResults();
    s.upsert(result(3, [{ ...d2, words: 'AISI D2 renamed wobbleword' }, cbn]));
    expect(s.search('wobbleword', 'result').facets.result).toBe(3);
    s.upsert(result(2, [d2, cbn]));
    expect(s.search('diamond', 'result').facets.result).toBe(0);
    expect(s.search('cbn', 'result').facets.result).toBe(3);
    s.remove('result:1');
    expect(s.search('cbn', 'result').hits.map((h) => h.id).sort()).toEqual([2, 3]);
    expect(s.size).toBe(docs.length + 2);
  });

  it('titles a result from its owners and figures, and highlights the owner words that matched there', async () => {
    const s = new SearchIndex();
    await s.rebuild([result(1, [d2, cbn, member])]);
    const [hit] = s.search('d2 cbn').hits;
    // The figures rounded as Math.round(x * 10) / 10 rounds them (HRC, degrees) and whole grams.
    expect(hit.title).toBe('AISI D2 on CBN wheel B126 · 61 HRC · 15° per side · median 142 g · @grey-hone');
    expect(hit.titleHighlights.map(([a, b]) => hit.title.slice(a, b))).toEqual(['D2', 'CBN']);
  });

  it('shows results that score alike in the order added, up to the limit, across a removal', async () => {
    const s = new SearchIndex();
    await s.rebuild([result(1, [d2, cbn]), result(2, [d2, diamond]), result(3, [d2, cbn]), result(4, [d2, cbn]), result(5, [d2, cbn, member])]);
    expect(s.search('cbn', 'result', 3).hits.map((h) => h.id)).toEqual([1, 3, 4]);
    expect(s.search('cbn', 'result', 3).facets.result).toBe(4);
    s.remove('result:3');
    s.upsert(result(6, [d2, cbn]));
    expect(s.search('cbn', 'result', 3).hits.map((h) => h.id)).toEqual([1, 4, 6]);
    expect(s.search('cbn grey', 'result').hits.map((h) => h.id)).toEqual([5]);
    expect(s.search('d2').facets.result).toBe(5);
  });

  it('holds notes shared by several results once, and drops them with the last result that had them', async () => {
    const s = await withResults();
    s.upsert(result(4, [d2, diamond], 'Burr came off cleanly'));
    expect(s.search('burr', 'result').hits.map((h) => h.id).sort()).toEqual([1, 4]);
    expect(s.search('burr', 'result').hits[0].snippet).toBe('Burr came off cleanly');
    s.remove('result:1');
    s.upsert(result(4, [d2, diamond]));
    expect(s.search('burr').facets.result).toBe(0);
    s.upsert(result(5, [d2, cbn], 'Burr came off cleanly'));
    expect(s.search('burr cbn', 'result').hits.map((h) => h.id)).toEqual([5]);
    expect(s.has('result:5') && !s.has('result:1')).toBe(true);
  });
});

describe('tokenizeQuery', () => {
  it('drops words too common to search by, unless nothing else is left', () => {
    expect(tokenizeQuery('diamond 15 µm at 60 HRC')).toEqual(['diamond', '15', '60']);
    expect(tokenizeQuery('the')).toEqual(['the']);
    expect(tokenizeQuery('1.2379, X153CrMoV12')).toEqual(['1.2379', 'x153crmov12']);
  });
});
