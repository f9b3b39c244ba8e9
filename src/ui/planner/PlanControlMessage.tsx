import { fieldMessageId } from '../fields/QuantityField';
import { useSekundoStore } from '../store';
import { planFieldKey } from './use-plan-field';

/*
 * Messages of the planner's controls (selects, buttons: plannerErrors) and of its typed fields
 * (the fields slice, under "planner.<key>") where a table has no room beside the box. Both use the
 * field's message id, so a box's aria-describedby finds the message wherever it is shown.
 */

/** The message of a planner key: a typed field's refusal, else a control's. */
function usePlanMessage(key: string): string | null {
  return useSekundoStore((s) => s.fieldDrafts[planFieldKey(key)]?.message ?? s.plannerErrors[key] ?? null);
}

/** The message of a control (or field) of the plan under it. */
export function PlanControlMessage({ controlKey }: { controlKey: string }) {
  const message = usePlanMessage(controlKey);
  if (!message) return null;
  return (
    <p id={fieldMessageId(planFieldKey(controlKey))} className="field-error quantity-field__error" role="alert">
      {message}
    </p>
  );
}

/** The messages of a table row's fields and controls, in a full-width row right under it. */
export function RowMessages({ keys, colSpan }: { keys: readonly string[]; colSpan: number }) {
  const shown = useSekundoStore((s) =>
    keys
      .filter((k) => s.fieldDrafts[planFieldKey(k)]?.message || s.plannerErrors[k])
      .join('\n'),
  );
  if (shown === '') return null;
  return (
    <tr className="row-messages">
      <td colSpan={colSpan}>
        {shown.split('\n').map((k) => (
          <PlanControlMessage key={k} controlKey={k} />
        ))}
      </td>
    </tr>
  );
}
