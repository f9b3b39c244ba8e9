import { requireInRange } from './errors';
import {
  BOLTZMANN_J_K,
  FIRST_SOUND_T0_M_S,
  HBAR_J_S,
  HE4_ATOM_MASS_KG,
  ROTON_GAP_K,
  ROTON_MASS_RATIO,
  ROTON_MOMENTUM_PER_M,
} from './constants';

/*
 * Landau's phonon–roton model of He II (L. Landau, J. Phys. USSR 5, 71 (1941); 11, 91 (1947)),
 * with phonon speed c = u1(0) and fixed roton parameters (Brooks & Donnelly 1977). Per unit volume:
 *   phonons  ρn = 2π²(k_BT)⁴/(45ħ³c⁵),  S = 2π²k_B⁴T³/(45ħ³c³),  C = 3S
 *   rotons   N = 2μ^½ p0² (k_BT)^½ e^(−Δ/k_BT)/((2π)^{3/2}ħ³),  ρn = p0² N/(3k_BT),
 *            S = N k_B (Δ/k_BT + 3/2),  C = T dS/dT
 * Valid where the excitations form a dilute gas: below about 1 K.
 */

export interface LandauGas {
  /** Normal-fluid density, kg/m³. */
  normalDensity_kg_m3: number;
  /** Entropy per unit volume, J/(m³·K). */
  entropy_J_m3K: number;
  /** Heat capacity per unit volume, J/(m³·K). */
  heatCapacity_J_m3K: number;
}

const c = FIRST_SOUND_T0_M_S;
const kB = BOLTZMANN_J_K;
const hbar3 = HBAR_J_S ** 3;
const p0 = ROTON_MOMENTUM_PER_M * HBAR_J_S;
const mu = ROTON_MASS_RATIO * HE4_ATOM_MASS_KG;
const gap = ROTON_GAP_K * kB;
const PHONON_S = (2 * Math.PI ** 2 * kB ** 4) / (45 * hbar3 * c ** 3);
const PHONON_RHO = (2 * Math.PI ** 2 * kB ** 4) / (45 * hbar3 * c ** 5);
const ROTON_N = (2 * Math.sqrt(mu) * p0 * p0 * Math.sqrt(kB)) / ((2 * Math.PI) ** 1.5 * hbar3);

/** Temperatures at which the Landau sums are offered, K (a dilute gas of excitations). */
export const LANDAU_RANGE_K = [1e-3, 2] as const;

/**
 * Phonon and roton contributions at temperature T, K (1 mK – 2 K; physically meaningful below
 * about 1 K). Throws OutOfRangeError / NonFiniteInputError.
 */
export function landauGas(T: number): LandauGas {
  requireInRange('temperature', T, LANDAU_RANGE_K[0], LANDAU_RANGE_K[1], 'K');
  return landauGasUnchecked(T);
}

/** {@link landauGas} without the range check (kernel-internal). */
export function landauGasUnchecked(T: number): LandauGas {
  const x = gap / (kB * T);
  const T3 = T * T * T;
  const sPh = PHONON_S * T3;
  const rhoPh = PHONON_RHO * T3 * T;
  const n = ROTON_N * Math.sqrt(T) * Math.exp(-x);
  const rhoR = (p0 * p0 * n) / (3 * kB * T);
  const sR = n * kB * (x + 1.5);
  // C_r = T dS_r/dT with dN/dT = N (1/2 + x)/T and d(x)/dT = −x/T.
  const cR = n * kB * ((0.5 + x) * (x + 1.5) - x);
  return {
    normalDensity_kg_m3: rhoPh + rhoR,
    entropy_J_m3K: sPh + sR,
    heatCapacity_J_m3K: 3 * sPh + cR,
  };
}

/**
 * Second sound of the Landau gas from the two-fluid relation u2² = (ρs/ρn)·T·S²/(ρ·C), m/s,
 * for total density ρ (kg/m³, 100–200). Tends to c/√3 as T → 0. T as for {@link landauGas}.
 */
export function landauSecondSound(T: number, density_kg_m3: number): number {
  requireInRange('temperature', T, LANDAU_RANGE_K[0], LANDAU_RANGE_K[1], 'K');
  requireInRange('density', density_kg_m3, 100, 200, 'kg/m³');
  return landauSecondSoundUnchecked(T, density_kg_m3);
}

/** {@link landauSecondSound} without range checks (kernel-internal). */
export function landauSecondSoundUnchecked(T: number, density_kg_m3: number): number {
  const g = landauGasUnchecked(T);
  const rhoS = density_kg_m3 - g.normalDensity_kg_m3;
  return Math.sqrt(((rhoS / g.normalDensity_kg_m3) * T * g.entropy_J_m3K ** 2) / (density_kg_m3 * g.heatCapacity_J_m3K));
}
