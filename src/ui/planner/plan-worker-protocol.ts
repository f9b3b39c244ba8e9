/**
 * Messages between the page and the plan worker (plan-worker.ts). The page sends the plan it
 * shows and the timeline it wants drawn; the worker answers with the outcome and the figure. Each
 * request has a rising id: the page keeps only the answer to its newest request, and the worker
 * drops a request the page has already replaced (latest wins).
 */
import type { PlanFile } from '../../io/plan-file';
import type { TimelineView } from '../store/planner-slice';
import type { PlanOutcome } from './derive-plan';
import type { DisplayUnit } from './display-units';
import type { TimelineFigure } from './timeline-figure';

/** What the timeline chart needs drawn: its span, its width in pixels and its time unit. */
export interface TimelineRequest {
  view: TimelineView;
  columns: number;
  timeUnit: DisplayUnit;
}

export interface PlanRequest {
  id: number;
  plan: PlanFile;
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
