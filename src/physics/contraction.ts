import { InvalidInputError, requireInRange } from './errors';

/*
 * Thermal contraction of spacer materials from room temperature (293 K) to liquid-helium
 * temperature (4 K): integrated linear contraction ε = (L293 − L4)/L293. Values are as given in
 * the project's physics notes, marked there "from memory (verify)"; they agree with the usual
 * cryogenic handbook tables to the digits shown (the trade's common values, no single source).
 * Below 4 K contraction is complete to far under these digits.
 */

export interface SpacerMaterial {
  id: string;
  name: string;
  /** Integrated linear contraction 293 K → 4 K, dimensionless. */
  contraction: number;
  /** One-sigma uncertainty of that contraction, dimensionless (handbook scatter, common practice). */
  contractionSd: number;
  source: string;
}

const FROM_MEMORY = 'cryogenic handbook value, from memory (verify against your material certificate)';

export const SPACER_MATERIALS: readonly SpacerMaterial[] = [
  { id: 'stainless-304', name: 'Stainless steel 304', contraction: 0.003, contractionSd: 0.0001, source: FROM_MEMORY },
  { id: 'copper', name: 'Copper (OFHC)', contraction: 0.0032, contractionSd: 0.0001, source: FROM_MEMORY },
  { id: 'aluminium-6061', name: 'Aluminium 6061', contraction: 0.0041, contractionSd: 0.0001, source: FROM_MEMORY },
  { id: 'brass', name: 'Brass', contraction: 0.0037, contractionSd: 0.0002, source: FROM_MEMORY },
  { id: 'g10-warp', name: 'G-10 (along the warp)', contraction: 0.0024, contractionSd: 0.0002, source: FROM_MEMORY },
  { id: 'g10-normal', name: 'G-10 (normal to the cloth)', contraction: 0.007, contractionSd: 0.0005, source: FROM_MEMORY },
  { id: 'ptfe', name: 'PTFE', contraction: 0.021, contractionSd: 0.001, source: FROM_MEMORY },
  { id: 'invar', name: 'Invar', contraction: 0.0004, contractionSd: 0.0001, source: FROM_MEMORY },
];

/** Looks a material up by id; throws a message listing the known ids. */
export function spacerMaterial(id: string): SpacerMaterial {
  const found = SPACER_MATERIALS.find((m) => m.id === id);
  if (!found) {
    throw new InvalidInputError('spacer material', `unknown "${id}"; known: ${SPACER_MATERIALS.map((m) => m.id).join(', ')}`);
  }
  return found;
}

/** Length of a path between 0 and 100 m, in metres: what the planner accepts. */
export const PATH_LENGTH_RANGE_M = [1e-6, 100] as const;

export interface ColdLength {
  length_m: number;
  /** Extra one-sigma uncertainty from the contraction value, m. */
  contractionSd_m: number;
}

/**
 * Cold length of a path measured warm: L_cold = L_warm (1 − ε).
 * @param warm_m length measured at room temperature, m (1 µm–100 m).
 * @param materialId a {@link SPACER_MATERIALS} id.
 */
export function coldLength(warm_m: number, materialId: string): ColdLength {
  requireInRange('distance', warm_m, PATH_LENGTH_RANGE_M[0], PATH_LENGTH_RANGE_M[1], 'm');
  const m = spacerMaterial(materialId);
  return { length_m: warm_m * (1 - m.contraction), contractionSd_m: warm_m * m.contractionSd };
}
