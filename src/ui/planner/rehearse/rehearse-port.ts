import type { RehearsePort, RehearseRequest, RehearseResponse } from './rehearse-protocol';

/**
 * The page's end of the rehearsal worker. Vite bundles rehearse-worker.ts as its own file from this
 * `new URL(…, import.meta.url)`; the built page's CSP allows it (worker-src 'self'). Component tests
 * replace this module with an in-process stand-in (jsdom has no workers).
 */
export function createRehearsePort(): RehearsePort {
  if (typeof Worker === 'undefined') throw new Error('This browser cannot run background workers, which the rehearsal needs.');
  const worker = new Worker(new URL('./rehearse-worker.ts', import.meta.url), { type: 'module', name: 'sekundo-rehearsal' });
  return {
    post: (message: RehearseRequest) => worker.postMessage(message),
    listen: (handler) => worker.addEventListener('message', (event: MessageEvent<RehearseResponse>) => handler(event.data)),
    onFailure: (handler) => {
      worker.addEventListener('error', (event) => handler(event.message || 'the rehearsal stopped'));
      worker.addEventListener('messageerror', () => handler('a message from the rehearsal could not be read'));
    },
    stop: () => worker.terminate(),
  };
}
