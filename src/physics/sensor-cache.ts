import type { PlanWarning, SensorPlanResult } from './plan-result';

/**
 * A memo of per-sensor plan results, for a caller that recomputes a plan many times with small
 * changes (the page, as the user types). A sensor's result and its warnings depend only on the
 * plan without its sensor list (bath, heater, planes, echo order, digitiser, targets) and on the
 * sensor itself, so they are kept under those two keys: an edit to one sensor recomputes that
 * sensor alone, and an edit that leaves the physics as it was (the plan's name) recomputes
 * nothing. The cache holds the sensors of the last `contexts` shared parts (a typed value and the
 * one before it), so memory stays bounded by a few plans.
 */
export class SensorResultCache {
  private readonly byContext = new Map<string, Map<string, CachedSensor>>();
  /** Sensors taken from the cache and computed, since the counts were last read. */
  hits = 0;
  misses = 0;

  constructor(private readonly contexts = 2) {}

  /** The sensors kept for a shared context (made when missing; the context becomes the newest). */
  context(key: string): Map<string, CachedSensor> {
    let sensors = this.byContext.get(key);
    if (sensors) this.byContext.delete(key);
    else sensors = new Map();
    this.byContext.set(key, sensors);
    while (this.byContext.size > this.contexts) {
      const oldest = this.byContext.keys().next().value as string;
      this.byContext.delete(oldest);
    }
    return sensors;
  }

  /** Forgets everything. */
  clear(): void {
    this.byContext.clear();
  }
}

/** One sensor's result and the warnings computing it gave, in order. */
export interface CachedSensor {
  result: SensorPlanResult;
  warnings: readonly PlanWarning[];
}
