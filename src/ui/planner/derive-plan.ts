import { noteThreadWork } from '../layout/main-thread-work';
import { explainPlanError, type PlanBath, type PlanFile, planBath, planObjectProblems, planFileToInput } from '../../io/plan-file';
import {
  checkPlanInput,
  computePlanSteps,
  imageSources,
  MAX_ECHO_ORDER,
  type PlanInput,
  type PlanResult,
  type SensorResultCache,
} from '../../physics';
import { describePlanMessage } from './plan-paths';

/** A plan's results, or the one message that says why there are none. */
export type PlanOutcome =
  | { ok: true; input: PlanInput; bath: PlanBath; result: PlanResult }
  /** `pending`: no results yet, the first computation of the plan is under way (not a refusal). */
  | { ok: false; message: string; pending?: true };

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

/**
 * The plan's results from the kernel (planFileToInput + computePlan), one sensor at a time: the
 * generator yields after each sensor (the page's plan worker stops there when the plan has been
 * changed meanwhile) and returns the outcome. With a cache, unchanged sensors are not recomputed.
 */
export function* derivePlanSteps(plan: PlanFile, cache?: SensorResultCache): Generator<number, PlanOutcome, void> {
  let input: PlanInput;
  try {
    input = planFileToInput(plan);
  } catch (error) {
    return { ok: false, message: describePlanMessage(explainPlanError(error)) };
  }
  try {
    const result = yield* computePlanSteps(input, cache);
    return { ok: true, input, bath: planBath(plan), result };
  } catch (error) {
    return { ok: false, message: describePlanMessage(explainPlanError(error)) };
  }
}

// Results are derived, never stored: one memo per plan object (plans are replaced, never mutated).
const outcomes = new WeakMap<PlanFile, PlanOutcome>();

/**
 * The plan's results on the calling thread, memoised per plan object. The page computes in its
 * plan worker (plan-engine.ts); this is for the printed setup sheet, tests and where no worker runs.
 */
export function derivePlan(plan: PlanFile, cache?: SensorResultCache): PlanOutcome {
  const known = outcomes.get(plan);
  if (known) return known;
  const start = performance.now();
  const steps = derivePlanSteps(plan, cache);
  let step = steps.next();
  while (!step.done) step = steps.next();
  outcomes.set(plan, step.value);
  // Named in the calling thread's performance timeline: the browser test checks the page's main
  // thread never computes a plan while its worker runs.
  noteThreadWork(PLAN_ON_THIS_THREAD, start);
  return step.value;
}

/** Performance-timeline name of a plan computed on the calling thread (see {@link derivePlan}). */
export const PLAN_ON_THIS_THREAD = 'sekundo: plan computed on this thread';

/**
 * Why a changed plan cannot be used, or null: the plan-file schema (every field and cross-field
 * rule), then the kernel's check of its inputs. Cheap enough for every keystroke: the plan itself
 * is computed in the plan worker, and a plan the kernel still refuses there shows its message in
 * place of results. The message names the field as the page labels it.
 */
export function planProblem(plan: PlanFile): string | null {
  const problems = planObjectProblems(plan);
  if (problems.length > 0) {
    const [first = 'plan: not valid', ...rest] = problems;
    const more = rest.length > 0 ? ` (and ${rest.length} more)` : '';
    return `${describePlanMessage(first)}${more}`;
  }
  try {
    checkPlanInput(planFileToInput(plan));
    return null;
  } catch (error) {
    return describePlanMessage(explainPlanError(error));
  }
}
