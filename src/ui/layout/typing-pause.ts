/**
 * Results that arrive from a worker while the person is typing wait for a pause before they are
 * drawn: drawing charts and tables takes the main thread for a while, and a keystroke that waits
 * behind it is answered late. One watcher of keys for the page; each caller holds its own latest
 * result (only the newest is drawn).
 */

/**
 * Typing pauses this long before held results are drawn, ms: longer than most gaps between the
 * keys of a word (common practice, no source).
 */
export const TYPING_PAUSE_MS = 300;

let lastTyped = Number.NEGATIVE_INFINITY;
let watching = false;

function noteTyping(): void {
  lastTyped = performance.now();
}

/**
 * Starts noting keys pressed anywhere on the page (once; nothing where there is no document). Only
 * keys: a choice made with the mouse (a select, a checkbox) is drawn at once.
 */
export function watchTyping(): void {
  if (watching || typeof document === 'undefined') return;
  watching = true;
  document.addEventListener('keydown', noteTyping, { capture: true, passive: true });
}

/** Holds the newest of a stream of results until typing pauses, then hands it on. */
export class HeldUntilTypingPauses<T> {
  private held: T | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor(
    private readonly deliver: (value: T) => void,
    private readonly quiet_ms = TYPING_PAUSE_MS,
  ) {}

  /** Delivers now when typing has paused, else once it has (a newer offer replaces this one). */
  offer(value: T): void {
    const wait = lastTyped + this.quiet_ms - performance.now();
    if (wait <= 0) {
      this.drop();
      this.deliver(value);
      return;
    }
    this.held = value;
    if (this.timer === null) {
      this.timer = setTimeout(() => {
        this.timer = null;
        const next = this.held;
        this.held = null;
        if (next !== null) this.offer(next);
      }, wait);
    }
  }

  /** Forgets a held value. */
  drop(): void {
    this.held = null;
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
  }
}
