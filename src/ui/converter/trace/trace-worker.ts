/**
 * The trace worker: reads digitiser CSV files off the main thread (see trace-service.ts).
 * Started by trace-port.ts with `new Worker(new URL('./trace-worker.ts', import.meta.url), { type: 'module' })`.
 */
import type { TraceRequest, TraceResponse } from './trace-protocol';
import { TraceService } from './trace-service';

interface WorkerScope {
  postMessage(message: TraceResponse, transfer: Transferable[]): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<TraceRequest>) => void): void;
}

const scope = globalThis as unknown as WorkerScope;
const service = new TraceService((message, transfer = []) => scope.postMessage(message, transfer));

scope.addEventListener('message', (event) => {
  void service.handle(event.data);
});
