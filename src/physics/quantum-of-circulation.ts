/*
 * The quantum of circulation of helium-4, κ = h/m₄, from CODATA 2018 values.
 * m₄ (the helium-4 atom) = alpha-particle mass + two electron masses − the two electrons' binding
 * energy (79.005 eV: the first and second ionisation energies of helium, 24.587 + 54.418 eV, from
 * memory; it moves κ by 2e-8 relative, far below any use here).
 */

/** Planck constant, J·s (SI 2019, exact; CODATA 2018). */
export const PLANCK_J_S = 6.62607015e-34;
/** Alpha-particle mass, kg (CODATA 2018). */
export const ALPHA_PARTICLE_MASS_KG = 6.6446573357e-27;
/** Electron mass, kg (CODATA 2018). */
export const ELECTRON_MASS_KG = 9.1093837015e-31;
/** Elementary charge, C (SI 2019, exact), for the binding energy in joules. */
const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** Speed of light in vacuum, m/s (SI, exact). */
const SPEED_OF_LIGHT_M_S = 299_792_458;
/** Binding energy of helium's two electrons, eV (24.587 + 54.418 eV; from memory). */
const HELIUM_ELECTRON_BINDING_EV = 79.005;

/** Mass of one helium-4 atom, kg (≈ 6.646479e-27). */
export const HELIUM4_ATOM_MASS_KG =
  ALPHA_PARTICLE_MASS_KG + 2 * ELECTRON_MASS_KG - (HELIUM_ELECTRON_BINDING_EV * ELEMENTARY_CHARGE_C) / SPEED_OF_LIGHT_M_S ** 2;

/** Quantum of circulation κ = h/m₄, m²/s (≈ 9.9693e-8; Donnelly & Barenghi 1998 quote 9.97e-4 cm²/s). */
export const QUANTUM_OF_CIRCULATION_M2_S = PLANCK_J_S / HELIUM4_ATOM_MASS_KG;
