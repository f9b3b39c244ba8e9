import { MODEL_MIN_K, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';
import { densityUnchecked_g_cm3, DENSITY_G_CM3_TO_KG_M3 } from './density';
import { entropyUnchecked } from './entropy';
import { requireInRange } from './errors';
import { firstSoundUnchecked } from './first-sound';
import { normalFractionUnchecked } from './fractions';
import { heatCapacityUnchecked } from './heat-capacity';
import { nonlinearityUnchecked } from './nonlinearity';
import {
  type SecondSoundRegion,
  secondSoundRegion,
  secondSoundSdUnchecked,
  secondSoundUnchecked,
} from './second-sound';
import { twoFluidSecondSoundUnchecked } from './two-fluid';
import { type VapourPressureScale, VAPOUR_TEMPERATURE_RANGE_K, vapourPressureUnchecked, ITS90_RANGE_K } from './vapour-pressure';

/** Temperature range of {@link heliumProperties}, K. */
export const PROPERTIES_RANGE_K = [MODEL_MIN_K, PROPERTIES_MAX_K] as const;

/** Why second sound is absent above Tλ (shown instead of a number). */
export const NO_SECOND_SOUND_REASON =
  'No second sound: above Tλ = 2.1768 K the liquid is He I, a normal fluid with no superfluid component; heat spreads by diffusion and convection.';

/** Why the vapour pressure is absent below the reference data. */
export const NO_VAPOUR_PRESSURE_REASON =
  'No vapour pressure: the reference vapour-pressure curve starts at 0.5 K.';

/** Every property of liquid helium-4 at one temperature along SVP. SI units, names carry them. */
export interface HeliumProperties {
  temperature_K: number;
  phase: 'He II' | 'He I';
  /** "Landau model" where u2 comes from the phonon–roton model (below 0.5517 K), else "measured". */
  model: 'measured' | 'Landau model';
  /** Finer detail of where u2 comes from; null above Tλ. */
  secondSoundRegion: SecondSoundRegion | null;
  secondSound_m_s: number | null;
  secondSoundSlope_m_s_K: number | null;
  secondSoundSd_m_s: number | null;
  /** Why second sound is null, or null when it exists. */
  secondSoundAbsentReason: string | null;
  /** u2 from the two-fluid relation with this kernel's s, c_p and fractions (cross-check). */
  twoFluidSecondSound_m_s: number | null;
  firstSound_m_s: number;
  density_kg_m3: number;
  superfluidFraction: number;
  normalFraction: number;
  entropy_J_kgK: number;
  specificHeat_J_kgK: number;
  /** α2 = ∂ ln(u2³ c_p/T)/∂T, 1/K; null above Tλ. */
  nonlinearity_per_K: number | null;
  /** Saturated vapour pressure, Pa; null below 0.5 K. */
  vapourPressure_Pa: number | null;
  vapourPressureScale: VapourPressureScale | null;
  /** Reduced temperature t = 1 − T/Tλ (negative in He I). */
  reducedTemperature: number;
}

/**
 * All properties of liquid helium-4 at SVP at one temperature.
 * @param T temperature T90, K, 0.3–4.24. He II below Tλ = 2.1768 K, He I from Tλ up.
 * Sources: see each property's module. Throws OutOfRangeError / NonFiniteInputError.
 */
export function heliumProperties(T: number): HeliumProperties {
  requireInRange('temperature', T, PROPERTIES_RANGE_K[0], PROPERTIES_RANGE_K[1], 'K');
  const heII = T < T_LAMBDA_K;
  const cp = heatCapacityUnchecked(T).value;
  const fn = normalFractionUnchecked(T);
  let u2: number | null = null;
  let slope: number | null = null;
  let sd: number | null = null;
  let alpha2: number | null = null;
  let twoFluid: number | null = null;
  if (heII) {
    const u = secondSoundUnchecked(T);
    u2 = u.value;
    slope = u.slope;
    sd = secondSoundSdUnchecked(T, u.value, u.slope);
    alpha2 = nonlinearityUnchecked(T);
    twoFluid = twoFluidSecondSoundUnchecked(T);
  }
  const hasVapour = T >= VAPOUR_TEMPERATURE_RANGE_K[0];
  return {
    temperature_K: T,
    phase: heII ? 'He II' : 'He I',
    model: heII && secondSoundRegion(T) === 'Landau model' ? 'Landau model' : 'measured',
    secondSoundRegion: heII ? secondSoundRegion(T) : null,
    secondSound_m_s: u2,
    secondSoundSlope_m_s_K: slope,
    secondSoundSd_m_s: sd,
    secondSoundAbsentReason: heII ? null : NO_SECOND_SOUND_REASON,
    twoFluidSecondSound_m_s: twoFluid,
    firstSound_m_s: firstSoundUnchecked(T),
    density_kg_m3: densityUnchecked_g_cm3(T) * DENSITY_G_CM3_TO_KG_M3,
    superfluidFraction: 1 - fn,
    normalFraction: fn,
    entropy_J_kgK: entropyUnchecked(T),
    specificHeat_J_kgK: cp,
    nonlinearity_per_K: alpha2,
    vapourPressure_Pa: hasVapour ? vapourPressureUnchecked(T) : null,
    vapourPressureScale: hasVapour ? (T < ITS90_RANGE_K[0] ? 'reference spline (not ITS-90)' : 'ITS-90') : null,
    reducedTemperature: 1 - T / T_LAMBDA_K,
  };
}
