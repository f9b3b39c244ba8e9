import type { PlanFileSensor } from '../../io/plan-file';
import { useSekundoStore } from '../store';
import { PLANNER_STRUCTURE_KEY } from '../store/planner-slice';
import { EditorCard } from './EditorCard';
import { messageId, PlanFieldMessage, PlanNumberField, PlanTextField } from './PlanField';
import { MAX_SENSORS, type PositionMode, positionMode, setPositionMode, setSensorText } from './plan-edits';
import { sensorFields } from './plan-fields';
import { themedColour } from '../plot/plot-theme';
import { useResolvedTheme } from '../theme/use-theme';
import { sensorColour } from './planner-colours';
import { CopyIcon, RemoveIcon } from './RowIcons';

/** The sensors as a table: one row each, with add, duplicate and remove. */
export function SensorsEditor() {
  const count = useSekundoStore((s) => s.plannerPlan.sensors.length);
  const keys = useSekundoStore((s) => s.plannerSensorKeys);
  const add = useSekundoStore((s) => s.addPlannerSensor);
  return (
    <EditorCard
      id="planner-sensors"
      title="Sensors"
      aside={
        <button type="button" className="button button--small" onClick={add} disabled={count >= MAX_SENSORS}>
          Add sensor
        </button>
      }
    >
      <p className="field-hint plan-card__lead">
        Positions are from the heater centre; the heater faces +z. Distances as measured (warm or cold, see Spacer). Units
        may be typed: 25 mm, 20 um, 1 mm2, 2 V/K, 1 uV, 20 us.
      </p>
      <div className="table-scroll">
        <table className="plan-table sensors-table">
          <caption className="visually-hidden">Sensors: position, uncertainty, size and electrical properties</caption>
          <thead>
            <tr>
              <th scope="col">#</th>
              <th scope="col">Id</th>
              <th scope="col">Label</th>
              <th scope="col">Position</th>
              <th scope="col">Distance sd</th>
              <th scope="col">Area</th>
              <th scope="col">Responsivity</th>
              <th scope="col">Noise (rms)</th>
              <th scope="col">Lag τ</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          {keys.map((key, i) => (
            <SensorRow key={key} index={i} rowKey={key} count={count} />
          ))}
        </table>
      </div>
      <PlanFieldMessage fieldKey={PLANNER_STRUCTURE_KEY} />
    </EditorCard>
  );
}

function SensorRow({ index, rowKey, count }: { index: number; rowKey: string; count: number }) {
  const sensor = useSekundoStore((s) => s.plannerPlan.sensors[index]);
  const duplicate = useSekundoStore((s) => s.duplicatePlannerSensor);
  const theme = useResolvedTheme();
  const remove = useSekundoStore((s) => s.removePlannerSensor);
  if (!sensor) return null;
  const fields = sensorFields(index, rowKey);
  const n = index + 1;
  const textKeys = [`sensor.${rowKey}.id`, `sensor.${rowKey}.label`, `sensor.${rowKey}.mode`];
  const messageKeys = [...textKeys, ...Object.values(fields).map((f) => f.key)];
  return (
    <tbody className="sensor-row">
      <tr>
        <td className="num">
          <span className="swatch" style={{ background: themedColour(sensorColour(index), theme) }} aria-hidden="true" />
          {n}
        </td>
        <td>
          <PlanTextField
            className="plan-field--id"
            label={`Sensor ${n} id`}
            labelHidden
            message="elsewhere"
            fieldKey={textKeys[0] as string}
            select={(p) => p.sensors[index]?.id ?? ''}
            edit={(p, text) => ({ ok: true, plan: setSensorText(p, index, 'id', text) })}
          />
        </td>
        <td>
          <PlanTextField
            className="plan-field--label"
            label={`Sensor ${n} label`}
            labelHidden
            message="elsewhere"
            fieldKey={textKeys[1] as string}
            select={(p) => p.sensors[index]?.label ?? ''}
            edit={(p, text) => ({ ok: true, plan: setSensorText(p, index, 'label', text) })}
          />
        </td>
        <td>
          <PositionCell index={index} sensor={sensor} fields={fields} modeKey={textKeys[2] as string} />
        </td>
        <td>
          <PlanNumberField field={fields.distanceSd} label={`Sensor ${n} distance sd`} labelHidden message="elsewhere" />
        </td>
        <td>
          <PlanNumberField field={fields.area} label={`Sensor ${n} area`} labelHidden message="elsewhere" />
        </td>
        <td>
          <PlanNumberField field={fields.responsivity} label={`Sensor ${n} responsivity`} labelHidden message="elsewhere" />
        </td>
        <td>
          <PlanNumberField field={fields.noise} label={`Sensor ${n} noise`} labelHidden message="elsewhere" />
        </td>
        <td>
          <PlanNumberField field={fields.lag} label={`Sensor ${n} lag`} labelHidden message="elsewhere" />
        </td>
        <td className="row-actions">
          <button type="button" className="icon-button" aria-label={`Duplicate sensor ${n} (${sensor.id})`} title="Duplicate" disabled={count >= MAX_SENSORS} onClick={() => duplicate(index)}>
            <CopyIcon />
          </button>
          <button type="button" className="icon-button" aria-label={`Remove sensor ${n} (${sensor.id})`} title={count <= 1 ? 'A plan needs at least one sensor' : 'Remove'} disabled={count <= 1} onClick={() => remove(index)}>
            <RemoveIcon />
          </button>
        </td>
      </tr>
      <RowMessages keys={messageKeys} colSpan={10} />
    </tbody>
  );
}

function PositionCell({ index, sensor, fields, modeKey }: { index: number; sensor: PlanFileSensor; fields: ReturnType<typeof sensorFields>; modeKey: string }) {
  const edit = useSekundoStore((s) => s.editPlanner);
  const mode = positionMode(sensor);
  const n = index + 1;
  return (
    <div className="position-cell">
      <select
        className="plan-select plan-select--small"
        aria-label={`Sensor ${n} position given as`}
        value={mode}
        onChange={(event) => edit(modeKey, (p) => setPositionMode(p, index, event.target.value as PositionMode))}
      >
        <option value="axis">on axis</option>
        <option value="xyz">x y z</option>
      </select>
      {mode === 'axis' ? (
        <PlanNumberField field={fields.distance} label={`Sensor ${n} distance`} labelHidden message="elsewhere" />
      ) : (
        <>
          <PlanNumberField field={fields.x} label={`Sensor ${n} x`} labelHidden message="elsewhere" />
          <PlanNumberField field={fields.y} label={`Sensor ${n} y`} labelHidden message="elsewhere" />
          <PlanNumberField field={fields.z} label={`Sensor ${n} z`} labelHidden message="elsewhere" />
        </>
      )}
    </div>
  );
}

/** The messages of a table row's fields, in a full-width row right under it. */
export function RowMessages({ keys, colSpan }: { keys: readonly string[]; colSpan: number }) {
  const errors = useSekundoStore((s) => s.plannerErrors);
  const shown = keys.filter((k) => errors[k]);
  if (shown.length === 0) return null;
  return (
    <tr className="row-messages">
      <td colSpan={colSpan}>
        {shown.map((k) => (
          <p key={k} id={messageId(k)} className="field-error plan-field__error" role="alert">
            {errors[k]}
          </p>
        ))}
      </td>
    </tr>
  );
}
