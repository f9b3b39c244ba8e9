import { T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';

/*
 * How a solid wall reflects second sound. A temperature wave carries heat q = Z δT with the
 * thermal impedance Z = ρ c_p u2; a wall takes heat from the liquid only through its boundary
 * (Kapitza) conductance h, q = h δT at the wall. Incident plus reflected wave then give
 *
 *   R = (Z − h)/(Z + h)
 *
 * (PHYSICS notes §4). Z ≈ 8.5 MW/(m²·K) at 1.8 K is thousands of times h, so R is within a few
 * parts in 10⁴ of 1 — why plate resonators ring to high harmonics — and a temperature sensor on a
 * wall sees (1 + R) ≈ 2 times the incident wave. Glass or a coated wall conducts less still.
 */

/**
 * Kapitza conductance of a clean metal–He II boundary, W/(m²·K⁴): h = this × T³. ORDER OF
 * MAGNITUDE only: 0.05 W/(cm²·K⁴), the middle of measured values on copper and other metals,
 * which spread by a factor of several with surface state (G. L. Pollack, Rev. Mod. Phys. 41, 48
 * (1969), from memory of its survey). The T³ law is the acoustic-mismatch form that review
 * discusses. It gives h ≈ 2.9 kW/(m²·K) at 1.8 K.
 */
export const KAPITZA_CONDUCTANCE_W_M2K4 = 500;

/** Kapitza conductance h at T, W/(m²·K) (order of magnitude; 0.3 K – Tλ). Throws on bad input. */
export function kapitzaConductance(T: number): number {
  requireInRange('temperature', T, 0.3, T_LAMBDA_K, 'K');
  return KAPITZA_CONDUCTANCE_W_M2K4 * T ** 3;
}

/** The wall's reflection of second sound and what it rests on. */
export interface WallReflection {
  reflection: number;
  /** Z = ρ c_p u2, W/(m²·K). */
  impedance_W_m2K: number;
  /** h used, W/(m²·K). */
  conductance_W_m2K: number;
}

/**
 * R = (Z − h)/(Z + h) of a solid wall for second sound at T.
 * @param T bath temperature, K (0.3 K – Tλ). @param impedance_W_m2K Z = ρ c_p u2, W/(m²·K), > 0.
 * Throws on bad input.
 */
export function wallReflection(T: number, impedance_W_m2K: number): WallReflection {
  requireInRange('thermal impedance', impedance_W_m2K, 1e-3, 1e12, 'W/(m²·K)');
  const h = kapitzaConductance(T);
  return { reflection: (impedance_W_m2K - h) / (impedance_W_m2K + h), impedance_W_m2K, conductance_W_m2K: h };
}
