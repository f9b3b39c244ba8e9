import { useId } from 'react';
import { SPACER_MATERIALS, TANGLE_GEOMETRIES, type TangleGeometry } from '../../physics';
import { CsvExportButton } from '../export/CsvExportButton';
import { HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { useSekundoStore } from '../store';
import { formatScientific, formatSignificant } from '../units/format-number';
import { useDisplayUnit } from '../units/use-display-unit';
import { ResonatorField } from './ResonatorField';
import { useResonatorPlan } from './use-resonator';

/** Before a cooldown: the resonator and bath → modes, df/dT, spacing, frequency step, Fresnel numbers, smallest L. */
export function ResonatorPlan() {
  const plan = useResonatorPlan();
  const temperature = useDisplayUnit('temperature');
  const length = useDisplayUnit('length');
  return (
    <section className="card resonator-card" aria-labelledby="resonator-plan-title">
      <div className="card-head">
        <h2 id="resonator-plan-title" className="card-title">
          Plan a resonator
        </h2>
        {plan.ok ? (
          <CsvExportButton
            fileName="resonator-modes.csv"
            what="the mode table"
            table={() => ({
              header: ['n', 'frequency_Hz', 'dfdT_Hz_K', 'frequency_step_Hz', 'fresnel_number'],
              rows: plan.value.modes.map((m) => [m.n, m.frequency_Hz, m.dfdT_Hz_K, m.frequencyStep_Hz, m.fresnelNumber]),
            })}
          />
        ) : null}
      </div>
      <div className="resonator-fields">
        <ResonatorField name="gap_m" />
        <ResonatorField name="gapSd_m" />
        <SpacerSelect />
        <ResonatorField name="plateDiameter_m" />
        <ResonatorField name="temperature_K" />
        <ResonatorField name="modes" />
        <ResonatorField name="targetSd_K" />
        <ResonatorField name="width0_Hz" />
        <ResonatorField name="amplitudeNoise" />
        <GeometrySelect />
      </div>
      {plan.ok ? (
        <>
          <dl className="resonator-figures" data-testid="resonator-plan-summary">
            <div>
              <dt>Cold gap</dt>
              <dd>
                {length.measured(plan.value.gapCold_m, plan.value.gapColdSd_m || null, 6).text} {length.shown}
              </dd>
            </div>
            <div>
              <dt>u₂ at the bath</dt>
              <dd>
                {formatSignificant(plan.value.speed_m_s, 6)} m/s, du₂/dT {formatSignificant(plan.value.slope_m_s_K, 4)} m/s/K
              </dd>
            </div>
            <div>
              <dt>Mode spacing u₂/2d</dt>
              <dd data-testid="resonator-mode-spacing">{formatSignificant(plan.value.modeSpacing_Hz, 6)} Hz</dd>
            </div>
            <div>
              <dt>Frequency step for the target</dt>
              <dd>{plan.value.relativeStep === null ? '— (no target)' : `δf/f = ${formatSignificant(plan.value.relativeStep, 3)} (every mode)`}</dd>
            </div>
            <div>
              <dt>df/dT = 0 at</dt>
              <dd>
                {temperature.measured(plan.value.insensitiveAt_K.minimum, null).value} and {temperature.measured(plan.value.insensitiveAt_K.maximum, null).value} {temperature.shown} (the u₂ minimum and maximum)
              </dd>
            </div>
            <div>
              <dt>Smallest line density</dt>
              <dd>
                {plan.value.lineDensityNoise_m2 === null
                  ? '— (give the expected width and the amplitude noise)'
                  : `${formatScientific(plan.value.lineDensityNoise_m2, 2)} m⁻² at 1 sd, ${formatScientific(plan.value.lineDensityDetectable_m2 ?? Number.NaN, 2)} m⁻² at 3 sd`}
              </dd>
            </div>
          </dl>
          <ul className="resonator-notes">
            {plan.value.notes.map((n) => (
              <li key={n.code} className={n.severity === 'caution' ? 'plan-caution' : 'resonator-note'}>
                <strong>{n.severity === 'caution' ? 'Caution' : 'Note'}:</strong> {n.message}
              </li>
            ))}
          </ul>
          <div className="table-scroll resonator-modes">
            <table className="properties-table">
              <caption>Modes f_n = n u₂/2d of ideal plates</caption>
              <thead>
                <tr>
                  <th scope="col">n</th>
                  <th scope="col" className="num">f_n (Hz)</th>
                  <th scope="col" className="num">df/dT (Hz/K)</th>
                  <th scope="col" className="num">step for target (Hz)</th>
                  <th scope="col" className="num">Fresnel N</th>
                </tr>
              </thead>
              <tbody>
                {plan.value.modes.map((m) => (
                  <tr key={m.n}>
                    <th scope="row">{m.n}</th>
                    <td className="num">{formatSignificant(m.frequency_Hz, 7)}</td>
                    <td className="num">{formatSignificant(m.dfdT_Hz_K, 4)}</td>
                    <td className="num">{m.frequencyStep_Hz === null ? '—' : formatSignificant(m.frequencyStep_Hz, 3)}</td>
                    <td className={`num${m.fresnelNumber !== null && m.fresnelNumber < 1 ? ' resonator-low' : ''}`}>{m.fresnelNumber === null ? '—' : formatSignificant(m.fresnelNumber, 3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      ) : (
        <p className="field-error" role="status">
          {plan.message}
        </p>
      )}
    </section>
  );
}

function SpacerSelect() {
  const id = useId();
  const value = useSekundoStore((s) => s.resonatorInputs.spacerId);
  const set = useSekundoStore((s) => s.setResonatorInput);
  const help = useFieldHelp('Gap measured', {
    what: 'Whether the gap was measured warm on a spacer (it is then contracted by the material’s integrated 293 K → 4 K contraction, as the planner does) or is already the cold gap.',
    range: 'cold, or one of the spacer materials',
    origin: 'cold, or the demo’s stainless-steel spacer',
  });
  return (
    <div className="quantity-field">
      <HelpLabel htmlFor={id} className="quantity-field__label" help={help}>
        Gap measured
      </HelpLabel>
      <select id={id} className="plan-select" value={value ?? 'cold'} onChange={(e) => set('spacerId', e.target.value === 'cold' ? null : e.target.value)}>
        <option value="cold">cold (as given)</option>
        {SPACER_MATERIALS.map((m) => (
          <option key={m.id} value={m.id}>
            warm, on {m.name}
          </option>
        ))}
      </select>
    </div>
  );
}

function GeometrySelect() {
  const id = useId();
  const value = useSekundoStore((s) => s.resonatorInputs.geometry);
  const set = useSekundoStore((s) => s.setResonatorInput);
  const help = useFieldHelp('Tangle geometry', {
    what: 'How the vortex lines lie relative to the second-sound wave: the factor 4π/⟨sin²θ⟩ in L = factor·(Δ − Δ₀)/(Bκ). Isotropic (6π, Vinen 1957); perpendicular to the wave (4π, Hall & Vinen 1956: rotation about an axis along the plates); in planes holding the wave (8π, a counterflow tangle probed across the flow).',
    range: 'isotropic, perpendicular, in planes',
    origin: 'isotropic',
  });
  return (
    <div className="quantity-field">
      <HelpLabel htmlFor={id} className="quantity-field__label" help={help}>
        Tangle geometry
      </HelpLabel>
      <select id={id} className="plan-select" value={value} onChange={(e) => set('geometry', e.target.value as TangleGeometry)}>
        {TANGLE_GEOMETRIES.map((g) => (
          <option key={g.id} value={g.id}>
            {g.label}
          </option>
        ))}
      </select>
    </div>
  );
}
