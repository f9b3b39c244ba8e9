import { SPACER_MATERIALS } from '../../physics';
import { useSekundoStore } from '../store';
import { EditorCard } from './EditorCard';
import { PlanFieldMessage, PlanNumberField, PlanTextField } from './PlanField';
import { MAX_REFLECTORS, setReflector, setSpacer } from './plan-edits';
import { ECHO_ORDER_FIELD, reflectorFields } from './plan-fields';
import { RemoveIcon } from './RowIcons';
import { RowMessages } from './SensorsEditor';

/** Spacer material (cold path lengths) and the reflecting planes that make echoes. */
export function SetupEditor() {
  const spacer = useSekundoStore((s) => s.plannerPlan.spacer);
  const edit = useSekundoStore((s) => s.editPlanner);
  const material = SPACER_MATERIALS.find((m) => m.id === spacer.materialId);
  return (
    <EditorCard id="planner-setup" title="Spacer and reflections">
      <div className="plan-grid">
        <div className="plan-field plan-field--wide">
          <label className="plan-field__label" htmlFor="planner-spacer">
            Spacer material
          </label>
          <select id="planner-spacer" className="plan-select" value={spacer.materialId} onChange={(event) => edit('spacer.materialId', (p) => setSpacer(p, { materialId: event.target.value }))}>
            {SPACER_MATERIALS.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({(m.contraction * 100).toFixed(2)} %)
              </option>
            ))}
          </select>
          <p className="field-hint plan-field__hint">Contraction 293 K → 4 K{material ? `: ${(material.contraction * 100).toFixed(2)} ± ${(material.contractionSd * 100).toFixed(2)} %` : ''} ({material?.source ?? 'handbook'}).</p>
          <PlanFieldMessage fieldKey="spacer.materialId" />
        </div>
        <div className="plan-field plan-field--check">
          <label className="toggle">
            <input type="checkbox" checked={spacer.measuredWarm} onChange={(event) => edit('spacer.measuredWarm', (p) => setSpacer(p, { measuredWarm: event.target.checked }))} />
            Distances were measured warm (shrink them by the contraction)
          </label>
        </div>
      </div>
      <Reflectors />
      <div className="plan-grid">
        <PlanNumberField field={ECHO_ORDER_FIELD} label="Echo order" hint="Most reflections followed per echo (0 = none)." />
      </div>
    </EditorCard>
  );
}

function Reflectors() {
  const count = useSekundoStore((s) => s.plannerPlan.reflectors.length);
  const keys = useSekundoStore((s) => s.plannerReflectorKeys);
  const add = useSekundoStore((s) => s.addPlannerReflector);
  return (
    <div className="reflectors">
      <div className="card-head reflectors__head">
        <h4 className="plan-subtitle">Reflecting planes</h4>
        <button type="button" className="button button--small" onClick={add} disabled={count >= MAX_REFLECTORS}>
          Add plane
        </button>
      </div>
      {count === 0 ? (
        <p className="field-hint">No reflecting planes: only direct arrivals.</p>
      ) : (
        <table className="plan-table reflectors-table">
          <caption className="field-hint reflectors__caption">Each plane is “axis = position” (z = across the heater axis, x or y = a side wall); R is the amplitude reflection coefficient.</caption>
          <thead>
            <tr>
              <th scope="col">Label</th>
              <th scope="col">Plane</th>
              <th scope="col">Position</th>
              <th scope="col">R</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          {keys.map((key, i) => (
            <ReflectorRow key={key} index={i} rowKey={key} />
          ))}
        </table>
      )}
    </div>
  );
}

function ReflectorRow({ index, rowKey }: { index: number; rowKey: string }) {
  const plane = useSekundoStore((s) => s.plannerPlan.reflectors[index]);
  const edit = useSekundoStore((s) => s.editPlanner);
  const remove = useSekundoStore((s) => s.removePlannerReflector);
  if (!plane) return null;
  const n = index + 1;
  const fields = reflectorFields(index, rowKey);
  const labelKey = `plane.${rowKey}.label`;
  const axisKey = `plane.${rowKey}.axis`;
  return (
    <tbody>
      <tr>
        <td>
          <PlanTextField
            label={`Plane ${n} label`}
            labelHidden
            message="elsewhere"
            fieldKey={labelKey}
            select={(p) => p.reflectors[index]?.label ?? ''}
            edit={(p, text) => ({ ok: true, plan: setReflector(p, index, { label: text }) })}
          />
        </td>
        <td>
          <select
            className="plan-select plan-select--small"
            aria-label={`Plane ${n} axis`}
            value={plane.axis}
            onChange={(event) => edit(axisKey, (p) => setReflector(p, index, { axis: event.target.value as 'x' | 'y' | 'z' }))}
          >
            <option value="z">z =</option>
            <option value="x">x =</option>
            <option value="y">y =</option>
          </select>
        </td>
        <td>
          <PlanNumberField field={fields.position} label={`Plane ${n} position`} labelHidden message="elsewhere" />
        </td>
        <td>
          <PlanNumberField field={fields.reflection} label={`Plane ${n} reflection R`} labelHidden message="elsewhere" />
        </td>
        <td className="row-actions">
          <button type="button" className="icon-button" aria-label={`Remove plane ${n} (${plane.label})`} title="Remove" onClick={() => remove(index)}>
            <RemoveIcon />
          </button>
        </td>
      </tr>
      <RowMessages keys={[labelKey, axisKey, fields.position.key, fields.reflection.key]} colSpan={5} />
    </tbody>
  );
}
