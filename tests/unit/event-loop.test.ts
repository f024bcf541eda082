import { describe, expect, it } from 'vitest';
import { eventLoopStalls, STALL_MS, watchEventLoop } from '../../server/event-loop';

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('the event-loop watch', () => {
  it('counts a block of the loop longer than 20 ms, with its length', async () => {
    watchEventLoop();
    await pause(30);
    const before = eventLoopStalls().count;
    // Holds the loop for 80 ms: the watch's timer, due every 10 ms, runs at least 70 ms late.
    const until = performance.now() + 80;
    while (performance.now() < until);
    await pause(30);
    const after = eventLoopStalls();
    expect(after.overMs).toBe(STALL_MS);
    expect(after.count).toBeGreaterThan(before);
    expect(after.recent.at(-1)!.ms).toBeGreaterThanOrEqual(70);
  });
});
