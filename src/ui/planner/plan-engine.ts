/**
 * The page's end of the plan worker (plan-worker.ts): the planner's results are computed there,
 * off the main thread, so a keystroke is answered at once however large the plan. The page
 * keeps showing the last results, marked as updating, until the answer for the newest plan
 * comes; answers to plans already replaced are dropped (latest wins).
 *
 * Where no worker can run (jsdom in the component tests, a browser without module workers) the
 * plan is computed on the calling thread, as before, with the same per-sensor cache.
 */
import { noteThreadWork } from '../layout/main-thread-work';
import { useEffect, useMemo, useSyncExternalStore } from 'react';
import type { PlanFile } from '../../io/plan-file';
import { SensorResultCache } from '../../physics';
import { useValueInTransition } from '../layout/transition-value';
import { HeldUntilTypingPauses, watchTyping } from '../layout/typing-pause';
import { derivePlan, PLAN_ON_THIS_THREAD, type PlanOutcome } from './derive-plan';
import { type PlanReply, type PlanRequest, packPlan, sameTimeline, type TimelineRequest } from './plan-worker-protocol';
import { type TimelineFigure, timelineFigure } from './timeline-figure';

/** What the planner shows: the newest answer, and whether a newer plan is being computed. */
export interface ShownPlan {
  /** The plan the outcome is for (null before the first answer). */
  plan: PlanFile | null;
  outcome: PlanOutcome | null;
  /** The timeline for `outcome` as last asked for (worker only). */
  figure: TimelineFigure | null;
  timeline: TimelineRequest | null;
  /** A newer plan or timeline than the one shown has been asked for and not yet answered. */
  updating: boolean;
}

interface PlanPort {
  post(request: PlanRequest): void;
}

let shown: ShownPlan = { plan: null, outcome: null, figure: null, timeline: null, updating: false };
const listeners = new Set<() => void>();
let port: PlanPort | null | undefined;
let nextId = 0;
/** The points of the last request sent (the worker keeps them). */
let lastSentPoints: Float64Array | null = null;
/** The newest request sent: its id, plan and timeline. */
let wanted: { id: number; plan: PlanFile | null; timeline: TimelineRequest | null } = { id: 0, plan: null, timeline: null };
const localCache = new SensorResultCache();

function publish(next: ShownPlan): void {
  shown = next;
  for (const listener of listeners) listener();
}

/** Answers wait for a pause in typing before they are drawn (see typing-pause.ts). */
const held = new HeldUntilTypingPauses<PlanReply>((reply) => {
  if (reply.id !== wanted.id) return;
  publish({ plan: wanted.plan, outcome: reply.outcome, figure: reply.figure, timeline: wanted.timeline, updating: false });
});

function receive(reply: PlanReply): void {
  // An answer to a plan already replaced is dropped: the newer one is on its way.
  if (reply.id !== wanted.id) return;
  held.offer(reply);
}

function fail(message: string): void {
  publish({ plan: wanted.plan, outcome: { ok: false, message: `The plan could not be computed: ${message}` }, figure: null, timeline: wanted.timeline, updating: false });
}

/** The worker, started on first use; null where none can run. */
function planPort(): PlanPort | null {
  if (port !== undefined) return port;
  if (typeof Worker === 'undefined') {
    port = null;
    return port;
  }
  try {
    const worker = new Worker(new URL('./plan-worker.ts', import.meta.url), { type: 'module', name: 'sekundo-plans' });
    // Keys typed anywhere on the page hold new results back until typing pauses.
    watchTyping();
    worker.addEventListener('message', (event: MessageEvent<PlanReply>) => receive(event.data));
    worker.addEventListener('error', (event) => fail(event.message || 'the plan worker stopped'));
    worker.addEventListener('messageerror', () => fail('an answer from the plan worker could not be read'));
    port = { post: (request) => worker.postMessage(request) };
  } catch {
    port = null;
  }
  return port;
}

function send(): void {
  const target = planPort();
  const plan = wanted.plan;
  if (target === null || plan === null) return;
  nextId += 1;
  wanted = { ...wanted, id: nextId };
  const packed = packPlan(plan);
  // The points the worker already has (an edit elsewhere in the plan) are not copied to it again.
  const points = packed.points !== null && packed.points === lastSentPoints ? 'as-before' : packed.points;
  lastSentPoints = packed.points;
  target.post({ id: nextId, plan: packed.plan, points, timeline: wanted.timeline });
  if (!shown.updating) publish({ ...shown, updating: true });
}

/** Asks for the plan's results (nothing new when it is the plan already asked for). */
export function requestPlan(plan: PlanFile): void {
  if (plan === wanted.plan) return;
  wanted = { ...wanted, plan };
  send();
}

/** Asks for the timeline drawn at this span, width and unit. */
export function requestTimeline(timeline: TimelineRequest): void {
  if (sameTimeline(timeline, wanted.timeline)) return;
  wanted = { ...wanted, timeline };
  send();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Whether results come from the worker (false: computed on this thread). */
export function planWorkerRuns(): boolean {
  return planPort() !== null;
}

/** One part of what the worker last gave, followed on its own: a view re-renders only when its part changes. */
function useShownPart<K extends keyof ShownPlan>(part: K): ShownPlan[K] {
  const read = () => shown[part];
  return useSyncExternalStore(subscribe, read, read);
}

/** The results themselves, taken in as a transition (`useValueInTransition`): one low-priority pass a keystroke interrupts. */
const readOutcome = () => shown.outcome;
const readFigure = () => shown.figure;

/**
 * The outcome the planner shows. `plan`: the store's plan where no worker runs (computed here), null
 * where the worker runs: the newest answer then, whatever the plan being typed (usePlanRequests asks
 * for each plan), so a keystroke re-renders none of the views that read the results — not even
 * when the page starts saying it is updating (that is `useShownUpdating`, a part of its own).
 */
export function useShownOutcome(plan: PlanFile | null): PlanOutcome | null {
  const fromWorker = useValueInTransition(subscribe, readOutcome);
  const here = useMemo(() => (plan === null ? null : derivePlan(plan, localCache)), [plan]);
  return plan !== null ? here : fromWorker;
}

/** Whether a newer plan or timeline than the one shown is being computed (never where the plan is computed here). */
export function useShownUpdating(plan: PlanFile | null): boolean {
  const updating = useShownPart('updating');
  return plan === null && updating;
}

/** The same, read once (a chart's "drawn" callback), without following it. */
export function shownIsUpdating(): boolean {
  return shown.updating;
}

/** Asks the worker for each new plan (`plan`: the store's plan where the worker runs, else null); used once, by the planner view. */
export function usePlanRequests(plan: PlanFile | null): void {
  useEffect(() => {
    if (plan !== null) requestPlan(plan);
  }, [plan]);
}

/** The timeline figure for the shown outcome: from the worker, or built here where none runs. */
export function useTimelineFigure(outcome: PlanOutcome | null, request: TimelineRequest): TimelineFigure | null {
  const inWorker = planWorkerRuns();
  const { view, columns, timeUnit } = request;
  useEffect(() => {
    if (inWorker) requestTimeline({ view, columns, timeUnit });
  }, [inWorker, view, columns, timeUnit]);
  const fromWorker = useValueInTransition(subscribe, readFigure);
  const result = outcome?.ok ? outcome.result : null;
  const here = useMemo(() => {
    if (inWorker || result === null) return null;
    const start = performance.now();
    const figure = timelineFigure(result, view, columns, timeUnit);
    noteThreadWork(PLAN_ON_THIS_THREAD, start);
    return figure;
  }, [inWorker, result, view, columns, timeUnit]);
  return inWorker ? fromWorker : here;
}

/** The outcome the page shows for this plan, if it is the plan shown (the printed sheet uses it rather than computing again). */
export function shownOutcomeFor(plan: PlanFile): PlanOutcome | null {
  return shown.plan === plan && !shown.updating ? shown.outcome : null;
}
