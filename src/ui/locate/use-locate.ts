import { noteThreadWork } from '../layout/main-thread-work';
import { useEffect, useState, useSyncExternalStore } from 'react';
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

interface ShownFit {
  rows: readonly LocateRowInput[] | null;
  options: LocateOptionsInput | null;
  outcome: LocateOutcome | null;
  updating: boolean;
}

let shown: ShownFit = { rows: null, options: null, outcome: null, updating: false };
const listeners = new Set<() => void>();
let port: ((request: LocateRequest) => void) | null | undefined;
let wanted: { id: number; rows: readonly LocateRowInput[] | null; options: LocateOptionsInput | null } = { id: 0, rows: null, options: null };

function publish(next: ShownFit): void {
  shown = next;
  for (const listener of listeners) listener();
}

const held = new HeldUntilTypingPauses<LocateReply>((reply) => {
  if (reply.id === wanted.id) publish({ rows: wanted.rows, options: wanted.options, outcome: reply.outcome, updating: false });
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
      const options = wanted.options;
      if (options === null) return;
      publish({ rows: wanted.rows, options, outcome: { ok: false, message: `The source could not be located: ${message}`, speed: speedOf(options), constraint: constraintOf(options) }, updating: false });
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
const current = () => shown;

/** The fit shown for the store's inputs, asked for when they change. */
function useShownFit(): { fit: ShownFit; rows: readonly LocateRowInput[]; options: LocateOptionsInput; inWorker: boolean } {
  const rows = useSekundoStore((s) => s.locateRows);
  const options = useSekundoStore((s) => s.locateOptions);
  const inWorker = locatePort() !== null;
  useEffect(() => {
    if (inWorker) request(rows, options);
  }, [rows, options, inWorker]);
  const fit = useSyncExternalStore(subscribe, current, current);
  return { fit, rows, options, inWorker };
}

/**
 * The located source (or why there is none) for the store's inputs: from the locate worker (the
 * last fit while a newer one runs), or computed here where no worker runs.
 */
export function useLocateOutcome(): LocateOutcome {
  const { fit, rows, options, inWorker } = useShownFit();
  if (!inWorker) return locateOutcomeFor(rows, options);
  // A fit of another set of rows cannot be laid over these (its indices are of its own rows).
  if (fit.outcome !== null && fit.rows?.length === rows.length) return fit.outcome;
  return { ok: false, message: 'Locating the source…', speed: speedOf(options), constraint: constraintOf(options) };
}

/** Whether the fit shown is for earlier inputs than the ones being edited. */
export function useLocateUpdating(): boolean {
  const { fit, rows, options, inWorker } = useShownFit();
  return inWorker && (fit.updating || fit.rows !== rows || fit.options !== options);
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
