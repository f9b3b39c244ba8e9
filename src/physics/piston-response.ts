import { faceReach, type HeaterFace, ringAngleOnFace } from './heater-face';
import { averageOverStep, type PulseProfile } from './pulse-shape';

/*
 * The transient baffled piston (Stepanishen, J. Acoust. Soc. Am. 49, 1629 (1971)) for second
 * sound: a heater face with flux q0·f(t) in its wall, seen from a sensor at height z, gives
 *
 *   δT(t) = q0/(2π ρ c_p u2) ∫ Φ(τ) f′(t − τ) dτ,   τ = R/u2,  s = √(R² − z²),
 *
 * Φ(τ) the angle of the ring of radius s about the sensor's foot point that lies on the face
 * (heater-face.ts). On a short path the ring stays on the face (Φ = 2π) for the whole pulse and
 * this is the plane wave q0 f(t − z/u2)/(ρ c_p u2); far away Φ is non-zero only briefly and it is
 * the small source Area·q0 f′/(2π ρ c_p u2² R). Both limits come out of the same sum.
 *
 * Φ is tabulated on [τ_min, τ_max] every max(step, detail) — detail a quarter of the pulse’s rise or the
 * sensor's lag, the finest the result can show — (at most MAX_PHI_SAMPLES points, straight lines between), with
 * its first and second integrals Ψ, Ψ₂ exact for those lines. A pulse made of straight lines
 * (rectangle, custom) then costs one Ψ₂ difference per corner per output sample:
 *   f′ = Σ_k (J_k δ(t − t_k) + Δm_k H(t − t_k))  ⇒  δT averaged over a step h is
 *   q0/(2π ρc u2 h) Σ_k [J_k ΔΨ + Δm_k ΔΨ₂](t − t_k) over [t − h/2, t + h/2].
 * A curved pulse (half-sine), or one with more corners than delay bins, is convolved on the output
 * grid instead: Φ averaged over each step against the step-averaged pulse's increments.
 */

/** Most Φ samples per arrival: Φ is smooth between its few kinks, so more buy no accuracy worth the time. */
export const MAX_PHI_SAMPLES = 512;
/** Fewest Φ samples, even for a far (nearly point-like) view of the face. */
const MIN_PHI_SAMPLES = 16;

export interface PistonCase {
  face: HeaterFace;
  /** Peak flux times the image's reflection product, W/m². */
  q0: number;
  /** Height of the sensor above the (image) face, m (≥ 0; 0: in the face's plane, a grazing image path). */
  z: number;
  u: number;
  rhoC: number;
  profile: PulseProfile;
  /**
   * Finest time detail the result can show, s: a quarter of the larger of the pulse’s effective rise and
   * the sensor's lag (a first-order lag smooths anything shorter). Φ is tabulated on this scale
   * (or the output step, if coarser), not finer.
   */
  detail_s: number;
}

/** A sensor point: its foot point (px, py) from the face centre, m, and its weight (weights add to 1). */
export interface FootPoint {
  px: number;
  py: number;
  w: number;
}

/** Φ and its integrals on a uniform τ grid starting at tau0. */
interface PhiTable {
  tau0: number;
  dtau: number;
  phi: Float64Array;
  psi: Float64Array;
  psi2: Float64Array;
}

/** Earliest and latest delay τ = R/u2 at which some part of the face reaches some sensor point, s. */
export function delaySpan(c: PistonCase, points: readonly FootPoint[]): { first_s: number; last_s: number } {
  let first = Number.POSITIVE_INFINITY;
  let last = 0;
  for (const p of points) {
    const reach = faceReach(c.face, p.px, p.py);
    first = Math.min(first, Math.hypot(c.z, reach.nearest_m) / c.u);
    last = Math.max(last, Math.hypot(c.z, reach.farthest_m) / c.u);
  }
  return { first_s: first, last_s: last };
}

function phiTable(c: PistonCase, points: readonly FootPoint[], span: { first_s: number; last_s: number }, step: number): PhiTable {
  const spread = span.last_s - span.first_s;
  const n = Math.min(MAX_PHI_SAMPLES, Math.max(MIN_PHI_SAMPLES, Math.ceil(spread / Math.max(step, c.detail_s))));
  const dtau = spread / n;
  const phi = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) {
    // The last node takes Φ just inside the farthest point: on a disk's axis Φ drops from 2π to 0
    // there at once, and the straight line to the next (zero) node must not smear that drop.
    const tau = i === n ? span.last_s - 1e-6 * dtau : span.first_s + i * dtau;
    const R = tau * c.u;
    const s = Math.sqrt(Math.max(0, R * R - c.z * c.z));
    let sum = 0;
    for (const p of points) sum += p.w * ringAngleOnFace(c.face, s, p.px, p.py);
    phi[i] = sum;
  }
  const psi = new Float64Array(n + 1);
  const psi2 = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) {
    const p0 = phi[i] as number;
    const p1 = phi[i + 1] as number;
    psi[i + 1] = (psi[i] as number) + (dtau * (p0 + p1)) / 2;
    psi2[i + 1] = (psi2[i] as number) + dtau * (psi[i] as number) + (dtau * dtau * (2 * p0 + p1)) / 6;
  }
  return { tau0: span.first_s, dtau, phi, psi, psi2 };
}

/** Ψ(τ) = ∫ Φ up to τ (τ absolute, s). */
function psiAt(tab: PhiTable, tau: number): number {
  const x = tau - tab.tau0;
  if (x <= 0) return 0;
  const n = tab.phi.length - 1;
  const i = Math.floor(x / tab.dtau);
  if (i >= n) return tab.psi[n] as number;
  const r = x - i * tab.dtau;
  const p0 = tab.phi[i] as number;
  return (tab.psi[i] as number) + p0 * r + (((tab.phi[i + 1] as number) - p0) * r * r) / (2 * tab.dtau);
}

/** Ψ₂(τ) = ∫ Ψ up to τ (τ absolute, s); grows linearly past the table. */
function psi2At(tab: PhiTable, tau: number): number {
  const x = tau - tab.tau0;
  if (x <= 0) return 0;
  const n = tab.phi.length - 1;
  const i = Math.floor(x / tab.dtau);
  if (i >= n) return (tab.psi2[n] as number) + (tab.psi[n] as number) * (x - n * tab.dtau);
  const r = x - i * tab.dtau;
  const p0 = tab.phi[i] as number;
  return (tab.psi2[i] as number) + (tab.psi[i] as number) * r + (p0 * r * r) / 2 + (((tab.phi[i + 1] as number) - p0) * r * r * r) / (6 * tab.dtau);
}

/**
 * Adds the piston's δT (K), averaged over each output step, to `values` sampled at
 * start_s + i·step_s. Time zero is the pulse onset.
 */
export function addPistonPulse(values: Float64Array, start_s: number, step_s: number, c: PistonCase, points: readonly FootPoint[]): void {
  const span = delaySpan(c, points);
  const tab = phiTable(c, points, span, step_s);
  const scale = c.q0 / (2 * Math.PI * c.rhoC * c.u);
  const h = step_s;
  const corners = c.profile.corners;
  const delayBins = Math.ceil((span.last_s - span.first_s) / h) + 2;
  if (corners && corners.t.length <= delayBins) {
    addByCorners(values, start_s, h, tab, corners, scale);
  } else {
    addByConvolution(values, start_s, h, tab, c.profile, scale);
  }
}

function addByCorners(values: Float64Array, start: number, h: number, tab: PhiTable, corners: { t: Float64Array; f: Float64Array }, scale: number): void {
  const { t, f } = corners;
  const k = t.length;
  // Jumps J (at the first and last corners if the pulse does not start or end at zero) and slope changes Δm.
  const jump = new Float64Array(k);
  const kink = new Float64Array(k);
  jump[0] = f[0] as number;
  jump[k - 1] = (jump[k - 1] as number) - (f[k - 1] as number);
  let previousSlope = 0;
  for (let i = 0; i < k; i++) {
    const slope = i + 1 < k ? ((f[i + 1] as number) - (f[i] as number)) / ((t[i + 1] as number) - (t[i] as number)) : 0;
    kink[i] = slope - previousSlope;
    previousSlope = slope;
  }
  const end = tab.tau0 + tab.dtau * (tab.phi.length - 1);
  // Once the last corner is past the table's end, a jump adds J·(Ψ(b) − Ψ(a)) = 0 (Ψ is constant
  // there) and a kink m·Ψ(end)·h, and the kinks sum to zero (the slope starts and ends at 0): the
  // rest of the grid (the sensor lag's tail) gets nothing from here.
  const quiet = end + (t[k - 1] as number) + h / 2;
  for (let n = 0; n < values.length; n++) {
    const tn = start + n * h;
    if (tn >= quiet) break;
    let acc = 0;
    for (let i = 0; i < k; i++) {
      const a = tn - h / 2 - (t[i] as number);
      const b = tn + h / 2 - (t[i] as number);
      if (b <= tab.tau0) break; // corners only get later: nothing has arrived from these yet
      const J = jump[i] as number;
      const m = kink[i] as number;
      if (J !== 0) acc += J * (psiAt(tab, b) - psiAt(tab, a));
      if (m !== 0) {
        // Past the table Ψ₂ is linear in τ with slope Ψ(end): the difference is exact and cheap.
        acc += m * (a >= end ? (tab.psi[tab.psi.length - 1] as number) * h : psi2At(tab, b) - psi2At(tab, a));
      }
    }
    values[n] = (values[n] as number) + (scale * acc) / h;
  }
}

function addByConvolution(values: Float64Array, start: number, h: number, tab: PhiTable, profile: PulseProfile, scale: number): void {
  const end = tab.tau0 + tab.dtau * (tab.phi.length - 1);
  const j0 = Math.floor(tab.tau0 / h);
  const bins = Math.max(1, Math.ceil(end / h) - j0);
  // Φ averaged over each delay bin [jh, (j+1)h].
  const phiBar = new Float64Array(bins);
  for (let j = 0; j < bins; j++) phiBar[j] = (psiAt(tab, (j0 + j + 1) * h) - psiAt(tab, (j0 + j) * h)) / h;
  const n0 = Math.round(start / h);
  const mMin = n0 - (j0 + bins - 1);
  const mMax = n0 + values.length - 1 - j0;
  const increments = new Float64Array(mMax - mMin + 1);
  for (let m = mMin; m <= mMax; m++) increments[m - mMin] = averageOverStep(profile, m * h, h) - averageOverStep(profile, (m - 1) * h, h);
  // The increments are zero before the pulse and after it (the sensor lag's tail): only the
  // products with a non-zero increment are summed, which leaves each sum as it was.
  let first = 0;
  while (first < increments.length && increments[first] === 0) first++;
  let last = increments.length - 1;
  while (last >= first && increments[last] === 0) last--;
  for (let i = 0; i < values.length; i++) {
    const base = n0 + i - j0 - mMin;
    const jFrom = Math.max(0, base - last);
    const jTo = Math.min(bins - 1, base - first);
    let acc = 0;
    for (let j = jFrom; j <= jTo; j++) acc += (phiBar[j] as number) * (increments[base - j] as number);
    values[i] = (values[i] as number) + scale * acc;
  }
}
