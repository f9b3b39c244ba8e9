import { InvalidInputError, requireInRange } from './errors';
import type { Vec3 } from './image-sources';
import { averageOverStep, type PulseProfile } from './pulse-shape';

/*
 * The temperature pulse a sensor receives from a heater in linear second-sound theory.
 * Second sound obeys a wave equation for the temperature, and a heater flux q on a wall acts like a
 * baffled piston, so the acoustic Rayleigh integral carries over (PHYSICS notes §4; derived here):
 *
 *   δT(x, t) = 1/(2π ρ c_p u2²) ∫_S q̇(t − R/u2)/R dS,   R = |x − x_S|.
 *
 *  - planar film (much wider than the path): the integral is the plane wave δT = q/(ρ c_p u2);
 *  - flat disk of radius a, sensor on the axis at distance z: the plane-wave pulse minus a copy
 *    delayed by (√(z²+a²) − z)/u2, so short pulses turn bipolar and fall off as 1/z far away;
 *  - small (point) heater of power P, far field: δT = Ṗ(t − r/u2)/(2π ρ c_p u2² r);
 *  - disk off the axis, or a sensor of finite area: the integral is taken numerically. Around the
 *    sensor's foot point, rings of radius s give ∫ q̇(t − R/u2) Φ(R) dR, Φ the angle of the ring
 *    inside the disk; a finite sensor is averaged with a 7-point disk rule (exact to degree 3).
 * A sensor with a first-order lag τ (time constant) filters the result: y′ = (δT − y)/τ.
 * Each sample is the signal averaged over its time step (the pulse enters through its integral),
 * so a pulse keeps its area on any grid: a slow sensor, sampled coarsely, still sees it.
 */

export type HeaterGeometry = 'planar' | 'disk' | 'point';

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
  /** Peak heat flux on the heater face, W/m² (planar, disk). */
  peakFlux_W_m2: number;
  /** Peak power, W (point). */
  peakPower_W: number;
  /** Disk radius, m (disk only). */
  radius_m: number;
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
const ON_AXIS_REL = 1e-9;
// 7-point rule for the mean over a disk: centre weight 1/4, six points at r = √(2/3) R, 1/8 each.
const DISK_RULE_R = Math.sqrt(2 / 3);
const DISK_RULE = [
  { r: 0, phi: 0, w: 0.25 },
  ...Array.from({ length: 6 }, (_, i) => ({ r: DISK_RULE_R, phi: (i * Math.PI) / 3, w: 0.125 })),
];

/**
 * Angle (rad, 0–2π) of the circle of radius s about a point at distance d from the centre of a
 * disk of radius a that lies inside the disk. Lengths ≥ 0 in any one unit; NaN gives 0.
 */
export function ringAngleInsideDisk(s: number, d: number, a: number): number {
  if (!(s >= 0 && d >= 0 && a >= 0)) return 0;
  if (s <= a - d) return 2 * Math.PI;
  if (s >= a + d || s <= d - a) return 0;
  const c = (s * s + d * d - a * a) / (2 * s * d);
  return 2 * Math.acos(Math.min(1, Math.max(-1, c)));
}

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
/** Most multiply-adds one disk integral may take (samples × delay bins). */
export const MAX_DISK_WORK = 200_000_000;

function checkPulseInputs(source: PulseSource, sensor: SensorPoint, medium: Medium, step_s: number): void {
  requireInRange('time step', step_s, 1e-15, 1, 's');
  requireInRange('second-sound speed', medium.secondSound_m_s, 1e-6, 1e3, 'm/s');
  requireInRange('density', medium.density_kg_m3, 1, 1e3, 'kg/m³');
  requireInRange('specific heat', medium.specificHeat_J_kgK, 1e-6, 1e7, 'J/(kg·K)');
  requireInRange('heat flux', source.peakFlux_W_m2, 0, 1e12, 'W/m²');
  requireInRange('heater power', source.peakPower_W, 0, 1e6, 'W');
  if (source.geometry === 'disk') requireInRange('heater radius', source.radius_m, 1e-9, 100, 'm');
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
  const dz = Math.abs(sensor.position[2] - source.centre[2]);
  if (!(dz > 0)) throw new InvalidInputError('sensor position', 'must lie off the heater plane (z differs from the heater)');
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

  if (source.geometry === 'planar') {
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
    const scale = (source.amplitudeFactor * source.peakPower_W) / (2 * Math.PI * rhoC * u * u * r);
    out.values.forEach((_, i) => {
      out.values[i] = scale * stepDerivative(f, out.start_s + i * step_s - arrival, step_s);
    });
    applyLag(out.values, step_s, sensor.lag_s);
    return { arrival_s: arrival, path_m: r, signal: out };
  }

  // Disk.
  const a = source.radius_m;
  const reach = lateral + sensor.radius_m;
  const nearest = Math.hypot(z, Math.max(0, lateral - sensor.radius_m - a));
  const farthest = Math.hypot(z, reach + a);
  const arrival = nearest / u;
  const out = grid(arrival, farthest / u + tail, step_s);
  const q0 = source.amplitudeFactor * source.peakFlux_W_m2;
  if (sensor.radius_m === 0 && lateral <= ON_AXIS_REL * Math.max(z, a)) {
    const edge = Math.hypot(z, a) / u;
    const scale = q0 / (rhoC * u);
    out.values.forEach((_, i) => {
      const t = out.start_s + i * step_s;
      out.values[i] = scale * (averageOverStep(f, t - z / u, step_s) - averageOverStep(f, t - edge, step_s));
    });
  } else {
    diskRayleigh(out, { q0, a, z, u, rhoC, profile: f }, sensorPoints(dx, dy, sensor.radius_m));
  }
  applyLag(out.values, step_s, sensor.lag_s);
  return { arrival_s: arrival, path_m: nearest, signal: out };
}

function sensorPoints(dx: number, dy: number, radius: number): { d: number; w: number }[] {
  if (radius === 0) return [{ d: Math.hypot(dx, dy), w: 1 }];
  return DISK_RULE.map((p) => ({
    d: Math.hypot(dx + radius * p.r * Math.cos(p.phi), dy + radius * p.r * Math.sin(p.phi)),
    w: p.w,
  }));
}

interface DiskCase {
  q0: number;
  a: number;
  z: number;
  u: number;
  rhoC: number;
  profile: PulseProfile;
}

/** Sub-samples per delay bin when averaging the ring angle Φ over the bin. */
const PHI_SUBSAMPLES = 4;

/**
 * Adds the Rayleigh integral for a disk. Delays τ = R/u2 are binned on the output's own step h
 * (bins [jh, (j+1)h]); the sensor points' ring angles, weighted, add into one Φ̄_j, so
 *   δT(t_n) = q0/(2π ρc u) Σ_j Φ̄_j [f((n − j)h) − f((n − j − 1)h)]
 * is a single discrete convolution with the pulse's increments.
 */
function diskRayleigh(out: SampledSignal, c: DiskCase, points: { d: number; w: number }[]): void {
  const h = out.step_s;
  const tauMin = Math.min(...points.map((p) => Math.hypot(c.z, Math.max(0, p.d - c.a)))) / c.u;
  const tauMax = Math.max(...points.map((p) => Math.hypot(c.z, p.d + c.a))) / c.u;
  const j0 = Math.floor(tauMin / h);
  const bins = Math.max(1, Math.ceil(tauMax / h) - j0);
  if (bins * out.values.length > MAX_DISK_WORK) {
    throw new InvalidInputError('time step', `${h} s is too fine for a disk this size seen from here (${bins} delay bins × ${out.values.length} samples)`);
  }
  const phi = new Float64Array(bins);
  for (const { d, w } of points) {
    for (let j = 0; j < bins; j++) {
      let sum = 0;
      for (let k = 0; k < PHI_SUBSAMPLES; k++) {
        const R = (j0 + j + (k + 0.5) / PHI_SUBSAMPLES) * h * c.u;
        sum += ringAngleInsideDisk(Math.sqrt(Math.max(0, R * R - c.z * c.z)), d, c.a);
      }
      phi[j] = (phi[j] as number) + (w * sum) / PHI_SUBSAMPLES;
    }
  }
  // Pulse increments D[m] = f̄(m h) − f̄((m − 1) h), f̄ the pulse averaged over one step (so the
  // output is averaged over its step too), for every lag the convolution needs.
  const n0 = Math.round(out.start_s / h);
  const mMin = n0 - (j0 + bins - 1);
  const mMax = n0 + out.values.length - 1 - j0;
  const increments = new Float64Array(mMax - mMin + 1);
  for (let m = mMin; m <= mMax; m++) increments[m - mMin] = averageOverStep(c.profile, m * h, h) - averageOverStep(c.profile, (m - 1) * h, h);
  const scale = c.q0 / (2 * Math.PI * c.rhoC * c.u);
  for (let i = 0; i < out.values.length; i++) {
    const base = n0 + i - j0 - mMin;
    let acc = 0;
    for (let j = 0; j < bins; j++) acc += (phi[j] as number) * (increments[base - j] as number);
    out.values[i] = (out.values[i] as number) + scale * acc;
  }
}
