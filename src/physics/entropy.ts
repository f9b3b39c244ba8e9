import { MODEL_MIN_K, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { HEAT_CAPACITY_MIN_K, heatCapacityUnchecked } from './heat-capacity';
import { HEAT_CAPACITY_HE1_SPLINE, HEAT_CAPACITY_HE2_SPLINE } from './reference-splines';

/*
 * Entropy per unit mass along SVP, s(T) = ∫₀ᵀ c(T′)/T′ dT′, from the published heat capacity
 * (Donnelly & Barenghi 1998). Below the curve's first point (0.01 K) c ∝ T³ (phonons), which
 * contributes c(0.01 K)/3. The integral is tabulated once at the spline knots with 8-point
 * Gauss–Legendre per knot interval (exact for the spline's pieces to far below its uncertainty);
 * a call adds the partial interval up to T.
 */

// 8-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun 1964, Table 25.4).
const GL_X = [
  -0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
  0.1834346424956498, 0.5255324099163290, 0.7966664774136267, 0.9602898564975363,
];
const GL_W = [
  0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620,
  0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763,
];

function integrateCOverT(a: number, b: number): number {
  const half = (b - a) / 2;
  const mid = (a + b) / 2;
  let sum = 0;
  for (let i = 0; i < 8; i++) {
    const T = mid + half * (GL_X[i] as number);
    sum += ((GL_W[i] as number) * heatCapacityUnchecked(T).value) / T;
  }
  return sum * half;
}

const TABLE_MAX_K = PROPERTIES_MAX_K;

function buildNodes(): Float64Array {
  const set = new Set<number>([HEAT_CAPACITY_MIN_K, T_LAMBDA_K, TABLE_MAX_K]);
  for (const k of [...HEAT_CAPACITY_HE2_SPLINE.knots, ...HEAT_CAPACITY_HE1_SPLINE.knots]) {
    if (k > HEAT_CAPACITY_MIN_K && k < TABLE_MAX_K) set.add(k);
  }
  // Extra nodes keep each Gauss–Legendre interval short where the knots are sparse.
  for (let T = 0.05; T < TABLE_MAX_K; T += 0.05) set.add(Number(T.toFixed(2)));
  return Float64Array.from([...set].sort((a, b) => a - b));
}

const nodes = buildNodes();
const cumulative = (() => {
  const s = new Float64Array(nodes.length);
  s[0] = heatCapacityUnchecked(HEAT_CAPACITY_MIN_K).value / 3;
  for (let i = 1; i < nodes.length; i++) {
    s[i] = (s[i - 1] as number) + integrateCOverT(nodes[i - 1] as number, nodes[i] as number);
  }
  return s;
})();

/** Entropy per unit mass in J/(kg·K), no range check (kernel-internal; T ≥ 0.01 K). */
export function entropyUnchecked(T: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (T >= (nodes[mid] as number)) lo = mid;
    else hi = mid;
  }
  const start = nodes[lo] as number;
  return (cumulative[lo] as number) + (T > start ? integrateCOverT(start, T) : 0);
}

/**
 * Entropy per unit mass of liquid helium-4 along SVP, J/(kg·K).
 * @param T temperature T90, K, 0.3–4.24.
 * Integrated from the Donnelly & Barenghi (1998) heat capacity. Throws on out-of-range input.
 */
export function entropy(T: number): number {
  requireInRange('temperature', T, MODEL_MIN_K, PROPERTIES_MAX_K, 'K');
  return entropyUnchecked(T);
}
