/**
 * How fast the page answers a keystroke, measured in the page (the browser benchmark
 * tests/bench/keystroke-limits.browser.ts and the browser test tests/e2e/limits.spec.ts use it):
 * from the keydown event's own time stamp (so time spent waiting for a busy main thread counts) to
 * the end of the first frame in which the field shows the keystroke — the animation frame that
 * sees the new value, and its style, layout and paint (a task posted from that frame's callback
 * runs after them).
 */
import type { Locator, Page } from 'playwright-core';

/** Gaps between keystrokes, ms, in turn: a word typed, then pauses long enough for results to draw. */
export const DEFAULT_KEY_GAPS_MS: readonly number[] = [120, 150, 120, 400, 130, 700, 160, 250];

declare global {
  interface Window {
    /** Keydown → frame showing the keystroke, ms, one entry per keystroke (NaN: never shown). */
    sekundoKeyTimes?: number[];
  }
}

/**
 * The page-side timer, as text: tsx names the functions of a script it compiles (`__name`), which
 * the page does not have, so the part that runs in the page is plain JavaScript.
 */
const KEYSTROKE_TIMER = `(() => {
  const times = (window.sekundoKeyTimes = []);
  document.addEventListener('keydown', (event) => {
    const field = event.target;
    if (!(field instanceof HTMLInputElement || field instanceof HTMLTextAreaElement)) return;
    if (event.key.length !== 1 && event.key !== 'Backspace' && event.key !== 'Delete') return;
    const start = event.timeStamp;
    const before = field.value;
    const slot = times.push(Number.NaN) - 1;
    const look = () => requestAnimationFrame(() => {
      if (field.value !== before) {
        const after = new MessageChannel();
        after.port1.onmessage = () => { times[slot] = performance.now() - start; };
        after.port2.postMessage(null);
      } else if (performance.now() - start < 10000) look();
    });
    look();
  }, true);
})()`;

/** Starts timing every keystroke in the page. */
export async function watchKeystrokes(page: Page): Promise<void> {
  await page.evaluate(KEYSTROKE_TIMER);
}

/** The keystroke times so far, ms. */
export async function keystrokeTimes(page: Page): Promise<number[]> {
  return page.evaluate(() => [...(window.sekundoKeyTimes ?? [])]);
}

/**
 * Types into a field as a person would: the caret at the start, then a digit and Backspace in
 * turn (each keystroke changes the value, so each is an edit of the plan), `count` keystrokes.
 */
export async function typeDigits(page: Page, field: Locator, count = 16, gaps_ms: readonly number[] = DEFAULT_KEY_GAPS_MS): Promise<void> {
  await field.click();
  await field.press('Home');
  for (let i = 0; i < count; i++) {
    await page.keyboard.press(i % 2 === 0 ? String(2 + ((i / 2) % 7)) : 'Backspace');
    await page.waitForTimeout(gaps_ms[i % gaps_ms.length] ?? 150);
  }
}

/** The q-quantile (0–1) of the values, nearest rank; NaN (a keystroke never shown) counts as the worst. */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].map((v) => (Number.isNaN(v) ? Number.POSITIVE_INFINITY : v)).sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))] as number;
}
