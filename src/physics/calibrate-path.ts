import { InvalidInputError } from './errors';
import { secondSoundRelativeSd } from './temperature-resolution';
import { SECOND_SOUND_EXTREMA } from './second-sound-extrema';

/*
 * Cold path-length calibration without a thermometer (PHYSICS notes §6): sweeping the bath
 * through 1.65 K, the shortest delay belongs to the maximum of u2 (20.37 m/s on this kernel's
 * curve; Wang, Wagner & Donnelly 1987 measured 20.3648 m/s ± 0.07 % and proposed it as a
 * reference point). A parabola through the delays around their minimum, against the sweep
 * coordinate (time or reading number), gives the shortest delay and its sd; then
 * L = u2,max · (t_min − t0).
 */

export interface SweepPoint {
  /** Sweep coordinate: time of the reading, or its number. */
  x: number;
  delay_s: number;
}

export interface PathCalibration {
  pathLength_m: number;
  pathLengthSd_m: number;
  shortestDelay_s: number;
  shortestDelaySd_s: number;
  /** Sweep coordinate of the shortest delay. */
  atX: number;
  /** The speed assumed at the minimum, m/s. */
  maximumSpeed_m_s: number;
  pointsUsed: number;
}

/** Points each side of the lowest delay that the parabola uses (at least). */
const HALF_WINDOW = 3;

/** Solves a 3×3 linear system by Cramer's rule (small, well-scaled after centring). */
function solve3(m: number[][], v: number[]): number[] {
  const det = (a: number[][]) =>
    (a[0]?.[0] ?? 0) * ((a[1]?.[1] ?? 0) * (a[2]?.[2] ?? 0) - (a[1]?.[2] ?? 0) * (a[2]?.[1] ?? 0)) -
    (a[0]?.[1] ?? 0) * ((a[1]?.[0] ?? 0) * (a[2]?.[2] ?? 0) - (a[1]?.[2] ?? 0) * (a[2]?.[0] ?? 0)) +
    (a[0]?.[2] ?? 0) * ((a[1]?.[0] ?? 0) * (a[2]?.[1] ?? 0) - (a[1]?.[1] ?? 0) * (a[2]?.[0] ?? 0));
  const d = det(m);
  if (d === 0) throw new InvalidInputError('sweep', 'the points near the minimum do not fix a parabola');
  return [0, 1, 2].map((k) => det(m.map((row, i) => row.map((x, j) => (j === k ? (v[i] as number) : x)))) / d);
}

/**
 * Shortest delay of a sweep through the u2 maximum and the path length it implies.
 * @param points at least 5 readings, in any order; the minimum must not sit at either end.
 * @param offset_s t0 to subtract (lags, electronics), s.
 */
export function calibratePathFromSweep(points: readonly SweepPoint[], offset_s = 0, offsetSd_s = 0): PathCalibration {
  if (points.length < 5) throw new InvalidInputError('sweep', `needs at least 5 readings through the maximum, got ${points.length}`);
  const sorted = [...points].sort((a, b) => a.x - b.x);
  let iMin = 0;
  sorted.forEach((p, i) => {
    if (p.delay_s < (sorted[iMin] as SweepPoint).delay_s) iMin = i;
  });
  const half = Math.max(HALF_WINDOW, Math.floor(sorted.length / 8));
  if (iMin < 2 || iMin > sorted.length - 3) {
    throw new InvalidInputError('sweep', 'the shortest delay is at an end of the sweep: sweep further through 1.65 K');
  }
  const used = sorted.slice(Math.max(0, iMin - half), Math.min(sorted.length, iMin + half + 1));
  const xc = (sorted[iMin] as SweepPoint).x;
  const yc = (sorted[iMin] as SweepPoint).delay_s;
  // Fit y − yc = a + b·u + c·u², u = x − xc.
  const S = [0, 0, 0, 0, 0];
  const Sy = [0, 0, 0];
  for (const p of used) {
    const u = p.x - xc;
    const y = p.delay_s - yc;
    for (let k = 0; k < 5; k++) S[k] = (S[k] as number) + u ** k;
    for (let k = 0; k < 3; k++) Sy[k] = (Sy[k] as number) + y * u ** k;
  }
  const N = [
    [S[0] as number, S[1] as number, S[2] as number],
    [S[1] as number, S[2] as number, S[3] as number],
    [S[2] as number, S[3] as number, S[4] as number],
  ];
  const [a, b, c] = solve3(N, Sy) as [number, number, number];
  if (!(c > 0)) throw new InvalidInputError('sweep', 'the delays near the minimum do not curve upwards: no clear shortest delay');
  const uMin = -b / (2 * c);
  const yMin = a - (b * b) / (4 * c);
  const residual = used.reduce((acc, p) => {
    const u = p.x - xc;
    return acc + (p.delay_s - yc - (a + b * u + c * u * u)) ** 2;
  }, 0);
  const dof = Math.max(1, used.length - 3);
  const sigma = Math.sqrt(residual / dof);
  // sd of the vertex value: by perturbing each point's delay, the linear response of yMin.
  let varY = 0;
  used.forEach((_, i) => {
    const bumped = used.map((q, j) => ({ u: q.x - xc, y: q.delay_s - yc + (i === j ? sigma : 0) }));
    const By = [0, 1, 2].map((k) => bumped.reduce((acc, q) => acc + q.y * q.u ** k, 0));
    const [a2, b2, c2] = solve3(N, By) as [number, number, number];
    const y2 = a2 - (b2 * b2) / (4 * c2);
    varY += (y2 - yMin) ** 2;
  });
  const shortest = yc + yMin;
  const shortestSd = Math.sqrt(varY);
  const uMax = SECOND_SOUND_EXTREMA.maximum.speed_m_s;
  const relU = secondSoundRelativeSd(SECOND_SOUND_EXTREMA.maximum.temperature_K);
  const transit = shortest - offset_s;
  if (!(transit > 0)) throw new InvalidInputError('offset', 'is not shorter than the shortest delay');
  const L = uMax * transit;
  const relL = Math.sqrt(relU ** 2 + (shortestSd ** 2 + offsetSd_s ** 2) / transit ** 2);
  return {
    pathLength_m: L,
    pathLengthSd_m: L * relL,
    shortestDelay_s: shortest,
    shortestDelaySd_s: shortestSd,
    atX: xc + uMin,
    maximumSpeed_m_s: uMax,
    pointsUsed: used.length,
  };
}
