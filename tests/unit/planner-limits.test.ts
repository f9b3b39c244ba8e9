/**
 * Each planner warning fires at its threshold and not below it. Thresholds and their bases are
 * documented in src/physics/planner.ts (PHYSICS notes §5; "common practice" where they say so).
 * The cases sit 1 % either side of the threshold.
 */
import { describe, expect, it } from 'vitest';
import {
  COUNTERFLOW_NOTE_M_S,
  computePlan,
  heliumProperties,
  LAMBDA_SHIFT_K_PER_PA,
  LARGE_AMPLITUDE_K,
  type PlanInput,
  SAMPLES_PER_EDGE,
  STANDARD_GRAVITY_M_S2,
  COUNTERFLOW_CAUTION_OF_U2,
  COUNTERFLOW_STOP_OF_U2,
  STRONG_FLUX_CAUTION_OF_LIMIT,
  strongHeatingFlux,
  T_LAMBDA_K,
  type WarningCode,
} from '../../src/physics';
import { basePlan, withHeater, withSensor } from '../support/plans';

const ABOVE = 1.01;
const BELOW = 0.99;
const AREA = 1e-4;
const p18 = heliumProperties(1.8);
const u2 = p18.secondSound_m_s as number;
const rhoCU = p18.density_kg_m3 * p18.specificHeat_J_kgK * u2;

function codes(plan: PlanInput): WarningCode[] {
  return computePlan(plan).warnings.map((w) => w.code);
}

function atFlux(plan: PlanInput, flux_W_m2: number): PlanInput {
  return withHeater(plan, { power_W: flux_W_m2 * AREA, area_m2: AREA });
}

describe('planner warnings at their thresholds', () => {
  it('large-amplitude: peak δT above 1 mK (common practice for thermometry)', () => {
    const fluxAtLimit = LARGE_AMPLITUDE_K * rhoCU;
    expect(codes(atFlux(basePlan(), fluxAtLimit * ABOVE))).toContain('large-amplitude');
    expect(codes(atFlux(basePlan(), fluxAtLimit * BELOW))).not.toContain('large-amplitude');
  });

  it('shock: shock distance u2·τ_rise/(|α2|·δT) shorter than the path', () => {
    const flux = 0.5e-3 * rhoCU; // δT = 0.5 mK at the heater face
    const alpha = Math.abs(p18.nonlinearity_per_K as number);
    const shock = (u2 * 1e-6) / (alpha * 0.5e-3);
    const at = (d: number) => withSensor(atFlux(basePlan(), flux), { position_m: [0, 0, d] });
    expect(codes(at(shock * ABOVE))).toContain('shock');
    expect(codes(at(shock * BELOW))).not.toContain('shock');
    const w = computePlan(at(shock * 2)).warnings.find((x) => x.code === 'shock');
    expect(w?.message).toMatch(/leading edge/); // α2 > 0 at 1.8 K
    expect(w?.message).toMatch(/biased by about/);
  });

  it('strong-flux: caution from half the Gorter–Mellink limit q*(T, τ), stop at it (estimate, gorter-mellink.ts)', () => {
    const plan = withHeater(basePlan(), { width_s: 1e-3 - 1e-6, riseTime_s: 1e-6 });
    const limit = strongHeatingFlux(1.8, 1e-3); // duration = width + rise = 1 ms
    const severity = (flux: number) => computePlan(atFlux(plan, flux)).warnings.find((w) => w.code === 'strong-flux')?.severity ?? null;
    expect(severity(limit * STRONG_FLUX_CAUTION_OF_LIMIT * BELOW)).toBe(null);
    expect(severity(limit * STRONG_FLUX_CAUTION_OF_LIMIT * ABOVE)).toBe('caution');
    expect(severity(limit * BELOW)).toBe('caution');
    expect(severity(limit * ABOVE)).toBe('stop');
    // Shorter pulses take more flux: q* ∝ τ^(−1/4).
    expect(strongHeatingFlux(1.8, 1e-5) / limit).toBeCloseTo(100 ** 0.25, 6);
  });

  it('counterflow: info above 1 cm/s, caution from 10 % of u₂, stop from 50 % of u₂ (w/u₂ the small-signal parameter; cut points common practice)', () => {
    const rhoS = p18.superfluidFraction * p18.density_kg_m3;
    const perVelocity = rhoS * p18.entropy_J_kgK * 1.8; // q = w·ρs·s·T
    const severity = (w: number) => computePlan(atFlux(basePlan(), w * perVelocity)).warnings.find((x) => x.code === 'counterflow')?.severity ?? null;
    expect(severity(COUNTERFLOW_NOTE_M_S * BELOW)).toBe(null);
    expect(severity(COUNTERFLOW_NOTE_M_S * ABOVE)).toBe('info');
    expect(severity(COUNTERFLOW_CAUTION_OF_U2 * u2 * BELOW)).toBe('info');
    expect(severity(COUNTERFLOW_CAUTION_OF_U2 * u2 * ABOVE)).toBe('caution');
    expect(severity(COUNTERFLOW_STOP_OF_U2 * u2 * BELOW)).toBe('caution');
    expect(severity(COUNTERFLOW_STOP_OF_U2 * u2 * ABOVE)).toBe('stop');
  });

  it('the issue’s cases: at 1.0 K, 1 W/cm² (422 cm/s) is a caution and 5 W/cm² (2110 cm/s, faster than u₂) a stop', () => {
    const at1K = (flux: number) => computePlan(withHeater(basePlan({ temperature_K: 1.0 }), { power_W: flux * AREA, area_m2: AREA })).warnings.find((w) => w.code === 'counterflow');
    const one = at1K(1e4);
    expect(one?.severity).toBe('caution');
    expect((one?.value ?? 0) * 100).toBeCloseTo(422, -1);
    const five = at1K(5e4);
    expect(five?.severity).toBe('stop');
    expect(five?.value ?? 0).toBeGreaterThan(heliumProperties(1.0).secondSound_m_s as number);
  });

  it('echo-overlap: the first echo arrives before the direct pulse has passed', () => {
    const d = 0.01;
    const gap = (2 * d) / u2; // echo at 3d/u2, direct at d/u2
    const plates = (duration: number) =>
      withSensor(
        withHeater(
          basePlan({
            reflectors: [
              { label: 'heater plate', axis: 'z', position_m: 0, reflection: 0.5 },
              { label: 'sensor plate', axis: 'z', position_m: d, reflection: 0.5 },
            ],
            echoOrder: 2,
          }),
          { width_s: duration - 1e-6, riseTime_s: 1e-6 },
        ),
        { position_m: [0, 0, d] },
      );
    expect(codes(plates(gap * ABOVE))).toContain('echo-overlap');
    expect(codes(plates(gap * BELOW))).not.toContain('echo-overlap');
  });

  it('range-ambiguity: repetition period shorter than the last signal above noise', () => {
    const lastHeard = 0.05 / u2 + 101e-6;
    const at = (f: number) => withHeater(basePlan(), { repetitionRate_Hz: f });
    expect(codes(at((1 / lastHeard) * ABOVE))).toContain('range-ambiguity');
    expect(codes(at((1 / lastHeard) * BELOW))).not.toContain('range-ambiguity');
  });

  it('record-too-short: the record ends before the pulse has passed the sensor', () => {
    const needed = 0.05 / u2 + 101e-6;
    const pre = 1e-3;
    const at = (end: number) => basePlan({ digitiser: { sampleRate_Hz: 1e8, recordLength_s: end + pre, preTrigger_s: pre } });
    expect(codes(at(needed * BELOW))).toContain('record-too-short');
    expect(codes(at(needed * ABOVE))).not.toContain('record-too-short');
  });

  it(`coarse-sampling: fewer than ${SAMPLES_PER_EDGE} samples on the rising edge`, () => {
    const rate = SAMPLES_PER_EDGE / 1e-6; // 1 µs rise
    const at = (r: number) => basePlan({ digitiser: { sampleRate_Hz: r, recordLength_s: 0.1, preTrigger_s: 0.001 } });
    expect(codes(at(rate * BELOW))).toContain('coarse-sampling');
    expect(codes(at(rate * ABOVE))).not.toContain('coarse-sampling');
  });

  it('low-snr: averaged SNR under the target', () => {
    const dT = computePlan(basePlan()).sensors[0]?.amplitude_K as number;
    const at = (noise: number) => withSensor(basePlan({ targets: { snr: 10, temperatureSd_K: 1e-3, temperatureKind: 'absolute' } }), { noise_V: noise });
    expect(codes(at((dT / 10) * ABOVE))).toContain('low-snr');
    expect(codes(at((dT / 10) * BELOW))).not.toContain('low-snr');
  });

  it('insensitive: at the u2 maximum (1.65 K) the delay hardly pins the temperature; at 1.8 K it does', () => {
    const noisy = (T: number) => withSensor(basePlan({ temperature_K: T }), { distanceSd_m: 20e-6 });
    expect(codes(noisy(1.6525))).toContain('insensitive');
    expect(codes(noisy(1.8))).not.toContain('insensitive');
    expect(computePlan(noisy(1.6525)).sensors[0]?.insensitive).toBe(true);
  });

  it('no-second-sound: at and above Tλ, stop; just below, none', () => {
    const at = computePlan(basePlan({ temperature_K: T_LAMBDA_K }));
    expect(at.warnings.find((w) => w.code === 'no-second-sound')?.severity).toBe('stop');
    expect(at.sensors[0]?.secondSoundArrival_s).toBeNull();
    expect(at.sensors[0]?.firstSoundArrival_s).toBeGreaterThan(0);
    expect(codes(basePlan({ temperature_K: T_LAMBDA_K - 1e-3 }))).not.toContain('no-second-sound');
  });

  it('lambda-head: the liquid head lowers Tλ below the bath temperature (0.01 K/bar, from memory)', () => {
    const depth = 1;
    const rho = heliumProperties(T_LAMBDA_K - 1e-4).density_kg_m3;
    const shift = LAMBDA_SHIFT_K_PER_PA * rho * STANDARD_GRAVITY_M_S2 * depth;
    expect(shift).toBeGreaterThan(1e-4);
    expect(shift).toBeLessThan(2e-4); // under 0.2 mK for a 1 m head (PHYSICS notes §2)
    expect(codes(basePlan({ temperature_K: T_LAMBDA_K - shift * BELOW, liquidDepth_m: depth }))).toContain('lambda-head');
    expect(codes(basePlan({ temperature_K: T_LAMBDA_K - shift * 1.05, liquidDepth_m: depth }))).not.toContain('lambda-head');
  });

  it('bath-heating is always shown, with the average power P·∫f dt·f_rep', () => {
    const plan = withHeater(basePlan(), { power_W: 2, width_s: 100e-6, repetitionRate_Hz: 5 });
    const w = computePlan(plan).warnings.find((x) => x.code === 'bath-heating');
    expect(w?.severity).toBe('info');
    expect(w?.value).toBeCloseTo(2 * 100e-6 * 5, 12);
  });

  it('model-region below 0.5517 K and near-lambda within 1 mK of Tλ are flagged as information', () => {
    expect(codes(basePlan({ temperature_K: 0.45 }))).toContain('model-region');
    expect(codes(basePlan({ temperature_K: T_LAMBDA_K - 5e-4 }))).toContain('near-lambda');
    expect(codes(basePlan({ temperature_K: 1.8 }))).not.toContain('model-region');
  });
});

describe('temperature resolution (PHYSICS notes §6)', () => {
  it('σ_T = (u2/|du2/dT|)·√((σ_d/d)² + (σ_t/t)²) at 1.8 K', () => {
    const plan = withSensor(basePlan(), { distanceSd_m: 20e-6 });
    const s = computePlan(plan).sensors[0];
    const t = s?.secondSoundArrival_s as number;
    const rel = Math.hypot(20e-6 / 0.05, (s?.timingSd_s as number) / t);
    const k = u2 / Math.abs(p18.secondSoundSlope_m_s_K as number);
    // First order; the kernel's curvature term changes this by under 1e-5 relative at 1.8 K.
    expect(Math.abs((s?.temperatureSd_K as number) / (k * rel) - 1)).toBeLessThan(1e-5);
    // Changes between readings: timing only.
    expect(Math.abs((s?.temperatureChangeSd_K as number) / ((k * (s?.timingSd_s as number)) / t) - 1)).toBeLessThan(1e-5);
  });

  it('the shortest distance for a change target gives exactly the target sd from timing alone (σ_T = k σ_t u₂/d, PHYSICS notes §6)', () => {
    const plan = withSensor(basePlan({ targets: { snr: 10, temperatureSd_K: 2e-5, temperatureKind: 'change' } }), { distanceSd_m: 10e-6 });
    const s = computePlan(plan).sensors[0];
    const d = s?.shortestDistanceForTarget_m as number;
    expect(d).toBeGreaterThan(0);
    const k = u2 / Math.abs(p18.secondSoundSlope_m_s_K as number);
    const timing = s?.timingSd_s as number;
    expect(k * (timing / (d / u2))).toBeCloseTo(2e-5, 12);
    expect(s?.targetKind).toBe('change');
    expect(s?.meetsTarget).toBe((s?.temperatureChangeSd_K as number) <= 2e-5);
  });

  it('an absolute target adds the u₂ curve’s own sd: reachable above it with exactly the target, "not reachable" below it with the reason', () => {
    const modelSd = (u2 / Math.abs(p18.secondSoundSlope_m_s_K as number)) * ((p18.secondSoundSd_m_s as number) / u2);
    const target = modelSd * 1.5;
    const reach = computePlan(withSensor(basePlan({ targets: { snr: 10, temperatureSd_K: target, temperatureKind: 'absolute' } }), { distanceSd_m: 10e-6 })).sensors[0];
    const d = reach?.shortestDistanceForTarget_m as number;
    const k = u2 / Math.abs(p18.secondSoundSlope_m_s_K as number);
    const timing = reach?.timingSd_s as number;
    expect(Math.hypot(k * Math.hypot(10e-6 / d, timing / (d / u2)), modelSd)).toBeCloseTo(target, 12);
    const none = computePlan(withSensor(basePlan({ targets: { snr: 10, temperatureSd_K: modelSd * 0.9, temperatureKind: 'absolute' } }), { distanceSd_m: 10e-6 })).sensors[0];
    expect(none?.shortestDistanceForTarget_m).toBe(null);
    expect(none?.shortestDistanceUnreachable).toBe('model-sd');
    expect(none?.shortestDistanceNote).toMatch(/Not reachable .*u₂ curve's own uncertainty/);
    expect(none?.meetsTarget).toBe(false);
  });
});

describe('planner input checks', () => {
  it('refuses a sensor behind the heater, naming the sensor', () => {
    expect(() => computePlan(withSensor(basePlan(), { position_m: [0, 0, -0.01] }))).toThrow(/sensor 1 \(S1\) z/);
  });
  it('refuses out-of-range digitiser settings with the range', () => {
    expect(() => computePlan(basePlan({ digitiser: { sampleRate_Hz: 0, recordLength_s: 0.01, preTrigger_s: 0 } }))).toThrow(/sample rate .* valid range/);
    expect(() => computePlan(basePlan({ digitiser: { sampleRate_Hz: 1e6, recordLength_s: 0.01, preTrigger_s: 0.02 } }))).toThrow(/pre-trigger/);
  });
  it('refuses a non-integer echo order', () => {
    expect(() => computePlan(basePlan({ echoOrder: 1.5 }))).toThrow(/echo order/);
  });
});
