/**
 * Watches the event loop for stalls: a timer due every 10 ms notes how late it ran; a lateness
 * over 20 ms (the most any request may hold the loop, issue 14) counts as a stall. /api/health
 * reports the count since start and the latest stalls with when they ended, so a load test can
 * tell which of its phases blocked the loop and for how long. One per process; the timer does
 * not keep the process alive.
 */
const PERIOD_MS = 10;
export const STALL_MS = 20;
const KEPT = 50;

let stalls = 0;
const recent: { at: number; ms: number }[] = [];
let timer: NodeJS.Timeout | null = null;

/** Starts watching (once; later calls do nothing). */
export function watchEventLoop(): void {
  if (timer) return;
  let due = performance.now() + PERIOD_MS;
  timer = setInterval(() => {
    const now = performance.now();
    const late = now - due;
    due = now + PERIOD_MS;
    if (late <= STALL_MS) return;
    stalls++;
    recent.push({ at: Date.now(), ms: Math.round(late) });
    if (recent.length > KEPT) recent.shift();
  }, PERIOD_MS);
  timer.unref();
}

/** Stalls over STALL_MS since the watch began, and the latest ones (end time in ms since the epoch, length in ms). */
export function eventLoopStalls(): { overMs: number; count: number; recent: { at: number; ms: number }[] } {
  return { overMs: STALL_MS, count: stalls, recent: [...recent] };
}
