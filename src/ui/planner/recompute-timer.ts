/**
 * How long the page takes from a plan edit to the redrawn charts, measured in the browser with
 * performance.now(): the store marks the edit, each chart reports its finished draw. The figures
 * live here, outside the store (they are measurements, not plan inputs), and the page shows them.
 */
import { useSyncExternalStore } from 'react';

export type TimedChart = 'timeline' | 'map';

export interface RecomputeTimes {
  /** Edit → results table and timeline redrawn, ms; null before the first timed edit. */
  timeline_ms: number | null;
  /**
   * Resolution map recomputed and redrawn, ms, from the moment it starts (it waits until typing
   * pauses, so it never holds up the timeline).
   */
  map_ms: number | null;
  /** Edits timed so far. */
  edits: number;
}

const pending: Record<TimedChart, number | null> = { timeline: null, map: null };
let times: RecomputeTimes = { timeline_ms: null, map_ms: null, edits: 0 };
const listeners = new Set<() => void>();

/** Marks the moment the plan changed (called by the store just before it updates). */
export function markPlanEdit(): void {
  pending.timeline = performance.now();
}

/** The map starts its recompute now (after typing paused): its figure is timed from here. */
export function markMapStart(): void {
  pending.map = performance.now();
}

/** A chart finished drawing; if an edit is pending for it, its time is recorded. */
export function reportDrawn(chart: TimedChart): void {
  const start = pending[chart];
  if (start === null) return;
  pending[chart] = null;
  const elapsed = performance.now() - start;
  times = chart === 'timeline' ? { ...times, timeline_ms: elapsed, edits: times.edits + 1 } : { ...times, map_ms: elapsed };
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

export function recomputeTimes(): RecomputeTimes {
  return times;
}

/** The last measured times, for display. */
export function useRecomputeTimes(): RecomputeTimes {
  return useSyncExternalStore(subscribe, recomputeTimes, recomputeTimes);
}

/** Forgets all figures (tests). */
export function resetRecomputeTimes(): void {
  pending.timeline = null;
  pending.map = null;
  times = { timeline_ms: null, map_ms: null, edits: 0 };
  for (const listener of listeners) listener();
}
