import { CubicBSpline } from './bspline';
import { MODEL_MIN_K, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';
import { densityUnchecked_g_cm3, DENSITY_G_CM3_TO_KG_M3 } from './density';
import { requireInRange } from './errors';
import { landauGasUnchecked } from './landau';
import { SUPERFLUID_DENSITY_SPLINE } from './reference-splines';

/*
 * Normal and superfluid fractions ρn/ρ and ρs/ρ along SVP.
 *  - Above 1.05 K: ρn = ρ − ρs with ρs from the published spline (Donnelly & Barenghi 1998) and ρ
 *    from their density equations.
 *  - Below 0.75 K ρ − ρs is the small difference of two nearly equal numbers and loses its
 *    relative accuracy (the reference's own caution); there ρn comes from Landau's phonon–roton sums.
 *  - 0.75–1.05 K: a smooth (cubic smoothstep) blend of the two. The sums with fixed roton
 *    parameters lie 7 % below the measured ρn at 1 K, which is why the blend ends there.
 * Above Tλ there is no superfluid: ρs/ρ = 0, ρn/ρ = 1.
 */

const spline = new CubicBSpline(SUPERFLUID_DENSITY_SPLINE);
const BLEND_START_K = 0.75;
const BLEND_END_K = 1.05;

/** ρn/ρ with no range check (kernel-internal). */
export function normalFractionUnchecked(T: number): number {
  if (T >= T_LAMBDA_K) return 1;
  const rho = densityUnchecked_g_cm3(T);
  const fromSpline = () => Math.min(1, Math.max(0, 1 - spline.value(T) / rho));
  const fromLandau = () => landauGasUnchecked(T).normalDensity_kg_m3 / (rho * DENSITY_G_CM3_TO_KG_M3);
  if (T >= BLEND_END_K) return fromSpline();
  if (T <= BLEND_START_K) return fromLandau();
  const x = (T - BLEND_START_K) / (BLEND_END_K - BLEND_START_K);
  const w = x * x * (3 - 2 * x);
  return (1 - w) * fromLandau() + w * fromSpline();
}

/**
 * Normal-fluid fraction ρn/ρ of liquid helium-4 at SVP (dimensionless, 0–1; 1 above Tλ).
 * @param T temperature T90, K, 0.3–4.24. Sources in the comment above. Throws on bad input.
 */
export function normalFraction(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, PROPERTIES_MAX_K, 'K');
  return normalFractionUnchecked(T);
}

/** Superfluid fraction ρs/ρ = 1 − ρn/ρ (0 above Tλ); same range and errors as {@link normalFraction}. */
export function superfluidFraction(T: number): number {
  return 1 - normalFraction(T);
}
