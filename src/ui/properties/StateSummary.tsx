import { type HeliumProperties, ITS90_RANGE_K, T_LAMBDA_K } from '../../physics';
import { INSENSITIVE_SLOPE_M_S_K } from '../charts/curves';
import { formatSignificant } from '../units/format-number';
import { useHeliumProperties } from '../store';
import { formatMillikelvin } from '../units/temperature-text';
import { KeyFigures } from './KeyFigures';
import { CRITICAL_REGION_UK, MODEL_REGION_TEXT } from './regions';

/** Phase, where the numbers come from and how well a time of flight pins T here. */
export function StateSummary() {
  const p = useHeliumProperties();
  const inModelRegion = p.model === 'Landau model';
  return (
    <section className="card" aria-labelledby="state-title">
      <h2 id="state-title" className="card-title">
        At this temperature
      </h2>
      <KeyFigures properties={p} />
      <dl className="state-list">
        <div>
          <dt>Phase</dt>
          <dd>
            <span className={`badge ${p.phase === 'He II' ? 'badge--superfluid' : 'badge--normal'}`}>{p.phase}</span>{' '}
            {p.phase === 'He II' ? 'superfluid' : 'normal fluid'}, {lambdaDistance(p.temperature_K)}
          </dd>
        </div>
        <div>
          <dt>Model</dt>
          <dd>
            <span className={`badge ${inModelRegion ? 'badge--model' : 'badge--measured'}`}>{p.model}</span>{' '}
            {modelDetail(p)}
          </dd>
        </div>
        <div>
          <dt>Vapour-pressure scale</dt>
          <dd>{vapourScale(p)}</dd>
        </div>
        <div>
          <dt>Time of flight</dt>
          <dd>{timeOfFlight(p)}</dd>
        </div>
      </dl>
      <p className={`model-note${inModelRegion ? ' model-note--active' : ''}`}>
        {MODEL_REGION_TEXT} is a model region: u₂ there comes from the Landau model, an extrapolation below the measured
        curve, not from measurements.
      </p>
    </section>
  );
}

function lambdaDistance(temperature_K: number): string {
  const distance_K = temperature_K - T_LAMBDA_K;
  if (distance_K === 0) return 'at Tλ';
  return `${formatMillikelvin(Math.abs(distance_K))} mK ${distance_K < 0 ? 'below' : 'above'} Tλ`;
}

function modelDetail(p: HeliumProperties): string {
  if (p.secondSoundRegion === 'Landau model') return `u₂ extrapolated (${MODEL_REGION_TEXT})`;
  if (p.secondSoundRegion === 'critical scaling') return `u₂ from a critical power law (last ${CRITICAL_REGION_UK} µK below Tλ)`;
  if (p.secondSoundRegion === null) return 'reference data; no u₂ in He I';
  return 'u₂ from the reference curve';
}

function vapourScale(p: HeliumProperties): string {
  if (p.vapourPressureScale === null) return 'none (no vapour-pressure data below 0.5 K)';
  if (p.vapourPressureScale === 'ITS-90') return 'ITS-90';
  return `${p.vapourPressureScale}: ITS-90 starts at ${ITS90_RANGE_K[0]} K`;
}

function timeOfFlight(p: HeliumProperties): string {
  const slope = p.secondSoundSlope_m_s_K;
  if (slope === null) return 'no second sound in He I';
  const magnitude = `|du₂/dT| = ${formatSignificant(Math.abs(slope), 3)} m/s/K`;
  if (Math.abs(slope) < INSENSITIVE_SLOPE_M_S_K) {
    return `${magnitude}: insensitive (below ${INSENSITIVE_SLOPE_M_S_K} m/s/K)`;
  }
  return `${magnitude}: sensitive (≥ ${INSENSITIVE_SLOPE_M_S_K} m/s/K)`;
}
