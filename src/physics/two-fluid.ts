import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { entropyUnchecked } from './entropy';
import { requireInRange } from './errors';
import { normalFractionUnchecked } from './fractions';
import { heatCapacityUnchecked } from './heat-capacity';

/**
 * Second sound from Landau's two-fluid relation u2² = (ρs/ρn)·T·s²/c_p, m/s, with this kernel's
 * fractions, entropy and heat capacity: a cross-check on the measured u2, not a replacement for it.
 * With the reference curves it agrees with the measured u2 within 1 % from 1.55 K to Tλ
 * (1.65 % at 1.50 K, growing below).
 * @param T temperature T90, K, 0.3 K to just below Tλ. Throws on bad input.
 */
export function twoFluidSecondSound(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, T_LAMBDA_K * (1 - 1e-9), 'K');
  return twoFluidSecondSoundUnchecked(T);
}

/** Two-fluid u2 with no range check (kernel-internal). */
export function twoFluidSecondSoundUnchecked(T: number): number {
  const fn = normalFractionUnchecked(T);
  const s = entropyUnchecked(T);
  return Math.sqrt((((1 - fn) / fn) * T * s * s) / heatCapacityUnchecked(T).value);
}
