/**
 * What each property is, its SI unit and where its numbers come from: one list that the page,
 * the command line and the docs all read, so a source is written down once.
 */

export const DB1998 =
  'R. J. Donnelly & C. F. Barenghi, J. Phys. Chem. Ref. Data 27, 1217 (1998)';
export const ITS90 = 'ITS-90: H. Preston-Thomas, Metrologia 27, 3 (1990)';
export const LANDAU =
  'L. Landau (1941, 1947) phonon–roton model; roton parameters: J. S. Brooks & R. J. Donnelly, J. Phys. Chem. Ref. Data 6, 51 (1977)';

/** Keys of {@link HeliumProperties} that carry a number. */
export type PropertyKey =
  | 'secondSound_m_s'
  | 'secondSoundSlope_m_s_K'
  | 'secondSoundSd_m_s'
  | 'twoFluidSecondSound_m_s'
  | 'firstSound_m_s'
  | 'density_kg_m3'
  | 'superfluidFraction'
  | 'normalFraction'
  | 'entropy_J_kgK'
  | 'specificHeat_J_kgK'
  | 'nonlinearity_per_K'
  | 'vapourPressure_Pa';

export interface PropertyInfo {
  key: PropertyKey;
  /** Short name with its symbol, for tables and axis titles. */
  label: string;
  symbol: string;
  /** SI unit as printed. */
  unit: string;
  /** Published source of the numbers. */
  source: string;
  /** One sentence a user needs to read the number right. */
  note: string;
}

export const PROPERTY_CATALOGUE: readonly PropertyInfo[] = [
  {
    key: 'secondSound_m_s',
    label: 'Second sound',
    symbol: 'u₂',
    unit: 'm/s',
    source: `${DB1998}, second-sound spline; below 0.5517 K ${LANDAU}`,
    note: 'Speed of a temperature (entropy) wave in He II. Absent above Tλ.',
  },
  {
    key: 'secondSoundSlope_m_s_K',
    label: 'Slope of second sound',
    symbol: 'du₂/dT',
    unit: 'm/s/K',
    source: `${DB1998}, derivative of the spline`,
    note: 'Sets how finely a delay pins the temperature: near zero at the u₂ extremes (1.12 K, 1.65 K).',
  },
  {
    key: 'secondSoundSd_m_s',
    label: 'Uncertainty of second sound',
    symbol: 'σ(u₂)',
    unit: 'm/s',
    source: `${DB1998}, Table 4.1 stated uncertainties (Peshkov 0.75 %, Wang et al. 0.07 %)`,
    note: 'One standard deviation of the tabulated curve, larger near Tλ and in the model region.',
  },
  {
    key: 'twoFluidSecondSound_m_s',
    label: 'Second sound, two-fluid check',
    symbol: 'u₂(2-fluid)',
    unit: 'm/s',
    source: 'Landau two-fluid relation u₂² = (ρs/ρn)·T·s²/c_p with the curves below',
    note: 'A cross-check, not a measurement: within about 1 % of u₂ from 1.55 K to Tλ.',
  },
  {
    key: 'firstSound_m_s',
    label: 'First sound',
    symbol: 'u₁',
    unit: 'm/s',
    source: `${DB1998}, first-sound spline`,
    note: 'Ordinary pressure wave, about ten times faster than second sound; exists in He I too.',
  },
  {
    key: 'density_kg_m3',
    label: 'Density',
    symbol: 'ρ',
    unit: 'kg/m³',
    source: `${DB1998}, density equations`,
    note: 'Liquid density along SVP; maximum near Tλ.',
  },
  {
    key: 'superfluidFraction',
    label: 'Superfluid fraction',
    symbol: 'ρs/ρ',
    unit: '1',
    source: `${DB1998}, superfluid-density spline; Landau sums below 1 K`,
    note: 'Zero at and above Tλ.',
  },
  {
    key: 'normalFraction',
    label: 'Normal fraction',
    symbol: 'ρn/ρ',
    unit: '1',
    source: `${DB1998}; below 1 K ${LANDAU}`,
    note: 'One at and above Tλ.',
  },
  {
    key: 'entropy_J_kgK',
    label: 'Entropy',
    symbol: 's',
    unit: 'J/(kg·K)',
    source: `Integrated from the heat capacity of ${DB1998}`,
    note: 'Per unit mass, s = ∫ c/T dT from 0 K.',
  },
  {
    key: 'specificHeat_J_kgK',
    label: 'Specific heat',
    symbol: 'c_p',
    unit: 'J/(kg·K)',
    source: `${DB1998}, heat-capacity splines (SVP)`,
    note: 'Diverges logarithmically at Tλ.',
  },
  {
    key: 'nonlinearity_per_K',
    label: 'Nonlinearity',
    symbol: 'α₂',
    unit: '1/K',
    source: 'Khalatnikov: α₂ = ∂ln(u₂³c_p/T)/∂T from the curves above; sign change published at 1.88 K (Kolmakov 2003)',
    note: 'A wave element of amplitude δT travels at u₂(1 + α₂δT); large |α₂δT| steepens pulses into shocks.',
  },
  {
    key: 'vapourPressure_Pa',
    label: 'Vapour pressure',
    symbol: 'p_sat',
    unit: 'Pa',
    source: `${ITS90} from 1.25 K; below, the ${DB1998} spline (not ITS-90)`,
    note: 'Saturated vapour pressure over the bath surface.',
  },
];
