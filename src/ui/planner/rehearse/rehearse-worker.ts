/**
 * The rehearsal worker: synthetic records and picks off the main thread (rehearse-service.ts).
 * Started by rehearse-port.ts; a cancel ends the worker, and the next run starts a new one.
 */
import type { RehearseRequest, RehearseResponse } from './rehearse-protocol';
import { handleRehearseRequest } from './rehearse-service';

interface WorkerScope {
  postMessage(message: RehearseResponse): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<RehearseRequest>) => void): void;
}

const scope = globalThis as unknown as WorkerScope;
scope.addEventListener('message', (event) => handleRehearseRequest(event.data, (message) => scope.postMessage(message)));
