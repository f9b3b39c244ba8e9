import type { HeaterPlanResult } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { LADDERS, type Ladder, readText, temperatureText } from '../units/ladders';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from '../units/use-shown-ladders';

/** What the heater does: flux, energy, power into the bath, the wave it launches and where it would shock. */
export function HeaterSummary() {
  const outcome = usePlanOutcome();
  const L = useShownLadders();
  if (!outcome.ok) return null;
  const { heater, temperature_K, headPressure_Pa } = outcome.result;
  const bath = outcome.bath;
  const show = (x: number | null, ladder: Ladder, digits = 3) => (x === null ? '—' : readText(x, ladder, digits));
  const rows: [string, string, string?][] = [
    [
      'Bath temperature',
      temperatureText(temperature_K, L.temperature),
      bath.vapourPressure_Pa === null ? 'as typed' : `from ${readText(bath.vapourPressure_Pa, L.pressure)} (${bath.scale})`,
    ],
    ['Peak heat flux', show(heater.flux_W_m2, L.heatFlux), `peak power ${show(heater.power_W, L.power)}`],
    ['Energy per pulse', show(heater.energyPerPulse_J, ENERGY)],
    ['Average power into the bath', show(heater.averagePower_W, L.power), 'boils helium off; check the cooling power'],
    ['δT at the heater face', show(heater.faceDeltaT_K, L.temperatureDifference), 'q/(ρ cₚ u₂): the plane-wave value, reached only on short paths'],
    ['Plane-wave value holds up to', planeWave(heater, (x) => show(x, L.length)), planeWaveDetail(heater, outcome.input.heater.geometry, (x) => show(x, L.length))],
    ['Counterflow velocity', heater.counterflowVelocity_m_s === null ? '—' : `${formatSignificant(heater.counterflowVelocity_m_s * 100, 3)} cm/s`, 'q/(ρs s T)'],
    [
      'Shock distance',
      heater.shockDistance_m === null ? '—' : Number.isFinite(heater.shockDistance_m) ? show(heater.shockDistance_m, L.length) : 'none',
      heater.shockEdge === null ? 'where the pulse would steepen' : `where the ${heater.shockEdge} edge would steepen (α₂ ${heater.shockEdge === 'leading' ? '> 0, below' : '< 0, above'} its sign change near 1.88 K)`,
    ],
    [
      'Strong heating from',
      show(heater.strongHeatingFlux_W_m2, L.heatFlux, 2),
      'the face reaches Tλ within this pulse (1-D Gorter–Mellink; an estimate, good to about ×2)',
    ],
    [
      'Solid walls reflect',
      heater.wallReflection === null ? '—' : `R = ${heater.wallReflection.toFixed(4)}`,
      heater.wallImpedance_W_m2K === null || heater.kapitzaConductance_W_m2K === null
        ? ''
        : `(Z − h)/(Z + h): Z = ρ cₚ u₂ = ${formatSignificant(heater.wallImpedance_W_m2K / 1e6, 3)} MW/(m²·K), Kapitza h ≈ ${formatSignificant(heater.kapitzaConductance_W_m2K / 1e3, 2)} kW/(m²·K) (order of magnitude, ∝ T³)`,
    ],
    ['Pulse length', show(heater.duration_s, L.time), `effective rise ${show(heater.effectiveRise_s, LADDERS.time)}`],
    ['Head pressure at the setup', show(headPressure_Pa, L.pressure)],
  ];
  return (
    <section className="card plan-heater-summary" aria-labelledby="planner-heater-summary-title">
      <h3 id="planner-heater-summary-title" className="card-title">
        Heater and bath
      </h3>
      <dl className="summary-list">
        {rows.map(([term, value, detail]) => (
          <div key={term} className="summary-list__item">
            <dt>{term}</dt>
            <dd>
              <span className="summary-list__value">{value}</span>
              {detail ? <span className="summary-list__detail">{detail}</span> : null}
            </dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

function planeWave(h: HeaterPlanResult, length: (x: number) => string): string {
  if (h.planeWaveRange_m === null) return h.faceDeltaT_K === null ? '—' : 'no range (a point source)';
  return h.planeWaveRange_m === 0 ? 'nowhere for this pulse' : length(h.planeWaveRange_m);
}

function planeWaveDetail(h: HeaterPlanResult, geometry: string, length: (x: number) => string): string {
  if (h.planeWaveEdge_m === null) return 'a point source: the signal follows dP/dt at every distance';
  const which = geometry === 'disk' ? 'the radius' : 'half the shorter side';
  return `a²/(2u₂τ) on the axis, for the whole pulse, with a = ${length(h.planeWaveEdge_m)} (${which}); beyond, the pulse is shorter and turns bipolar`;
}

/** Joules with SI prefixes: the watt's ladder gives the same factors (only the symbols differ). */
const ENERGY: Ladder = [
  { shown: 'J', unit: 'W' },
  { shown: 'mJ', unit: 'mW' },
  { shown: 'µJ', unit: 'µW' },
];
