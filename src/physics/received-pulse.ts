import { InvalidInputError, requireInRange } from './errors';
import { faceReach, type HeaterFace } from './heater-face';
import type { Vec3 } from './image-sources';
import { addPistonPulse, delaySpan, type FootPoint } from './piston-response';
import { averageOverStep, type PulseProfile } from './pulse-shape';

/*
 * The temperature pulse a sensor receives from a heater in linear second-sound theory.
 * Second sound obeys a wave equation for the temperature, and a heater flux q on a wall acts like a
 * baffled piston, so the acoustic Rayleigh integral carries over (PHYSICS notes §4):
 *
 *   δT(x, t) = 1/(2π ρ c_p u2²) ∫_S q̇(t − R/u2)/R dS,   R = |x − x_S|.
 *
 *  - rectangle or disk of any size: the transient-piston form of that integral (piston-response.ts;
 *    Stepanishen, J. Acoust. Soc. Am. 49, 1629 (1971)), on or off the axis. Its short-path limit
 *    is the plane wave q/(ρ c_p u2); far away it is the small source below. A sensor of finite
 *    area is averaged with a 7-point disk rule (exact to degree 3).
 *  - small source of power P on a wall (2π): δT = Ṗ(t − r/u2)/(2π ρ c_p u2² r); standing free in
 *    the liquid it radiates into 4π: δT = Ṗ(t − r/u2)/(4π ρ c_p u2² r). The signal follows dP/dt.
 *  - plane wave (an unbounded film; only the command line's explicit "plane-wave limit"):
 *    δT = q f(t − z/u2)/(ρ c_p u2).
 * A sensor with a first-order lag τ (time constant) filters the result: y′ = (δT − y)/τ.
 * Each sample is the signal averaged over its time step (the pulse enters through its integral),
 * so a pulse keeps its area on any grid: a slow sensor, sampled coarsely, still sees it.
 */

/** Heater kinds: sized faces, a small source, or the unbounded film of the plane-wave limit. */
export type HeaterGeometry = 'rectangle' | 'disk' | 'point' | 'plane-wave';
/** Where a small source sits: on a wall it radiates into 2π, free in the liquid into 4π. */
export type PointMount = 'wall' | 'free';

/** Helium properties a received pulse depends on, at the bath temperature. */
export interface Medium {
  density_kg_m3: number;
  specificHeat_J_kgK: number;
  secondSound_m_s: number;
}

/** A uniformly sampled signal: values[i] at start_s + i·step_s. */
export interface SampledSignal {
  start_s: number;
  step_s: number;
  values: Float64Array;
}

export interface PulseSource {
  geometry: HeaterGeometry;
  /** Peak heat flux on the heater face, W/m² (rectangle, disk, plane wave). */
  peakFlux_W_m2: number;
  /** Peak power, W (point). */
  peakPower_W: number;
  /** The face of a rectangle or disk heater; null for a point or the plane wave. */
  face: HeaterFace | null;
  /** A point source's mounting (ignored for the others). */
  mount: PointMount;
  profile: PulseProfile;
  /** Heater (or image) centre, m; the face is parallel to the z = const planes. */
  centre: Vec3;
  /** Product of reflection coefficients for an image (1 for the heater itself). */
  amplitudeFactor: number;
}

export interface SensorPoint {
  position: Vec3;
  /** Radius of the sensing disk (facing the heater), m; 0 for a point sensor. */
  radius_m: number;
  /** First-order time constant, s (0: none). */
  lag_s: number;
}

export interface ReceivedPulse {
  /** Earliest geometric arrival of second sound (shortest path / u2), s after the pulse onset. */
  arrival_s: number;
  /** Shortest path from heater to sensor, m. */
  path_m: number;
  signal: SampledSignal;
}

/** Lag tail kept after the pulse, in time constants (e⁻⁶ ≈ 0.25 % left). */
const LAG_TAIL = 6;
// 7-point rule for the mean over a disk: centre weight 1/4, six points at r = √(2/3) R, 1/8 each.
const DISK_RULE_R = Math.sqrt(2 / 3);
const DISK_RULE = [
  { r: 0, phi: 0, w: 0.25 },
  ...Array.from({ length: 6 }, (_, i) => ({ r: DISK_RULE_R, phi: (i * Math.PI) / 3, w: 0.125 })),
];

/** Mean of a function over the time step centred on t: (f(t + h/2) − f(t − h/2))/h is f′ so averaged. */
function stepDerivative(profile: PulseProfile, t: number, h: number): number {
  return (profile.value(t + h / 2) - profile.value(t - h / 2)) / h;
}

function applyLag(values: Float64Array, step: number, lag: number): void {
  if (!(lag > 0)) return;
  const k = 1 - Math.exp(-step / lag);
  let y = 0;
  for (let i = 0; i < values.length; i++) {
    y += k * ((values[i] as number) - y);
    values[i] = y;
  }
}

function grid(first_s: number, last_s: number, step: number): SampledSignal {
  // Anchored at multiples of the step so that signals on the same step add sample by sample.
  const i0 = Math.floor(first_s / step) - 1;
  const i1 = Math.ceil(last_s / step) + 1;
  if (i1 - i0 + 1 > MAX_PULSE_SAMPLES) {
    throw new InvalidInputError('time step', `${step} s would need ${i1 - i0 + 1} samples for this pulse (at most ${MAX_PULSE_SAMPLES})`);
  }
  return { start_s: i0 * step, step_s: step, values: new Float64Array(i1 - i0 + 1) };
}

/** Most samples one received pulse may hold: a guard against a step far too fine for the pulse. */
export const MAX_PULSE_SAMPLES = 2_000_000;

function checkPulseInputs(source: PulseSource, sensor: SensorPoint, medium: Medium, step_s: number): void {
  requireInRange('time step', step_s, 1e-15, 1, 's');
  requireInRange('second-sound speed', medium.secondSound_m_s, 1e-6, 1e3, 'm/s');
  requireInRange('density', medium.density_kg_m3, 1, 1e3, 'kg/m³');
  requireInRange('specific heat', medium.specificHeat_J_kgK, 1e-6, 1e7, 'J/(kg·K)');
  requireInRange('heat flux', source.peakFlux_W_m2, 0, 1e12, 'W/m²');
  requireInRange('heater power', source.peakPower_W, 0, 1e6, 'W');
  if (source.geometry === 'rectangle' || source.geometry === 'disk') {
    if (source.face === null || source.face.kind !== source.geometry) throw new InvalidInputError('heater face', `a ${source.geometry} heater needs its ${source.geometry} face`);
    if (source.face.kind === 'disk') requireInRange('heater radius', source.face.radius_m, 1e-9, 100, 'm');
    else {
      requireInRange('heater width', source.face.width_m, 1e-9, 100, 'm');
      requireInRange('heater height', source.face.height_m, 1e-9, 100, 'm');
    }
  }
  requireInRange('reflection product', source.amplitudeFactor, -1, 1, '');
  requireInRange('sensor radius', sensor.radius_m, 0, 100, 'm');
  requireInRange('sensor lag', sensor.lag_s, 0, 10, 's');
  for (const [name, v] of [
    ['source', source.centre],
    ['sensor', sensor.position],
  ] as const) {
    v.forEach((x, k) => {
      requireInRange(`${name} ${'xyz'[k]}`, x, -1e3, 1e3, 'm');
    });
  }
  // A sensor in the plane of the face (height 0) is allowed: with stacked reflecting planes the
  // image method puts heater images in a sensor's plane, a grazing path. The Rayleigh integral is
  // continuous down to the face's plane (at z = 0, R = s and the ring form needs no 1/z), so the
  // pulse there is its z → 0 limit, computed by the same formulas. Only a small source seen from
  // its own point (r = 0) has no finite value.
  if (source.geometry === 'point') {
    const r = Math.hypot(sensor.position[0] - source.centre[0], sensor.position[1] - source.centre[1], sensor.position[2] - source.centre[2]);
    if (!(r > 0)) throw new InvalidInputError('sensor position', 'must not coincide with the heater or one of its images (distance 0)');
  }
}

/**
 * δT(t) (K) at one sensor from one heater (or heater image), on a grid of the given step.
 * Time zero is the pulse onset at the heater. Inputs in SI; `step_s` > 0. Throws typed errors
 * naming the field for bad input, and when the pulse would need more than 2 million samples.
 */
export function receivedPulse(source: PulseSource, sensor: SensorPoint, medium: Medium, step_s: number): ReceivedPulse {
  checkPulseInputs(source, sensor, medium, step_s);
  const u = medium.secondSound_m_s;
  const rhoC = medium.density_kg_m3 * medium.specificHeat_J_kgK;
  const dx = sensor.position[0] - source.centre[0];
  const dy = sensor.position[1] - source.centre[1];
  const z = Math.abs(sensor.position[2] - source.centre[2]);
  const lateral = Math.hypot(dx, dy);
  const tail = source.profile.duration_s + LAG_TAIL * sensor.lag_s;
  const f = source.profile;

  if (source.geometry === 'plane-wave') {
    const arrival = z / u;
    const out = grid(arrival, arrival + tail, step_s);
    const scale = (source.amplitudeFactor * source.peakFlux_W_m2) / (rhoC * u);
    out.values.forEach((_, i) => {
      out.values[i] = scale * averageOverStep(f, out.start_s + i * step_s - arrival, step_s);
    });
    applyLag(out.values, step_s, sensor.lag_s);
    return { arrival_s: arrival, path_m: z, signal: out };
  }

  if (source.geometry === 'point') {
    const r = Math.hypot(lateral, z);
    const arrival = r / u;
    const out = grid(arrival, arrival + tail, step_s);
    const solidAngle = source.mount === 'free' ? 4 * Math.PI : 2 * Math.PI;
    const scale = (source.amplitudeFactor * source.peakPower_W) / (solidAngle * rhoC * u * u * r);
    out.values.forEach((_, i) => {
      out.values[i] = scale * stepDerivative(f, out.start_s + i * step_s - arrival, step_s);
    });
    applyLag(out.values, step_s, sensor.lag_s);
    return { arrival_s: arrival, path_m: r, signal: out };
  }

  // A sized face: the transient piston.
  const face = source.face as HeaterFace;
  const detail = Math.max(f.effectiveRise_s, sensor.lag_s) / 4;
  const piston = { face, q0: source.amplitudeFactor * source.peakFlux_W_m2, z, u, rhoC, profile: f, detail_s: detail };
  const points = footPoints(dx, dy, sensor.radius_m, sensorSpread(piston, dx, dy, sensor.radius_m) < Math.max(step_s, detail) / 2);
  const span = delaySpan(piston, points);
  const out = grid(span.first_s, span.last_s + tail, step_s);
  addPistonPulse(out.values, out.start_s, step_s, piston, points);
  applyLag(out.values, step_s, sensor.lag_s);
  return { arrival_s: span.first_s, path_m: span.first_s * u, signal: out };
}

/**
 * How much the delay to the face's farthest point changes across the sensor's face, s: when it is
 * well below the finest detail the result can show, the sensor's centre stands for its face (the
 * face average differs from the centre value only at second order in the sensor's size).
 */
function sensorSpread(c: { face: HeaterFace; z: number; u: number }, dx: number, dy: number, radius: number): number {
  if (radius === 0) return 0;
  const far = faceReach(c.face, dx, dy).farthest_m;
  return (Math.hypot(c.z, far + radius) - Math.hypot(c.z, Math.max(0, far - radius))) / c.u;
}

function footPoints(dx: number, dy: number, radius: number, centreOnly: boolean): FootPoint[] {
  if (radius === 0 || centreOnly) return [{ px: dx, py: dy, w: 1 }];
  return DISK_RULE.map((p) => ({ px: dx + radius * p.r * Math.cos(p.phi), py: dy + radius * p.r * Math.sin(p.phi), w: p.w }));
}
