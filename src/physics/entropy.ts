import { MODEL_MIN_K, PROPERTIES_MAX_K, T_LAMBDA_K } from './constants';
import { requireInRange } from './errors';
import { HEAT_CAPACITY_MIN_K, heatCapacityUnchecked } from './heat-capacity';
import { HEAT_CAPACITY_HE1_SPLINE, HEAT_CAPACITY_HE2_SPLINE } from './reference-splines';

/*
 * Entropy per unit mass along SVP, s(T) = ∫₀ᵀ c(T′)/T′ dT′, from the published heat capacity
 * (Donnelly & Barenghi 1998). Below the curve's first point (0.01 K) c ∝ T³ (phonons), which
 * contributes c(0.01 K)/3. The integral is tabulated once, at the spline knots and every 0.01 K,
 * with 8-point Gauss–Legendre per interval. Between table nodes s is the cubic Hermite
 * interpolant of the node values and their exact slopes ds/dT = c/T: its error (h⁴/384·s⁗,
 * h ≤ 0.01 K) is below 1e-7 relative, far inside the data's uncertainty, and a call costs a
 * table search and a few multiplications.
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
const TABLE_STEP_K = 0.01;

function buildNodes(): Float64Array {
  const set = new Set<number>([HEAT_CAPACITY_MIN_K, T_LAMBDA_K, TABLE_MAX_K]);
  for (const k of [...HEAT_CAPACITY_HE2_SPLINE.knots, ...HEAT_CAPACITY_HE1_SPLINE.knots]) {
    if (k > HEAT_CAPACITY_MIN_K && k < TABLE_MAX_K) set.add(k);
  }
  // Extra nodes keep each Gauss–Legendre interval short where the knots are sparse.
  for (let i = 1; i * TABLE_STEP_K < TABLE_MAX_K; i++) set.add(Number((i * TABLE_STEP_K).toFixed(2)));
  return Float64Array.from([...set].sort((a, b) => a - b));
}

const nodes = buildNodes();
/**
 * Cumulative entropy at each node and ds/dT = c/T there (on the node's own side of Tλ), filled on
 * demand up to the highest node asked for, in the same order as a whole table: a program that
 * asks for one temperature (the command line's `props`) integrates only the nodes below it.
 */
const cumulative = new Float64Array(nodes.length);
let cumulativeFilled = 0;
const slopes = new Float64Array(nodes.length).fill(Number.NaN);
let leftSlopeAtLambda = Number.NaN;

function cumulativeAt(i: number): number {
  if (cumulativeFilled === 0) {
    cumulative[0] = heatCapacityUnchecked(HEAT_CAPACITY_MIN_K).value / 3;
    cumulativeFilled = 1;
  }
  for (; cumulativeFilled <= i; cumulativeFilled++) {
    const k = cumulativeFilled;
    cumulative[k] = (cumulative[k - 1] as number) + integrateCOverT(nodes[k - 1] as number, nodes[k] as number);
  }
  return cumulative[i] as number;
}

function slopeAt(i: number): number {
  let m = slopes[i] as number;
  if (Number.isNaN(m)) {
    const T = nodes[i] as number;
    m = heatCapacityUnchecked(T).value / T;
    slopes[i] = m;
  }
  return m;
}

function slopeJustBelowLambda(): number {
  if (Number.isNaN(leftSlopeAtLambda)) leftSlopeAtLambda = heatCapacityUnchecked(T_LAMBDA_K * (1 - 1e-12)).value / T_LAMBDA_K;
  return leftSlopeAtLambda;
}

/** Entropy per unit mass in J/(kg·K), no range check (kernel-internal; 0.01 K ≤ T ≤ 4.24 K). */
export function entropyUnchecked(T: number): number {
  let lo = 0;
  let hi = nodes.length - 1;
  if (T >= (nodes[hi] as number)) return cumulativeAt(hi);
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (T >= (nodes[mid] as number)) lo = mid;
    else hi = mid;
  }
  const t0 = nodes[lo] as number;
  const h = (nodes[lo + 1] as number) - t0;
  const u = (T - t0) / h;
  const s1 = cumulativeAt(lo + 1);
  const s0 = cumulative[lo] as number;
  // Slopes at the interval's own ends: just inside Tλ the heat capacity jumps.
  const m0 = slopeAt(lo) * h;
  const m1 = (t0 < T_LAMBDA_K && (nodes[lo + 1] as number) === T_LAMBDA_K ? slopeJustBelowLambda() : slopeAt(lo + 1)) * h;
  const u2 = u * u;
  const u3 = u2 * u;
  return (2 * u3 - 3 * u2 + 1) * s0 + (u3 - 2 * u2 + u) * m0 + (-2 * u3 + 3 * u2) * s1 + (u3 - u2) * m1;
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
