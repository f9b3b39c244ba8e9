import type { RehearsePort, RehearseRequest, RehearseResponse } from '../../src/ui/planner/rehearse/rehearse-protocol';
import { handleRehearseRequest } from '../../src/ui/planner/rehearse/rehearse-service';

/**
 * Runs waiting to start: while `hold` is set, a run request waits here (as in a worker still
 * starting up) until the test calls `release()`, so a test can press Cancel before it is done.
 */
export const runGate = {
  hold: false,
  pending: [] as (() => void)[],
  release(): void {
    this.hold = false;
    for (const start of this.pending.splice(0)) start();
  },
};

/**
 * The rehearsal worker's boundary, replaced for jsdom (which has no workers): the same service in
 * this thread, each request run on a later task and each message delivered on a later task, as a
 * worker would; `stop()` drops everything after it, as ending a worker does.
 */
export function inProcessRehearsePort(): RehearsePort {
  let handler: ((message: RehearseResponse) => void) | null = null;
  let stopped = false;
  const handle = (request: RehearseRequest) => {
    if (!stopped) handleRehearseRequest(request, (message) => setTimeout(() => !stopped && handler?.(message), 0));
  };
  return {
    post: (request: RehearseRequest) => {
      if (request.type === 'run' && runGate.hold) runGate.pending.push(() => handle(request));
      else setTimeout(() => handle(request), 0);
    },
    listen: (h) => {
      handler = h;
    },
    onFailure: () => undefined,
    stop: () => {
      stopped = true;
    },
  };
}
