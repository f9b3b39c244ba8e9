/**
 * A fast check of a custom pulse's points: a plain loop over every rule the plan-file schema has
 * for them, microseconds for 10 000 points where the schema takes tens to hundreds of
 * milliseconds. The page checks a plan on every keystroke and writes its autosave after each
 * pause; both check the rest of the plan with the schema and the points with this.
 */
import { CUSTOM_PULSE_MAX_POINTS, PULSE_WIDTH_RANGE_S } from '../physics';
import { CUSTOM_AMPLITUDE_RANGE, type PlanFile } from './plan-file-types';

/**
 * Whether a custom pulse's points pass every rule the schema has for them (2 to the limit of
 * points, each [time, amplitude] in range, times increasing, some amplitude above 0, a duration of
 * at least the shortest pulse). When it fails, the schema runs on them to word the messages.
 */
export function pointsPass(points: unknown): boolean {
  if (!Array.isArray(points) || points.length < 2 || points.length > CUSTOM_PULSE_MAX_POINTS) return false;
  let previous = Number.NEGATIVE_INFINITY;
  let peak = 0;
  for (const point of points) {
    if (!Array.isArray(point) || point.length !== 2) return false;
    const [t, a] = point as unknown[];
    if (typeof t !== 'number' || typeof a !== 'number' || !Number.isFinite(t) || !Number.isFinite(a)) return false;
    if (!(t >= 0 && t <= PULSE_WIDTH_RANGE_S[1]) || !(a >= CUSTOM_AMPLITUDE_RANGE[0] && a <= CUSTOM_AMPLITUDE_RANGE[1]) || !(t > previous)) return false;
    previous = t;
    peak = Math.max(peak, a);
  }
  return peak > 0 && previous >= PULSE_WIDTH_RANGE_S[0];
}

/**
 * The plan with a custom pulse whose points pass {@link pointsPass} replaced by a two-point
 * stand-in of the same duration and height (the schema then checks the rest of the plan quickly),
 * or the plan itself; `points` are the points taken out (null when none were).
 */
export function withCheckedPointsShort(plan: PlanFile): { plan: PlanFile; points: PlanFile['heater']['shape'] | null } {
  const shape = plan.heater.shape;
  if (typeof shape === 'string' || !pointsPass(shape.custom)) return { plan, points: null };
  const points = shape.custom;
  const last = points[points.length - 1] as readonly [number, number];
  let peak = 0;
  for (const p of points) peak = Math.max(peak, p[1]);
  return { plan: { ...plan, heater: { ...plan.heater, shape: { custom: [[0, peak], [last[0], peak]] } } }, points: shape };
}
