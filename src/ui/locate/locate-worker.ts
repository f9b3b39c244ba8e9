/**
 * The locate worker: fits the source (the kernel's locateSource, through deriveLocate) off the
 * main thread, so typing an arrival stays answered with hundreds of sensors. Started by
 * locate-engine.ts. Requests that arrive while a fit runs replace each other: only the newest
 * waiting one is fitted next (latest wins).
 */
import { deriveLocate, type LocateOutcome } from './derive-locate';
import { constraintOf } from './locate-inputs';
import type { LocateReply, LocateRequest } from './locate-worker-protocol';

interface WorkerScope {
  postMessage(message: LocateReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<LocateRequest>) => void): void;
}

const scope = globalThis as unknown as WorkerScope;
let waiting: LocateRequest | null = null;
let running = false;

/** Lets requests already sent arrive before the next fit starts. */
const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

async function drain(): Promise<void> {
  running = true;
  await pause();
  while (waiting !== null) {
    const request: LocateRequest = waiting;
    waiting = null;
    let outcome: LocateOutcome;
    try {
      outcome = deriveLocate(request.rows, request.options);
    } catch (error) {
      const message = `The source could not be located: ${error instanceof Error ? error.message : String(error)}`;
      outcome = { ok: false, message, speed: { ok: false, message }, constraint: constraintOf(request.options) };
    }
    if (waiting === null) scope.postMessage({ id: request.id, outcome });
    await pause();
  }
  running = false;
}

scope.addEventListener('message', (event) => {
  waiting = event.data;
  if (!running) void drain();
});
