import { type PlanFile, type PlanFileParse, type PlanMigrationNote, parsePlanFile, serializePlanFile } from '../../io/plan-file';
import { MAX_PLAN_FILE_BYTES, planTextFromBytes } from '../../io/plan-text';

/** Reads a plan file chosen by the user: the plan (with what reading an older version changed), or every problem found (the current plan is kept). */
export async function readPlanFile(file: Blob): Promise<PlanFileParse> {
  if (file.size > MAX_PLAN_FILE_BYTES) return planTextFromBytes(new Uint8Array(MAX_PLAN_FILE_BYTES + 1)) as { ok: false; errors: string[] };
  try {
    const text = planTextFromBytes(new Uint8Array(await file.arrayBuffer()));
    return text.ok ? parsePlanFile(text.text) : text;
  } catch (error) {
    return { ok: false, errors: [`plan: the file could not be read (${error instanceof Error ? error.message : String(error)})`] };
  }
}

/** "Read as version 2 from a version 1 file: heater: …; targets: …" — or '' when nothing was migrated. */
export function migrationText(notes: readonly PlanMigrationNote[]): string {
  const changes = notes.flatMap((n) => n.changes);
  if (notes.length === 0) return '';
  const from = notes[0]?.fromVersion ?? 0;
  return `Written by an older Sekundo (plan format version ${from}) and brought up to date${changes.length > 0 ? `: ${changes.join('; ')}.` : '.'} Save the plan to keep it in the new format.`;
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
