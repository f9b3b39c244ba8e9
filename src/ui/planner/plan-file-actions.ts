import { type PlanFile, parsePlanFile, serializePlanFile } from '../../io/plan-file';
import { MAX_PLAN_FILE_BYTES, planTextFromBytes } from '../../io/plan-text';

/** Reads a plan file chosen by the user: the plan, or every problem found (the current plan is kept). */
export async function readPlanFile(file: Blob): Promise<{ ok: true; plan: PlanFile } | { ok: false; errors: string[] }> {
  if (file.size > MAX_PLAN_FILE_BYTES) return planTextFromBytes(new Uint8Array(MAX_PLAN_FILE_BYTES + 1)) as { ok: false; errors: string[] };
  try {
    const text = planTextFromBytes(new Uint8Array(await file.arrayBuffer()));
    return text.ok ? parsePlanFile(text.text) : text;
  } catch (error) {
    return { ok: false, errors: [`plan: the file could not be read (${error instanceof Error ? error.message : String(error)})`] };
  }
}

/** A file name for a plan: its name in lower case, words joined by hyphens. */
export function planFileName(plan: PlanFile): string {
  const slug = plan.name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .slice(0, 60)
    .replace(/-+$/, '');
  return `${slug || 'plan'}.sekundo-plan.json`;
}

/** Offers the plan as a file download (nothing leaves the browser). */
export function downloadPlanFile(plan: PlanFile): void {
  const blob = new Blob([serializePlanFile(plan)], { type: 'application/json' });
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = planFileName(plan);
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}
