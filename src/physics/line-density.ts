import { InvalidInputError, OutOfRangeError, requireInRange } from './errors';
import { MUTUAL_FRICTION_RANGE_K, mutualFrictionBUnchecked } from './mutual-friction';
import { QUANTUM_OF_CIRCULATION_M2_S } from './quantum-of-circulation';

/*
 * Vortex line density from the extra damping of a second-sound resonance (PHYSICS notes §8).
 * Vortex lines damp second sound through mutual friction: a line at angle θ to the wave vector
 * adds an attenuation (amplitude, per length) α = B κ L sin²θ/(4 u₂) (Hall & Vinen, Proc. R. Soc.
 * A 238, 204 (1956), for lines perpendicular to the wave, sin²θ = 1). In a resonator the full
 * width grows by Δ − Δ₀ = α u₂/π = B κ L ⟨sin²θ⟩/(4π), so
 *   L = (4π/⟨sin²θ⟩) (Δ − Δ₀)/(B κ).
 * An isotropic tangle has ⟨sin²θ⟩ = 2/3: L = 6π (Δ − Δ₀)/(B κ) (Vinen, Proc. R. Soc. A 240, 114
 * (1957)). At a fixed drive the peak amplitude times the width stays constant (A Δ = A₀ Δ₀), so
 * L = (6π Δ₀/(B κ)) (A₀/A − 1): the form used here from a peak amplitude.
 * Other geometries (derived here from the same sin²θ average; state which one your tangle is):
 *  - lines perpendicular to the wave (a rotating resonator with the axis along the plates, Hall &
 *    Vinen 1956): ⟨sin²θ⟩ = 1, factor 4π;
 *  - lines lying in planes that hold the wave vector (a counterflow tangle, whose lines lie mostly
 *    in planes across the heat flow, probed by a resonator whose wave crosses the flow): ⟨sin²θ⟩
 *    = 1/2, factor 8π.
 */

/** Largest A₀/A read (a peak fallen by more than this is no resonance to read). */
const MAX_AMPLITUDE_RATIO = 1e9;

export type TangleGeometry = 'isotropic' | 'perpendicular' | 'in-plane';

export interface TangleGeometryInfo {
  id: TangleGeometry;
  label: string;
  /** ⟨sin²θ⟩ between the lines and the wave vector. */
  meanSin2: number;
  /** 4π/⟨sin²θ⟩: L = factor (Δ − Δ₀)/(B κ). */
  factor: number;
  source: string;
}

export const TANGLE_GEOMETRIES: readonly TangleGeometryInfo[] = [
  {
    id: 'isotropic',
    label: 'isotropic (6π)',
    meanSin2: 2 / 3,
    factor: 6 * Math.PI,
    source: 'Vinen, Proc. R. Soc. A 240, 114 (1957): isotropic average ⟨sin²θ⟩ = 2/3',
  },
  {
    id: 'perpendicular',
    label: 'perpendicular to the wave (4π)',
    meanSin2: 1,
    factor: 4 * Math.PI,
    source: 'Hall & Vinen, Proc. R. Soc. A 238, 204 (1956): lines across the wave (rotation), sin²θ = 1',
  },
  {
    id: 'in-plane',
    label: 'in planes holding the wave (8π)',
    meanSin2: 1 / 2,
    factor: 8 * Math.PI,
    source: 'derived here from the Hall–Vinen sin²θ dependence: lines spread evenly in planes that contain the wave vector, ⟨sin²θ⟩ = 1/2',
  },
];

/** The geometry by id; throws InvalidInputError listing the known ids. */
export function lineDensityGeometry(id: string): TangleGeometryInfo {
  const found = TANGLE_GEOMETRIES.find((g) => g.id === id);
  if (!found) throw new InvalidInputError('tangle geometry', `unknown "${id}"; known: ${TANGLE_GEOMETRIES.map((g) => g.id).join(', ')}`);
  return found;
}

/** A line density with its sd in two parts. */
export interface LineDensity {
  lineDensity_m2: number;
  /** Total one-sigma, m⁻². */
  sd_m2: number;
  /** The measured sweep's part (its amplitude or width), m⁻²: what limits a change between readings. */
  sdMeasurement_m2: number;
  /** The vortex-free reference's part (its Δ₀, A₀), m⁻²: common to every reading against it. */
  sdReference_m2: number;
  /** The B used (no uncertainty is published with the representation; none is included). */
  mutualFrictionB: number;
  geometry: TangleGeometry;
  /** factor/(B κ), s/m²: L per hertz of extra width. */
  perHertz_m2_Hz: number;
}

function perHertz(T: number, geometry: TangleGeometry): { k: number; B: number } {
  requireInRange('temperature for the line density', T, MUTUAL_FRICTION_RANGE_K[0], MUTUAL_FRICTION_RANGE_K[1], 'K', 'where the published mutual friction B is given');
  const B = mutualFrictionBUnchecked(T);
  return { k: lineDensityGeometry(geometry).factor / (B * QUANTUM_OF_CIRCULATION_M2_S), B };
}

/** Inputs of {@link lineDensityFromAmplitude}. */
export interface AmplitudeReading {
  /** Peak amplitude with vortices, any unit (the same as A₀). */
  amplitude: number;
  amplitudeSd: number;
  /** Vortex-free peak amplitude and full width (the reference), and their sds. */
  amplitude0: number;
  amplitude0Sd: number;
  width0_Hz: number;
  width0Sd_Hz: number;
  /** Covariance of A₀ and Δ₀ from the reference fit (default 0). */
  covariance0?: number;
  temperature_K: number;
  geometry?: TangleGeometry;
}

/**
 * L = (factor Δ₀/(B κ)) (A₀/A − 1) (factor 6π for an isotropic tangle), with its sd split into the
 * measurement's part (A) and the reference's (A₀, Δ₀ and their covariance). m⁻².
 * Throws OutOfRangeError for T outside the B range or non-positive amplitudes or widths.
 */
export function lineDensityFromAmplitude(r: AmplitudeReading): LineDensity {
  requireInRange('amplitude', r.amplitude, Number.MIN_VALUE, Number.MAX_VALUE, '');
  requireInRange('vortex-free amplitude', r.amplitude0, Number.MIN_VALUE, Number.MAX_VALUE, '');
  requireInRange('vortex-free width', r.width0_Hz, Number.MIN_VALUE, 1e9, 'Hz');
  for (const [name, v] of [['amplitude sd', r.amplitudeSd], ['vortex-free amplitude sd', r.amplitude0Sd], ['vortex-free width sd', r.width0Sd_Hz]] as const) {
    requireInRange(name, v, 0, Number.MAX_VALUE, '');
  }
  const geometry = r.geometry ?? 'isotropic';
  const { k, B } = perHertz(r.temperature_K, geometry);
  const ratio = requireInRange('amplitude ratio A₀/A', r.amplitude0 / r.amplitude, 0, MAX_AMPLITUDE_RATIO, '', 'the peak fell by more than a factor 1e9: no resonance left to read');
  const scale = k * r.width0_Hz;
  const L = scale * (ratio - 1);
  // In relative terms so that tiny amplitudes (any unit) cannot overflow: ∂L/∂A · σ_A = scale·ratio·σ_A/A,
  // ∂L/∂A₀ · σ_A₀ = scale·ratio·σ_A₀/A₀, ∂L/∂Δ₀ · σ_Δ₀ = k (ratio − 1) σ_Δ₀.
  const measurement = scale * ratio * (r.amplitudeSd / r.amplitude);
  const fromA0 = scale * ratio * (r.amplitude0Sd / r.amplitude0);
  const fromW0 = k * (ratio - 1) * r.width0Sd_Hz;
  const cross = 2 * (scale * ratio) * (k * (ratio - 1)) * ((r.covariance0 ?? 0) / r.amplitude0);
  const reference = Math.sqrt(Math.max(0, fromA0 * fromA0 + fromW0 * fromW0 + cross));
  if (![L, measurement, reference].every(Number.isFinite)) {
    throw new OutOfRangeError('amplitude sd', r.amplitudeSd, 0, r.amplitude, '', 'the sds are too large against the amplitudes to propagate');
  }
  return { lineDensity_m2: L, sd_m2: Math.hypot(measurement, reference), sdMeasurement_m2: measurement, sdReference_m2: reference, mutualFrictionB: B, geometry, perHertz_m2_Hz: k };
}

/**
 * L = factor (Δ − Δ₀)/(B κ) from the two full widths (Hz) and their sds, m⁻²: the width form,
 * which needs no constant drive. Throws like {@link lineDensityFromAmplitude}.
 */
export function lineDensityFromWidth(width_Hz: number, widthSd_Hz: number, width0_Hz: number, width0Sd_Hz: number, temperature_K: number, geometry: TangleGeometry = 'isotropic'): LineDensity {
  requireInRange('width', width_Hz, Number.MIN_VALUE, 1e9, 'Hz');
  requireInRange('vortex-free width', width0_Hz, Number.MIN_VALUE, 1e9, 'Hz');
  requireInRange('width sd', widthSd_Hz, 0, 1e9, 'Hz');
  requireInRange('vortex-free width sd', width0Sd_Hz, 0, 1e9, 'Hz');
  const { k, B } = perHertz(temperature_K, geometry);
  const measurement = k * widthSd_Hz;
  const reference = k * width0Sd_Hz;
  return {
    lineDensity_m2: k * (width_Hz - width0_Hz),
    sd_m2: Math.hypot(measurement, reference),
    sdMeasurement_m2: measurement,
    sdReference_m2: reference,
    mutualFrictionB: B,
    geometry,
    perHertz_m2_Hz: k,
  };
}
