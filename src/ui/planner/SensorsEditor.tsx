import type { PlanFileSensor } from '../../io/plan-file';
import { type FieldHelpParts, HelpColumnHead, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { PLANNER_STRUCTURE_KEY } from './planner-slice';
import { EditorCard } from './EditorCard';
import { QuantityField, TextField } from '../fields/QuantityField';
import { PlanControlMessage, RowMessages } from './PlanControlMessage';
import { usePlanField, usePlanText } from './use-plan-field';
import { MAX_SENSORS, type PositionMode, positionMode, setPositionMode, setSensorText } from './plan-edits';
import { fieldRangeText, type NumberField, sensorFields } from './plan-fields';
import { PLAN_OTHER_HELP, planNumberHelp, planUnitsText, sensorPositionHelp } from './planner-help';
import { themedColour } from '../plot/plot-theme';
import { useResolvedTheme } from '../theme/use-theme';
import { sensorColour } from './planner-colours';
import { CopyIcon, RemoveIcon } from './RowIcons';
import { usePagedRows } from '../layout/TablePager';

/**
 * Sensor rows shown at once: a row holds a dozen fields, and 16 rows keep a keystroke in a plan of
 * 64 sensors as quick as in a small plan (tests/bench/keystroke-limits.browser.ts).
 */
export const SENSOR_PAGE_ROWS = 16;

/** The help of each column of the sensors table; the cells point to it. */
interface SensorColumnHelp {
  id: FieldHelpParts;
  label: FieldHelpParts;
  position: FieldHelpParts;
  distanceSd: FieldHelpParts;
  area: FieldHelpParts;
  responsivity: FieldHelpParts;
  noise: FieldHelpParts;
  lag: FieldHelpParts;
}

/** A table column's help for one number field of the sensors, its range read against the plan in use. */
function useColumnHelp(name: string, field: NumberField): FieldHelpParts {
  const range = useSekundoStore((s) => fieldRangeText(field, s.plannerPlan));
  return useFieldHelp(name, planNumberHelp(field, range));
}

function useSensorColumnHelp(): SensorColumnHelp {
  const fields = sensorFields(0, '');
  const distance = useSekundoStore((s) => fieldRangeText(fields.distance, s.plannerPlan));
  const x = useSekundoStore((s) => fieldRangeText(fields.x, s.plannerPlan));
  const z = useSekundoStore((s) => fieldRangeText(fields.z, s.plannerPlan));
  return {
    id: useFieldHelp('sensor id', PLAN_OTHER_HELP['sensor.id']),
    label: useFieldHelp('sensor label', PLAN_OTHER_HELP['sensor.label']),
    position: useFieldHelp('sensor position', sensorPositionHelp({ distance, x, z }, planUnitsText(fields.distance))),
    distanceSd: useColumnHelp('distance sd', fields.distanceSd),
    area: useColumnHelp('sensor area', fields.area),
    responsivity: useColumnHelp('responsivity', fields.responsivity),
    noise: useColumnHelp('noise (rms)', fields.noise),
    lag: useColumnHelp('lag τ', fields.lag),
  };
}

/** The sensors as a table: one row each, with add, duplicate and remove. */
export function SensorsEditor() {
  const count = useSekundoStore((s) => s.plannerPlan.sensors.length);
  const keys = useSekundoStore((s) => s.plannerSensorKeys);
  const addSensor = useSekundoStore((s) => s.addPlannerSensor);
  const help = useSensorColumnHelp();
  const { start, end, pager, showRow } = usePagedRows(count, SENSOR_PAGE_ROWS);
  // A row added or duplicated is shown: its page is turned to.
  const add = () => {
    addSensor();
    showRow(count);
  };
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
        may be typed: 25 mm, 20 um, 1 mm2, 2 V/K, 1 uV, 20 us. The “?” in a column’s heading says more.
      </p>
      <div className="help-panels">
        {help.id.panel}
        {help.label.panel}
        {help.position.panel}
        {help.distanceSd.panel}
        {help.area.panel}
        {help.responsivity.panel}
        {help.noise.panel}
        {help.lag.panel}
      </div>
      <div className="table-scroll">
        <table className="plan-table sensors-table">
          <caption className="visually-hidden">Sensors: position, uncertainty, size and electrical properties</caption>
          <thead>
            <tr>
              <th scope="col">#</th>
              <HelpColumnHead help={help.id}>Id</HelpColumnHead>
              <HelpColumnHead help={help.label}>Label</HelpColumnHead>
              <HelpColumnHead help={help.position}>Position</HelpColumnHead>
              <HelpColumnHead help={help.distanceSd}>Distance sd</HelpColumnHead>
              <HelpColumnHead help={help.area}>Area</HelpColumnHead>
              <HelpColumnHead help={help.responsivity}>Responsivity</HelpColumnHead>
              <HelpColumnHead help={help.noise}>Noise (rms)</HelpColumnHead>
              <HelpColumnHead help={help.lag}>Lag τ</HelpColumnHead>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          {keys.slice(start, end).map((key, j) => (
            <SensorRow key={key} index={start + j} rowKey={key} count={count} help={help} onDuplicated={showRow} />
          ))}
        </table>
      </div>
      {pager('sensors')}
      <PlanControlMessage controlKey={PLANNER_STRUCTURE_KEY} />
    </EditorCard>
  );
}

function SensorRow({ index, rowKey, count, help, onDuplicated }: { index: number; rowKey: string; count: number; help: SensorColumnHelp; onDuplicated: (index: number) => void }) {
  const sensor = useSekundoStore((s) => s.plannerPlan.sensors[index]);
  const duplicate = useSekundoStore((s) => s.duplicatePlannerSensor);
  const theme = useResolvedTheme();
  const remove = useSekundoStore((s) => s.removePlannerSensor);
  const fields = sensorFields(index, rowKey);
  const textKeys = [`sensor.${rowKey}.id`, `sensor.${rowKey}.label`, `sensor.${rowKey}.mode`];
  const id = usePlanText(textKeys[0] as string, (p) => p.sensors[index]?.id ?? '', (p, text) => setSensorText(p, index, 'id', text));
  const label = usePlanText(textKeys[1] as string, (p) => p.sensors[index]?.label ?? '', (p, text) => setSensorText(p, index, 'label', text));
  const distanceSd = usePlanField(fields.distanceSd);
  const area = usePlanField(fields.area);
  const responsivity = usePlanField(fields.responsivity);
  const noise = usePlanField(fields.noise);
  const lag = usePlanField(fields.lag);
  if (!sensor) return null;
  const n = index + 1;
  const messageKeys = [...textKeys, ...Object.values(fields).map((f) => f.key)];
  return (
    <tbody className="sensor-row">
      <tr>
        <td className="num">
          <span className="swatch" style={{ background: themedColour(sensorColour(index), theme) }} aria-hidden="true" />
          {n}
        </td>
        <td>
          <TextField {...id} help={undefined} className="plan-field--id" label={`Sensor ${n} id`} labelHidden message="elsewhere" describedBy={help.id.describedBy} />
        </td>
        <td>
          <TextField {...label} help={undefined} className="plan-field--label" label={`Sensor ${n} label`} labelHidden message="elsewhere" describedBy={help.label.describedBy} />
        </td>
        <td>
          <PositionCell index={index} sensor={sensor} fields={fields} modeKey={textKeys[2] as string} help={help.position.describedBy} />
        </td>
        <td>
          <QuantityField {...distanceSd} label={`Sensor ${n} distance sd`} labelHidden message="elsewhere" describedBy={help.distanceSd.describedBy} />
        </td>
        <td>
          <QuantityField {...area} label={`Sensor ${n} area`} labelHidden message="elsewhere" describedBy={help.area.describedBy} />
        </td>
        <td>
          <QuantityField {...responsivity} label={`Sensor ${n} responsivity`} labelHidden message="elsewhere" describedBy={help.responsivity.describedBy} />
        </td>
        <td>
          <QuantityField {...noise} label={`Sensor ${n} noise`} labelHidden message="elsewhere" describedBy={help.noise.describedBy} />
        </td>
        <td>
          <QuantityField {...lag} label={`Sensor ${n} lag`} labelHidden message="elsewhere" describedBy={help.lag.describedBy} />
        </td>
        <td className="row-actions">
          <button type="button" className="icon-button" aria-label={`Duplicate sensor ${n} (${sensor.id})`} title="Duplicate" disabled={count >= MAX_SENSORS} onClick={() => {
              duplicate(index);
              onDuplicated(index + 1);
            }}
          >
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

function PositionCell({ index, sensor, fields, modeKey, help }: { index: number; sensor: PlanFileSensor; fields: ReturnType<typeof sensorFields>; modeKey: string; help: string }) {
  const edit = useSekundoStore((s) => s.editPlanner);
  const mode = positionMode(sensor);
  const n = index + 1;
  const distance = usePlanField(fields.distance);
  const x = usePlanField(fields.x);
  const y = usePlanField(fields.y);
  const z = usePlanField(fields.z);
  return (
    <div className="position-cell">
      <select
        className="plan-select plan-select--small"
        aria-label={`Sensor ${n} position given as`}
        aria-describedby={help}
        value={mode}
        onChange={(event) => edit(modeKey, (p) => setPositionMode(p, index, event.target.value as PositionMode))}
      >
        <option value="axis">on axis</option>
        <option value="xyz">x y z</option>
      </select>
      {mode === 'axis' ? (
        <QuantityField {...distance} label={`Sensor ${n} distance`} labelHidden message="elsewhere" describedBy={help} />
      ) : (
        <>
          <QuantityField {...x} label={`Sensor ${n} x`} labelHidden message="elsewhere" describedBy={help} />
          <QuantityField {...y} label={`Sensor ${n} y`} labelHidden message="elsewhere" describedBy={help} />
          <QuantityField {...z} label={`Sensor ${n} z`} labelHidden message="elsewhere" describedBy={help} />
        </>
      )}
    </div>
  );
}
