import { type PlanFile, parsePlanFile } from '../../io/plan-file';
import type { PlannerSource } from '../store';
import { BUILT_IN_PLAN, DEMO_PLAN_URL } from './default-plan';

/**
 * Fetches the demo plan from beside the page and checks it with the plan-file schema. Never
 * throws: when it cannot be had, the built-in plan comes back with a note saying why.
 */
export async function loadDemoPlan(fetchText: (url: string) => Promise<Response> = (url) => fetch(url)): Promise<{ plan: PlanFile; source: PlannerSource }> {
  const fallback = (why: string) => ({
    plan: BUILT_IN_PLAN,
    source: { kind: 'built-in', note: `The demo plan could not be loaded (${why}), so the planner starts from its built-in plan.` } as const,
  });
  let text: string;
  try {
    const response = await fetchText(DEMO_PLAN_URL);
    if (!response.ok) return fallback(`the server answered ${response.status}${response.statusText ? ` ${response.statusText}` : ''}`);
    text = await response.text();
  } catch (error) {
    return fallback(error instanceof Error ? error.message : String(error));
  }
  const parsed = parsePlanFile(text);
  if (!parsed.ok) return fallback(`it is not a valid plan: ${parsed.errors[0] ?? 'unknown problem'}`);
  return { plan: parsed.plan, source: { kind: 'demo', note: null } };
}
