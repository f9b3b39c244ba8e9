import type { Vec3 } from './image-sources';
import type { PlanHeater, PlanInput, PlanSensor } from './plan-input';
import type { PlanePlanResult } from './plan-result';

/*
 * The planner's geometry at low temperature: reflecting planes shrunk with the spacer when they
 * were measured warm (like the sensors), the heater's own wall added when the plan does not list
 * it, and the faults a layout can have — a sensor the heater's wave cannot reach because a
 * reflecting plane stands between them, or a plane cutting through the heater.
 */

const AXIS = { x: 0, y: 1, z: 2 } as const;
/** Closer than this to a plane, a sensor is on it (1 nm: far below any measured distance). */
export const ON_PLANE_M = 1e-9;

/** The heater sits in a wall (its face is a baffled piston), except a small source standing free. */
export function heaterInWall(h: PlanHeater): boolean {
  return !(h.geometry === 'point' && h.mount === 'free');
}

/**
 * Cold planes with their R: measured R as typed, solid walls from (Z − h)/(Z + h); the heater's
 * own wall (z = 0) added as "heater plate" when the heater sits in one and the plan lists no plane
 * there. `scale` is 1 − contraction when distances were measured warm, else 1.
 */
export function coldPlanes(plan: PlanInput, scale: number, wall: { reflection: number; note: string } | null): PlanePlanResult[] {
  const planes: PlanePlanResult[] = plan.reflectors.map((r) => {
    const measured = r.reflection !== null;
    return {
      label: r.label,
      axis: r.axis,
      position_m: r.position_m * scale,
      reflection: measured ? (r.reflection as number) : (wall?.reflection ?? 1),
      source: measured ? 'measured' : 'solid-wall',
      note: measured
        ? `R = ${r.reflection} as typed (a measured value); a solid wall would reflect ${wall ? wall.reflection.toFixed(4) : 'nearly all'} of the wave.`
        : (wall?.note ?? 'a solid wall reflects nearly all of the wave'),
    };
  });
  const hasHeaterPlate = planes.some((p) => p.axis === 'z' && Math.abs(p.position_m) < ON_PLANE_M);
  if (heaterInWall(plan.heater) && !hasHeaterPlate) {
    planes.unshift({
      label: 'heater plate',
      axis: 'z',
      position_m: 0,
      reflection: wall?.reflection ?? 1,
      source: 'heater-plate',
      note: `The heater's own wall (not listed, so added): ${wall?.note ?? 'a solid wall'}.`,
    });
  }
  return planes;
}

/** The plane standing between the heater centre and a sensor, if any (the first listed). */
export function planeBetween(position: Vec3, planes: readonly PlanePlanResult[]): PlanePlanResult | null {
  for (const p of planes) {
    const k = AXIS[p.axis];
    const heaterSide = p.axis === 'z' && Math.abs(p.position_m) < ON_PLANE_M ? 1 : Math.sign(0 - p.position_m);
    const sensorSide = position[k] - p.position_m;
    if (Math.abs(sensorSide) <= ON_PLANE_M) continue; // on the plane: it sees (1 + R) of the wave
    if (heaterSide === 0) continue; // a plane through the heater: its own fault (planesThroughHeater)
    if (Math.sign(sensorSide) !== heaterSide) return p;
  }
  return null;
}

/** The plane a sensor lies on, if any. */
export function planeUnder(position: Vec3, planes: readonly PlanePlanResult[]): PlanePlanResult | null {
  return planes.find((p) => Math.abs(position[AXIS[p.axis]] - p.position_m) <= ON_PLANE_M) ?? null;
}

/**
 * Planes across the heater's face: an x or y plane closer to the centre than the face's half-width,
 * or a z plane other than the heater's own at z = 0 cannot cut a face, so only x and y count.
 */
export function planesThroughHeater(h: PlanHeater, planes: readonly PlanePlanResult[]): PlanePlanResult[] {
  const half = (axis: 'x' | 'y'): number => {
    if (h.geometry === 'rectangle') return (axis === 'x' ? h.width_m : h.height_m) / 2;
    if (h.geometry === 'disk') return h.radius_m;
    return 0;
  };
  return planes.filter((p) => p.axis !== 'z' && (Math.abs(p.position_m) < half(p.axis) || Math.abs(p.position_m) < ON_PLANE_M));
}

/** A sensor's position at low temperature. */
export function coldPosition(sensor: PlanSensor, scale: number): Vec3 {
  return [sensor.position_m[0] * scale, sensor.position_m[1] * scale, sensor.position_m[2] * scale];
}
