import type { TracePort, TraceRequest, TraceResponse } from '../../src/ui/converter/trace/trace-protocol';
import { TraceService } from '../../src/ui/converter/trace/trace-service';

/**
 * The trace worker's boundary, replaced for jsdom (which has no workers): the same service the
 * worker runs, in this thread, with every message delivered on a later task as a worker would.
 */
export function inProcessPort(): TracePort {
  let handler: ((message: TraceResponse) => void) | null = null;
  const service = new TraceService((message) => setTimeout(() => handler?.(message), 0));
  return {
    post: (message: TraceRequest) => {
      setTimeout(() => void service.handle(message), 0);
    },
    listen: (h) => {
      handler = h;
    },
    onFailure: () => undefined,
  };
}
