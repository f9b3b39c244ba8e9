import { MODEL_MIN_K, T_LAMBDA_K } from './constants';
import { densityUnchecked_g_cm3 } from './density';
import { entropyUnchecked } from './entropy';
import { requireInRange } from './errors';
import { normalFractionUnchecked } from './fractions';
import { heatCapacityUnchecked } from './heat-capacity';

/*
 * Strong pulsed heating by the one-dimensional Gorter–Mellink transient (PHYSICS notes §5; the
 * model of S. W. Van Sciver, Helium Cryogenics, 2nd ed., Springer 2012, ch. 7). Once a vortex
 * tangle carries the heat, the gradient is ∇T = −f(T) q³ with the heat-conductivity function
 *
 *   f⁻¹(T) = ρs³ s⁴ T³ / (A_GM ρn),
 *
 * ρs, ρn, s from this kernel's published curves and A_GM the Gorter–Mellink constant. A face
 * heated at flux q from t = 0 warms the liquid next to it; it reaches Tλ — He I and boiling at
 * the heater, past which more power gives no more second sound — after t_λ with
 *
 *   q⁴ t_λ = (8/5) ∫_{Tb}^{Tλ} ρ c_p(T) F(T) dT,   F(T) = ∫_T^{Tλ} f⁻¹(T′) dT′.
 *
 * The heat-capacity factor is what makes "q⁴ t_λ ≈ ∫ f⁻¹ dT" dimensionally whole; the form and its
 * 8/5 come from the heat-balance integral method (flux falling linearly across the heated layer),
 * which for constant properties gives q⁴ t = (4/5) ρ c_p f⁻¹ ΔT². So the strong-heating flux for a
 * pulse of length τ, q* = (G/τ)^{1/4}, falls as τ^(−1/4) and depends on the bath through G(Tb).
 * ESTIMATE: A_GM below is a single value, not a fitted A_GM(T) table, and the heat-balance method
 * is approximate; take q* as good to about a factor 2 (the planner cautions from half of q*).
 */

/**
 * Gorter–Mellink constant A_GM, m·s/kg: an ESTIMATE, one value for every temperature. From memory
 * of the range quoted in Van Sciver, Helium Cryogenics (2012), ch. 7 (several hundred to about
 * 1500 m·s/kg between 1.4 K and 2.1 K). With it f⁻¹ peaks near 1.95 K at about 2×10¹³ W³/(m⁵·K), and
 * a 1 m channel at 1.8 K carries about 1.5 W/cm² steadily — the usual order for such channels.
 */
export const GORTER_MELLINK_A_M_S_KG = 1000;

/** Grid of the G(Tb) table, K. */
const TABLE_STEP_K = 1e-3;
const TABLE_MIN_K = MODEL_MIN_K;

/** f⁻¹(T), W³/(m⁵·K), no range check (0.3 K ≤ T < Tλ; 0 at and above Tλ). */
export function heatConductivityFunctionUnchecked(T: number): number {
  if (T >= T_LAMBDA_K) return 0;
  const rho = densityUnchecked_g_cm3(T) * 1000;
  const fn = normalFractionUnchecked(T);
  const rhoN = fn * rho;
  const rhoS = rho - rhoN;
  const s = entropyUnchecked(T);
  return rhoN > 0 ? (rhoS ** 3 * s ** 4 * T ** 3) / (GORTER_MELLINK_A_M_S_KG * rhoN) : 0;
}

/** G on the grid from Tλ down: G_i = (8/5) ∫_{T_i}^{Tλ} ρ c_p F dT (trapezoids on a 1 mK grid). */
const table = (() => {
  const n = Math.ceil((T_LAMBDA_K - TABLE_MIN_K) / TABLE_STEP_K);
  const temps = Float64Array.from({ length: n + 1 }, (_, i) => Math.min(T_LAMBDA_K, TABLE_MIN_K + i * TABLE_STEP_K));
  const finv = temps.map((T) => heatConductivityFunctionUnchecked(T));
  const rhoC = temps.map((T) => densityUnchecked_g_cm3(Math.min(T, T_LAMBDA_K - 1e-9)) * 1000 * heatCapacityUnchecked(Math.min(T, T_LAMBDA_K - 1e-6)).value);
  const F = new Float64Array(n + 1);
  const G = new Float64Array(n + 1);
  for (let i = n - 1; i >= 0; i--) {
    const dT = (temps[i + 1] as number) - (temps[i] as number);
    F[i] = (F[i + 1] as number) + (dT * ((finv[i] as number) + (finv[i + 1] as number))) / 2;
    G[i] = (G[i + 1] as number) + (8 / 5) * (dT * ((rhoC[i] as number) * (F[i] as number) + (rhoC[i + 1] as number) * (F[i + 1] as number))) / 2;
  }
  return { G };
})();

function gUnchecked(T: number): number {
  const x = (T - TABLE_MIN_K) / TABLE_STEP_K;
  const i = Math.min(table.G.length - 2, Math.max(0, Math.floor(x)));
  const f = Math.min(1, Math.max(0, x - i));
  return (1 - f) * (table.G[i] as number) + f * (table.G[i + 1] as number);
}

/**
 * G(Tb) = q⁴ t_λ, W⁴·s/m⁸: the Gorter–Mellink transient's constant for a bath at Tb (see above).
 * @param T bath temperature, K, 0.3 K up to Tλ (0 at Tλ). Throws on bad input. ESTIMATE.
 */
export function gorterMellinkConstant(T: number): number {
  requireInRange('bath temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  return gUnchecked(T);
}

/**
 * The flux (W/m²) at which a heater face in a bath at T reaches Tλ within a pulse of length τ:
 * q* = (G(T)/τ)^{1/4}. ESTIMATE (A_GM one value; heat-balance integral), good to about a factor 2.
 * @param T bath temperature, K, 0.3 K – Tλ. @param duration_s pulse length, s, 1 ns – 1000 s.
 */
export function strongHeatingFlux(T: number, duration_s: number): number {
  requireInRange('bath temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('pulse length', duration_s, 1e-9, 1e3, 's');
  return (gUnchecked(T) / duration_s) ** 0.25;
}

/**
 * Time (s) for a heater face at flux q (W/m², above 0) in a bath at T to reach Tλ: G(T)/q⁴.
 * ESTIMATE as above. Throws on bad input.
 */
export function timeToLambda(T: number, flux_W_m2: number): number {
  requireInRange('bath temperature', T, MODEL_MIN_K, T_LAMBDA_K, 'K');
  requireInRange('heat flux', flux_W_m2, 1e-9, 1e12, 'W/m²');
  return gUnchecked(T) / flux_W_m2 ** 4;
}
