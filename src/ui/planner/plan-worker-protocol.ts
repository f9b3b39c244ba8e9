/**
 * Messages between the page and the plan worker (plan-worker.ts). The page sends the plan it
 * shows and the timeline it wants drawn; the worker answers with the outcome and the figure. Each
 * request has a rising id: the page keeps only the answer to its newest request, and the worker
 * drops a request the page has already replaced (latest wins).
 */
import type { PlanFile } from '../../io/plan-file';
import type { TimelineView } from './planner-slice';
import type { PlanOutcome } from './derive-plan';
import type { DisplayUnit } from '../units/ladders';
import type { TimelineFigure } from './timeline-figure';

/** What the timeline chart needs drawn: its span, its width in pixels and its time unit. */
export interface TimelineRequest {
  view: TimelineView;
  columns: number;
  timeUnit: DisplayUnit;
}

export interface PlanRequest {
  id: number;
  /** The plan, with a custom pulse's points left out (`custom: []`) when `points` carries them. */
  plan: PlanFile;
  /**
   * A custom pulse's points as [t₀, a₀, t₁, a₁, …]: a typed array copies in one block, where
   * 10 000 little arrays take the page tens of milliseconds to send on every keystroke; or
   * 'as-before' when they are the very points of the page's previous request (an edit elsewhere
   * in the plan), which are then not copied again.
   */
  points: Float64Array | null | 'as-before';
  /** Null until the timeline is on screen. */
  timeline: TimelineRequest | null;
}

export interface PlanReply {
  id: number;
  /**
   * The plan's outcome with each sensor's waveform left out (the figure carries what the page
   * draws of them; the waveforms of a large plan run to tens of megabytes).
   */
  outcome: PlanOutcome;
  figure: TimelineFigure | null;
  /** Sensors computed for this answer and sensors taken from the worker's cache. */
  sensorsComputed: number;
  sensorsReused: number;
}

/** Same timeline request (the page asks again only when something changed). */
export function sameTimeline(a: TimelineRequest | null, b: TimelineRequest | null): boolean {
  if (a === null || b === null) return a === b;
  return a.view === b.view && a.columns === b.columns && a.timeUnit.shown === b.timeUnit.shown;
}

/** The outcome without the sensors' waveforms, for sending to the page. */
export function withoutWaveforms(outcome: PlanOutcome): PlanOutcome {
  if (!outcome.ok) return outcome;
  return { ...outcome, result: { ...outcome.result, sensors: outcome.result.sensors.map((s) => ({ ...s, waveform: [] })) } };
}

const packed = new WeakMap<object, Float64Array>();

/** The plan as sent: a custom pulse's points as one typed array (made once per list of points). */
export function packPlan(plan: PlanFile): { plan: PlanFile; points: Float64Array | null } {
  const shape = plan.heater.shape;
  if (typeof shape === 'string') return { plan, points: null };
  let points = packed.get(shape.custom);
  if (!points) {
    points = new Float64Array(shape.custom.length * 2);
    shape.custom.forEach(([t, a], i) => {
      (points as Float64Array)[2 * i] = t;
      (points as Float64Array)[2 * i + 1] = a;
    });
    packed.set(shape.custom, points);
  }
  return { plan: { ...plan, heater: { ...plan.heater, shape: { custom: [] } } }, points };
}

/** The plan as it was before {@link packPlan}. */
export function unpackPlan(plan: PlanFile, points: Float64Array | null): PlanFile {
  if (points === null) return plan;
  const custom: [number, number][] = [];
  for (let i = 0; i + 1 < points.length; i += 2) custom.push([points[i] as number, points[i + 1] as number]);
  return { ...plan, heater: { ...plan.heater, shape: { custom } } };
}

/** Same points, value for value (null for none). */
export function samePoints(a: Float64Array | null, b: Float64Array | null): boolean {
  if (a === null || b === null) return a === b;
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
