/** The one cache helper of the server: kept until its events fire, bounded, never keeping a raced read. */
import { describe, expect, it } from 'vitest';
import { keptUntil } from '../../server/queries/kept-until';

/** A change event a test can fire. */
function event() {
  const listeners: (() => void)[] = [];
  return { on: (l: () => void) => void listeners.push(l), fire: () => listeners.forEach((l) => l()) };
}

describe('keptUntil', () => {
  it('reads once, then answers from memory until its event fires', async () => {
    const changed = event();
    const cache = keptUntil<string, number>([changed.on]);
    let reads = 0;
    const load = async () => ++reads;
    expect(await cache.read('a', load)).toBe(1);
    expect(await cache.read('a', load)).toBe(1);
    changed.fire();
    expect(await cache.read('a', load)).toBe(2);
  });

  it('hands out, but does not keep, a value read while a change happened', async () => {
    const changed = event();
    const cache = keptUntil<string, string>([changed.on]);
    const raced = await cache.read('a', async () => {
      changed.fire();
      return 'old';
    });
    expect(raced).toBe('old');
    expect(cache.get('a')).toBeUndefined();
  });

  it('starts again empty past its entry count or its weight budget', () => {
    const cache = keptUntil<number, string>([], { max: 3, weigh: (v) => v.length, budget: 10 });
    for (const k of [1, 2, 3]) cache.keep(k, 'ab', cache.mark());
    expect([1, 2, 3].map((k) => cache.get(k))).toEqual(['ab', 'ab', 'ab']);
    cache.keep(4, 'ab', cache.mark());
    expect([1, 4].map((k) => cache.get(k))).toEqual([undefined, 'ab']);
    cache.keep(5, 'x'.repeat(9), cache.mark());
    expect([4, 5].map((k) => cache.get(k)?.length)).toEqual([undefined, 9]);
  });
});
