/**
 * The plan worker: computes the planner's plan (the kernel's computePlan) and the timeline figure
 * off the main thread, so typing stays answered while a large plan computes. Started by
 * plan-engine.ts with `new Worker(new URL('./plan-worker.ts', import.meta.url), { type: 'module' })`.
 *
 * Latest wins: requests that arrive while one is computing replace each other, and the plan
 * being computed is dropped at the next sensor once a newer request is waiting. Sensors already
 * computed stay in the per-sensor cache (SensorResultCache), so the newer plan starts from them.
 */
import { SensorResultCache } from '../../physics';
import { derivePlanSteps, type PlanOutcome } from './derive-plan';
import type { PlanReply, PlanRequest } from './plan-worker-protocol';
import { samePoints, unpackPlan, withoutWaveforms } from './plan-worker-protocol';
import { timelineFigure } from './timeline-figure';

interface WorkerScope {
  postMessage(message: PlanReply): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<PlanRequest>) => void): void;
}

/** Longest stretch of work before the worker looks for a newer request, ms. */
const SLICE_MS = 8;

const scope = globalThis as unknown as WorkerScope;
const cache = new SensorResultCache();
/** A request with its points as received (never 'as-before'). */
type ReceivedRequest = PlanRequest & { points: Float64Array | null };
let waiting: ReceivedRequest | null = null;
/** The points of the newest request that carried them ('as-before' means these). */
let receivedPoints: Float64Array | null = null;
let running = false;
/** The last plan computed in full (as text) and its outcome, for requests that change only the figure. */
let last: { text: string; points: Float64Array | null; outcome: PlanOutcome } | null = null;

const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/** Computes one request; returns without answering when a newer one arrived meanwhile. */
async function serve(request: ReceivedRequest): Promise<void> {
  const text = JSON.stringify(request.plan);
  let outcome: PlanOutcome;
  cache.hits = 0;
  cache.misses = 0;
  if (last?.text === text && samePoints(last.points, request.points)) outcome = last.outcome;
  else {
    const steps = derivePlanSteps(unpackPlan(request.plan, request.points), cache);
    let sliceStart = performance.now();
    for (;;) {
      const step = steps.next();
      if (step.done) {
        outcome = step.value;
        break;
      }
      if (performance.now() - sliceStart > SLICE_MS) {
        await pause();
        if (waiting !== null) return;
        sliceStart = performance.now();
      }
    }
    last = { text, points: request.points, outcome };
  }
  const t = request.timeline;
  const figure = t !== null && outcome.ok ? timelineFigure(outcome.result, t.view, t.columns, t.timeUnit) : null;
  if (waiting !== null) return;
  scope.postMessage({ id: request.id, outcome: withoutWaveforms(outcome), figure, sensorsComputed: cache.misses, sensorsReused: cache.hits });
}

async function drain(): Promise<void> {
  running = true;
  while (waiting !== null) {
    const request: ReceivedRequest = waiting;
    waiting = null;
    try {
      await serve(request);
    } catch (error) {
      last = null;
      const outcome: PlanOutcome = { ok: false, message: `The plan could not be computed: ${error instanceof Error ? error.message : String(error)}` };
      scope.postMessage({ id: request.id, outcome, figure: null, sensorsComputed: 0, sensorsReused: 0 });
    }
  }
  running = false;
}

scope.addEventListener('message', (event: MessageEvent<PlanRequest>) => {
  const request = event.data;
  // Requests arrive in the order sent: 'as-before' is the points of the last one that had them.
  if (request.points !== 'as-before') receivedPoints = request.points;
  waiting = { ...request, points: receivedPoints };
  if (!running) void drain();
});
