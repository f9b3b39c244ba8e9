import { useId } from 'react';
import { MAX_NOTES_CHARS, type PlanFile } from '../../io/plan-file';
import { HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { PLAN_OTHER_HELP } from './planner-help';
import { useOwnForm } from '../fields/OwnForm';

/** The description's key in the fields slice (see use-plan-field.ts). */
const KEY = 'planner.plan.notes';

/** The plan with its description set; an empty description is no description (the file leaves it out). */
export function setPlanNotes(plan: PlanFile, text: string): PlanFile {
  const { notes: _old, ...rest } = plan;
  return text.trim() === '' ? rest : { ...rest, notes: text };
}

function notesEdit(plan: PlanFile, text: string) {
  if (text.length > MAX_NOTES_CHARS) return { ok: false as const, message: `Description: at most ${MAX_NOTES_CHARS} characters (got ${text.length}); the last good text is kept.` };
  return { ok: true as const, plan: setPlanNotes(plan, text) };
}

/**
 * "About this plan": the plan's own description, written by the user — it travels with the plan file
 * and the share link and prints on the setup sheet (nothing prints when it is empty). Open when there
 * is a description to read; Escape restores the text in effect.
 */
export function PlanDescription() {
  const id = useId();
  const ownForm = useOwnForm();
  const notes = useSekundoStore((s) => s.plannerPlan.notes ?? '');
  const draft = useSekundoStore((s) => s.fieldDrafts[KEY]);
  const error = draft?.message ?? null;
  const help = useFieldHelp('Plan description', PLAN_OTHER_HELP['plan.notes']);
  // The same rules as every typed field (src/ui/fields): a good text applies as it is typed, a
  // refused one stays with its message, leaving shows the text in effect, Escape restores it.
  const type = (text: string) => {
    const { setFieldDraft, applyPlannerEdit } = useSekundoStore.getState();
    setFieldDraft(KEY, { text, unit: null, message: null });
    const message = applyPlannerEdit((plan) => notesEdit(plan, text));
    if (message !== null) setFieldDraft(KEY, { text, unit: null, message });
  };
  const leave = () => {
    if (draft && draft.message === null) useSekundoStore.getState().dropFieldDraft(KEY);
  };
  return (
    <details className="plan-bar__notes" open={notes !== '' || draft !== undefined}>
      <summary>About this plan{notes === '' ? ' (no description yet)' : ''}</summary>
      <HelpLabel htmlFor={id} help={help} className="quantity-field__label">
        Plan description
      </HelpLabel>
      <textarea
        id={id}
        form={ownForm.id}
        className="plan-bar__description"
        rows={3}
        value={draft?.text ?? notes}
        placeholder="What this plan is for: the insert, the cooldown, what to check. Printed on the setup sheet."
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error ${help.describedBy}` : help.describedBy}
        onChange={(event) => type(event.target.value)}
        onBlur={leave}
        onKeyDown={(event) => {
          if (event.key === 'Escape') useSekundoStore.getState().dropFieldDraft(KEY);
        }}
      />
      {ownForm.element}
      {error ? (
        <p id={`${id}-error`} className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </details>
  );
}
