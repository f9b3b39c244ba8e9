import { CUSTOM_AMPLITUDE_RANGE, explainPlanError, type PlanBath, type PlanFile, parsePlanFile, planBath, planFileToInput } from '../../io/plan-file';
import { computePlan, CUSTOM_PULSE_MAX_POINTS, imageSources, MAX_ECHO_ORDER, type PlanInput, type PlanResult, PULSE_WIDTH_RANGE_S } from '../../physics';
import { describePlanMessage } from './plan-paths';

/** A plan's results, or the one message that says why there are none. */
export type PlanOutcome = { ok: true; input: PlanInput; bath: PlanBath; result: PlanResult } | { ok: false; message: string };

/**
 * The page's limit on work per recompute: sensors × echo paths (the heater and its images in the
 * reflecting planes, up to one order past the echo order). The kernel's cost grows with it (about
 * 0.1–0.2 ms per arrival in Chromium on one core), and every keystroke recomputes the plan, so
 * above this the page would stop answering keys within 100 ms (tests/bench/keystroke-limits
 * .browser.ts). The plan file and `sekundo plan` take larger plans; the page opens them with this
 * message in place of results, and refuses an edit that would pass it.
 */
export const PAGE_ARRIVALS_LIMIT = 400;

/** Sensors × echo paths of a plan, as the kernel will compute them (null when the plan cannot say). */
export function planArrivals(plan: PlanFile): number | null {
  try {
    // As the kernel takes them: every plane (a solid wall where no R is typed), and the heater's own
    // wall when the heater sits in one and no plane is listed at z = 0.
    const planes = plan.reflectors.map((r) => ({ label: r.label, axis: r.axis, position_m: r.position_m, reflection: r.reflection ?? 1 }));
    const inWall = !(plan.heater.geometry === 'point' && plan.heater.mount === 'free');
    if (inWall && !planes.some((p) => p.axis === 'z' && p.position_m === 0)) planes.unshift({ label: 'heater plate', axis: 'z', position_m: 0, reflection: 1 });
    return plan.sensors.length * imageSources([0, 0, 0], planes, Math.min(plan.echoOrder + 1, MAX_ECHO_ORDER + 1)).length;
  } catch {
    return null;
  }
}

/** Why the page will not compute this plan as you type (over {@link PAGE_ARRIVALS_LIMIT}), or null. */
export function overPageLimit(plan: PlanFile): string | null {
  const arrivals = planArrivals(plan);
  if (arrivals === null || arrivals <= PAGE_ARRIVALS_LIMIT) return null;
  const paths = arrivals / plan.sensors.length;
  return (
    `This plan has ${plan.sensors.length} sensor${plan.sensors.length === 1 ? '' : 's'} × ${paths} echo paths = ${arrivals} arrivals to compute; ` +
    `the page computes up to ${PAGE_ARRIVALS_LIMIT} as you type, so it stays responsive. Remove sensors or reflecting planes, or lower the echo order; ` +
    '`sekundo plan` on the command line computes the plan as it is.'
  );
}

// Results are derived, never stored: one memo per plan object (plans are replaced, never mutated),
// so the check made while typing and the page's own read share one computation.
const outcomes = new WeakMap<PlanFile, PlanOutcome>();

/** The plan's results from the kernel (planFileToInput + computePlan), memoised per plan object. */
export function derivePlan(plan: PlanFile): PlanOutcome {
  const known = outcomes.get(plan);
  if (known) return known;
  let outcome: PlanOutcome;
  const tooLarge = overPageLimit(plan);
  if (tooLarge !== null) {
    outcome = { ok: false, message: tooLarge };
    outcomes.set(plan, outcome);
    return outcome;
  }
  try {
    const input = planFileToInput(plan);
    outcome = { ok: true, input, bath: planBath(plan), result: computePlan(input) };
  } catch (error) {
    outcome = { ok: false, message: describePlanMessage(explainPlanError(error)) };
  }
  outcomes.set(plan, outcome);
  return outcome;
}

/**
 * Whether a custom pulse's points pass every rule the plan-file schema has for them (2 to the
 * limit of points, each [time, amplitude] in range, times increasing, some amplitude above 0, a
 * duration of at least the shortest pulse): a plain loop, microseconds for 10 000 points where the
 * schema takes a few hundred milliseconds. When it fails, the schema runs to word the messages.
 */
function pointsPass(points: unknown): boolean {
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
 * stand-in of the same duration and height, for the schema's check of the rest of the plan on
 * every keystroke.
 */
function withCheckedPointsShort(plan: PlanFile): PlanFile {
  const shape = plan.heater.shape;
  if (typeof shape === 'string' || !pointsPass(shape.custom)) return plan;
  const points = shape.custom;
  const last = points[points.length - 1] as readonly [number, number];
  let peak = 0;
  for (const p of points) peak = Math.max(peak, p[1]);
  return { ...plan, heater: { ...plan.heater, shape: { custom: [[0, peak], [last[0], peak]] } } };
}

/**
 * Why a changed plan cannot be used, or null: first the plan-file schema (every field and
 * cross-field rule), then the kernel itself. The message names the field as the page labels it.
 */
export function planProblem(plan: PlanFile): string | null {
  const parsed = parsePlanFile(JSON.stringify(withCheckedPointsShort(plan)));
  if (!parsed.ok) {
    const [first = 'plan: not valid', ...rest] = parsed.errors;
    const more = rest.length > 0 ? ` (and ${rest.length} more)` : '';
    return `${describePlanMessage(first)}${more}`;
  }
  const tooLarge = overPageLimit(plan);
  if (tooLarge !== null) return tooLarge;
  const outcome = derivePlan(plan);
  return outcome.ok ? null : outcome.message;
}
