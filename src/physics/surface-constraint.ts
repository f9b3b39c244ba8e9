import { requireInRange } from './errors';
import type { Vec3 } from './image-sources';
import type { Matrix } from './small-matrix';
import { basisAround, dot, norm, sub, unit, vec3 } from './vector3';

/*
 * Surfaces a heat source may be held on while it is located (a cavity wall): a sphere, a cylinder
 * or a plane, each leaving two free coordinates; or none (free in 3-D). The same shapes bound the
 * body a sensor cannot sit inside.
 */

export type SurfaceConstraint =
  | { kind: 'none' }
  | { kind: 'sphere'; centre_m: Vec3; radius_m: number }
  | { kind: 'cylinder'; axisPoint_m: Vec3; axisDirection: Vec3; radius_m: number }
  | { kind: 'plane'; point_m: Vec3; normal: Vec3 };

/** Maps the free coordinates q to a position and its Jacobian ∂x/∂q (3 × k). */
export interface Parametrisation {
  dims: 2 | 3;
  position(q: readonly number[]): Vec3;
  jacobian(q: readonly number[]): Matrix;
  /** The free coordinates of the surface point nearest to x. */
  project(x: Vec3): number[];
}

/** The free coordinates of a surface (range-checked radius; a non-zero axis or normal). */
export function parametrise(c: SurfaceConstraint): Parametrisation {
  switch (c.kind) {
    case 'none':
      return {
        dims: 3,
        position: (q) => [q[0] as number, q[1] as number, q[2] as number],
        jacobian: () => [
          [1, 0, 0],
          [0, 1, 0],
          [0, 0, 1],
        ],
        project: (x) => [...x],
      };
    case 'sphere': {
      requireInRange('sphere radius', c.radius_m, 1e-6, 100, 'm');
      const [cx, cy, cz] = c.centre_m;
      const R = c.radius_m;
      return {
        dims: 2,
        position: ([th = 0, ph = 0]) => [cx + R * Math.sin(th) * Math.cos(ph), cy + R * Math.sin(th) * Math.sin(ph), cz + R * Math.cos(th)],
        jacobian: ([th = 0, ph = 0]) => [
          [R * Math.cos(th) * Math.cos(ph), -R * Math.sin(th) * Math.sin(ph)],
          [R * Math.cos(th) * Math.sin(ph), R * Math.sin(th) * Math.cos(ph)],
          [-R * Math.sin(th), 0],
        ],
        project: (x) => {
          const d = sub(x, c.centre_m);
          const r = norm(d) || 1;
          return [Math.acos(Math.max(-1, Math.min(1, d[2] / r))), Math.atan2(d[1], d[0])];
        },
      };
    }
    case 'cylinder': {
      requireInRange('cylinder radius', c.radius_m, 1e-6, 100, 'm');
      const d = unit(c.axisDirection, 'cylinder axis');
      const [e1, e2] = basisAround(d);
      const a = c.axisPoint_m;
      const R = c.radius_m;
      return {
        dims: 2,
        position: ([ph = 0, h = 0]) => vec3((k) => a[k] + h * d[k] + R * (Math.cos(ph) * e1[k] + Math.sin(ph) * e2[k])),
        jacobian: ([ph = 0]) => ([0, 1, 2] as const).map((k) => [R * (-Math.sin(ph) * e1[k] + Math.cos(ph) * e2[k]), d[k]]),
        project: (x) => {
          const v = sub(x, a);
          const h = v[0] * d[0] + v[1] * d[1] + v[2] * d[2];
          return [Math.atan2(v[0] * e2[0] + v[1] * e2[1] + v[2] * e2[2], v[0] * e1[0] + v[1] * e1[1] + v[2] * e1[2]), h];
        },
      };
    }
    case 'plane': {
      const n = unit(c.normal, 'plane normal');
      const [e1, e2] = basisAround(n);
      const p = c.point_m;
      return {
        dims: 2,
        position: ([al = 0, be = 0]) => vec3((k) => p[k] + al * e1[k] + be * e2[k]),
        jacobian: () => ([0, 1, 2] as const).map((k) => [e1[k], e2[k]]),
        project: (x) => {
          const v = sub(x, p);
          return [v[0] * e1[0] + v[1] * e1[1] + v[2] * e1[2], v[0] * e2[0] + v[1] * e2[1] + v[2] * e2[2]];
        },
      };
    }
  }
}

/**
 * True when a point lies inside the body a surface bounds (the solid sphere, the infinite solid
 * cylinder around its axis, beam axis included): where no sensor can be put. A plane or no
 * surface bounds no body.
 */
export function insideBody(p: Vec3, c: SurfaceConstraint): boolean {
  switch (c.kind) {
    case 'sphere':
      return norm(sub(p, c.centre_m)) < c.radius_m;
    case 'cylinder': {
      const d = unit(c.axisDirection, 'cylinder axis');
      const v = sub(p, c.axisPoint_m);
      const along = dot(v, d);
      return norm(vec3((k) => v[k] - along * d[k])) < c.radius_m;
    }
    default:
      return false;
  }
}
