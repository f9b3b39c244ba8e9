import type { RehearsePort, RehearseRequest, RehearseResponse } from '../../src/ui/planner/rehearse/rehearse-protocol';
import { handleRehearseRequest } from '../../src/ui/planner/rehearse/rehearse-service';

/**
 * The rehearsal worker's boundary, replaced for jsdom (which has no workers): the same service in
 * this thread, each request run on a later task (a run after 100 ms, as a worker starting up, so a
 * person can press Cancel before it is done) and each message delivered on a later task, as a
 * worker would; `stop()` drops everything after it, as ending a worker does.
 */
export function inProcessRehearsePort(): RehearsePort {
  let handler: ((message: RehearseResponse) => void) | null = null;
  let stopped = false;
  return {
    post: (request: RehearseRequest) => {
      setTimeout(() => {
        if (!stopped) handleRehearseRequest(request, (message) => setTimeout(() => !stopped && handler?.(message), 0));
      }, request.type === 'run' ? 100 : 0);
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
