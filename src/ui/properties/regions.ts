import { PROPERTIES_RANGE_K, SECOND_SOUND_CRITICAL_JOIN_K, SECOND_SOUND_MEASURED_MIN_K, T_LAMBDA_K } from '../../physics';
import { formatFixed } from '../units/format-number';

const MICROKELVIN_PER_KELVIN = 1e6;

/** "0.3–0.55 K": the Landau-model region as people read it. */
export const MODEL_REGION_TEXT = `${PROPERTIES_RANGE_K[0]}–${formatFixed(SECOND_SOUND_MEASURED_MIN_K, 2)} K`;

/** Width of the critical power-law region just below Tλ, µK (rounded). */
export const CRITICAL_REGION_UK = Math.round((T_LAMBDA_K - SECOND_SOUND_CRITICAL_JOIN_K) * MICROKELVIN_PER_KELVIN);
