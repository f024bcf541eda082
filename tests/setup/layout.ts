import type { Page } from 'playwright-core';

/**
 * Layout checks for the browser tests: the texts of `selector` whose bounding boxes overlap
 * another's (as "a / b" pairs; half a pixel of touching allowed), and how far the page is wider
 * than its window.
 */
export async function overlaps(page: Page, selector: string): Promise<string[]> {
  return page.$$eval(selector, (els) => {
    const boxes = els.map((e) => ({ text: e.textContent ?? '', r: e.getBoundingClientRect() })).filter((b) => b.r.width > 0);
    const out: string[] = [];
    for (let i = 0; i < boxes.length; i++)
      for (let j = i + 1; j < boxes.length; j++) {
        const [a, b] = [boxes[i].r, boxes[j].r];
        if (a.left < b.right - 0.5 && b.left < a.right - 0.5 && a.top < b.bottom - 0.5 && b.top < a.bottom - 0.5) out.push(`${boxes[i].text} / ${boxes[j].text}`);
      }
    return out;
  });
}

/** How far the page is wider than the window (0 when nothing overflows sideways). */
export const sidewaysOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
