import { requireInRange } from './errors';
import { MODEL_MIN_K, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';

/*
 * Liquid helium-4 density along SVP: the equations of Donnelly & Barenghi, J. Phys. Chem. Ref.
 * Data 27, 1217 (1998). Three pieces: a polynomial below 1.334 K, and on each side of Tλ the form
 * ρ = ρλ (1 + (a1 τ + a2 τ²) ln|τ| + Σ b_k τ^k), τ = T − Tλ in kelvin.
 */

const RHO_0_G_CM3 = 0.1451397;
const RHO_LAMBDA_G_CM3 = 0.1461087;
const LOW_T_COEFFS = [-1.26935e-5, 7.12413e-5, -16.7461e-5, 8.75342e-5] as const; // × T^2 … T^5
const POLY_MAX_K = 1.334;
const BELOW = { a1: -7.57537e-3, a2: 6.87483e-3, b: [3.79937e-3, 1.86557e-3, 4.88345e-3, 0] } as const;
const ABOVE = {
  a1: -7.94605e-3,
  a2: 5.057051e-3,
  b: [-30.3511e-3, -10.2326e-3, -3.00636e-3, 0.24072e-3, -2.45749e-3, 1.53454e-3, -0.308182e-3],
} as const;
const G_CM3_TO_KG_M3 = 1000;

function lambdaForm(tau: number, p: { a1: number; a2: number; b: readonly number[] }): number {
  // At τ = 0 exactly the log terms vanish (τ ln|τ| → 0).
  const logTerm = tau === 0 ? 0 : (p.a1 * tau + p.a2 * tau * tau) * Math.log(Math.abs(tau));
  let poly = 0;
  let power = tau;
  for (const b of p.b) {
    poly += b * power;
    power *= tau;
  }
  return RHO_LAMBDA_G_CM3 * (1 + logTerm + poly);
}

/** Density in g/cm³ without range checks (kernel-internal). */
export function densityUnchecked_g_cm3(T: number): number {
  if (T < POLY_MAX_K) {
    const T2 = T * T;
    return (
      RHO_0_G_CM3 +
      LOW_T_COEFFS[0] * T2 +
      LOW_T_COEFFS[1] * T2 * T +
      LOW_T_COEFFS[2] * T2 * T2 +
      LOW_T_COEFFS[3] * T2 * T2 * T
    );
  }
  return lambdaForm(T - T_LAMBDA_K, T < T_LAMBDA_K ? BELOW : ABOVE);
}

/**
 * Density of liquid helium-4 at SVP, kg/m³.
 * @param T temperature T90, K, 0.3–4.24.
 * Source: Donnelly & Barenghi (1998) density equations. Throws OutOfRangeError / NonFiniteInputError.
 */
export function density(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, PROPERTIES_MAX_K, 'K');
  return densityUnchecked_g_cm3(T) * G_CM3_TO_KG_M3;
}

export const DENSITY_G_CM3_TO_KG_M3 = G_CM3_TO_KG_M3;
