import { InvalidInputError } from './errors';
import type { Vec3 } from './image-sources';

/*
 * Small three-vector helpers for the location kernel (metres or unit directions).
 */

/** Builds a vector from its three components. */
export function vec3(f: (k: 0 | 1 | 2) => number): Vec3 {
  return [f(0), f(1), f(2)];
}
export function sub(a: Vec3, b: Vec3): Vec3 {
  return [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
}
export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
export function norm(a: Vec3): number {
  return Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);
}
/** `a` scaled to unit length; throws InvalidInputError naming `field` for a zero vector. */
export function unit(a: Vec3, field: string): Vec3 {
  const n = norm(a);
  if (!(n > 0)) throw new InvalidInputError(field, 'needs a non-zero direction');
  return [a[0] / n, a[1] / n, a[2] / n];
}
/** Two unit vectors completing `d` to an orthonormal basis. */
export function basisAround(d: Vec3): [Vec3, Vec3] {
  const helper: Vec3 = Math.abs(d[0]) < 0.9 ? [1, 0, 0] : [0, 1, 0];
  const e1raw: Vec3 = [d[1] * helper[2] - d[2] * helper[1], d[2] * helper[0] - d[0] * helper[2], d[0] * helper[1] - d[1] * helper[0]];
  const e1 = unit(e1raw, 'direction');
  const e2: Vec3 = [d[1] * e1[2] - d[2] * e1[1], d[2] * e1[0] - d[0] * e1[2], d[0] * e1[1] - d[1] * e1[0]];
  return [e1, e2];
}
export function centroid(points: readonly Vec3[]): Vec3 {
  const n = points.length;
  return vec3((k) => points.reduce((a, s) => a + s[k], 0) / n);
}
