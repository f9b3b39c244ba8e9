import { describedBy, HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { ChoiceGroup, EditorCard } from './EditorCard';
import { QuantityField } from '../fields/QuantityField';
import { PlanControlMessage } from './PlanControlMessage';
import { usePlanField } from './use-plan-field';
import { PulseShapeEditor } from './PulseShapeEditor';
import { type DriveMode, driveMode, type HeaterChoice, heaterChoice, setDriveMode, setGeometry } from './plan-edits';
import { HEATER_FIELDS } from './plan-fields';
import { PLAN_OTHER_HELP } from './planner-help';

const GEOMETRIES = [
  { value: 'rectangle', label: 'Rectangle (film)' },
  { value: 'disk', label: 'Disk' },
  { value: 'point-wall', label: 'Point, on a wall (2π)' },
  { value: 'point-free', label: 'Point, free in the liquid (4π)' },
] as const;

const DRIVES = [
  { value: 'flux', label: 'Heat flux' },
  { value: 'power', label: 'Power' },
] as const;

const GEOMETRY_NOTE: Record<HeaterChoice, string> = {
  rectangle: 'Computed with its size (a baffled piston): a plane wave on short paths, a shorter bipolar pulse beyond.',
  disk: 'Flat disk in a wall, computed with its size: pulses turn bipolar and fall as 1/z far away.',
  'point-wall': 'Small heater in a wall, radiating into a half space: the signal follows dP/dt.',
  'point-free': 'Small heater standing in the liquid, radiating all round (4π): half the on-wall signal.',
};

/** The heater: geometry and size, drive, pulse shape and timing, repetition and averaging. */
export function HeaterEditor() {
  const geometry = useSekundoStore((s) => heaterChoice(s.plannerPlan));
  const drive = useSekundoStore((s) => driveMode(s.plannerPlan));
  const edit = useSekundoStore((s) => s.editPlanner);
  const geometryHelp = useFieldHelp('heater geometry', PLAN_OTHER_HELP['heater.geometry']);
  const radius = usePlanField(HEATER_FIELDS.radius);
  const sideX = usePlanField(HEATER_FIELDS.sideX);
  const sideY = usePlanField(HEATER_FIELDS.sideY);
  const area = usePlanField(HEATER_FIELDS.area);
  const flux = usePlanField(HEATER_FIELDS.flux);
  const power = usePlanField(HEATER_FIELDS.power);
  const repetitionRate = usePlanField(HEATER_FIELDS.repetitionRate);
  const averages = usePlanField(HEATER_FIELDS.averages);
  return (
    <EditorCard id="planner-heater" title="Heater">
      <div className="plan-grid">
        <div className="plan-field">
          <HelpLabel htmlFor="planner-geometry" className="plan-field__label" help={geometryHelp}>
Heater geometry
</HelpLabel>
          <select
            id="planner-geometry"
            className="plan-select"
            value={geometry}
            aria-describedby={describedBy('planner-geometry-note', geometryHelp.describedBy)}
            onChange={(event) => edit('heater.geometry', (p) => setGeometry(p, event.target.value as HeaterChoice))}
          >
            {GEOMETRIES.map((g) => (
              <option key={g.value} value={g.value}>
                {g.label}
              </option>
            ))}
          </select>
          <p id="planner-geometry-note" className="field-hint plan-field__hint">
            {GEOMETRY_NOTE[geometry]}
          </p>
          <PlanControlMessage controlKey="heater.geometry" />
        </div>
        {geometry === 'disk' ? (
          <QuantityField {...radius} label="Disk radius" />
        ) : geometry === 'rectangle' ? (
          <>
            <QuantityField {...sideX} label="Heater width" />
            <QuantityField {...sideY} label="Heater height" />
          </>
        ) : (
          <QuantityField {...area} label="Nominal area (for the flux)" />
        )}
        <ChoiceGroup<DriveMode> legend="Drive given as" name="planner-drive" value={drive} options={DRIVES} onChange={(m) => edit('heater.drive', (p) => setDriveMode(p, m))}
          help={PLAN_OTHER_HELP['heater.drive']}
        />
        {drive === 'flux' ? (
          <QuantityField {...flux} label="Peak heat flux" hint="e.g. 0.1 W/cm2" />
        ) : (
          <QuantityField {...power} label="Peak power" hint="e.g. 100 mW" />
        )}
      </div>
      <PulseShapeEditor />
      <div className="plan-grid">
        <QuantityField {...repetitionRate} label="Repetition rate" />
        <QuantityField {...averages} label="Pulses averaged" />
      </div>
      <HeaterCaution />
    </EditorCard>
  );
}

/** The usual cautions for heaters in cryogenic baths, beside the heater inputs. */
function HeaterCaution() {
  return (
    <aside className="plan-caution" aria-label="Heater safety">
      <p>
        <span aria-hidden="true" className="plan-caution__icon">
          ⚠
        </span>{' '}
        <strong>Heaters in a cryogenic bath.</strong> Leads and heaters that end up in vacuum or gas instead of liquid
        overheat and can burn out; every joule boils off helium, and boil-off in a closed volume builds pressure, so keep
        relief valves and vents clear and rooms ventilated (asphyxiation). Check the drive against the wiring's rating
        before cooling. Follow your local codes and your lab's licensed safety practice.
      </p>
    </aside>
  );
}
