/**
 * Published cubic B-spline representations of helium-4 properties along the saturated vapour
 * pressure (T90 in kelvin), copied from the project's reference set (copied by hand from
 * R. J. Donnelly and C. F. Barenghi, 'The Observed Properties of Liquid Helium at the Saturated Vapor Pressure', J. Phys. Chem. Ref. Data 27, 1217 (1998), doi:10.1063/1.556028).
 *
 * Values copied unchanged from tests/reference/he4-svp.json (same source); edit only together with
 * tests/unit/reference-checks.test.ts, which holds every curve against measured points.
 * Each spline: clamped knot vector, coefficients (count = knots − 4), valid range, value unit.
 */

export interface SplineData {
  readonly knots: readonly number[];
  readonly coefficients: readonly number[];
  readonly range: readonly [number, number];
  readonly unit: string;
  readonly note: string;
}

/** second sound speed: The last five non-zero coefficients (knots 2.1766-2.1768 K) are given here as 6.743104e-1 ... 1.059874e-1. One printed copy gives them with exponent e-2, which makes u2/t^(1/3) (t = 1 - T/T_lambda) collapse within 0.1 mK of T_lambda; with e-1 that ratio stays smooth (about 31 -> 25 m/s from t = 8e-4 to 2e-6), as the critical scaling of u2 requires. Treat the region within 0.2 mK of T_lambda as uncertain either way. */
export const SECOND_SOUND_SPLINE: SplineData = {
  knots: [0.5517426, 0.5517426, 0.5517426, 0.5517426, 0.64197, 0.80623, 0.9297, 1.06964, 1.2855, 1.7202, 1.94043, 2.06885, 2.12622, 2.153079, 2.164207, 2.169182, 2.170551, 2.174832, 2.175738, 2.176319, 2.1766, 2.176735, 2.17678, 2.176787, 2.176797, 2.1768, 2.1768, 2.1768, 2.1768, 2.1768],
  coefficients: [105.0, 92.87425, 49.73642, 27.12778, 19.31258, 17.95336, 19.23863, 21.15625, 19.21708, 15.75245, 11.92157, 8.953338, 6.771458, 5.50638, 4.456879, 3.840343, 2.542421, 1.957438, 1.427086, 1.001273, 0.6743104, 0.4565972, 0.3519492, 0.2088277, 0.1059874, 0.0],
  range: [0.5517426, 2.1768],
  unit: 'm/s',
  note: "The last five non-zero coefficients (knots 2.1766-2.1768 K) are given here as 6.743104e-1 ... 1.059874e-1. One printed copy gives them with exponent e-2, which makes u2/t^(1/3) (t = 1 - T/T_lambda) collapse within 0.1 mK of T_lambda; with e-1 that ratio stays smooth (about 31 -> 25 m/s from t = 8e-4 to 2e-6), as the critical scaling of u2 requires. Treat the region within 0.2 mK of T_lambda as uncertain either way.",
};

/** first sound speed: Covers He II and He I; minimum (cusp) at T_lambda. */
export const FIRST_SOUND_SPLINE: SplineData = {
  knots: [0.0, 0.0, 0.0, 0.0, 0.5016077, 0.7021246, 1.002777, 1.804065, 2.004234, 2.154563, 2.169604, 2.1758, 2.1763, 2.17675, 2.176797, 2.176797, 2.176797, 2.17681, 2.17683, 2.17695, 2.1773, 2.178, 2.184625, 2.224629, 2.505156, 4.248035, 4.248035, 4.248035, 4.248035],
  coefficients: [238.20999999999998, 238.2041, 238.2203, 238.29579999999999, 237.5414, 236.402, 227.00330000000002, 222.14610000000002, 218.7201, 218.00099999999998, 217.6634, 217.5663, 217.43670000000003, 217.3641, 217.57119999999998, 217.6713, 217.8168, 217.97019999999998, 218.1464, 218.7212, 219.31060000000002, 221.6496, 223.82430000000002, 205.6185, 179.5017],
  range: [0.0, 4.248035],
  unit: 'm/s',
  note: "Covers He II and He I; minimum (cusp) at T_lambda.",
};

/** superfluid density: rho_n = rho - rho_s loses relative accuracy at low T (rho_n/rho < 0.03 below 1.2 K); there the Landau phonon-roton sums are the better route to rho_n. */
export const SUPERFLUID_DENSITY_SPLINE: SplineData = {
  knots: [0.0, 0.0, 0.0, 0.0, 0.443, 0.9012, 1.5419, 1.754, 1.918, 2.111, 2.156991, 2.173218, 2.175647, 2.176358, 2.176568, 2.176692, 2.176766, 2.176791, 2.176798, 2.176799, 2.17679999, 2.1768, 2.1768, 2.1768, 2.1768],
  coefficients: [0.1451275432822459, 0.1451334563362309, 0.1449759191497576, 0.1455008000684433, 0.14075, 0.1095, 0.0815, 0.053, 0.021, 0.008904576, 0.003053214, 0.001494043, 0.0008342826, 0.000510686, 0.00028379, 0.0001287426, 5.202569e-05, 2.15358e-05, 8.564206e-06, 3.567958e-06, 0],
  range: [0.0, 2.1768],
  unit: 'g/cm³',
  note: "rho_n = rho - rho_s loses relative accuracy at low T (rho_n/rho < 0.03 below 1.2 K); there the Landau phonon-roton sums are the better route to rho_n.",
};

/** specific heat svp below lambda: Divide 10^value by the molar mass (kg/mol) for J/(kg K). Logarithmic divergence at T_lambda. */
export const HEAT_CAPACITY_HE2_SPLINE: SplineData = {
  knots: [0.01, 0.01, 0.01, 0.01, 0.024973899074, 0.060764110599, 0.063652865377, 0.154157179076, 0.249299135447, 0.634497077644, 0.904465380669, 1.17474564385, 1.54255910867, 2.0649908872, 2.16070930746, 2.17157525125, 2.175906292, 2.176553159, 2.176728499, 2.176787881, 2.176796632, 2.176799582, 2.17679996468, 2.17679996468, 2.17679996468, 2.17679996468],
  coefficients: [-7.080029, -6.461204, -5.407887, -4.971098, -4.092648, -3.43029, -2.300493, -1.865551, -0.6120157, 0.1800753, 0.8200057, 1.231093, 1.494099, 1.633977, 1.694854, 1.760367, 1.813528, 1.849639, 1.900049, 1.93577, 1.974983, 2.017442],
  range: [0.01, 2.17679996468],
  unit: 'log10(J/(mol·K))',
  note: "Divide 10^value by the molar mass (kg/mol) for J/(kg K). Logarithmic divergence at T_lambda.",
};

/** specific heat svp above lambda:  */
export const HEAT_CAPACITY_HE1_SPLINE: SplineData = {
  knots: [2.176800132, 2.176800132, 2.176800132, 2.176800132, 2.176801012, 2.176803495, 2.176818018, 2.176924206, 2.177507556, 2.180863971, 2.20374020794, 2.30368058865, 2.60849038128, 3.60335763894, 4.41358469422, 4.81404577042, 5.06143581698, 5.06143581698, 5.06143581698, 5.06143581698],
  coefficients: [1.900539, 1.862865, 1.822431, 1.759056, 1.679157, 1.584631, 1.464344, 1.274043, 1.09505, 0.9546039, 0.9503531, 1.100724, 1.260996, 1.42136, 1.609738, 1.732672],
  range: [2.176800132, 5.06143581698],
  unit: 'log10(J/(mol·K))',
  note: "",
};

/** vapour pressure spline: Agrees with the ITS-90 equations to better than 0.1 % from 1.3 to 4.2 K and extends below ITS-90's 1.25 K lower limit for helium-4. */
export const VAPOUR_PRESSURE_SPLINE: SplineData = {
  knots: [0.5, 0.5, 0.5, 0.5, 0.52, 0.53, 0.56, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.92, 1, 1.1, 1.25, 1.5, 1.7, 1.85, 2, 2.2, 2.5, 2.7, 3, 3.3, 3.7, 4.05, 4.5, 5.1, 5.1, 5.1, 5.1],
  coefficients: [0.00183797, 0.0025, 0.00376, 0.00624, 0.01236, 0.03306, 0.09339, 0.25856, 0.6269, 1.37025, 2.93305, 6.37318, 15.0042, 38.057, 116.05, 362.7, 990.9, 1886, 3194, 5569.5, 9279.1, 15370, 23480, 37355, 57050, 87170, 132825, 179650, 211567],
  range: [0.5, 5.1],
  unit: 'Pa',
  note: "Agrees with the ITS-90 equations to better than 0.1 % from 1.3 to 4.2 K and extends below ITS-90's 1.25 K lower limit for helium-4.",
};

/** mutual friction B: Dimensionless Hall-Vinen coefficient B. Near T_lambda (T > 2.167 K) the reference uses B = 0.47 t^-0.33. Variable log10(t), t = 1 − T/Tλ; value log10(B). */
export const MUTUAL_FRICTION_B_SPLINE: SplineData = {
  knots: [-5.0, -5.0, -5.0, -5.0, -2.5, -2.0, -0.8, -0.387958059947, -0.387958059947, -0.387958059947, -0.387958059947],
  coefficients: [1.31928144433, 1.12452707801, 0.639314792565, 0.313383532495, -0.162687403543, 0.092047691284, 0.188452616588],
  range: [-5.0, -0.387958059947],
  unit: "log10(B)",
  note: "Dimensionless Hall-Vinen coefficient B. Near T_lambda (T > 2.167 K) the reference uses B = 0.47 t^-0.33.",
};

/** mutual friction B prime: Subtract 15 after taking 10^value. Near T_lambda (T > 2.134 K) the reference uses B' = 1.01 - 0.34 t^-0.33. Variable log10(t), t = 1 − T/Tλ; value log10(B' + 15). */
export const MUTUAL_FRICTION_B_PRIME_SPLINE: SplineData = {
  knots: [-5.0, -5.0, -5.0, -5.0, -3.55, -3.2, -2.5, -1.0, -0.384067377871, -0.384067377871, -0.384067377871, -0.384067377871],
  coefficients: [-0.0847218032526, 0.931621715174, 0.973263359433, 1.10543591819, 1.15904485127, 1.18311634566, 1.17480594214, 1.19458392766],
  range: [-5.0, -0.384067377871],
  unit: "log10(B' + 15)",
  note: "Subtract 15 after taking 10^value. Near T_lambda (T > 2.134 K) the reference uses B' = 1.01 - 0.34 t^-0.33.",
};
