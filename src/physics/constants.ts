/**
 * Constants of the property kernel, each with its source. SI units unless the name says otherwise.
 */

/** Lambda temperature at saturated vapour pressure, K (ITS-90; Donnelly & Barenghi 1998). */
export const T_LAMBDA_K = 2.1768;

/** Vapour pressure at the lambda point, Pa: where the two ITS-90 helium-4 ranges meet (ITS-90). */
export const P_LAMBDA_PA = 5041.8;

/** Boltzmann constant, J/K (CODATA 2018, exact). */
export const BOLTZMANN_J_K = 1.380649e-23;

/** Reduced Planck constant, J·s (CODATA 2018, exact). */
export const HBAR_J_S = 1.054571817e-34;

/** Avogadro constant, 1/mol (CODATA 2018, exact). */
export const AVOGADRO_PER_MOL = 6.02214076e23;

/** Molar mass of helium-4, kg/mol (IUPAC standard atomic weight, 4.002602 g/mol). */
export const MOLAR_MASS_KG_MOL = 4.002602e-3;

/** Mass of one helium-4 atom, kg. */
export const HE4_ATOM_MASS_KG = MOLAR_MASS_KG_MOL / AVOGADRO_PER_MOL;

/** Standard acceleration of gravity, m/s² (CGPM 1901, exact). */
export const STANDARD_GRAVITY_M_S2 = 9.80665;

/** First sound as T → 0, m/s (ultrasonic measurement quoted by Donnelly & Barenghi 1998; ±0.13). */
export const FIRST_SOUND_T0_M_S = 238.3;

/**
 * Roton parameters for the Landau model. Convention chosen here: the values typical of SVP near
 * 1.1 K from Brooks & Donnelly, J. Phys. Chem. Ref. Data 6, 51 (1977), sec. 3.1.c, held fixed.
 * (The neutron gap is 8.618 ± 0.009 K at 0.75 K and about 8.71 K as T → 0; below 0.55 K, where the
 * model is used, rotons carry less than half of ρn and the choice moves u2 by well under 1 %.)
 */
export const ROTON_GAP_K = 8.68;
/** Roton momentum p0/ħ, 1/m (Brooks & Donnelly 1977: 1.91 Å⁻¹ at SVP). */
export const ROTON_MOMENTUM_PER_M = 1.91e10;
/** Roton effective mass over the helium-4 atom mass (Brooks & Donnelly 1977: 0.16 at SVP). */
export const ROTON_MASS_RATIO = 0.16;

/**
 * Temperature where the second-sound nonlinearity coefficient changes sign, K
 * (A. Kolmakov, Low Temp. Phys. 29, 495 (2003)). Shown to users beside the computed crossing.
 */
export const NONLINEARITY_SIGN_CHANGE_PUBLISHED_K = 1.88;

/** Lowest temperature the kernel accepts, K: the Landau model is stretched no further. */
export const MODEL_MIN_K = 0.3;

/**
 * Highest temperature the kernel accepts for the full property set, K: the first-sound spline
 * ends at 4.248 K (Donnelly & Barenghi 1998); rounded down.
 */
export const PROPERTIES_MAX_K = 4.24;
