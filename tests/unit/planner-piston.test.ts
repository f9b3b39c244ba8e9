/**
 * Finite heaters as baffled pistons: the rectangle (and disk) pulse against a brute-force
 * surface integral written here independently of the kernel, and the two limits the model must
 * reach by itself — the plane wave on short paths and the small source far away. Sources: the
 * transient-piston result (P. R. Stepanishen, J. Acoust. Soc. Am. 49, 1629 (1971)) and the
 * Rayleigh integral for second sound (PHYSICS notes §4).
 */
import { describe, expect, it } from 'vitest';
import {
  computePlan,
  heliumProperties,
  type Medium,
  type PulseSource,
  planeWaveRange_m,
  pulseProfile,
  receivedPulse,
  ringAngleInsideRectangle,
  type SampledSignal,
} from '../../src/physics';
import { basePlan, withHeater, withSensor } from '../support/plans';

const props = heliumProperties(1.8);
const U2 = props.secondSound_m_s as number;
const medium: Medium = { density_kg_m3: props.density_kg_m3, specificHeat_J_kgK: props.specificHeat_J_kgK, secondSound_m_s: U2 };
const RHO_C = medium.density_kg_m3 * medium.specificHeat_J_kgK;
const Q0 = 1e3;

function valueAt(signal: SampledSignal, t: number): number {
  return signal.values[Math.round((t - signal.start_s) / signal.step_s)] ?? 0;
}

function peak(signal: SampledSignal): number {
  let m = 0;
  for (const v of signal.values) m = Math.max(m, Math.abs(v));
  return m;
}

function rectangle(width: number, height: number, profile = pulseProfile({ kind: 'rectangle' }, 60e-6, 2e-6)): PulseSource {
  return { geometry: 'rectangle', peakFlux_W_m2: Q0, peakPower_W: 0, face: { kind: 'rectangle', width_m: width, height_m: height }, mount: 'wall', profile, centre: [0, 0, 0], amplitudeFactor: 1 };
}

/**
 * Brute-force Rayleigh integral over a rectangle, independent of the kernel: a grid of n × n (fine
 * enough that each element spans less than the 2 µs edge in delay)
 * area elements, each adding dA·q̇(t − R/u2)/R, q̇ averaged over one step, all over 2π ρ c_p u2².
 */
function bruteForce(source: PulseSource, sensor: readonly [number, number, number], t: number, step: number, n = 500): number {
  const face = source.face as { kind: 'rectangle'; width_m: number; height_m: number };
  const dx = face.width_m / n;
  const dy = face.height_m / n;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = -face.width_m / 2 + (i + 0.5) * dx;
      const y = -face.height_m / 2 + (j + 0.5) * dy;
      const R = Math.hypot(sensor[0] - x, sensor[1] - y, sensor[2]);
      const tau = t - R / U2;
      const qdot = (Q0 * (source.profile.value(tau + step / 2) - source.profile.value(tau - step / 2))) / step;
      sum += (dx * dy * qdot) / R;
    }
  }
  return sum / (2 * Math.PI * RHO_C * U2 * U2);
}

describe('the angle of a ring on a rectangle (heater-face.ts)', () => {
  it('on the axis of a square of half-side a: 2π up to s = a, 2π − 8·acos(a/s) up to a√2, then 0 (PHYSICS notes §4)', () => {
    const a = 1;
    expect(ringAngleInsideRectangle(0.9, 0, 0, a, a)).toBeCloseTo(2 * Math.PI, 12);
    for (const s of [1.05, 1.2, 1.4]) expect(ringAngleInsideRectangle(s, 0, 0, a, a)).toBeCloseTo(2 * Math.PI - 8 * Math.acos(a / s), 10);
    expect(ringAngleInsideRectangle(1.5, 0, 0, a, a)).toBe(0);
  });

  it('off the axis and outside the face it matches a count of points on the circle (independent sampling)', () => {
    const cases: [number, number, number, number, number][] = [
      [0.7, 0.3, -0.2, 1, 0.5],
      [1.3, 1.2, 0.1, 1, 0.5],
      [0.4, 1.1, 0.4, 1, 0.5],
      [2.0, 0.2, 0.3, 1.5, 0.8],
    ];
    for (const [s, px, py, hx, hy] of cases) {
      const N = 200_000;
      let inside = 0;
      for (let k = 0; k < N; k++) {
        const phi = ((k + 0.5) * 2 * Math.PI) / N;
        const x = px + s * Math.cos(phi);
        const y = py + s * Math.sin(phi);
        if (Math.abs(x) <= hx && Math.abs(y) <= hy) inside++;
      }
      expect(ringAngleInsideRectangle(s, px, py, hx, hy)).toBeCloseTo((inside / N) * 2 * Math.PI, 3);
    }
  });
});

describe('a rectangular heater against a brute-force surface integral (Rayleigh integral, PHYSICS notes §4)', () => {
  const step = 0.25e-6;
  // The brute-force grid and the kernel's Φ table each carry errors of a few 0.1 % of the peak.
  const TOLERANCE_OF_PEAK = 0.015;
  const cases: [string, readonly [number, number, number]][] = [
    ['on the axis', [0, 0, 0.012]],
    ['off the axis, over the face', [2e-3, 1e-3, 0.008]],
    ['off the axis, beyond the face', [9e-3, -3e-3, 0.01]],
  ];
  it.each(cases)('%s', (_name, sensor) => {
    const source = rectangle(10e-3, 6e-3);
    const kernel = receivedPulse(source, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step).signal;
    const top = peak(kernel);
    expect(top).toBeGreaterThan(0);
    for (const k of [10, 60, 150, 250, 330]) {
      const t = kernel.start_s + k * step;
      expect(Math.abs(valueAt(kernel, t) - bruteForce(source, sensor, t, step))).toBeLessThan(TOLERANCE_OF_PEAK * top);
    }
  });
});

describe('the limits a finite heater reaches by itself', () => {
  const step = 0.25e-6;

  it('short path: the plane wave q/(ρ c_p u2) for the whole pulse, sample by sample (PHYSICS notes §4)', () => {
    const source = rectangle(40e-3, 40e-3);
    const z = 2e-3; // range a²/(2u2τ) ≈ 0.2²/… ≫ 2 mm for a 20 mm half-side and a 62 µs pulse
    expect(planeWaveRange_m(source.face as never, U2, source.profile.duration_s)).toBeGreaterThan(10 * z);
    const finite = receivedPulse(source, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const plane = receivedPulse({ ...source, geometry: 'plane-wave', face: null }, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const plateau = Q0 / (RHO_C * U2);
    expect(peak(finite)).toBeCloseTo(plateau, 9);
    for (let t = z / U2; t < z / U2 + source.profile.duration_s; t += 5e-6) expect(valueAt(finite, t)).toBeCloseTo(valueAt(plane, t), 9);
  });

  it('far away: a small source of the same power, δT = Ṗ(t − r/u2)/(2π ρ c_p u2² r) (PHYSICS notes §4)', () => {
    const source = rectangle(1e-3, 0.6e-3);
    const z = 0.06;
    const finite = receivedPulse(source, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const point = receivedPulse({ ...source, geometry: 'point', face: null, peakPower_W: Q0 * 1e-3 * 0.6e-3 }, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    expect(Math.abs(peak(finite) / peak(point) - 1)).toBeLessThan(0.02);
  });

  it('a small source free in the liquid radiates into 4π: half the signal it gives on a wall (2π)', () => {
    const point = { ...rectangle(1e-3, 1e-3), geometry: 'point' as const, face: null, peakPower_W: 1e-3 };
    const wall = receivedPulse(point, { position: [0, 0, 0.02], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const free = receivedPulse({ ...point, mount: 'free' }, { position: [0, 0, 0.02], radius_m: 0, lag_s: 0 }, medium, step).signal;
    expect(peak(free) / peak(wall)).toBeCloseTo(0.5, 12);
  });

  it('the plane-wave range is a²/(2u2τ) with a half the shorter side; past it the pulse no longer holds the plane value for its whole length', () => {
    const plan = withHeater(basePlan({ temperature_K: 1.8 }), { geometry: 'rectangle', width_m: 0.01, height_m: 0.006, power_W: Q0 * 0.01 * 0.006, width_s: 100e-6, riseTime_s: 1e-6 });
    const result = computePlan(plan);
    const a = 0.003;
    const tau = 101e-6;
    expect(result.heater.planeWaveEdge_m).toBe(a);
    // (a² − (u2τ)²)/(2u2τ) ≈ a²/(2u2τ) for u2τ ≪ a.
    expect(result.heater.planeWaveRange_m).toBeCloseTo((a * a - (U2 * tau) ** 2) / (2 * U2 * tau), 12);
    const range = result.heater.planeWaveRange_m as number;
    const plateau = Q0 / (RHO_C * U2);
    const at = (z: number) => computePlan(withSensor(plan, { position_m: [0, 0, z] })).sensors[0]?.waveform[0] as SampledSignal;
    const inside = at(range * 0.8);
    const z = range * 3;
    const beyond = at(z);
    const heldFor = (s: SampledSignal) => s.values.filter((v) => v > 0.99 * plateau).length * s.step_s;
    expect(heldFor(inside)).toBeGreaterThan(0.95 * 100e-6);
    // Beyond, the edge wave cuts the plateau short after (√(z² + a²) − z)/u2 (Stepanishen 1971),
    // less half the 1 µs rise; to within a microsecond (the samples' own step is 0.2 µs).
    expect(Math.abs(heldFor(beyond) - ((Math.hypot(z, a) - z) / U2 - 0.5e-6))).toBeLessThan(1e-6);
  });
});
