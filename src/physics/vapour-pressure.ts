import { CubicBSpline } from './bspline';
import { P_LAMBDA_PA } from './constants';
import { ConvergenceError, requireInRange } from './errors';
import { VAPOUR_PRESSURE_SPLINE } from './reference-splines';

/*
 * Helium-4 saturated vapour pressure, both ways.
 *  - ITS-90 (H. Preston-Thomas, Metrologia 27, 3 (1990); coefficients as in Donnelly & Barenghi
 *    1998, Table 17.1): T90 = A0 + Σ_{i=1..9} A_i ((ln(p/Pa) − B)/C)^i, two ranges meeting at
 *    Tλ = 2.1768 K, 5041.8 Pa; defined 1.25–5.0 K. This is the scale itself.
 *  - Below 1.25 K, the published vapour-pressure spline of Donnelly & Barenghi (1998), 0.5–5.1 K,
 *    which agrees with ITS-90 to 0.1 % from 1.3 to 4.2 K. It is NOT part of ITS-90 and is labelled so.
 * The inverse of each is solved by Newton's method on ln p with a bracket fallback.
 */

/** Which realisation a vapour-pressure conversion used. */
export type VapourPressureScale = 'ITS-90' | 'reference spline (not ITS-90)';

interface Its90Range {
  readonly T_K: readonly [number, number];
  readonly A: readonly number[];
  readonly B: number;
  readonly C: number;
}

const ITS90_LOW: Its90Range = {
  T_K: [1.25, 2.1768],
  A: [1.392408, 0.527153, 0.166756, 0.050988, 0.026514, 0.001975, -0.017976, 0.005409, 0.013259],
  B: 5.6,
  C: 2.9,
};
const ITS90_HIGH: Its90Range = {
  T_K: [2.1768, 5.0],
  A: [3.146631, 1.357655, 0.413923, 0.091159, 0.016349, 0.001826, -0.004325, -0.004973, 0],
  B: 10.3,
  C: 1.9,
};

/** ITS-90 helium-4 vapour-pressure equations' temperature span, K. */
export const ITS90_RANGE_K = [1.25, 5.0] as const;
const spline = new CubicBSpline(VAPOUR_PRESSURE_SPLINE);
/** Temperature span of the reference vapour-pressure spline used below ITS-90, K. */
export const VAPOUR_SPLINE_RANGE_K = [VAPOUR_PRESSURE_SPLINE.range[0], ITS90_RANGE_K[0]] as const;

function its90T(p: number, r: Its90Range): number {
  const x = (Math.log(p) - r.B) / r.C;
  let sum = r.A[0] as number;
  let power = x;
  for (let i = 1; i < r.A.length; i++) {
    sum += (r.A[i] as number) * power;
    power *= x;
  }
  return sum;
}

function its90Temperature(p: number): number {
  return its90T(p, p < P_LAMBDA_PA ? ITS90_LOW : ITS90_HIGH);
}

const SOLVER_TOLERANCE = 1e-12;
const SOLVER_MAX_ITERATIONS = 200;

/**
 * Solves f(x) = target on [lo, hi] by bisection, f increasing. Each ITS-90 range is inverted on
 * its own (the two meet at 5041.8 Pa only to the printed digits), so the bracket always holds a
 * root when T lies in the range's span. Throws ConvergenceError if the bracket holds none.
 */
function bisectIncreasing(f: (x: number) => number, target: number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  if (f(a) > target + SOLVER_TOLERANCE || f(b) < target - SOLVER_TOLERANCE) {
    throw new ConvergenceError(`no root of the vapour-pressure curve for T = ${target} K in its bracket`);
  }
  for (let i = 0; i < SOLVER_MAX_ITERATIONS && b - a > SOLVER_TOLERANCE * Math.max(1, Math.abs(a)); i++) {
    const m = (a + b) / 2;
    if (f(m) < target) a = m;
    else b = m;
  }
  return (a + b) / 2;
}

const LN_P_ITS_MIN = Math.log(1e2); // below p(1.25 K) ≈ 115 Pa
const LN_P_ITS_MAX = Math.log(2.5e5); // above p(5.0 K) ≈ 196 kPa
const LN_P_LAMBDA = Math.log(P_LAMBDA_PA);
const LN_P_OVERLAP = 1e-3; // lets each range's root sit a hair past the nominal joint

/** ITS-90 temperature and its derivative dT/d(ln p) for one range. */
function its90TAndSlope(lnP: number, r: Its90Range): { T: number; dT: number } {
  const x = (lnP - r.B) / r.C;
  let T = r.A[0] as number;
  let dT = 0;
  let power = 1;
  for (let i = 1; i < r.A.length; i++) {
    const a = r.A[i] as number;
    dT += i * a * power;
    power *= x;
    T += a * power;
  }
  return { T, dT: dT / r.C };
}

const NEWTON_STEP_TOLERANCE = 1e-13;
const NEWTON_MAX_ITERATIONS = 20;

/**
 * ITS-90 vapour pressure at T (Pa), T in 1.25–5.0 K: Newton's method on ln p, started from the
 * reference spline (within 0.1 % of the scale), with bisection as the fallback if it stalls.
 */
function its90Pressure(T: number): number {
  const low = T < ITS90_LOW.T_K[1];
  const r = low ? ITS90_LOW : ITS90_HIGH;
  let lnP = Math.log(spline.value(T));
  for (let i = 0; i < NEWTON_MAX_ITERATIONS; i++) {
    const { T: Tn, dT } = its90TAndSlope(lnP, r);
    const step = (Tn - T) / dT;
    lnP -= step;
    if (Math.abs(step) < NEWTON_STEP_TOLERANCE) return Math.exp(lnP);
  }
  const lo = low ? LN_P_ITS_MIN : LN_P_LAMBDA - LN_P_OVERLAP;
  const hi = low ? LN_P_LAMBDA + LN_P_OVERLAP : LN_P_ITS_MAX;
  return Math.exp(bisectIncreasing((l) => its90T(Math.exp(l), r), T, lo, hi));
}

/**
 * The reference spline meets ITS-90 at 1.25 K 0.058 % high (87 µK in T), so p(T) fell at the join
 * and a pressure just above p₉₀(1.25 K) had two temperatures. Over the last SPLINE_EASE_K below the
 * join the spline is eased onto the scale in ln p (a linear weight, 0 at 1.20 K, 1 at 1.25 K): p(T)
 * is continuous and increasing, T → p → T returns T, and nothing below 1.20 K changes. The shift
 * (≤ 0.058 % in p) is inside the spline's own stated agreement with the scale (0.1 %).
 */
const SPLINE_EASE_K = 0.05;
const JOIN_LN_RATIO = Math.log(its90Pressure(ITS90_RANGE_K[0]) / spline.value(ITS90_RANGE_K[0]));

/** The reference spline below ITS-90 (Pa), eased onto the scale at the join (above). */
function splinePressure(T: number): number {
  const weight = (T - (ITS90_RANGE_K[0] - SPLINE_EASE_K)) / SPLINE_EASE_K;
  const p = spline.value(T);
  return weight <= 0 ? p : p * Math.exp(JOIN_LN_RATIO * Math.min(1, weight));
}

/** Pressure range covered by ITS-90 (Pa), computed once from the scale itself. */
export const ITS90_PRESSURE_RANGE_PA = [its90Pressure(ITS90_RANGE_K[0]), its90Pressure(ITS90_RANGE_K[1])] as const;
/** Pressure range covered by the reference spline below ITS-90 (Pa). */
export const SPLINE_PRESSURE_RANGE_PA = [splinePressure(VAPOUR_SPLINE_RANGE_K[0]), ITS90_PRESSURE_RANGE_PA[0]] as const;
/** Full pressure range accepted by {@link temperatureFromVapourPressure}, Pa. */
export const VAPOUR_PRESSURE_RANGE_PA = [SPLINE_PRESSURE_RANGE_PA[0], ITS90_PRESSURE_RANGE_PA[1]] as const;
/** Full temperature range accepted by {@link vapourPressure}, K. */
export const VAPOUR_TEMPERATURE_RANGE_K = [VAPOUR_SPLINE_RANGE_K[0], ITS90_RANGE_K[1]] as const;

export interface VapourPressureResult {
  temperature_K: number;
  pressure_Pa: number;
  scale: VapourPressureScale;
}

function splineTemperature(p: number): number {
  // The eased spline p(T) increases monotonically on 0.5–1.25 K: bisection on ln p against T.
  return bisectIncreasing((T) => Math.log(splinePressure(T)), Math.log(p), VAPOUR_SPLINE_RANGE_K[0], VAPOUR_SPLINE_RANGE_K[1]);
}

/**
 * Temperature T90 (K) of liquid helium-4 whose saturated vapour pressure is p.
 * @param p_Pa pressure, Pa, 0.0018 Pa – 196 kPa (0.5–5.0 K). ITS-90 at and above p(1.25 K) ≈ 115 Pa;
 * below, the Donnelly & Barenghi (1998) spline, labelled not ITS-90.
 * Throws OutOfRangeError / NonFiniteInputError naming the pressure range.
 */
export function temperatureFromVapourPressure(p_Pa: number): VapourPressureResult {
  requireInRange('vapour pressure', p_Pa, VAPOUR_PRESSURE_RANGE_PA[0], VAPOUR_PRESSURE_RANGE_PA[1], 'Pa');
  if (p_Pa >= ITS90_PRESSURE_RANGE_PA[0]) {
    return { temperature_K: its90Temperature(p_Pa), pressure_Pa: p_Pa, scale: 'ITS-90' };
  }
  return { temperature_K: splineTemperature(p_Pa), pressure_Pa: p_Pa, scale: 'reference spline (not ITS-90)' };
}

/** Vapour pressure (Pa) at T with no range check (kernel-internal; 0.5–5.0 K). */
export function vapourPressureUnchecked(T: number): number {
  return T < ITS90_RANGE_K[0] ? splinePressure(T) : its90Pressure(T);
}

/**
 * Saturated vapour pressure of helium-4 at temperature T, Pa.
 * @param T temperature T90, K, 0.5–5.0: ITS-90 from 1.25 K, the reference spline (not ITS-90) below.
 * Throws OutOfRangeError / NonFiniteInputError naming the temperature range.
 */
export function vapourPressure(T: number): VapourPressureResult {
  requireInRange('temperature', T, VAPOUR_TEMPERATURE_RANGE_K[0], VAPOUR_TEMPERATURE_RANGE_K[1], 'K');
  return {
    temperature_K: T,
    pressure_Pa: vapourPressureUnchecked(T),
    scale: T < ITS90_RANGE_K[0] ? 'reference spline (not ITS-90)' : 'ITS-90',
  };
}

