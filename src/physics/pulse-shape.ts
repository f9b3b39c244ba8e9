import { InvalidInputError, requireInRange } from './errors';

/*
 * The time course of the heater flux, relative to its peak: f(t), 0 ≤ f ≤ 1, starting at t = 0.
 *  - rectangle: a trapezoid whose edges take the heater's rise time; its area is the width.
 *  - half-sine: sin(πt/τ) on [0, τ].
 *  - custom: straight lines through the user's points (time from the onset, relative amplitude),
 *    scaled so the largest point is 1.
 * The effective rise time — peak over steepest slope — is what sets the shock distance
 * (for a half-sine it is τ/π, the sinusoid's 1/ω).
 */

export type PulseShape =
  | { kind: 'rectangle' }
  | { kind: 'half-sine' }
  | { kind: 'custom'; points: readonly (readonly [number, number])[] };

/** Pulse widths the planner accepts, s: 10 ns to 10 s. */
export const PULSE_WIDTH_RANGE_S = [1e-8, 10] as const;
/** Most points in a custom pulse. */
export const CUSTOM_PULSE_MAX_POINTS = 10_000;

export interface PulseProfile {
  /** Time from onset to the end of the pulse, s. */
  duration_s: number;
  /** ∫ f dt, s (energy per pulse = peak power × this). */
  area_s: number;
  /** Peak over steepest slope, s. */
  effectiveRise_s: number;
  /** Relative flux at time t after the onset (0 outside the pulse). */
  value(t: number): number;
  /** ∫₀ᵗ f dt′, s: 0 before the onset, `area_s` after the end. */
  integral(t: number): number;
  /**
   * The pulse as straight lines through these corners (times s, strictly increasing; relative
   * amplitude), zero before the first and after the last, when it is exactly that (rectangle,
   * custom); null for a curved pulse (half-sine).
   */
  corners: { t: Float64Array; f: Float64Array } | null;
}

/**
 * The pulse averaged over a window of length h centred on t: (F(t + h/2) − F(t − h/2))/h. Sampled
 * this way a pulse keeps its area on any grid, even one much coarser than the pulse itself.
 */
export function averageOverStep(profile: PulseProfile, t: number, h: number): number {
  return (profile.integral(t + h / 2) - profile.integral(t - h / 2)) / h;
}

function trapezoid(width: number, rise: number): PulseProfile {
  const t = rise < width ? [0, rise, width, width + rise] : [0, rise, width + rise];
  const f = rise < width ? [0, 1, 1, 0] : [0, 1, 0];
  return {
    corners: { t: Float64Array.from(t), f: Float64Array.from(f) },
    duration_s: width + rise,
    area_s: width,
    effectiveRise_s: rise,
    value(t) {
      if (t <= 0 || t >= width + rise) return 0;
      if (t < rise) return t / rise;
      if (t <= width) return 1;
      return 1 - (t - width) / rise;
    },
    integral(t) {
      if (t <= 0) return 0;
      if (t < rise) return (t * t) / (2 * rise);
      if (t <= width) return rise / 2 + (t - rise);
      if (t < width + rise) {
        const u = t - width;
        return width - rise / 2 + u - (u * u) / (2 * rise);
      }
      return width;
    },
  };
}

function halfSine(width: number): PulseProfile {
  return {
    corners: null,
    duration_s: width,
    area_s: (2 * width) / Math.PI,
    effectiveRise_s: width / Math.PI,
    value(t) {
      return t <= 0 || t >= width ? 0 : Math.sin((Math.PI * t) / width);
    },
    integral(t) {
      if (t <= 0) return 0;
      if (t >= width) return (2 * width) / Math.PI;
      return (width / Math.PI) * (1 - Math.cos((Math.PI * t) / width));
    },
  };
}

function piecewiseLinear(points: readonly (readonly [number, number])[]): PulseProfile {
  if (points.length < 2 || points.length > CUSTOM_PULSE_MAX_POINTS) {
    throw new InvalidInputError('pulse points', `give 2 to ${CUSTOM_PULSE_MAX_POINTS} points (time, relative amplitude)`);
  }
  let peak = 0;
  let previous = Number.NEGATIVE_INFINITY;
  points.forEach(([t, a], i) => {
    if (!Number.isFinite(t) || !Number.isFinite(a)) throw new InvalidInputError('pulse points', `point ${i + 1} is not a pair of finite numbers`);
    if (t < 0 || t <= previous) throw new InvalidInputError('pulse points', `times must start at 0 or later and increase (point ${i + 1})`);
    if (a < 0) throw new InvalidInputError('pulse points', `amplitudes must be 0 or more (point ${i + 1})`);
    previous = t;
    peak = Math.max(peak, a);
  });
  if (peak === 0) throw new InvalidInputError('pulse points', 'at least one amplitude must be above 0');
  const ts = Float64Array.from(points, (p) => p[0]);
  const fs = Float64Array.from(points, (p) => p[1] / peak);
  let area = 0;
  let steepest = 0;
  for (let i = 1; i < ts.length; i++) {
    const dt = (ts[i] as number) - (ts[i - 1] as number);
    area += (dt * ((fs[i] as number) + (fs[i - 1] as number))) / 2;
    steepest = Math.max(steepest, Math.abs((fs[i] as number) - (fs[i - 1] as number)) / dt);
  }
  const last = ts.length - 1;
  // Cumulative area at each point, for the integral.
  const cumulative = new Float64Array(ts.length);
  for (let i = 1; i < ts.length; i++) {
    cumulative[i] = (cumulative[i - 1] as number) + (((ts[i] as number) - (ts[i - 1] as number)) * ((fs[i] as number) + (fs[i - 1] as number))) / 2;
  }
  const segment = (t: number): number => {
    let lo = 0;
    let hi = last;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (t >= (ts[mid] as number)) lo = mid;
      else hi = mid;
    }
    return lo;
  };
  const valueIn = (i: number, t: number): number => {
    const t0 = ts[i] as number;
    const t1 = ts[i + 1] as number;
    const f0 = fs[i] as number;
    return t1 > t0 ? f0 + (((fs[i + 1] as number) - f0) * (t - t0)) / (t1 - t0) : f0;
  };
  return {
    corners: { t: ts, f: fs },
    duration_s: ts[last] as number,
    area_s: area,
    effectiveRise_s: steepest > 0 ? 1 / steepest : (ts[last] as number),
    value(t) {
      if (t < (ts[0] as number) || t > (ts[last] as number)) return 0;
      return valueIn(Math.min(segment(t), last - 1), t);
    },
    integral(t) {
      if (t <= (ts[0] as number)) return 0;
      if (t >= (ts[last] as number)) return area;
      const i = Math.min(segment(t), last - 1);
      return (cumulative[i] as number) + ((t - (ts[i] as number)) * ((fs[i] as number) + valueIn(i, t))) / 2;
    },
  };
}

/**
 * The relative time course of one heater pulse.
 * @param shape rectangle, half-sine or custom points (time in s from onset, relative amplitude).
 * @param width_s pulse width, s (10 ns–10 s; for custom pulses the last point's time is used).
 * @param riseTime_s edge time of a rectangle, s (above 0, at most the width).
 * Throws OutOfRangeError / NonFiniteInputError / InvalidInputError naming the field.
 */
export function pulseProfile(shape: PulseShape, width_s: number, riseTime_s: number): PulseProfile {
  if (shape.kind === 'custom') {
    const profile = piecewiseLinear(shape.points);
    requireInRange('pulse width', profile.duration_s, PULSE_WIDTH_RANGE_S[0], PULSE_WIDTH_RANGE_S[1], 's');
    return profile;
  }
  requireInRange('pulse width', width_s, PULSE_WIDTH_RANGE_S[0], PULSE_WIDTH_RANGE_S[1], 's');
  if (shape.kind === 'half-sine') return halfSine(width_s);
  requireInRange('rise time', riseTime_s, width_s * 1e-6, width_s, 's', 'from a millionth of the pulse width up to the width');
  return trapezoid(width_s, riseTime_s);
}
