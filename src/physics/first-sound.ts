import { CubicBSpline } from './bspline';
import { MODEL_MIN_K, PROPERTIES_MAX_K } from './constants';
import { requireInRange } from './errors';
import { FIRST_SOUND_SPLINE } from './reference-splines';

/*
 * First-sound (ordinary pressure wave) speed along SVP from the published B-spline of Donnelly &
 * Barenghi (1998), valid 0–4.248 K in He II and He I, with its cusp-shaped minimum at Tλ.
 */

const spline = new CubicBSpline(FIRST_SOUND_SPLINE);

/** u1 in m/s, no range check (kernel-internal). */
export function firstSoundUnchecked(T: number): number {
  return spline.value(T);
}

/**
 * First-sound speed u1 in liquid helium-4 at SVP, m/s.
 * @param T temperature T90, K, 0.3–4.24 (He II and He I).
 * Source: Donnelly & Barenghi (1998). Throws OutOfRangeError / NonFiniteInputError.
 */
export function firstSound(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, PROPERTIES_MAX_K, 'K');
  return spline.value(T);
}
