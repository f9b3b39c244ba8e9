import { InvalidInputError, requireInRange } from './errors';
import { lineDensityGeometry, type TangleGeometry } from './line-density';
import { MUTUAL_FRICTION_RANGE_K, mutualFrictionBPrimeUnchecked, mutualFrictionBUnchecked } from './mutual-friction';
import { QUANTUM_OF_CIRCULATION_M2_S } from './quantum-of-circulation';
import type { ResonanceFit } from './resonance-fit';
import { secondSoundUnchecked } from './second-sound';

/*
 * A lock-in record at a fixed drive frequency f_d, read in the inverse plane (PHYSICS notes §8;
 * Woillez et al. (2023) use such an inverse-plane analysis for open-cavity resonators).
 * With the reference sweep's fit (vortex-free: A₀, Δ₀, f₀, φ and the background), the resonant
 * part of each sample Z' = Z − background(f_d) = A (Δ/2) e^{iφ}/((Δ/2) + i(f_d − f₀)). At a fixed
 * drive A Δ = A₀ Δ₀ = C, so
 *   w = (C/2) e^{iφ}/Z' = Δ/2 + i (f_d − f₀):
 * the real part moves only when the resonance widens (vortices), the imaginary part only when it
 * shifts (temperature or pressure drift). Hence Δ(t) = 2 Re w, f₀(t) = f_d − Im w,
 * L(t) = factor (Δ(t) − Δ₀)/(B κ) and δf₀(t) = f₀(t) − f₀,ref.
 * Sds: the measurement part from the record's own noise σ (per component, from successive
 * differences unless given), σ_w = (C/2) σ/|Z'|² per component; the reference part from the
 * reference fit's covariance (f₀, Δ, A, φ), common to every row (the background's own sd is left
 * out: it is small where the resonance is tall). The vortices also shift f₀
 * through B′: up to about (B′/B)(Δ − Δ₀)/2 (Hall–Vinen), which a drift reading includes.
 */

export interface LockinRecord {
  time_s: Float64Array;
  x: Float64Array;
  y: Float64Array;
}

export interface LockinOptions {
  /** Drive frequency, Hz (default: the reference's f₀). */
  drive_Hz?: number;
  /** Bath temperature, K: for B (and the temperature drift); required for L. */
  temperature_K: number;
  geometry?: TangleGeometry;
  /** Noise per component, signal units (default: from the record's successive differences). */
  noise?: number;
}

export interface LockinSeries {
  time_s: Float64Array;
  width_Hz: Float64Array;
  lineDensity_m2: Float64Array;
  /** Total sd of L per row (measurement ⊕ reference), m⁻². */
  lineDensitySd_m2: Float64Array;
  lineDensitySdMeasurement_m2: Float64Array;
  frequencyShift_Hz: Float64Array;
  frequencyShiftSd_Hz: Float64Array;
  frequencyShiftSdMeasurement_Hz: Float64Array;
  /** δT = δf₀/(df₀/dT), K; null when |df₀/dT| is too small to say (near a u₂ extremum). */
  temperatureShift_K: Float64Array | null;
  temperatureShiftSd_K: Float64Array | null;
  drive_Hz: number;
  noise: number;
  noiseFrom: 'given' | 'record';
  mutualFrictionB: number;
  mutualFrictionBPrime: number;
  /** df₀/dT at the bath, Hz/K. */
  dfdT_Hz_K: number;
  notes: string[];
}

/** Largest record read, rows. */
export const LOCKIN_MAX_ROWS = 10_000_000;
/** Below this |du₂/dT|/u₂ (per K) no temperature drift is given (common practice, no source). */
const MIN_RELATIVE_SLOPE_PER_K = 1e-4;
/** Median of χ² with two degrees of freedom, 2 ln 2: turns a median of squared differences into σ². */
const CHI2_2_MEDIAN = 2 * Math.LN2;

/**
 * L(t) and the drift of f₀ from a lock-in record against a complex reference fit. Throws
 * InvalidInputError for an amplitude-only reference or mismatched columns, OutOfRangeError for a
 * temperature outside the B range.
 */
export function analyseLockin(record: LockinRecord, reference: ResonanceFit, options: LockinOptions): LockinSeries {
  if (reference.kind !== 'complex' || reference.phase_rad === null || reference.phaseCovariance === null) {
    throw new InvalidInputError('reference sweep', 'the inverse-plane analysis needs a reference with x and y (in-phase and quadrature), not amplitude alone');
  }
  const n = record.time_s.length;
  if (record.x.length !== n || record.y.length !== n) throw new InvalidInputError('lock-in record', 'time, x and y need one value each per row');
  if (n < 2) throw new InvalidInputError('lock-in record', `needs at least 2 rows, got ${n}`);
  if (n > LOCKIN_MAX_ROWS) throw new InvalidInputError('lock-in record', `at most ${LOCKIN_MAX_ROWS} rows, got ${n}`);
  const T = options.temperature_K;
  requireInRange('temperature for the line density', T, MUTUAL_FRICTION_RANGE_K[0], MUTUAL_FRICTION_RANGE_K[1], 'K', 'where the published mutual friction B is given');
  const drive = options.drive_Hz ?? reference.frequency_Hz;
  requireInRange('drive frequency', drive, 1e-3, 1e8, 'Hz');
  const B = mutualFrictionBUnchecked(T);
  const Bp = mutualFrictionBPrimeUnchecked(T);
  const k = lineDensityGeometry(options.geometry ?? 'isotropic').factor / (B * QUANTUM_OF_CIRCULATION_M2_S);
  const noiseFrom = options.noise === undefined ? 'record' : 'given';
  const noise = options.noise ?? noiseFromDifferences(record);
  if (options.noise !== undefined) requireInRange('noise', options.noise, 0, Number.MAX_VALUE, '');

  const ref = reference;
  const f0 = ref.frequency_Hz;
  const W0 = ref.width_Hz;
  const A0 = ref.amplitude;
  const phi = ref.phase_rad as number;
  const off = drive - ref.background.centre_Hz;
  const bgr = ref.background.re + ref.background.slopeRe_per_Hz * off;
  const bgi = ref.background.im + ref.background.slopeIm_per_Hz * off;
  // Gradients of (Re w, Im w) with respect to (f₀, Δ, A, φ) for the reference part: w = (A₀Δ₀/2) e^{iφ}/Z'.
  // ∂w/∂A₀ = w/A₀, ∂w/∂Δ₀ = w/Δ₀, ∂w/∂φ = i w; f₀ enters only δf₀ = f_d − Im w − f₀ (∂/∂f₀ = −1)
  // and L through −Δ₀ (∂/∂Δ₀ of Δ − Δ₀ adds −1).
  const c = ref.covariance;
  const pc = ref.phaseCovariance as [number, number, number];
  // Σ over (f₀, Δ, A, φ)
  const S = [
    [c[0][0], c[0][1], c[0][2], pc[0]],
    [c[1][0], c[1][1], c[1][2], pc[1]],
    [c[2][0], c[2][1], c[2][2], pc[2]],
    [pc[0], pc[1], pc[2], (ref.phaseSd_rad as number) ** 2],
  ];
  const quad = (g: readonly number[]) => {
    let v = 0;
    for (let a = 0; a < 4; a++) for (let b = 0; b < 4; b++) v += (g[a] as number) * (S[a]?.[b] as number) * (g[b] as number);
    return Math.max(0, v);
  };
  const half = (A0 * W0) / 2;
  const er = half * Math.cos(phi);
  const ei = half * Math.sin(phi);

  const at = secondSoundUnchecked(T);
  const dfdT = (f0 * at.slope) / at.value;
  const withTemperature = Math.abs(at.slope / at.value) >= MIN_RELATIVE_SLOPE_PER_K;

  const out: LockinSeries = {
    time_s: record.time_s,
    width_Hz: new Float64Array(n),
    lineDensity_m2: new Float64Array(n),
    lineDensitySd_m2: new Float64Array(n),
    lineDensitySdMeasurement_m2: new Float64Array(n),
    frequencyShift_Hz: new Float64Array(n),
    frequencyShiftSd_Hz: new Float64Array(n),
    frequencyShiftSdMeasurement_Hz: new Float64Array(n),
    temperatureShift_K: withTemperature ? new Float64Array(n) : null,
    temperatureShiftSd_K: withTemperature ? new Float64Array(n) : null,
    drive_Hz: drive,
    noise,
    noiseFrom,
    mutualFrictionB: B,
    mutualFrictionBPrime: Bp,
    dfdT_Hz_K: dfdT,
    notes: [],
  };
  const gW = [0, 0, 0, 0];
  const gF = [0, 0, 0, 0];
  for (let i = 0; i < n; i++) {
    const zr = (record.x[i] as number) - bgr;
    const zi = (record.y[i] as number) - bgi;
    const m2 = zr * zr + zi * zi;
    if (!(m2 > 0)) throw new InvalidInputError('lock-in record', `row ${i + 1}: the signal equals the background: no resonant part to invert`);
    // w = (er + i ei)(zr − i zi)/m2
    const wr = (er * zr + ei * zi) / m2;
    const wi = (ei * zr - er * zi) / m2;
    const width = 2 * wr;
    const shift = drive - wi - f0;
    const sigmaW = (half * noise) / m2;
    // Reference part: Δ − Δ₀ = 2 Re w − Δ₀; δf₀ = f_d − Im w − f₀.
    gW[0] = 0;
    gW[1] = (2 * wr) / W0 - 1;
    gW[2] = (2 * wr) / A0;
    gW[3] = -2 * wi;
    gF[0] = -1;
    gF[1] = -wi / W0;
    gF[2] = -wi / A0;
    gF[3] = -wr;
    const refW = Math.sqrt(quad(gW));
    const refF = Math.sqrt(quad(gF));
    out.width_Hz[i] = width;
    out.lineDensity_m2[i] = k * (width - W0);
    out.lineDensitySdMeasurement_m2[i] = k * 2 * sigmaW;
    out.lineDensitySd_m2[i] = k * Math.hypot(2 * sigmaW, refW);
    out.frequencyShift_Hz[i] = shift;
    out.frequencyShiftSdMeasurement_Hz[i] = sigmaW;
    out.frequencyShiftSd_Hz[i] = Math.hypot(sigmaW, refF);
    if (out.temperatureShift_K && out.temperatureShiftSd_K) {
      out.temperatureShift_K[i] = shift / dfdT;
      out.temperatureShiftSd_K[i] = Math.hypot(sigmaW, refF) / Math.abs(dfdT);
    }
  }
  if (!withTemperature) out.notes.push(`df₀/dT = ${dfdT.toPrecision(3)} Hz/K is too small at ${T.toFixed(4)} K (near a u₂ extremum) to turn the drift of f₀ into a temperature.`);
  out.notes.push(`The vortices shift f₀ too, through B′ (${Bp.toPrecision(3)} at ${T.toFixed(4)} K): by up to about |B′/B|·(Δ − Δ₀)/2 = ${(Math.abs(Bp / B) / 2).toPrecision(2)} × (Δ − Δ₀), included in the f₀ drift.`);
  if (noiseFrom === 'record') out.notes.push('Noise per component from successive differences of the record: a lock-in time constant longer than the sampling step makes it (and the measurement sds) too small.');
  return out;
}

/** Noise per component from successive differences: σ² = median(dx² + dy²)/(2 · 2 ln 2). */
export function noiseFromDifferences(record: LockinRecord): number {
  const n = record.x.length;
  const d = new Float64Array(n - 1);
  for (let i = 1; i < n; i++) {
    const dx = (record.x[i] as number) - (record.x[i - 1] as number);
    const dy = (record.y[i] as number) - (record.y[i - 1] as number);
    d[i - 1] = dx * dx + dy * dy;
  }
  d.sort();
  const median = d[(d.length - 1) >> 1] as number;
  return Math.sqrt(median / (2 * CHI2_2_MEDIAN));
}
