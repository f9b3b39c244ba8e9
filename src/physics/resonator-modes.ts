import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { coldLength, PATH_LENGTH_RANGE_M } from './contraction';
import { requireInRange } from './errors';
import { lineDensityGeometry, type TangleGeometry } from './line-density';
import { MUTUAL_FRICTION_RANGE_K, mutualFrictionBUnchecked } from './mutual-friction';
import { QUANTUM_OF_CIRCULATION_M2_S } from './quantum-of-circulation';
import { secondSoundUnchecked } from './second-sound';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';

/*
 * Planning a plane-parallel second-sound resonator (PHYSICS notes §8): a heater plate and a sensor
 * plate a gap d apart (cold). Ideal plates (R ≈ 1, no end correction) resonate at
 * f_n = n u₂/(2d); df_n/dT = f_n (du₂/dT)/u₂ vanishes at the u₂ minimum (≈ 1.12 K) and maximum
 * (≈ 1.65 K). The frequency step a temperature step δT makes is computed on the curve itself,
 * min |f_n(T ± δT) − f_n(T)|, so it stays honest at the extremes (second order there).
 * The plates' Fresnel number N_F = a²/(λ d), a the plate radius, λ = u₂/f_n = 2d/n, says how far
 * the wave spreads past the plates in one crossing: below about 1 diffraction losses limit the
 * quality factor (common practice for plane-parallel resonators, as for optical ones: Fox & Li,
 * Bell Syst. Tech. J. 40, 453 (1961); no sharper threshold is claimed here).
 */

/** Inputs of a resonator plan (SI). */
export interface ResonatorPlanInput {
  /** Plate gap as measured, m (warm when `spacerId` is given, else already cold). */
  gap_m: number;
  /** One-sigma of the measured gap, m (default 0). */
  gapSd_m?: number;
  /** Spacer material id (contraction.ts) when the gap was measured warm; null: the gap is cold. */
  spacerId: string | null;
  /** Plate diameter, m (the smaller plate's); without it no Fresnel number. */
  plateDiameter_m?: number;
  /** Bath temperature, K (He II). */
  temperature_K: number;
  /** Highest mode number shown, 1–500. */
  modes: number;
  /** Target temperature resolution, K (for the frequency resolution each mode needs); optional. */
  targetSd_K?: number;
  /** Expected full width of a vortex-free resonance, Hz (with `amplitudeNoise`: the smallest line density). */
  width0_Hz?: number;
  /** Amplitude noise relative to the vortex-free peak amplitude, σ_A/A₀. */
  amplitudeNoise?: number;
  /** Tangle geometry assumed for line densities (default isotropic). */
  geometry?: TangleGeometry;
}

/** Limits of a resonator plan (SI). */
export const RESONATOR_LIMITS = {
  gap_m: [1e-5, 1],
  gapSd_m: [0, 0.01],
  plateDiameter_m: [1e-4, 1],
  temperature_K: [MODEL_MIN_K, T_LAMBDA_K * (1 - 1e-6)],
  modes: [1, 500],
  targetSd_K: [1e-9, 0.1],
  width0_Hz: [1e-4, 1e5],
  amplitudeNoise: [1e-7, 0.5],
} as const;

/** Fresnel numbers below this draw a caution: diffraction limits Q (common practice). */
export const FRESNEL_CAUTION = 1;
/** Fresnel numbers below this draw a note: diffraction may matter (common practice). */
export const FRESNEL_NOTE = 10;
/** A line density is "detectable" at this many amplitude-noise sds (common practice). */
export const DETECTION_SD = 3;

export interface ResonatorMode {
  n: number;
  frequency_Hz: number;
  /** df_n/dT, Hz/K. */
  dfdT_Hz_K: number;
  /** Frequency change a step of the target resolution makes (the resolution the readout needs), Hz; null without a target. */
  frequencyStep_Hz: number | null;
  /** N_F = a²/(λ d) for this mode; null without a plate diameter. */
  fresnelNumber: number | null;
}

export interface ResonatorNote {
  code: 'extremum' | 'diffraction' | 'diffraction-limited' | 'no-mutual-friction' | 'spacer';
  severity: 'info' | 'caution';
  message: string;
  value: number | null;
}

export interface ResonatorPlan {
  gapCold_m: number;
  /** Gap sd after contraction (measured sd and the contraction value's), m. */
  gapColdSd_m: number;
  speed_m_s: number;
  /** du₂/dT at the bath, m/s/K. */
  slope_m_s_K: number;
  /** Spacing of neighbouring modes u₂/(2d), Hz (= f₁). */
  modeSpacing_Hz: number;
  /** Relative frequency resolution needed for the target: δf/f (the same for every mode); null without a target. */
  relativeStep: number | null;
  modes: ResonatorMode[];
  /** Where df/dT vanishes: the u₂ minimum and maximum. */
  insensitiveAt_K: { minimum: number; maximum: number };
  /** Noise-equivalent line density (1 sd of amplitude noise), m⁻², or null without B at this temperature. */
  lineDensityNoise_m2: number | null;
  /** Smallest line density seen at {@link DETECTION_SD} sd, m⁻², or null. */
  lineDensityDetectable_m2: number | null;
  notes: ResonatorNote[];
}

/** Frequency of mode n, Hz: f_n = n u₂/(2d). Pure formula (no checks). */
export function modeFrequency(n: number, speed_m_s: number, gap_m: number): number {
  return (n * speed_m_s) / (2 * gap_m);
}

/**
 * A resonator before the cooldown: cold gap, modes up to `modes` with df/dT, the frequency step
 * a target temperature resolution makes, Fresnel numbers, the smallest line density the amplitude
 * noise allows, and notes. Throws OutOfRangeError naming the field for bad input.
 */
export function planResonator(input: ResonatorPlanInput): ResonatorPlan {
  const L = RESONATOR_LIMITS;
  requireInRange('gap', input.gap_m, L.gap_m[0], L.gap_m[1], 'm');
  requireInRange('gap sd', input.gapSd_m ?? 0, L.gapSd_m[0], L.gapSd_m[1], 'm');
  if (input.plateDiameter_m !== undefined) requireInRange('plate diameter', input.plateDiameter_m, L.plateDiameter_m[0], L.plateDiameter_m[1], 'm');
  requireInRange('temperature', input.temperature_K, L.temperature_K[0], L.temperature_K[1], 'K', 'second sound exists only below Tλ');
  requireInRange('modes', input.modes, L.modes[0], L.modes[1], '');
  if (input.targetSd_K !== undefined) requireInRange('target temperature resolution', input.targetSd_K, L.targetSd_K[0], L.targetSd_K[1], 'K');
  if (input.width0_Hz !== undefined) requireInRange('vortex-free width', input.width0_Hz, L.width0_Hz[0], L.width0_Hz[1], 'Hz');
  if (input.amplitudeNoise !== undefined) requireInRange('relative amplitude noise', input.amplitudeNoise, L.amplitudeNoise[0], L.amplitudeNoise[1], '');
  const notes: ResonatorNote[] = [];
  const cold = coldGap(input.gap_m, input.gapSd_m ?? 0, input.spacerId);
  if (input.spacerId !== null) {
    notes.push({
      code: 'spacer',
      severity: 'info',
      message: `Gap contracted from ${mm(input.gap_m)} warm to ${mm(cold.gap_m)} cold with the spacer (integrated 293 K → 4 K contraction, handbook value).`,
      value: cold.gap_m,
    });
  }
  const T = input.temperature_K;
  const at = secondSoundUnchecked(T);
  const spacing = modeFrequency(1, at.value, cold.gap_m);
  const relativeStep = input.targetSd_K === undefined ? null : relativeFrequencyStep(T, input.targetSd_K, at.value);
  const radius = input.plateDiameter_m === undefined ? null : input.plateDiameter_m / 2;
  const modes: ResonatorMode[] = [];
  const count = Math.round(input.modes);
  for (let n = 1; n <= count; n++) {
    const f = n * spacing;
    const wavelength = (2 * cold.gap_m) / n;
    modes.push({
      n,
      frequency_Hz: f,
      dfdT_Hz_K: (f * at.slope) / at.value,
      frequencyStep_Hz: relativeStep === null ? null : f * relativeStep,
      fresnelNumber: radius === null ? null : (radius * radius) / (wavelength * cold.gap_m),
    });
  }
  const { minimum, maximum } = SECOND_SOUND_EXTREMA;
  const nearest = Math.abs(T - minimum.temperature_K) < Math.abs(T - maximum.temperature_K) ? minimum : maximum;
  if (Math.abs(T - nearest.temperature_K) <= 0.05) {
    notes.push({
      code: 'extremum',
      severity: 'caution',
      message: `${T.toFixed(4)} K is ${(Math.abs(T - nearest.temperature_K) * 1e3).toFixed(1)} mK from the u₂ ${nearest === minimum ? 'minimum' : 'maximum'} at ${nearest.temperature_K.toFixed(4)} K, where df/dT = 0: resonance frequencies barely move with temperature here (second order), which is good for a stable reference and poor for thermometry.`,
      value: nearest.temperature_K,
    });
  }
  const f1 = modes[0]?.fresnelNumber ?? null;
  if (f1 === null) {
    // No plate diameter: no Fresnel number, no diffraction note.
  } else if (f1 < FRESNEL_CAUTION) {
    const nGood = Math.ceil(FRESNEL_CAUTION / f1);
    notes.push({
      code: 'diffraction-limited',
      severity: 'caution',
      message: `Fresnel number a²/(λd) = ${f1.toPrecision(3)} for n = 1 (below ${FRESNEL_CAUTION}): the wave spreads past the plates within one crossing, so diffraction will limit the quality factor of the low modes; modes from n = ${nGood} have N_F ≥ ${FRESNEL_CAUTION}. Wider plates or a smaller gap help.`,
      value: f1,
    });
  } else if (f1 < FRESNEL_NOTE) {
    notes.push({
      code: 'diffraction',
      severity: 'info',
      message: `Fresnel number a²/(λd) = ${f1.toPrecision(3)} for n = 1: diffraction losses may still lower the Q of the lowest modes (N_F grows as n).`,
      value: f1,
    });
  }
  let noise: number | null = null;
  let detectable: number | null = null;
  if (input.width0_Hz === undefined || input.amplitudeNoise === undefined) {
    // No expected width or noise: no smallest line density.
  } else if (T >= MUTUAL_FRICTION_RANGE_K[0] && T <= MUTUAL_FRICTION_RANGE_K[1]) {
    const { factor } = lineDensityGeometry(input.geometry ?? 'isotropic');
    const k = (factor * input.width0_Hz) / (mutualFrictionBUnchecked(T) * QUANTUM_OF_CIRCULATION_M2_S);
    const r = input.amplitudeNoise;
    noise = (k * r) / (1 - r);
    const rd = Math.min(DETECTION_SD * r, 0.99);
    detectable = (k * rd) / (1 - rd);
  } else {
    notes.push({
      code: 'no-mutual-friction',
      severity: 'info',
      message: `No line density below ${MUTUAL_FRICTION_RANGE_K[0].toFixed(4)} K: the published mutual friction B starts there.`,
      value: MUTUAL_FRICTION_RANGE_K[0],
    });
  }
  return {
    gapCold_m: cold.gap_m,
    gapColdSd_m: cold.sd_m,
    speed_m_s: at.value,
    slope_m_s_K: at.slope,
    modeSpacing_Hz: spacing,
    relativeStep,
    modes,
    insensitiveAt_K: { minimum: minimum.temperature_K, maximum: maximum.temperature_K },
    lineDensityNoise_m2: noise,
    lineDensityDetectable_m2: detectable,
    notes,
  };
}

/** Cold gap and its sd: L_cold = L_warm(1 − ε) with the contraction's sd, or the gap as given. */
export function coldGap(gap_m: number, gapSd_m: number, spacerId: string | null): { gap_m: number; sd_m: number } {
  requireInRange('gap', gap_m, PATH_LENGTH_RANGE_M[0], PATH_LENGTH_RANGE_M[1], 'm');
  if (spacerId === null) return { gap_m, sd_m: gapSd_m };
  const c = coldLength(gap_m, spacerId);
  return { gap_m: c.length_m, sd_m: Math.hypot(gapSd_m, c.contractionSd_m) };
}

/**
 * δf/f for a temperature step δT at T: min over the two sides of |u₂(T ± δT) − u₂(T)|/u₂(T),
 * on the curve itself (second order at an extremum); one side only near the model's ends.
 */
function relativeFrequencyStep(T: number, step_K: number, u2: number): number {
  const sides: number[] = [];
  if (T + step_K < T_LAMBDA_K) sides.push(Math.abs(secondSoundUnchecked(T + step_K).value - u2));
  if (T - step_K >= MODEL_MIN_K) sides.push(Math.abs(secondSoundUnchecked(T - step_K).value - u2));
  return Math.min(...sides) / u2;
}

function mm(x_m: number): string {
  return `${(x_m * 1e3).toPrecision(5)} mm`;
}
