import { useId } from 'react';
import { useSekundoStore } from '../store';
import { formatSignificant } from '../format/format-number';
import { speedOf } from './derive-locate';
import { DEFAULT_SD_SPEC, defaultSdEdit, SPEED_SPEC, SURFACE_FIELDS, speedEdit, TEMPERATURE_SPEC, temperatureEdit } from './locate-fields';
import type { LocateOptionsInput, SurfaceKind } from './locate-inputs';
import { LocateField } from './LocateField';

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
  const surfaceId = useId();
  const set = (key: string, patch: Partial<LocateOptionsInput>) => change(key, (inputs) => ({ ...inputs, options: { ...inputs.options, ...patch } }));
  const speed = speedOf(options);
  return (
    <section className="card locate-card locate-options" aria-labelledby="locate-options-title">
      <h2 id="locate-options-title" className="card-title">
        Fit options
      </h2>
      <fieldset className="locate-group">
        <legend className="locate-field__label">Speed of the front</legend>
        <label className="locate-choice">
          <input type="radio" name="locate-speed-mode" checked={options.speedMode === 'temperature'} onChange={() => set('opt.speedMode', { speedMode: 'temperature' })} />
          u₂ at the bath temperature
        </label>
        {options.speedMode === 'temperature' ? (
          <div className="locate-indent">
            <LocateField fieldKey="opt.temperature" spec={TEMPERATURE_SPEC} value={options.temperature_K} edit={temperatureEdit} label="Bath temperature T90" unit="K" />
            <p className="field-hint" aria-live="polite">
              {speed.ok ? `u₂ = ${formatSignificant(speed.speed_m_s, 4)} m/s (Donnelly & Barenghi 1998 curve)` : speed.message}
            </p>
          </div>
        ) : null}
        <label className="locate-choice">
          <input type="radio" name="locate-speed-mode" checked={options.speedMode === 'speed'} onChange={() => set('opt.speedMode', { speedMode: 'speed' })} />
          A speed I give
        </label>
        {options.speedMode === 'speed' ? (
          <div className="locate-indent">
            <LocateField fieldKey="opt.speed" spec={SPEED_SPEC} value={options.speed_m_s} edit={speedEdit} label="Speed" unit="m/s" />
          </div>
        ) : null}
        <label className="locate-choice">
          <input type="checkbox" checked={options.fitSpeed} onChange={(event) => set('opt.fitSpeed', { fitSpeed: event.target.checked })} />
          Fit an effective speed too (strong pulses can travel faster than u₂; needs one more sensor)
        </label>
      </fieldset>
      <LocateField fieldKey="opt.arrivalSd" spec={DEFAULT_SD_SPEC} value={options.arrivalSd_s} edit={defaultSdEdit} label="Timing sd of sensors without their own" unit="µs" />
      <div className="locate-group">
        <label htmlFor={surfaceId} className="locate-field__label">
          Source on a surface
        </label>
        <select id={surfaceId} className="locate-select" value={options.surface} onChange={(event) => set('opt.surface', { surface: event.target.value as SurfaceKind })}>
          {SURFACE_CHOICES.map((c) => (
            <option key={c.kind} value={c.kind}>
              {c.label}
            </option>
          ))}
        </select>
        {options.surface !== 'none' ? (
          <div className="locate-surface-fields">
            {SURFACE_FIELDS[options.surface].map((f) => (
              <LocateField
                key={f.id}
                fieldKey={`opt.${f.id}`}
                spec={f.spec}
                value={f.value(options)}
                edit={f.edit}
                label={f.spec.name.replace(/^(Sphere|Cylinder|Plane) /, '')}
                unit={f.spec.unit === 'mm' ? 'mm' : undefined}
              />
            ))}
          </div>
        ) : null}
      </div>
      <label className="locate-choice">
        <input type="checkbox" checked={options.dropOutliers} onChange={(event) => set('opt.dropOutliers', { dropOutliers: event.target.checked })} />
        Robust refit: leave out the worst sensor while its residual exceeds 3σ
      </label>
    </section>
  );
}
