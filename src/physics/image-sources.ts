import { InvalidInputError, requireInRange } from './errors';

/*
 * Echoes by the method of images (the standard treatment of a source near plane reflectors in
 * linear acoustics; e.g. Morse & Ingard, "Theoretical Acoustics" (1968), cited from memory): each
 * plane mirrors every image
 * across it, multiplying the amplitude by the plane's reflection coefficient. Planes are taken
 * parallel to the coordinate planes (x, y or z = constant), which covers the walls, plates and
 * lids of a cryostat insert. An image lying on a plane is not mirrored in it: that is the heater's
 * own wall, already counted in the heater's half-space emission.
 *
 * A wave meets a plane only from the side the heater is on (the room's side): an image behind a
 * plane is not mirrored in it. This is the validity test of the image method for rooms that are
 * not simple boxes (Borish, J. Acoust. Soc. Am. 75, 1827 (1984), cited from memory). Without it,
 * planes stacked on one side of the heater (two plates above it) gave paths that reflect off the
 * back of the nearer plate: images that arrive before the direct wave, some in a sensor's own
 * plane. In a box (one plane each side per axis) every image passes the test. The wave a
 * partially reflecting plate lets through is followed as if the plate were not there (its
 * transmission is not modelled).
 */

export type Vec3 = readonly [number, number, number];

export interface ReflectingPlane {
  label: string;
  /** The plane is `axis = position_m`. */
  axis: 'x' | 'y' | 'z';
  position_m: number;
  /** Amplitude reflection coefficient, −1 to 1 (glass measured about 0.4 for second sound). */
  reflection: number;
}

export interface SourceImage {
  position: Vec3;
  /** Product of the reflection coefficients along the path. */
  factor: number;
  /** Number of reflections. */
  order: number;
  /** Labels of the planes, in the order the wave meets them. */
  path: readonly string[];
}

/** Highest reflection order the planner reports. */
export const MAX_ECHO_ORDER = 12;
/** Highest order generated: one more than reported, for partners of the last echo. */
const MAX_IMAGE_ORDER = MAX_ECHO_ORDER + 1;
/**
 * Images weaker than this (|∏R|) are dropped: below any sensor's noise in practice. Low enough
 * that the partner of a reported echo (one more reflection, at the sensor's own plate) survives
 * up to the highest order at R = 0.4.
 */
export const MIN_IMAGE_FACTOR = 1e-6;
/** Most images generated, however many planes: keeps a recompute fast. */
export const MAX_IMAGES = 400;
const AXIS_INDEX = { x: 0, y: 1, z: 2 } as const;
const ON_PLANE_M = 1e-12;

/**
 * The source and its images up to `maxOrder` reflections.
 * @param source position of the heater centre, m.
 * @param planes reflecting planes (reflection −1…1).
 * @param maxOrder 0–13.
 * Result: the source itself first (order 0), then images by increasing order.
 */
export function imageSources(source: Vec3, planes: readonly ReflectingPlane[], maxOrder: number): SourceImage[] {
  requireInRange('echo order', maxOrder, 0, MAX_IMAGE_ORDER, '');
  if (!Number.isInteger(maxOrder)) throw new InvalidInputError('echo order', `must be a whole number 0–${MAX_IMAGE_ORDER}`);
  planes.forEach((p, i) => {
    requireInRange(`reflection of plane ${i + 1}`, p.reflection, -1, 1, '');
    requireInRange(`position of plane ${i + 1}`, p.position_m, -100, 100, 'm');
  });
  // The room's side of each plane: the source's side; for a z plane through the source (the
  // heater's wall) +z, where the heater faces; either side for an x or y plane through it.
  const roomSide = planes.map((plane) => {
    const d = source[AXIS_INDEX[plane.axis]] - plane.position_m;
    return Math.abs(d) < ON_PLANE_M ? (plane.axis === 'z' ? 1 : 0) : Math.sign(d);
  });
  const all: SourceImage[] = [{ position: source, factor: 1, order: 0, path: [] }];
  let frontier: { image: SourceImage; lastPlane: number }[] = [{ image: all[0] as SourceImage, lastPlane: -1 }];
  for (let order = 1; order <= maxOrder && frontier.length > 0; order++) {
    const next: typeof frontier = [];
    for (const { image, lastPlane } of frontier) {
      planes.forEach((plane, index) => {
        if (index === lastPlane || all.length + next.length >= MAX_IMAGES) return;
        const k = AXIS_INDEX[plane.axis];
        const coordinate = image.position[k];
        if (Math.abs(coordinate - plane.position_m) < ON_PLANE_M) return;
        const side = roomSide[index] as number;
        if (side !== 0 && Math.sign(coordinate - plane.position_m) !== side) return;
        const factor = image.factor * plane.reflection;
        if (Math.abs(factor) < MIN_IMAGE_FACTOR) return;
        const position = [...image.position] as [number, number, number];
        position[k] = 2 * plane.position_m - coordinate;
        next.push({ image: { position, factor, order, path: [...image.path, plane.label] }, lastPlane: index });
      });
    }
    for (const n of next) all.push(n.image);
    frontier = next;
  }
  return all;
}
