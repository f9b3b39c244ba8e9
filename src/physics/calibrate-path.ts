import { InvalidInputError, requireInRange } from './errors';
import { fitParabola, parabolaVertex } from './parabola';
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

/**
 * Shortest delay of a sweep through the u2 maximum and the path length it implies.
 * @param points at least 5 readings, in any order; the minimum must not sit at either end.
 * @param offset_s t0 to subtract (lags, electronics), s.
 */
export function calibratePathFromSweep(points: readonly SweepPoint[], offset_s = 0, offsetSd_s = 0): PathCalibration {
  if (points.length < 5) throw new InvalidInputError('sweep', `needs at least 5 readings through the maximum, got ${points.length}`);
  points.forEach((p, i) => {
    requireInRange(`sweep position (reading ${i + 1})`, p.x, -1e12, 1e12, '');
    requireInRange(`delay (reading ${i + 1})`, p.delay_s, 1e-9, 1e4, 's');
  });
  requireInRange('offset', offset_s, -1e3, 1e3, 's');
  requireInRange('offset sd', offsetSd_s, 0, 1e3, 's');
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
  const fit = fitParabola(
    used.map((p) => p.x - xc),
    used.map((p) => p.delay_s - yc),
  );
  if (!(fit.c > 0)) throw new InvalidInputError('sweep', 'the delays near the minimum do not curve upwards: no clear shortest delay');
  // Noise sd of one delay from the residual scatter (n − 3 degrees of freedom).
  const sigma = fit.rms * Math.sqrt(fit.n / Math.max(1, fit.n - 3));
  const vertex = parabolaVertex(fit, sigma);
  const uMin = vertex.u;
  const yMin = vertex.y;
  const shortest = yc + yMin;
  const shortestSd = vertex.ySd;
  const uMax = SECOND_SOUND_EXTREMA.maximum.speed_m_s;
  const relU = secondSoundRelativeSd(SECOND_SOUND_EXTREMA.maximum.temperature_K);
  const transit = shortest - offset_s;
  if (!(transit > 0)) throw new InvalidInputError('offset', 'is not shorter than the shortest delay');
  const L = uMax * transit;
  if (!(Number.isFinite(L) && Number.isFinite(shortestSd))) throw new InvalidInputError('sweep', 'the readings do not fix a shortest delay');
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
