/**
 * How fast the page answers a keystroke, measured in the page (the browser benchmark
 * tests/bench/keystroke-limits.browser.ts and the browser test tests/e2e/limits.spec.ts use it),
 * two ways:
 *
 * - answered (`keystrokeTimes`): the browser's own Event Timing (W3C Event Timing API, the measure
 *   behind Interaction to Next Paint): from the keydown's time stamp (time spent waiting for a busy
 *   main thread counts) to the next paint after its handlers ran — when the keystroke is on
 *   screen. The browser reports a keystroke only from 16 ms on (its smallest threshold), in steps
 *   of 8 ms; one it does not report was answered within 16 ms and counts as 16.
 * - frame and the task after it (`frameTimes`): from the same time stamp to a task posted from the
 *   first animation frame that sees the new value. It runs after that frame's style, layout and
 *   paint, and also after any task already queued, such as the results drawn after a keystroke,
 *   so it reads higher; kept for comparison with earlier figures.
 */
import type { Locator, Page } from 'playwright-core';

/** Gaps between keystrokes, ms, in turn: a word typed, then pauses long enough for results to draw. */
export const DEFAULT_KEY_GAPS_MS: readonly number[] = [120, 150, 120, 400, 130, 700, 160, 250];

/** What the browser reports of a keystroke answered quicker than this, ms (the Event Timing API's smallest threshold). */
export const UNREPORTED_WITHIN_MS = 16;

interface KeyRecord {
  /** The keydown event's time stamp (the Event Timing entry's start time). */
  start: number;
  /** Keydown → the task after the first frame showing the keystroke, ms (NaN: never shown). */
  frame: number;
}

declare global {
  interface Window {
    sekundoKeys?: KeyRecord[];
    /** Event Timing entries of keyboard events: start time → the longest duration reported, ms. */
    sekundoKeyEvents?: Map<number, number>;
  }
}

/**
 * The page-side timer, as text: tsx names the functions of a script it compiles (`__name`), which
 * the page does not have, so the part that runs in the page is plain JavaScript.
 */
const KEYSTROKE_TIMER = `(() => {
  const keys = (window.sekundoKeys = []);
  const events = (window.sekundoKeyEvents = new Map());
  new PerformanceObserver((list) => {
    for (const entry of list.getEntries()) {
      if (entry.name !== 'keydown' && entry.name !== 'keypress') continue;
      events.set(entry.startTime, Math.max(events.get(entry.startTime) ?? 0, entry.duration));
    }
  }).observe({ type: 'event', durationThreshold: ${UNREPORTED_WITHIN_MS} });
  document.addEventListener('keydown', (event) => {
    const field = event.target;
    if (!(field instanceof HTMLInputElement || field instanceof HTMLTextAreaElement)) return;
    if (event.key.length !== 1 && event.key !== 'Backspace' && event.key !== 'Delete') return;
    const start = event.timeStamp;
    const before = field.value;
    const record = { start, frame: Number.NaN };
    keys.push(record);
    const look = () => requestAnimationFrame(() => {
      if (field.value !== before) {
        const after = new MessageChannel();
        after.port1.onmessage = () => { record.frame = performance.now() - start; };
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

/**
 * Keydown → next paint, ms, per keystroke so far, from the browser's Event Timing (see the top of
 * this file): a keystroke the browser did not report counts as {@link UNREPORTED_WITHIN_MS}; one
 * never shown (the field's value did not change) as NaN.
 */
export async function keystrokeTimes(page: Page): Promise<number[]> {
  // Entries are delivered a little after the paint: let the observer catch up.
  await page.waitForTimeout(300);
  return page.evaluate(
    (unreported) => (window.sekundoKeys ?? []).map((k) => (Number.isNaN(k.frame) ? Number.NaN : (window.sekundoKeyEvents?.get(k.start) ?? unreported))),
    UNREPORTED_WITHIN_MS,
  );
}

/** Keydown → the task after the first frame showing the keystroke, ms, per keystroke so far (see the top of this file). */
export async function frameTimes(page: Page): Promise<number[]> {
  return page.evaluate(() => (window.sekundoKeys ?? []).map((k) => k.frame));
}

/**
 * Types into a field as a person would: the field scrolled into view and the page left to settle
 * (SETTLE_BEFORE_TYPING_MS), a click into it with the caret at the start, then a digit and
 * Backspace in turn (each keystroke changes the value, so each is an edit of the plan), `count`
 * keystrokes. A person takes longer than that between scrolling and typing; a keystroke sent
 * within milliseconds of the scroll waits for the page's repaint after it (measured: 64–96 ms for
 * that first keystroke, 24–48 ms once the page has settled).
 */
export async function typeDigits(page: Page, field: Locator, count = 16, gaps_ms: readonly number[] = DEFAULT_KEY_GAPS_MS): Promise<void> {
  await field.scrollIntoViewIfNeeded();
  await page.waitForTimeout(SETTLE_BEFORE_TYPING_MS);
  await field.click();
  await field.press('Home');
  for (let i = 0; i < count; i++) {
    await page.keyboard.press(i % 2 === 0 ? String(2 + ((i / 2) % 7)) : 'Backspace');
    await page.waitForTimeout(gaps_ms[i % gaps_ms.length] ?? 150);
  }
}

/** Pause between scrolling a field into view and typing into it, ms (common practice, no source: well under a person's). */
export const SETTLE_BEFORE_TYPING_MS = 300;

/** The q-quantile (0–1) of the values, nearest rank; NaN (a keystroke never shown) counts as the worst. */
export function quantile(values: readonly number[], q: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].map((v) => (Number.isNaN(v) ? Number.POSITIVE_INFINITY : v)).sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))] as number;
}
