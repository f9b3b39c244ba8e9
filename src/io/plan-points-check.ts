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
  return passedPeak(points) !== null;
}

/**
 * Points already found to pass, with their peak: a plan's points stay the same array through
 * every edit that is not of the pulse, and 10 000 of them are not checked again on each keystroke.
 * Plans are never changed in place (every edit makes a new plan, plan-edits.ts), so an array that
 * passed once still passes.
 */
const passed = new WeakMap<object, number>();

/** The peak amplitude of points that pass {@link pointsPass}; null when they do not. */
function passedPeak(points: unknown): number | null {
  if (!Array.isArray(points)) return null;
  const known = passed.get(points);
  if (known !== undefined) return known;
  if (points.length < 2 || points.length > CUSTOM_PULSE_MAX_POINTS) return null;
  let previous = Number.NEGATIVE_INFINITY;
  let peak = 0;
  for (let i = 0; i < points.length; i++) {
    const point: unknown = points[i];
    if (!Array.isArray(point) || point.length !== 2) return null;
    const t: unknown = point[0];
    const a: unknown = point[1];
    if (typeof t !== 'number' || typeof a !== 'number' || !Number.isFinite(t) || !Number.isFinite(a)) return null;
    if (!(t >= 0 && t <= PULSE_WIDTH_RANGE_S[1]) || !(a >= CUSTOM_AMPLITUDE_RANGE[0] && a <= CUSTOM_AMPLITUDE_RANGE[1]) || !(t > previous)) return null;
    previous = t;
    if (a > peak) peak = a;
  }
  if (!(peak > 0 && previous >= PULSE_WIDTH_RANGE_S[0])) return null;
  passed.set(points, peak);
  return peak;
}

/**
 * The plan with a custom pulse whose points pass {@link pointsPass} replaced by a two-point
 * stand-in of the same duration and height (the schema then checks the rest of the plan quickly),
 * or the plan itself; `points` are the points taken out (null when none were).
 */
export function withCheckedPointsShort(plan: PlanFile): { plan: PlanFile; points: PlanFile['heater']['shape'] | null } {
  const shape = plan.heater.shape;
  const peak = typeof shape === 'string' ? null : passedPeak(shape.custom);
  if (typeof shape === 'string' || peak === null) return { plan, points: null };
  const points = shape.custom;
  const last = points[points.length - 1] as readonly [number, number];
  return { plan: { ...plan, heater: { ...plan.heater, shape: { custom: [[0, peak], [last[0], peak]] } } }, points: shape };
}
