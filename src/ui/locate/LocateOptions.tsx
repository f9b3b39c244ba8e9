import { type ReactNode, useId } from 'react';
import { formatSignificant } from '../units/format-number';
import { HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { useDisplayUnit } from '../units/use-display-unit';
import { priorOf, speedOf } from './derive-locate';
import {
  DEFAULT_SD_SPEC,
  defaultSdEdit,
  regionEdit,
  regionSpec,
  SPEED_SPEC,
  speedEdit,
  SURFACE_FIELDS,
  TEMPERATURE_SD_SPEC,
  TEMPERATURE_SPEC,
  temperatureEdit,
  temperatureSdEdit,
} from './locate-fields';
import { locateFieldProps } from './locate-field-props';
import { QuantityField } from '../fields/QuantityField';
import { LOCATE_HELP } from './locate-help';
import { AXIS_NAMES, type LocateOptionsInput, type SurfaceKind } from './locate-inputs';

const SURFACE_CHOICES: readonly { kind: SurfaceKind; label: string }[] = [
  { kind: 'none', label: 'None: anywhere in 3-D' },
  { kind: 'sphere', label: 'Sphere (a cavity cell)' },
  { kind: 'cylinder', label: 'Cylinder (a beam tube, a can)' },
  { kind: 'plane', label: 'Plane (a flat wall)' },
];

/** How the fit is set up: the speed, its fit, the timing sd, a surface for the source, the robust refit. */
export function LocateOptions() {
  const options = useSekundoStore((s) => s.locateOptions);
  const change = useSekundoStore((s) => s.changeLocate);
  const temperature = useDisplayUnit('temperature');
  const surfaceId = useId();
  const speedHelp = useFieldHelp('speed of the front', LOCATE_HELP.speedMode);
  const surfaceHelp = useFieldHelp('source on a surface', LOCATE_HELP.surface);
  const set = (key: string, patch: Partial<LocateOptionsInput>) => change(key, (inputs) => ({ ...inputs, options: { ...inputs.options, ...patch } }));
  const speed = speedOf(options);
  const prior = priorOf(options);
  return (
    <section className="card locate-card locate-options" aria-labelledby="locate-options-title">
      <h2 id="locate-options-title" className="card-title">
        Fit options
      </h2>
      <fieldset className="locate-group">
        <legend className="locate-field__label field-head">
          Speed of the front {speedHelp.button}
        </legend>
        {speedHelp.panel}
        <label className="locate-choice">
          <input type="radio" name="locate-speed-mode" aria-describedby={speedHelp.describedBy} checked={options.speedMode === 'temperature'} onChange={() => set('opt.speedMode', { speedMode: 'temperature' })} />
          u₂ at the bath temperature
        </label>
        {options.speedMode === 'temperature' ? (
          <div className="locate-indent">
            <QuantityField
              {...locateFieldProps('opt.temperature', TEMPERATURE_SPEC, options.temperature_K, temperatureEdit)}
              label="Bath temperature T90"
              help={LOCATE_HELP.temperature(temperature.shown)}
            />
            <p className="field-hint" aria-live="polite">
              {speed.ok ? `u₂ = ${formatSignificant(speed.speed_m_s, 4)} m/s (Donnelly & Barenghi 1998 curve)` : speed.message}
              {prior ? `; prior sd ${formatSignificant(prior.sd_m_s, 2)} m/s` : ''}
            </p>
            <CheckWithHelp
              name="speed prior"
              help={LOCATE_HELP.speedPrior}
              checked={options.speedPrior && !options.fitSpeed}
              disabled={options.fitSpeed}
              onChange={(checked) => set('opt.speedPrior', { speedPrior: checked })}
            >
              Fit the speed within u₂’s own uncertainty (a prior){options.fitSpeed ? ' — off while an effective speed is fitted freely' : ''}
            </CheckWithHelp>
            {options.speedPrior && !options.fitSpeed ? (
              <QuantityField
                {...locateFieldProps('opt.temperatureSd', TEMPERATURE_SD_SPEC, options.temperatureSd_K, temperatureSdEdit)}
                label="Bath temperature sd"
                help={LOCATE_HELP.temperatureSd}
              />
            ) : null}
          </div>
        ) : null}
        <label className="locate-choice">
          <input type="radio" name="locate-speed-mode" aria-describedby={speedHelp.describedBy} checked={options.speedMode === 'speed'} onChange={() => set('opt.speedMode', { speedMode: 'speed' })} />
          A speed I give
        </label>
        {options.speedMode === 'speed' ? (
          <div className="locate-indent">
            <QuantityField {...locateFieldProps('opt.speed', SPEED_SPEC, options.speed_m_s, speedEdit)} label="Speed" help={LOCATE_HELP.speed} />
          </div>
        ) : null}
        <CheckWithHelp
          name="fit an effective speed"
          help={LOCATE_HELP.fitSpeed}
          checked={options.fitSpeed}
          onChange={(checked) => set('opt.fitSpeed', { fitSpeed: checked })}
        >
          Fit an effective speed too (strong pulses can travel faster than u₂; needs one more sensor)
        </CheckWithHelp>
      </fieldset>
      <QuantityField
        {...locateFieldProps('opt.arrivalSd', DEFAULT_SD_SPEC, options.arrivalSd_s, defaultSdEdit)}
        label="Timing sd of sensors without their own"
        help={LOCATE_HELP.defaultSd}
      />
      <div className="locate-group">
        <HelpLabel htmlFor={surfaceId} className="locate-field__label" help={surfaceHelp}>
Source on a surface
</HelpLabel>
        <select
          id={surfaceId}
          className="locate-select"
          value={options.surface}
          aria-describedby={surfaceHelp.describedBy}
          onChange={(event) => set('opt.surface', { surface: event.target.value as SurfaceKind })}
        >
          {SURFACE_CHOICES.map((c) => (
            <option key={c.kind} value={c.kind}>
              {c.label}
            </option>
          ))}
        </select>
        {options.surface !== 'none' ? (
          <div className="locate-surface-fields">
            {SURFACE_FIELDS[options.surface].map((f) => (
              <QuantityField
                key={f.id}
                {...locateFieldProps(`opt.${f.id}`, f.spec, f.value(options), f.edit)}
                label={f.spec.label.replace(/^(Sphere|Cylinder|Plane) /, '')}
                describedBy={surfaceHelp.describedBy}
              />
            ))}
          </div>
        ) : null}
      </div>
      <SensorRegion options={options} set={set} />
      <CheckWithHelp
        name="robust refit"
        help={LOCATE_HELP.dropOutliers}
        checked={options.dropOutliers}
        onChange={(checked) => set('opt.dropOutliers', { dropOutliers: checked })}
      >
        Robust refit: leave out the worst sensor while its residual exceeds 3σ
      </CheckWithHelp>
    </section>
  );
}

/** Where the quality map may suggest one more sensor: outside the body (always), inside a box (when asked). */
function SensorRegion({ options, set }: { options: LocateOptionsInput; set: (key: string, patch: Partial<LocateOptionsInput>) => void }) {
  const region = options.sensorRegion;
  const body = options.surface === 'sphere' || options.surface === 'cylinder' ? options.surface : null;
  return (
    <div className="locate-group">
      <CheckWithHelp name="region for added sensors" help={LOCATE_HELP.sensorRegion} checked={region.on} onChange={(checked) => set('opt.sensorRegion', { sensorRegion: { ...region, on: checked } })}>
        Suggest an added sensor only inside a box{body ? ` (never inside the ${body})` : ''}
      </CheckWithHelp>
      {region.on ? (
        <div className="locate-surface-fields">
          {(['min', 'max'] as const).flatMap((corner) =>
            ([0, 1, 2] as const).map((axis) => (
              <QuantityField
                key={`${corner}${axis}`}
                {...locateFieldProps(`opt.region.${corner}${axis}`, regionSpec(corner, axis), (corner === 'min' ? region.min_m : region.max_m)[axis], regionEdit(corner, axis))}
                label={`${corner === 'min' ? 'lowest' : 'highest'} ${AXIS_NAMES[axis]}`}
              />
            )),
          )}
        </div>
      ) : null}
    </div>
  );
}

/** A checkbox with its label and a "?" beside it (a button cannot sit inside the label). */
function CheckWithHelp({
  name,
  help,
  checked,
  onChange,
  children,
  disabled = false,
}: { name: string; help: HelpTopic; checked: boolean; onChange: (checked: boolean) => void; children: ReactNode; disabled?: boolean }) {
  const fieldHelp = useFieldHelp(name, help);
  return (
    <div className="locate-check">
      <div className="locate-check__row">
        <label className="locate-choice">
          <input type="checkbox" checked={checked} disabled={disabled} aria-describedby={fieldHelp.describedBy} onChange={(event) => onChange(event.target.checked)} />
          {children}
        </label>
        {fieldHelp.button}
      </div>
      {fieldHelp.panel}
    </div>
  );
}
