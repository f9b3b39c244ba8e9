/**
 * Walls, layout faults, strong heating and the consistency of the planner's figures.
 * Sources: R = (Z − h)/(Z + h) with Z = ρ c_p u2 (≈ 8.5 MW/(m²·K) at 1.8 K) and the Kapitza
 * conductance of order kW/(m²·K) (G. L. Pollack, Rev. Mod. Phys. 41, 48 (1969)); a temperature
 * sensor on a wall sees (1 + R) times the incident wave (PHYSICS notes §4); the Gorter–Mellink
 * transient (S. W. Van Sciver, Helium Cryogenics, 2012; PHYSICS notes §5).
 */
import { describe, expect, it } from 'vitest';
import {
  computePlan,
  GORTER_MELLINK_A_M_S_KG,
  heatConductivityFunctionUnchecked,
  heliumProperties,
  KAPITZA_CONDUCTANCE_W_M2K4,
  type PlanInput,
  SPACER_MATERIALS,
  strongHeatingFlux,
  T_LAMBDA_K,
  temperatureSpread,
  timeToLambda,
  wallReflection,
} from '../../src/physics';
import { basePlan, withHeater, withSensor } from '../support/plans';

const p18 = heliumProperties(1.8);
const U2 = p18.secondSound_m_s as number;
const Z18 = p18.density_kg_m3 * p18.specificHeat_J_kgK * U2;

describe('solid walls reflect second sound almost wholly', () => {
  it('Z = ρ c_p u2 ≈ 8.5 MW/(m²·K) at 1.8 K (PHYSICS notes §4), so R = (Z − h)/(Z + h) ≈ 0.9993 with h ≈ 2.9 kW/(m²·K)', () => {
    expect(Z18 / 1e6).toBeCloseTo(8.5, 1);
    const r = wallReflection(1.8, Z18);
    // h = 500·T³ W/(m²·K⁴): an order-of-magnitude Kapitza conductance (Pollack 1969, from memory).
    expect(r.conductance_W_m2K).toBeCloseTo(KAPITZA_CONDUCTANCE_W_M2K4 * 1.8 ** 3, 9);
    expect(r.reflection).toBeCloseTo((Z18 - r.conductance_W_m2K) / (Z18 + r.conductance_W_m2K), 15);
    expect(r.reflection).toBeGreaterThan(0.999);
  });

  it('a sensor on a wall sees (1 + R) times the incident plane wave (PHYSICS notes §4)', () => {
    const d = 0.02;
    const plan = withSensor(basePlan({ reflectors: [{ label: 'sensor plate', axis: 'z', position_m: d, reflection: null }] }), { position_m: [0, 0, d] });
    const result = computePlan(plan);
    const R = result.planes.find((p) => p.label === 'sensor plate')?.reflection as number;
    const incident = result.heater.faceDeltaT_K as number;
    expect(result.sensors[0]?.amplitude_K).toBeCloseTo((1 + R) * incident, 12);
    expect(result.sensors[0]?.onPlane).toBe('sensor plate');
  });

  it('a typed R is a measured value and is used as typed; the note says what a solid wall would give', () => {
    const result = computePlan(basePlan({ reflectors: [{ label: 'mesh', axis: 'z', position_m: 0.08, reflection: 0.3 }] }));
    const mesh = result.planes.find((p) => p.label === 'mesh');
    expect(mesh?.reflection).toBe(0.3);
    expect(mesh?.source).toBe('measured');
    expect(mesh?.note).toMatch(/measured.*solid wall would reflect 0\.999/);
  });

  it('the heater’s own wall is added when not listed, and not for a small source standing free', () => {
    const wall = computePlan(basePlan()).planes;
    expect(wall.map((p) => [p.label, p.source])).toEqual([['heater plate', 'heater-plate']]);
    const free = computePlan(withHeater(basePlan(), { geometry: 'point', mount: 'free' })).planes;
    expect(free).toEqual([]);
  });
});

describe('layout faults', () => {
  const lidPlan = (sensorAt: number, warm: boolean): PlanInput =>
    withSensor(
      basePlan({
        reflectors: [
          { label: 'bottom plate', axis: 'z', position_m: 0, reflection: null },
          { label: 'lid', axis: 'z', position_m: 0.06, reflection: null },
        ],
        echoOrder: 4,
        spacer: { materialId: 'stainless-304', measuredWarm: warm },
      }),
      { id: 'far', label: 'Bolometer far', position_m: [0, 0, sensorAt] },
    );

  it('a sensor behind a reflecting plane is a stop naming the plane and the sensor, with no echoes at all (the issue’s 140 mm behind a 60 mm lid)', () => {
    const result = computePlan(lidPlan(0.14, true));
    const stop = result.warnings.find((w) => w.code === 'behind-plane');
    expect(stop?.severity).toBe('stop');
    expect(stop?.sensorId).toBe('far');
    expect(stop?.message).toMatch(/Bolometer far lies behind the reflecting plane "lid"/);
    const s = result.sensors[0];
    expect(s?.secondSoundArrival_s).toBe(null);
    expect(s?.echoes).toEqual([]);
  });

  it('no echo ever arrives before its direct pulse', () => {
    const plan = basePlan({
      reflectors: [
        { label: 'lid', axis: 'z', position_m: 0.06, reflection: null },
        { label: 'side', axis: 'x', position_m: 0.02, reflection: null },
      ],
      echoOrder: 6,
      sensors: [0.01, 0.03, 0.059].map((z, i) => ({ ...basePlan().sensors[0], id: `s${i}`, position_m: [0.005, 0, z] as const })) as PlanInput['sensors'],
    });
    for (const s of computePlan(plan).sensors) {
      for (const e of s.echoes) expect(e.arrival_s).toBeGreaterThan(s.secondSoundArrival_s as number);
    }
  });

  it('planes measured warm shrink like the sensors: a sensor at the lid’s nominal place sits on the cold lid, (1 + R), no spurious echo', () => {
    const result = computePlan(lidPlan(0.06, true));
    const contraction = SPACER_MATERIALS.find((m) => m.id === 'stainless-304')?.contraction as number;
    expect(result.planes.find((p) => p.label === 'lid')?.position_m).toBeCloseTo(0.06 * (1 - contraction), 15);
    const s = result.sensors[0];
    expect(s?.onPlane).toBe('lid');
    expect(result.warnings.some((w) => w.code === 'behind-plane' || w.code === 'echo-overlap')).toBe(false);
    const R = result.planes.find((p) => p.label === 'lid')?.reflection as number;
    expect(s?.amplitude_K).toBeCloseTo((1 + R) * (result.heater.faceDeltaT_K as number), 12);
    // The first echo comes after a full round trip to the bottom plate and back, not 20 µs later.
    expect((s?.echoes[0]?.arrival_s as number) - (s?.secondSoundArrival_s as number)).toBeGreaterThan(0.9 * ((2 * 0.06) / U2));
  });

  it('a side wall across the heater’s face is a stop', () => {
    const plan = withHeater(basePlan({ reflectors: [{ label: 'side', axis: 'x', position_m: 0.002, reflection: null }] }), { geometry: 'rectangle', width_m: 0.01, height_m: 0.01, power_W: 0.01 });
    const result = computePlan(plan);
    expect(result.warnings.find((w) => w.code === 'plane-through-heater')?.severity).toBe('stop');
    expect(result.sensors[0]?.secondSoundArrival_s).toBe(null);
  });
});

describe('strong heating by the one-dimensional Gorter–Mellink transient (an estimate)', () => {
  it('f⁻¹ = ρs³ s⁴ T³/(A_GM ρn) peaks near 1.9 K (PHYSICS notes §5)', () => {
    let best = 0;
    let at = 0;
    for (let T = 1.2; T < 2.17; T += 0.005) {
      const f = heatConductivityFunctionUnchecked(T);
      if (f > best) [best, at] = [f, T];
    }
    expect(at).toBeGreaterThan(1.85);
    expect(at).toBeLessThan(2.0);
    expect(GORTER_MELLINK_A_M_S_KG).toBe(1000);
  });

  it('a 1 m channel at 1.8 K carries about 1–2 W/cm² steadily, q³L = ∫f⁻¹dT (the usual order; from memory, no single source)', () => {
    let integral = 0;
    const dT = 1e-4;
    for (let T = 1.8; T < T_LAMBDA_K; T += dT) integral += heatConductivityFunctionUnchecked(T + dT / 2) * dT;
    const q = Math.cbrt(integral / 1);
    expect(q / 1e4).toBeGreaterThan(1);
    expect(q / 1e4).toBeLessThan(2);
  });

  it('q* falls as τ^(−1/4) and depends on the bath; t_λ = G/q⁴ is the same relation read the other way', () => {
    expect(strongHeatingFlux(1.8, 1e-4) / strongHeatingFlux(1.8, 1e-3)).toBeCloseTo(10 ** 0.25, 9);
    expect(strongHeatingFlux(1.95, 1e-3)).toBeLessThan(strongHeatingFlux(1.8, 1e-3));
    expect(strongHeatingFlux(2.1, 1e-3)).toBeLessThan(strongHeatingFlux(1.95, 1e-3));
    const q = strongHeatingFlux(1.9, 2e-4);
    expect(timeToLambda(1.9, q)).toBeCloseTo(2e-4, 12);
  });

  it('G(Tb) = (8/5) ∫ ρ c_p(T) ∫_T^{Tλ} f⁻¹ dT′ dT, the heat-balance form (q⁴t = (4/5) ρ c_p f⁻¹ ΔT² for constant properties), by an independent midpoint double sum', () => {
    const Tb = 1.9;
    let G = 0;
    const dT = 2e-4;
    for (let T = Tb; T < T_LAMBDA_K; T += dT) {
      let F = 0;
      for (let U = T; U < T_LAMBDA_K; U += dT) F += heatConductivityFunctionUnchecked(U + dT / 2) * dT;
      const p = heliumProperties(Math.min(T + dT / 2, T_LAMBDA_K - 1e-6));
      G += (8 / 5) * p.density_kg_m3 * p.specificHeat_J_kgK * F * dT;
      if (T > 2.17) break;
    }
    expect(timeToLambda(Tb, 1e4) * 1e16).toBeCloseTo(G, -Math.floor(Math.log10(G)) + 1);
  });
});

describe('consistency of the figures (issue item 5)', () => {
  it('first sound includes the sensor lag, as second sound does', () => {
    const s = computePlan(withSensor(basePlan(), { lag_s: 30e-6 })).sensors[0];
    expect(s?.firstSoundArrival_s).toBeCloseTo(0.05 / p18.firstSound_m_s + 30e-6, 12);
  });

  it('the timing sd’s relative part uses the travel time, not travel time plus lag', () => {
    const s = computePlan(withSensor(basePlan(), { lag_s: 1e-3, noise_V: 1e-5 })).sensors[0];
    const travel = (s?.secondSoundArrival_s as number) - 1e-3;
    const expected = temperatureSpread(1.8, (s?.timingSd_s as number) / travel).sd_K;
    expect(s?.temperatureChangeSd_K).toBeCloseTo(expected, 15);
  });

  it('the repetition-rate caution always asks for a rate below the one set', () => {
    for (const rate of [385, 390, 400, 1000]) {
      const plan = withHeater(basePlan(), { repetitionRate_Hz: rate });
      const w = computePlan(plan).warnings.find((x) => x.code === 'range-ambiguity');
      expect(w).toBeDefined();
      const suggested = Number(/to ([\d.]+) Hz or less/.exec(w?.message ?? '')?.[1]);
      expect(suggested).toBeLessThan(rate);
      expect(1 / suggested).toBeGreaterThanOrEqual(w?.limit as number);
    }
  });

  it('the shock card and warning name the edge that steepens: leading below the α2 sign change, trailing above', () => {
    expect(computePlan(basePlan({ temperature_K: 1.8 })).heater.shockEdge).toBe('leading');
    expect(computePlan(basePlan({ temperature_K: 1.95 })).heater.shockEdge).toBe('trailing');
  });
});
