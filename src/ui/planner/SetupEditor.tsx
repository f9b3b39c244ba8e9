import { SPACER_MATERIALS } from '../../physics';
import { describedBy, type FieldHelpParts, HelpColumnHead, HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { EditorCard } from './EditorCard';
import { QuantityField, TextField } from '../fields/QuantityField';
import { PlanControlMessage, RowMessages } from './PlanControlMessage';
import { usePlanField, usePlanText } from './use-plan-field';
import { MAX_REFLECTORS, setReflectionSource, setReflector, setSpacer } from './plan-edits';
import { usePlanOutcome } from './use-plan';
import { ECHO_ORDER_FIELD, fieldRangeText, reflectorFields } from './plan-fields';
import { PLAN_OTHER_HELP, planNumberHelp } from './planner-help';
import { RemoveIcon } from './RowIcons';

/** Spacer material (cold path lengths) and the reflecting planes that make echoes. */
export function SetupEditor() {
  const spacer = useSekundoStore((s) => s.plannerPlan.spacer);
  const edit = useSekundoStore((s) => s.editPlanner);
  const material = SPACER_MATERIALS.find((m) => m.id === spacer.materialId);
  const spacerHelp = useFieldHelp('spacer material', PLAN_OTHER_HELP['spacer.materialId']);
  const echoOrder = usePlanField(ECHO_ORDER_FIELD);
  const warmHelp = useFieldHelp('distances measured warm', PLAN_OTHER_HELP['spacer.measuredWarm']);
  return (
    <EditorCard id="planner-setup" title="Spacer and reflections">
      <div className="plan-grid">
        <div className="plan-field plan-field--wide">
          <HelpLabel htmlFor="planner-spacer" className="plan-field__label" help={spacerHelp}>
Spacer material
</HelpLabel>
          <select
            id="planner-spacer"
            className="plan-select"
            value={spacer.materialId}
            aria-describedby={describedBy('planner-spacer-note', spacerHelp.describedBy)}
            onChange={(event) => edit('spacer.materialId', (p) => setSpacer(p, { materialId: event.target.value }))}>
            {SPACER_MATERIALS.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({(m.contraction * 100).toFixed(2)} %)
              </option>
            ))}
          </select>
          <p id="planner-spacer-note" className="field-hint plan-field__hint">
            Contraction 293 K → 4 K{material ? `: ${(material.contraction * 100).toFixed(2)} ± ${(material.contractionSd * 100).toFixed(2)} %` : ''} ({material?.source ?? 'handbook'}).</p>
          <PlanControlMessage controlKey="spacer.materialId" />
        </div>
        <div className="plan-field plan-field--check">
          <div className="field-head">
            <label className="toggle">
              <input
                type="checkbox"
                checked={spacer.measuredWarm}
                aria-describedby={warmHelp.describedBy}
                onChange={(event) => edit('spacer.measuredWarm', (p) => setSpacer(p, { measuredWarm: event.target.checked }))}
              />
              Distances were measured warm (shrink them by the contraction)
            </label>
            {warmHelp.button}
          </div>
          {warmHelp.panel}
        </div>
      </div>
      <Reflectors />
      <div className="plan-grid">
        <QuantityField {...echoOrder} label="Echo order" hint="Most reflections followed per echo (0 = none)." />
      </div>
    </EditorCard>
  );
}

function Reflectors() {
  const count = useSekundoStore((s) => s.plannerPlan.reflectors.length);
  const keys = useSekundoStore((s) => s.plannerReflectorKeys);
  const add = useSekundoStore((s) => s.addPlannerReflector);
  const positionRange = useSekundoStore((s) => fieldRangeText(reflectorFields(0, '').position, s.plannerPlan));
  const reflectionRange = useSekundoStore((s) => fieldRangeText(reflectorFields(0, '').reflection, s.plannerPlan));
  const help: PlaneColumnHelp = {
    label: useFieldHelp('plane label', PLAN_OTHER_HELP['plane.label']),
    axis: useFieldHelp('plane axis', PLAN_OTHER_HELP['plane.axis']),
    position: useFieldHelp('plane position', planNumberHelp(reflectorFields(0, '').position, positionRange)),
    reflection: useFieldHelp('reflection coefficient R', planNumberHelp(reflectorFields(0, '').reflection, reflectionRange)),
    source: useFieldHelp('where R comes from', PLAN_OTHER_HELP['plane.source']),
  };
  const outcome = usePlanOutcome();
  const heaterPlate = outcome.ok ? outcome.result.planes.find((p) => p.source === 'heater-plate') : undefined;
  const wall = outcome.ok ? outcome.result.heater : null;
  const wallNote =
    wall && wall.wallReflection !== null && wall.wallImpedance_W_m2K !== null && wall.kapitzaConductance_W_m2K !== null
      ? `a solid wall reflects R = (Z − h)/(Z + h) = ${wall.wallReflection.toFixed(4)}, with Z = ρ cₚ u₂ = ${(wall.wallImpedance_W_m2K / 1e6).toPrecision(3)} MW/(m²·K) far above the Kapitza conductance h ≈ ${(wall.kapitzaConductance_W_m2K / 1e3).toPrecision(2)} kW/(m²·K) (order of magnitude, ∝ T³; Pollack 1969)`
      : null;
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
        <>
          <div className="help-panels">
            {help.label.panel}
            {help.axis.panel}
            {help.position.panel}
            {help.source.panel}
            {help.reflection.panel}
          </div>
          <div className="table-scroll">
          <table className="plan-table reflectors-table">
            <caption className="visually-hidden">Reflecting planes: label, axis, position, where R comes from, R</caption>
            <thead>
              <tr>
                <HelpColumnHead help={help.label}>Label</HelpColumnHead>
                <HelpColumnHead help={help.axis}>Plane</HelpColumnHead>
                <HelpColumnHead help={help.position}>Position</HelpColumnHead>
                <HelpColumnHead help={help.source}>R from</HelpColumnHead>
                <HelpColumnHead help={help.reflection}>R</HelpColumnHead>
                <th scope="col">
                  <span className="visually-hidden">Actions</span>
                </th>
              </tr>
            </thead>
            {keys.map((key, i) => (
              <ReflectorRow key={key} index={i} rowKey={key} help={help} />
            ))}
          </table>
          </div>
          <p className="field-hint reflectors__caption">
            Each plane is “axis = position” (z = across the heater axis, x or y = a side wall), measured like the sensors (warm planes shrink with the spacer). Give a measured R only for a wall you have measured.
          </p>
        </>
      )}
      {wallNote ? <p className="field-hint reflectors__plate">Walls: {wallNote}.</p> : null}
      {heaterPlate ? <p className="field-hint reflectors__plate">The heater’s own wall at z = 0 is not listed, so it is added with the same R.</p> : null}
    </div>
  );
}

/** The help of each column of the planes table; the cells point to it. */
interface PlaneColumnHelp {
  label: FieldHelpParts;
  axis: FieldHelpParts;
  position: FieldHelpParts;
  reflection: FieldHelpParts;
  source: FieldHelpParts;
}

function ReflectorRow({ index, rowKey, help }: { index: number; rowKey: string; help: PlaneColumnHelp }) {
  const plane = useSekundoStore((s) => s.plannerPlan.reflectors[index]);
  const edit = useSekundoStore((s) => s.editPlanner);
  const remove = useSekundoStore((s) => s.removePlannerReflector);
  const outcome = usePlanOutcome();
  const fields = reflectorFields(index, rowKey);
  const labelKey = `plane.${rowKey}.label`;
  const axisKey = `plane.${rowKey}.axis`;
  const position = usePlanField(fields.position);
  const reflection = usePlanField(fields.reflection);
  const label = usePlanText(labelKey, (p) => p.reflectors[index]?.label ?? '', (p, text) => setReflector(p, index, { label: text }));
  if (!plane) return null;
  const used = outcome.ok ? outcome.result.planes.filter((p) => p.source !== 'heater-plate')[index] : undefined;
  const measured = plane.reflection !== undefined;
  const sourceKey = `plane.${rowKey}.source`;
  const n = index + 1;
  return (
    <tbody>
      <tr>
        <td>
          <TextField {...label} help={undefined} label={`Plane ${n} label`} labelHidden message="elsewhere" describedBy={help.label.describedBy} />
        </td>
        <td>
          <select
            className="plan-select plan-select--small"
            aria-label={`Plane ${n} axis`}
            aria-describedby={help.axis.describedBy}
            value={plane.axis}
            onChange={(event) => edit(axisKey, (p) => setReflector(p, index, { axis: event.target.value as 'x' | 'y' | 'z' }))}
          >
            <option value="z">z =</option>
            <option value="x">x =</option>
            <option value="y">y =</option>
          </select>
        </td>
        <td>
          <QuantityField {...position} label={`Plane ${n} position`} labelHidden message="elsewhere" describedBy={help.position.describedBy} />
        </td>
        <td>
          <select
            className="plan-select plan-select--small"
            aria-label={`Plane ${n} R from`}
            aria-describedby={help.source.describedBy}
            value={measured ? 'measured' : 'wall'}
            onChange={(event) => edit(sourceKey, (p) => setReflectionSource(p, index, event.target.value as 'wall' | 'measured'))}
          >
            <option value="wall">wall</option>
            <option value="measured">measured</option>
          </select>
        </td>
        <td>
          {measured ? (
            <QuantityField {...reflection} label={`Plane ${n} reflection R`} labelHidden message="elsewhere" describedBy={help.reflection.describedBy} />
          ) : (
            <span className="plane-r" title={used?.note}>
              {used ? used.reflection.toFixed(4) : '—'}
            </span>
          )}
        </td>
        <td className="row-actions">
          <button type="button" className="icon-button" aria-label={`Remove plane ${n} (${plane.label})`} title="Remove" onClick={() => remove(index)}>
            <RemoveIcon />
          </button>
        </td>
      </tr>
      {used && measured ? (
        <tr className="plane-note">
          <td colSpan={6} className="field-hint">
            {used.note}
          </td>
        </tr>
      ) : null}
      <RowMessages keys={[labelKey, axisKey, sourceKey, fields.position.key, fields.reflection.key]} colSpan={6} />
    </tbody>
  );
}
