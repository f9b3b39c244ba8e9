import { InvalidInputError, requireInRange } from './errors';
import { SPEED_RANGE_M_S, type TemperatureCandidate, temperatureCandidates } from './invert-delay';

/*
 * Bath temperature from a resonance frequency (PHYSICS notes §8): with the cold gap d and the mode
 * number n, u₂ = 2 d f₀/n, and every temperature with that speed follows by the same inversion as
 * a delay (invert-delay.ts: candidates with sds in two parts and 68 %/95 % intervals). Two
 * neighbouring resonances give the spacing u₂/(2d) = f_{n+1} − f_n and so n = f_n/(f_{n+1} − f_n)
 * rounded — but only when that ratio is near a whole number compared with its own sd; otherwise
 * the data cannot decide n and this says so instead of choosing.
 */

/** Limits of a resonance reading (SI). */
export const RESONANCE_LIMITS = {
  frequency_Hz: [1e-3, 1e8],
  frequencySd_Hz: [0, 1e6],
  gap_m: [1e-6, 100],
  gapSd_m: [0, 1],
  mode: [1, 100_000],
} as const;

export interface ResonanceReading {
  frequency_Hz: number;
  frequencySd_Hz: number;
  /** Cold plate gap, m, and its sd. */
  gap_m: number;
  gapSd_m: number;
  /** Mode number n (a whole number ≥ 1). */
  mode: number;
}

export interface ResonanceTemperature {
  speed_m_s: number;
  speedSd_m_s: number;
  candidates: TemperatureCandidate[];
}

/**
 * u₂ = 2 d f₀/n with σ_u/u = √((σ_f/f)² + (σ_d/d)²), and every candidate temperature.
 * Throws OutOfRangeError / InvalidInputError naming the field.
 */
export function temperatureFromResonance(r: ResonanceReading): ResonanceTemperature {
  const L = RESONANCE_LIMITS;
  requireInRange('resonance frequency', r.frequency_Hz, L.frequency_Hz[0], L.frequency_Hz[1], 'Hz');
  requireInRange('resonance frequency sd', r.frequencySd_Hz, L.frequencySd_Hz[0], L.frequencySd_Hz[1], 'Hz');
  requireInRange('gap', r.gap_m, L.gap_m[0], L.gap_m[1], 'm');
  requireInRange('gap sd', r.gapSd_m, L.gapSd_m[0], L.gapSd_m[1], 'm');
  requireInRange('mode number', r.mode, L.mode[0], L.mode[1], '');
  if (!Number.isInteger(r.mode)) throw new InvalidInputError('mode number', `must be a whole number, got ${r.mode}`);
  const speed = (2 * r.gap_m * r.frequency_Hz) / r.mode;
  const rel = Math.hypot(r.frequencySd_Hz / r.frequency_Hz, r.gapSd_m / r.gap_m);
  requireInRange('speed 2 d f₀/n', speed, SPEED_RANGE_M_S[0], SPEED_RANGE_M_S[1], 'm/s', 'no second sound that fast or slow: check the gap, the mode number and the frequency unit');
  return { speed_m_s: speed, speedSd_m_s: speed * rel, candidates: temperatureCandidates(speed, Math.min(rel, 1)) };
}

export interface ModeFromNeighbour {
  /** The mode number of the first resonance, or null when the data cannot decide it. */
  mode: number | null;
  /** f₁/(f₂ − f₁) as measured (for the lower of the two: n), with its sd. */
  ratio: number;
  ratioSd: number;
  /** The spacing |f₂ − f₁| = u₂/(2d), Hz, and its sd. */
  spacing_Hz: number;
  spacingSd_Hz: number;
  /** Plain words: how n was found or why it was not. */
  reason: string;
}

/** 3 sd of the ratio must stay within half a mode; the ratio within 0.25 of a whole number (common practice). */
const MODE_REACH_SD = 3;
const MODE_REACH_MAX = 0.25;

/**
 * The mode number of the resonance at `frequency_Hz`, from its neighbour at `neighbour_Hz` (the
 * next mode up or down): n_low = f_low/(f_high − f_low) rounded, the upper one n_low + 1. The ratio
 * must lie within 0.25 of a whole number (real plates shift it a little: an end correction) and its
 * sd must be small enough that 3 sd cannot reach the next whole number; else `mode` is null.
 */
export function modeFromNeighbour(frequency_Hz: number, frequencySd_Hz: number, neighbour_Hz: number, neighbourSd_Hz: number): ModeFromNeighbour {
  const L = RESONANCE_LIMITS;
  requireInRange('resonance frequency', frequency_Hz, L.frequency_Hz[0], L.frequency_Hz[1], 'Hz');
  requireInRange('neighbouring resonance', neighbour_Hz, L.frequency_Hz[0], L.frequency_Hz[1], 'Hz');
  requireInRange('resonance frequency sd', frequencySd_Hz, L.frequencySd_Hz[0], L.frequencySd_Hz[1], 'Hz');
  requireInRange('neighbouring resonance sd', neighbourSd_Hz, L.frequencySd_Hz[0], L.frequencySd_Hz[1], 'Hz');
  const low = Math.min(frequency_Hz, neighbour_Hz);
  const high = Math.max(frequency_Hz, neighbour_Hz);
  const spacing = high - low;
  if (!(spacing > 0)) throw new InvalidInputError('neighbouring resonance', 'must differ from the resonance frequency');
  const lowSd = low === frequency_Hz ? frequencySd_Hz : neighbourSd_Hz;
  const highSd = low === frequency_Hz ? neighbourSd_Hz : frequencySd_Hz;
  const spacingSd = Math.hypot(lowSd, highSd);
  const ratio = low / spacing;
  // ∂r/∂low = high/spacing², ∂r/∂high = −low/spacing².
  const ratioSd = Math.hypot((high / (spacing * spacing)) * lowSd, (low / (spacing * spacing)) * highSd);
  const nearest = Math.round(ratio);
  const off = Math.abs(ratio - nearest);
  const base = { ratio, ratioSd, spacing_Hz: spacing, spacingSd_Hz: spacingSd };
  if (nearest < 1) return { ...base, mode: null, reason: `f/(spacing) = ${ratio.toFixed(3)} is below 1: these are not neighbouring modes of one gap` };
  if (ratioSd * MODE_REACH_SD >= 0.5) {
    return { ...base, mode: null, reason: `f/(spacing) = ${ratio.toFixed(3)} ± ${ratioSd.toFixed(3)}: the frequencies are too uncertain to tell n from n ± 1` };
  }
  if (off > MODE_REACH_MAX) {
    return {
      ...base,
      mode: null,
      reason: `f/(spacing) = ${ratio.toFixed(3)} ± ${ratioSd.toFixed(3)} is ${off.toFixed(3)} from a whole number: not neighbours of ideal plates (a skipped mode, a plate tilt or an end correction); give the mode number`,
    };
  }
  const mode = low === frequency_Hz ? nearest : nearest + 1;
  return { ...base, mode, reason: `from the neighbouring resonance: f/(spacing) = ${ratio.toFixed(3)} ± ${ratioSd.toFixed(3)} → n = ${mode}` };
}
