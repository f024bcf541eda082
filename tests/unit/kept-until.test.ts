/** The one cache helper of the server: kept until the change feed tells of what it follows, bounded, never keeping a raced read. */
import { describe, expect, it } from 'vitest';
import { keptUntil } from '../../server/queries/kept-until';
import { tellFollowers, type Change } from '../../server/changes';

/** What the dispatcher does after a commit that changed `change` (KEPT.accounts follows `account`). */
function committed(change: Change) {
  return tellFollowers({}, [{ id: 1, change }]);
}

describe('keptUntil', () => {
  it('reads once, then answers from memory until its event fires', async () => {
    const cache = keptUntil<string, number>('accounts');
    let reads = 0;
    const load = async () => ++reads;
    expect(await cache.read('a', load)).toBe(1);
    expect(await cache.read('a', load)).toBe(1);
    // A change it does not follow keeps it; one it follows empties it.
    await committed({ kind: 'page', pageType: 'steel', ids: [1] });
    expect(await cache.read('a', load)).toBe(1);
    await committed({ kind: 'account', ids: [1] });
    expect(await cache.read('a', load)).toBe(2);
  });

  it('hands out, but does not keep, a value read while a change happened', async () => {
    const cache = keptUntil<string, string>('accounts');
    const raced = await cache.read('a', async () => {
      await committed({ kind: 'account', ids: [1] });
      return 'old';
    });
    expect(raced).toBe('old');
    expect(cache.get('a')).toBeUndefined();
  });

  it('starts again empty past its entry count or its weight budget', () => {
    const cache = keptUntil<number, string>('accounts', { max: 3, weigh: (v) => v.length, budget: 10 });
    for (const k of [1, 2, 3]) cache.keep(k, 'ab', cache.mark());
    expect([1, 2, 3].map((k) => cache.get(k))).toEqual(['ab', 'ab', 'ab']);
    cache.keep(4, 'ab', cache.mark());
    expect([1, 4].map((k) => cache.get(k))).toEqual([undefined, 'ab']);
    cache.keep(5, 'x'.repeat(9), cache.mark());
    expect([4, 5].map((k) => cache.get(k)?.length)).toEqual([undefined, 9]);
  });
});
