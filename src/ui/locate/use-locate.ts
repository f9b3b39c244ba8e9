import { noteThreadWork } from '../layout/main-thread-work';
import { useEffect, useState, useSyncExternalStore } from 'react';
import { useValueInTransition } from '../layout/transition-value';
import { HeldUntilTypingPauses, watchTyping } from '../layout/typing-pause';
import { useSekundoStore } from '../store';
import { deriveLocate, type LocateOutcome, speedOf } from './derive-locate';
import { constraintOf, type LocateOptionsInput, type LocateRowInput } from './locate-inputs';
import type { LocateReply, LocateRequest } from './locate-worker-protocol';

/** The last few inputs and their outcomes: every panel reads the same fit, computed once per change. */
let recent: { rows: readonly LocateRowInput[]; options: LocateOptionsInput; outcome: LocateOutcome }[] = [];
const KEEP = 3;

/** The fit for the given inputs on this thread, reusing a recent one when the inputs are the same objects. */
export function locateOutcomeFor(rows: readonly LocateRowInput[], options: LocateOptionsInput): LocateOutcome {
  const hit = recent.find((e) => e.rows === rows && e.options === options);
  if (hit) return hit.outcome;
  const start = performance.now();
  const outcome = deriveLocate(rows, options);
  recent = [{ rows, options, outcome }, ...recent].slice(0, KEEP);
  // The browser test checks the page's main thread never fits while the locate worker runs.
  noteThreadWork(LOCATE_ON_THIS_THREAD, start);
  return outcome;
}

/** Performance-timeline name of a fit made on the calling thread. */
export const LOCATE_ON_THIS_THREAD = 'sekundo: source located on this thread';

// The fit runs in the locate worker (locate-worker.ts) where the browser has workers: the view
// keeps the last outcome, marked as updating, until the newest inputs are fitted. Without workers
// (jsdom in component tests) it is computed here, as above.

/** A fit and the inputs it is for (the fit's indices are of its own rows). */
export interface LocateFit {
  rows: readonly LocateRowInput[];
  options: LocateOptionsInput;
  outcome: LocateOutcome;
}

interface ShownFit {
  /** The newest fit from the worker; the same object while the page only says it is updating. */
  fit: LocateFit | null;
  updating: boolean;
}

let shown: ShownFit = { fit: null, updating: false };
const listeners = new Set<() => void>();
let port: ((request: LocateRequest) => void) | null | undefined;
let wanted: { id: number; rows: readonly LocateRowInput[] | null; options: LocateOptionsInput | null } = { id: 0, rows: null, options: null };

function publish(next: ShownFit): void {
  shown = next;
  for (const listener of listeners) listener();
}

const held = new HeldUntilTypingPauses<LocateReply>((reply) => {
  const { rows, options } = wanted;
  if (reply.id === wanted.id && rows !== null && options !== null) publish({ fit: { rows, options, outcome: reply.outcome }, updating: false });
});

function locatePort(): ((request: LocateRequest) => void) | null {
  if (port !== undefined) return port;
  port = null;
  if (typeof Worker === 'undefined') return port;
  try {
    const worker = new Worker(new URL('./locate-worker.ts', import.meta.url), { type: 'module', name: 'sekundo-locate' });
    watchTyping();
    worker.addEventListener('message', (event: MessageEvent<LocateReply>) => {
      if (event.data.id === wanted.id) held.offer(event.data);
    });
    const fail = (message: string) => {
      const { rows, options } = wanted;
      if (rows === null || options === null) return;
      publish({ fit: { rows, options, outcome: { ok: false, message: `The source could not be located: ${message}`, speed: speedOf(options), constraint: constraintOf(options) } }, updating: false });
    };
    worker.addEventListener('error', (event) => fail(event.message || 'the locate worker stopped'));
    worker.addEventListener('messageerror', () => fail('an answer from the locate worker could not be read'));
    port = (request) => worker.postMessage(request);
  } catch {
    port = null;
  }
  return port;
}

function request(rows: readonly LocateRowInput[], options: LocateOptionsInput): void {
  const post = locatePort();
  if (post === null || (rows === wanted.rows && options === wanted.options)) return;
  wanted = { id: wanted.id + 1, rows, options };
  post({ id: wanted.id, rows, options });
  if (!shown.updating) publish({ ...shown, updating: true });
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Asks the locate worker to fit each new set of inputs (once on the page: the locate view). */
export function useLocateRequests(): void {
  const rows = useSekundoStore((s) => s.locateRows);
  const options = useSekundoStore((s) => s.locateOptions);
  const inWorker = locatePort() !== null;
  useEffect(() => {
    if (inWorker) request(rows, options);
  }, [rows, options, inWorker]);
}

/**
 * The worker's newest fit, taken in as a transition (`useValueInTransition`): the panels that draw
 * it re-render at low priority in one pass a keystroke interrupts, and only when a new fit arrives
 * — not on each keystroke, nor when the page starts saying it is updating.
 */
const readFit = () => shown.fit;

/**
 * The fit on screen and the inputs it is for: the locate worker's newest (the last fit while a
 * newer one runs; the store's inputs, not yet located, before the first), or computed here from
 * the store's inputs where no worker runs.
 */
export function useLocateFit(): LocateFit {
  const inWorker = locatePort() !== null;
  const fromWorker = useValueInTransition(subscribe, readFit);
  // The store's inputs only where they are what is shown (no worker, or no fit yet).
  const storeRows = useSekundoStore((s) => (inWorker && fromWorker !== null ? null : s.locateRows));
  const storeOptions = useSekundoStore((s) => (inWorker && fromWorker !== null ? null : s.locateOptions));
  if (inWorker && fromWorker !== null) return fromWorker;
  const rows = storeRows ?? [];
  const options = storeOptions as LocateOptionsInput;
  if (!inWorker) return { rows, options, outcome: locateOutcomeFor(rows, options) };
  return { rows, options, outcome: { ok: false, message: 'Locating the source…', speed: speedOf(options), constraint: constraintOf(options) } };
}

/** The located source (or why there is none) on screen; see {@link useLocateFit}. */
export function useLocateOutcome(): LocateOutcome {
  return useLocateFit().outcome;
}

/** Whether the fit shown is for earlier inputs than the ones being edited. */
export function useLocateUpdating(): boolean {
  const inWorker = locatePort() !== null;
  const updating = useSyncExternalStore(subscribe, () => shown.updating, () => shown.updating);
  const fit = useSyncExternalStore(subscribe, () => shown.fit, () => shown.fit);
  const current = useSekundoStore((s) => fit !== null && fit.rows === s.locateRows && fit.options === s.locateOptions);
  return inWorker && (updating || !current);
}

/** `value` once it has stayed the same for `delay_ms` (the first value at once): costly maps wait for typing to pause. */
export function useSettled<T>(value: T, delay_ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(value, settled)) return;
    const timer = setTimeout(() => setSettled(value), delay_ms);
    return () => clearTimeout(timer);
  }, [value, settled, delay_ms]);
  return settled;
}
