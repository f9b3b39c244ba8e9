import type { ReactNode } from 'react';
import { lineDensityGeometry, type ResonanceFit } from '../../physics';
import { ChartFigure } from '../charts/ChartFigure';
import { CandidatesTable } from '../converter/CandidatesTable';
import { DropZone } from '../converter/DropZone';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import { formatMeasured } from '../units/format-measured';
import { formatScientific, formatSignificant } from '../units/format-number';
import { useDisplayUnit } from '../units/use-display-unit';
import { readResonatorFile } from './read-file';
import { sweepFigure } from './resonator-figures';
import type { LineDensityPair } from './derive-resonator';
import type { ResonatorFileRole } from './resonator-slice';
import { ResonatorField } from './ResonatorField';
import { useResonatorFits, useResonatorReading } from './use-resonator';

/** A sweep and its vortex-free reference → fits, temperature candidates, line density. */
export function ResonatorSweep() {
  const { sweep, reference, sweepFit, referenceFit } = useResonatorFits();
  return (
    <section className="card resonator-card" aria-labelledby="resonator-sweep-title">
      <h2 id="resonator-sweep-title" className="card-title">
        Read a frequency sweep
      </h2>
      <p className="muted">
        CSV columns <code>frequency_Hz</code> and <code>x</code>, <code>y</code> (also X/Y, in_phase/quadrature) or <code>amplitude</code>; a unit in a name scales it (frequency_kHz, x_mV).
      </p>
      <div className="resonator-drops">
        <FileSlot fileRole="sweep" title="Sweep" fileName={sweep?.name ?? null} />
        <FileSlot fileRole="reference" title="Vortex-free reference" fileName={reference?.name ?? null} />
      </div>
      <div className="resonator-fields">
        <ResonatorField name="mode" />
        <ResonatorField name="neighbour_Hz" />
        <ResonatorField name="pressure_Pa" />
      </div>
      {sweepFit && !sweepFit.ok ? (
        <p className="field-error" role="alert">
          The sweep could not be fitted: {sweepFit.message}
        </p>
      ) : null}
      {referenceFit && !referenceFit.ok ? (
        <p className="field-error" role="alert">
          The reference could not be fitted: {referenceFit.message}
        </p>
      ) : null}
      {sweepFit?.ok && sweep ? (
        <>
          <FitTable fit={sweepFit.value} reference={referenceFit?.ok ? referenceFit.value : null} />
          <ChartFigure
            id="resonator-sweep-chart"
            title="Sweep, fit and residuals"
            caption="Dots: |x + iy| of the sweep (grey: the reference); lines: the fitted complex Lorentzian on its linear background; dotted: the fitted centre. Below: residuals of x and y, which should scatter evenly about zero."
          >
            <PlotlyChart
              chartId="resonator-sweep"
              label="Sweep amplitude against frequency with the fitted resonance and residuals"
              {...sweepFigure(sweep.data, sweepFit.value, reference && referenceFit?.ok ? { data: reference.data, fit: referenceFit.value } : null)}
            />
          </ChartFigure>
        </>
      ) : null}
    </section>
  );
}

function FileSlot({ fileRole: role, title, fileName }: { fileRole: ResonatorFileRole; title: string; fileName: string | null }) {
  const error = useSekundoStore((s) => s.resonatorFileErrors[role]);
  return (
    <div className="resonator-drop">
      <h3 className="resonator-drop__title">{title}</h3>
      <DropZone buttonLabel={`Choose a ${title.toLowerCase()} CSV`} onFiles={(files) => files[0] && void readResonatorFile(role, files[0])}>
        <p className="muted resonator-drop__file">{fileName ? `Open: ${fileName}` : 'No file yet.'}</p>
      </DropZone>
      {error ? (
        <p className="field-error" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

function FitTable({ fit, reference }: { fit: ResonanceFit; reference: ResonanceFit | null }) {
  const row = (label: string, pick: (f: ResonanceFit) => [number, number | null], unit: string, digits = 4): ReactNode => (
    <tr>
      <th scope="row">{label}</th>
      <td className="num">{formatMeasured(...pick(fit), digits).text}</td>
      {reference ? <td className="num">{formatMeasured(...pick(reference), digits).text}</td> : null}
      <td>{unit}</td>
    </tr>
  );
  const scale = Math.max(fit.amplitude, reference?.amplitude ?? 0);
  const [factor, signal] = scale >= 1 ? [1, 'V'] : scale >= 1e-3 ? [1e3, 'mV'] : scale >= 1e-6 ? [1e6, 'µV'] : [1e9, 'nV'];
  return (
    <div className="table-scroll">
      <table className="properties-table resonator-fit" data-testid="resonator-fit">
        <caption>Fitted resonance (sds from the fit, noise from the residuals)</caption>
        <thead>
          <tr>
            <th scope="col">quantity</th>
            <th scope="col" className="num">sweep</th>
            {reference ? <th scope="col" className="num">reference</th> : null}
            <th scope="col">unit</th>
          </tr>
        </thead>
        <tbody>
          {row('centre f₀', (f) => [f.frequency_Hz, f.frequencySd_Hz], 'Hz', 9)}
          {row('full width Δ', (f) => [f.width_Hz, f.widthSd_Hz], 'Hz')}
          {row('peak amplitude A', (f) => [f.amplitude * factor, f.amplitudeSd * factor], signal)}
          {row('Q = f₀/Δ', (f) => [f.q, f.qSd], '')}
          {fit.phase_rad !== null ? row('phase φ', (f) => [f.phase_rad ?? Number.NaN, f.phaseSd_rad], 'rad') : null}
          {row('noise per point', (f) => [f.residualSd * factor, null], signal, 2)}
        </tbody>
      </table>
      {[...fit.warnings.map((w) => ({ w, whose: 'sweep' })), ...(reference?.warnings ?? []).map((w) => ({ w, whose: 'reference' }))].map(({ w, whose }) => (
        <p key={`${whose}-${w.code}`} className="plan-caution">
          <strong>Caution ({whose}):</strong> {w.message}
        </p>
      ))}
    </div>
  );
}

/** What the fitted sweep says: every candidate temperature from f₀, and the vortex line density. */
export function ResonatorReading() {
  const reading = useResonatorReading();
  const temperature = useDisplayUnit('temperature');
  const { referenceFit } = useResonatorFits();
  if (!reading) return null;
  const t = reading.temperature;
  return (
    <section className="card resonator-card resonator-reading" aria-labelledby="resonator-reading-title">
      <h2 id="resonator-reading-title" className="card-title">
        Temperature and line density from the sweep
      </h2>
      <h3 className="resonator-sub resonator-sub--first">Temperature from f₀</h3>
      {t === null ? (
        <p className="muted" role="status">
          {reading.modeReason}.
        </p>
      ) : t.ok ? (
        <>
          <p data-testid="resonator-speed">
            u₂ = 2 d f₀/n = {formatMeasured(t.value.speed_m_s, t.value.speedSd_m_s).text} m/s with n = {reading.mode} ({reading.modeReason}).{' '}
            {reading.choice ? <span className="muted">{reading.choice.reason}</span> : null}
          </p>
          {reading.choice ? (
            <CandidatesTable candidates={t.value.candidates} rule={reading.rule} choice={reading.choice} caption={`Every temperature with u₂ = ${formatSignificant(t.value.speed_m_s, 6)} m/s, coldest first`} />
          ) : (
            <p className="muted">No temperature between 0.3 K and Tλ has this speed: check the gap, the mode number and the spacer.</p>
          )}
        </>
      ) : (
        <p className="field-error" role="status">
          {t.message}
        </p>
      )}
      <h3 className="resonator-sub">Vortex line density</h3>
      {reading.lineDensity === null ? (
        <p className="muted" role="status">
          {referenceFit && !referenceFit.ok ? 'The reference could not be fitted.' : 'Drop a vortex-free reference sweep of the same mode at the same drive to get the line density.'}
        </p>
      ) : reading.lineDensity.ok ? (
        <LineDensityBox value={reading.lineDensity.value} bath={reading.bath} temperatureText={`${temperature.measured(reading.bath.temperature_K, null, 5).value} ${temperature.shown}`} />
      ) : (
        <p className="field-error" role="status">
          {reading.lineDensity.message}
        </p>
      )}
    </section>
  );
}

function LineDensityBox({ value, bath, temperatureText }: { value: LineDensityPair; bath: { from: string }; temperatureText: string }) {
  const a = value.amplitude;
  const geometry = lineDensityGeometry(a.geometry);
  return (
    <div className="resonator-density" data-testid="resonator-line-density">
      <p className="resonator-density__value">
        L = {formatMeasured(a.lineDensity_m2, a.sd_m2).text} m⁻²
      </p>
      <p className="muted">
        From the peak amplitudes, L = (k Δ₀/(B κ))(A₀/A − 1) with k = {Math.round(geometry.factor / Math.PI)}π (tangle: {geometry.label.replace(/ \(.*\)$/, '')}; {geometry.source}): sd {formatScientific(a.sdMeasurement_m2, 2)} m⁻² from this sweep and {formatScientific(a.sdReference_m2, 2)} m⁻² from the reference. B = {formatSignificant(a.mutualFrictionB, 4)} at {temperatureText} ({bath.from}; Donnelly & Barenghi 1998); its own uncertainty is not published with the representation and is not included.
      </p>
      <p className="muted">
        Check from the widths, factor·(Δ − Δ₀)/(B κ): {formatMeasured(value.width.lineDensity_m2, value.width.sd_m2).text} m⁻²
        {value.apartSd > 3 ? '' : ' — the two agree.'}
      </p>
      {value.apartSd > 3 ? (
        <p className="plan-caution">
          <strong>Caution:</strong> the amplitude form and the width form differ by {formatSignificant(value.apartSd, 2)} sd: the drive or the gain changed between the sweeps, or the reference is not vortex-free. Trust the width form if the drive changed.
        </p>
      ) : null}
    </div>
  );
}
