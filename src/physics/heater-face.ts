/*
 * The face of a finite heater, seen from the foot point of a sensor on the heater's plane: how
 * much of a circle of radius s about that point lies on the face. That angle Φ(s) is all the
 * Rayleigh integral needs (received-pulse.ts): the element ring at distance R = √(z² + s²) from
 * the sensor contributes q̇(t − R/u2)·Φ(s) dR. On the axis of a disk Φ = 2π until s = a; on the
 * axis of a square of half-side a, Φ = 2π − 8·acos(a/s) for a < s ≤ a√2 (PHYSICS notes §4).
 */

/** A finite heater face centred on the z axis, in the z = const plane. */
export type HeaterFace =
  | { kind: 'disk'; radius_m: number }
  /** Rectangle: `width_m` along x, `height_m` along y. */
  | { kind: 'rectangle'; width_m: number; height_m: number };

const TWO_PI = 2 * Math.PI;

/**
 * Angle (rad, 0–2π) of the circle of radius s about a point at distance d from the centre of a
 * disk of radius a that lies inside the disk. Lengths ≥ 0 in any one unit; NaN gives 0.
 */
export function ringAngleInsideDisk(s: number, d: number, a: number): number {
  if (!(s >= 0 && d >= 0 && a >= 0)) return 0;
  if (s <= a - d) return TWO_PI;
  if (s >= a + d || s <= d - a) return 0;
  const c = (s * s + d * d - a * a) / (2 * s * d);
  return 2 * Math.acos(Math.min(1, Math.max(-1, c)));
}

// Scratch space for the crossing angles (at most 8), reused so evaluation allocates nothing.
const crossings = new Float64Array(10);

function inside(x: number, y: number, hx: number, hy: number): boolean {
  return Math.abs(x) <= hx && Math.abs(y) <= hy;
}

/**
 * Angle (rad, 0–2π) of the circle of radius s about the point (px, py) that lies inside the
 * rectangle |x| ≤ hx, |y| ≤ hy (half-sides). The circle's crossings with the four edges cut it into
 * arcs; each arc is in or out as its midpoint is. Lengths in any one unit; NaN gives 0.
 */
export function ringAngleInsideRectangle(s: number, px: number, py: number, hx: number, hy: number): number {
  if (!(s >= 0 && hx >= 0 && hy >= 0) || !Number.isFinite(px) || !Number.isFinite(py)) return 0;
  const ax = Math.abs(px);
  const ay = Math.abs(py);
  if (ax + s <= hx && ay + s <= hy) return TWO_PI;
  const nx = Math.max(0, ax - hx);
  const ny = Math.max(0, ay - hy);
  if (nx * nx + ny * ny >= s * s) return 0;
  const fx = ax + hx;
  const fy = ay + hy;
  if (fx * fx + fy * fy <= s * s) return 0;
  let n = 0;
  // Crossings with x = ±hx (cos θ = c/s) and y = ±hy (sin θ = c/s), written out: no arrays per call.
  let c = -hx - ax;
  if (Math.abs(c) < s) {
    const a = Math.acos(c / s);
    crossings[n++] = a;
    crossings[n++] = TWO_PI - a;
  }
  c = hx - ax;
  if (Math.abs(c) < s) {
    const a = Math.acos(c / s);
    crossings[n++] = a;
    crossings[n++] = TWO_PI - a;
  }
  c = -hy - ay;
  if (Math.abs(c) < s) {
    const a = Math.asin(c / s);
    crossings[n++] = a < 0 ? a + TWO_PI : a;
    crossings[n++] = Math.PI - a;
  }
  c = hy - ay;
  if (Math.abs(c) < s) {
    const a = Math.asin(c / s);
    crossings[n++] = a < 0 ? a + TWO_PI : a;
    crossings[n++] = Math.PI - a;
  }
  if (n === 0) return inside(ax + s, ay, hx, hy) ? TWO_PI : 0;
  // Insertion sort of at most 8 angles.
  for (let i = 1; i < n; i++) {
    const v = crossings[i] as number;
    let j = i - 1;
    while (j >= 0 && (crossings[j] as number) > v) {
      crossings[j + 1] = crossings[j] as number;
      j--;
    }
    crossings[j + 1] = v;
  }
  let total = 0;
  for (let i = 0; i < n; i++) {
    const a0 = crossings[i] as number;
    const a1 = i + 1 < n ? (crossings[i + 1] as number) : (crossings[0] as number) + TWO_PI;
    const arc = a1 - a0;
    if (arc <= 0) continue;
    const mid = a0 + arc / 2;
    if (inside(ax + s * Math.cos(mid), ay + s * Math.sin(mid), hx, hy)) total += arc;
  }
  return Math.min(TWO_PI, total);
}

/** Φ(s) for a face and a foot point (px, py) measured from the face's centre, m. */
export function ringAngleOnFace(face: HeaterFace, s: number, px: number, py: number): number {
  return face.kind === 'disk'
    ? ringAngleInsideDisk(s, Math.hypot(px, py), face.radius_m)
    : ringAngleInsideRectangle(s, px, py, face.width_m / 2, face.height_m / 2);
}

/** Lateral distance from a foot point (px, py) to the nearest and to the farthest point of the face, m. */
export function faceReach(face: HeaterFace, px: number, py: number): { nearest_m: number; farthest_m: number } {
  if (face.kind === 'disk') {
    const d = Math.hypot(px, py);
    return { nearest_m: Math.max(0, d - face.radius_m), farthest_m: d + face.radius_m };
  }
  const hx = face.width_m / 2;
  const hy = face.height_m / 2;
  const ax = Math.abs(px);
  const ay = Math.abs(py);
  return { nearest_m: Math.hypot(Math.max(0, ax - hx), Math.max(0, ay - hy)), farthest_m: Math.hypot(ax + hx, ay + hy) };
}

/** Area of the face, m². */
export function faceArea(face: HeaterFace): number {
  return face.kind === 'disk' ? Math.PI * face.radius_m * face.radius_m : face.width_m * face.height_m;
}

/**
 * The edge nearest the centre, m: the disk's radius, or half the rectangle's shorter side. Its
 * wave reaches a sensor on the axis at distance z a time (√(z² + a²) − z)/u2 ≈ a²/(2 z u2) after the
 * front (Stepanishen, J. Acoust. Soc. Am. 49, 1629 (1971), for the disk).
 */
export function nearestEdge_m(face: HeaterFace): number {
  return face.kind === 'disk' ? face.radius_m : Math.min(face.width_m, face.height_m) / 2;
}

/**
 * Distance along the axis up to which the plane-wave value q/(ρ c_p u2) holds for the whole of a
 * pulse of length τ: the edge wave arrives after the pulse has passed while (√(z² + a²) − z)/u2 ≥ τ,
 * i.e. z ≤ (a² − (u2 τ)²)/(2 u2 τ) ≈ a²/(2 u2 τ) (0 when u2 τ ≥ a). Inputs SI, result m.
 */
export function planeWaveRange_m(face: HeaterFace, secondSound_m_s: number, duration_s: number): number {
  const a = nearestEdge_m(face);
  const l = secondSound_m_s * duration_s;
  return l >= a ? 0 : (a * a - l * l) / (2 * l);
}
