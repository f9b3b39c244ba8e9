import type { TracePort, TraceRequest, TraceResponse } from './trace-protocol';

/**
 * The page's end of the trace worker. Vite bundles trace-worker.ts as its own file from this
 * `new URL(…, import.meta.url)`; the built page's CSP allows it (worker-src 'self').
 * Component tests replace this module with an in-process stand-in (jsdom has no workers).
 */
export function createTracePort(): TracePort {
  if (typeof Worker === 'undefined') throw new Error('This browser cannot run background workers, which reading trace files needs.');
  const worker = new Worker(new URL('./trace-worker.ts', import.meta.url), { type: 'module', name: 'sekundo-traces' });
  return {
    post: (message: TraceRequest) => worker.postMessage(message),
    listen: (handler) => worker.addEventListener('message', (event: MessageEvent<TraceResponse>) => handler(event.data)),
    onFailure: (handler) => {
      worker.addEventListener('error', (event) => handler(event.message || 'the trace reader stopped'));
      worker.addEventListener('messageerror', () => handler('a message from the trace reader could not be read'));
    },
  };
}
