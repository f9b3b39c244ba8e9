import { normalCdf, normalMaximum } from './normal-maximum';
import { PEAK_FIT_LEVEL, PEAK_MAX_POINTS, type PickerKind, TEMPLATE_EDGE_FRACTION } from './pickers';
import type { PulseProfile } from './pulse-shape';
import type { SampledSignal } from './received-pulse';

/*
 * The analytic timing sd of each picker (src/physics/pickers.ts, as the converter calls them with a
 * heater channel, src/io/trace-pick.ts) for the planner's predicted pulse at one sensor: small-noise
 * error propagation through each picker's own rule, on the digitiser's samples.
 *
 * The samples. The trigger is not locked to the sample clock, so the samples fall at (k + φ)Δt
 * after the heater onset with φ uniform in [0, 1). The clean pulse is sampled at PHASES phases (the
 * prediction read between the planner's grid points linearly, as the rehearsal's records are); the
 * drive f(t) at the same instants (the heater channel shares the clock). For each phase:
 *  - d(φ): the picker's delay on the clean samples, measured like with like as the converter does;
 *  - v(φ): the variance the noise gives it, to first order in σ (σ: rms per sample of the averaged
 *    record).
 * σ_τ² = mean over φ of v(φ) + variance over φ of d(φ). The second part is the sampling term,
 * computed, not assumed: a sub-sample interpolating picker on an edge that spans several samples
 * has next to none (no Δt/√12 at high SNR), while an edge shorter than a sample gives about Δt/√12.
 * Derived here unless marked.
 *
 * threshold (first sample at or above baseline + kσ̂, linear interpolation with the sample before):
 *   the crossing of the line through (tᵢ₋₁, yᵢ₋₁ + nᵢ₋₁) and (tᵢ, yᵢ + nᵢ) moves by −[(1 − u)nᵢ₋₁ +
 *   u·nᵢ]/ṡ, ṡ = (yᵢ − yᵢ₋₁)/Δt, u ∈ [0, 1) the crossing's place between the samples; the level
 *   itself moves with the baseline's mean (σ²/N over N pre-trigger samples) and with k times the
 *   measured sd (k²σ²/(2N), the sd of a sample sd, common practice):
 *   v = σ²[(1 − u)² + u² + 1/N + k²/(2N)]/ṡ². Over a uniform u, (1 − u)² + u² averages 2/3: linear
 *   interpolation between two noisy samples beats one sample by √(3/2).
 * fraction (f × the largest sample, crossing on the leading edge below it, walked back from it):
 *   as threshold, the level moving by f·δ(max) and (1 − f)·δ(baseline):
 *   v = σ²[(1 − u)² + u² + (1 − f)²/N + f²·V_max]/ṡ², V_max the variance of the largest sample near
 *   the top in σ² (order statistics, normal-maximum.ts: 1 for a sharp peak, about 0.26 for a flat top
 *   of 40 samples). The delay counts from the drive's 50 % rise found the same way on the clean
 *   heater channel.
 * peak (least-squares parabola through the run of samples at or above half the largest around it,
 *   grown backwards then forwards to at most 201 intervals, its vertex; from the drive's centre at
 *   half height): with the run fixed, the vertex u* = −b/2c moves by the parabola's own error
 *   propagation (parabola.ts, Bevington & Robinson ch. 7): for a symmetric run this is the textbook
 *   σ_u = σ/(2|c|√Σ(uᵢ − ū)²) in sample units. That alone undershoots a rehearsal by ×1.5 on a flat
 *   top (tests/unit/picker-timing.test.ts), because the run is not fixed:
 *   - its end samples sit near the half level (0.5 × the largest sample, which sits μσ/2 above half
 *     the clean top, μ the mean shift of the maximum, normal-maximum.ts), and noise drops the last
 *     one out or takes the next one in. Each of those four samples changes status with probability
 *     p = Φ(−|y − level|/σ_level), σ_level = σ√(1 + V_max/4), and moves the vertex by Δ (the fit redone
 *     without or with it): the pick moves by pΔ on average (a phase-dependent shift, so it enters the
 *     sampling term) and spreads by p(1 − p)Δ² (independent toggles, first order);
 *   - when the top is broader than 201 intervals the run hangs on the largest sample, so where
 *     noise puts that sample moves the whole fit (the demo's b10 and b35x: ×4–5 without this).
 *     P(sample j is the largest) = ∫ φ(x − μⱼ) Πₖ≠ⱼ Φ(x − μₖ) dx; the pick's mean and spread are
 *     taken over those j, each with its fixed-run variance.
 * xcorr (the drive samples as template T, correlation C(L) = Σⱼ Tⱼ yⱼ₊ₗ, best lag refined by a
 *   parabola through three lags, offset = ½(C₋ − C₊)/D with D = C₋ − 2C₀ + C₊):
 *   δoffset = (δN − offset·δD)/D with N = ½(C₋ − C₊), and the noise of the three lags is correlated
 *   through the template: Cov(δCₐ, δC_b) = σ² R(a − b), R(d) = Σⱼ TⱼTⱼ₊d. So
 *   v = σ²Δt² Σₐ Σ_b gₐ g_b R(a − b), g = ((½, 0, −½) − offset·(1, −2, 1))/D. The baseline cancels
 *   (both g's sum to zero). For a template matched to the pulse and many samples per edge this
 *   reaches the Cramér–Rao bound σ/√Σṡ² (Kay 1993 §3.11, delay-bound.ts); the drive template is
 *   not matched to a pulse smoothed by the lag or spread by the heater's size, and then the figure
 *   is above the bound (σ√ΣṪ²/|ΣṪṡ| in the continuous limit).
 *
 * Validity: small noise. Below an averaged SNR of about 10 (`TIMING_SNR_LIMIT`) missed crossings,
 * noise crossings and noise peaks take over and these are lower limits. An edge that rises by less
 * than a noise sd per sample at the crossing is also outside the first-order picture (an earlier
 * sample can cross by noise alone); `edgeStepSigma` reports it, but the demo plan's sensors, with
 * such edges at 10 MS/s, rehearse within 25 % of these figures (tests/unit/picker-timing.test.ts),
 * so it raises no flag.
 */

/** Trigger phases sampled per sensor (evenly, at their centres): the sampling term to a few %. */
const PHASES = 8;
/**
 * Most samples per phase worked on (span plus the drive's length): the planner runs per keystroke
 * for up to 64 sensors. A longer span (a long pulse at a high rate) is thinned k-fold: the
 * correlation and the peak then see σ/√k per kept sample (k samples averaged carry the same
 * information about a pulse resolved at kΔt), the edge pickers σ (one crossing: σ/ṡ does not
 * depend on the rate once the edge is resolved). Approximate in that case, most for the peak,
 * whose run is counted in samples (common practice, no source).
 */
const MAX_SPAN_SAMPLES = 20_000;
/**
 * Averaged SNR below which the small-noise figures are lower limits: missed crossings, noise
 * crossings and noise peaks take over (common practice, no source; the rehearsal shows how far).
 */
export const TIMING_SNR_LIMIT = 10;

export interface PickerTimingInput {
  /** The predicted signal around the direct pulse, time from the heater onset (s), in the noise's unit. */
  span: SampledSignal;
  /** The drive's shape (the heater channel and the correlation's template). */
  profile: PulseProfile;
  /** Sign of the direct pulse's extreme. */
  polarity: 'positive' | 'negative';
  /** Noise rms per sample of the averaged record (after any dithered quantisation), > 0. */
  noise: number;
  /** Digitiser sample interval, s. */
  sampleInterval_s: number;
  /** Pre-trigger samples the baseline is measured on (≥ 8). */
  baselineSamples: number;
  /** Threshold picker's level, noise sd; fraction picker's share of the peak. */
  thresholdSigma: number;
  fraction: number;
  /** Quantisation step the clean record is rounded to when the noise does not dither it, or null. */
  roundingStep?: number | null;
  /** Interval of the heater channel's samples when it differs from the sensor's (a thinned span), s. */
  driveInterval_s?: number;
}

export type PickerTimingSds = Record<PickerKind, number | null>;

export interface PickerTiming {
  /** One-sigma timing of each picker, s (null: the picker finds no such feature on the clean pulse). */
  sd_s: PickerTimingSds;
  /** Rise per sample at the threshold and fraction crossings in noise sd (the smaller, over phases), or null. */
  edgeStepSigma: number | null;
  /** The thinning factor k (1: every sample; see MAX_SPAN_SAMPLES). */
  thinned: number;
}

interface PhaseSamples {
  /** Sample index of the first value (time (first + k + φ)Δt). */
  first: number;
  y: Float64Array;
  /** The drive at (j + φ)·driveStep_s (driveStep_s is Δt unless the span is thinned, see MAX_SPAN_SAMPLES). */
  drive: Float64Array;
  driveStep_s: number;
  phase: number;
}

function sampleAt(span: SampledSignal, t: number): number {
  const x = (t - span.start_s) / span.step_s;
  const n = span.values.length;
  if (x < 0 || x > n - 1) return 0;
  const k = Math.min(n - 2, Math.floor(x));
  const f = x - k;
  return (1 - f) * (span.values[k] as number) + f * (span.values[k + 1] as number);
}

function samples(input: PickerTimingInput, phase: number): PhaseSamples {
  const dt = input.sampleInterval_s;
  const sign = input.polarity === 'negative' ? -1 : 1;
  const span = input.span;
  const end = span.start_s + (span.values.length - 1) * span.step_s;
  const first = Math.ceil(span.start_s / dt - phase);
  const last = Math.floor(end / dt - phase);
  const n = Math.max(0, last - first + 1);
  const y = new Float64Array(n);
  const q = input.roundingStep ?? null;
  for (let k = 0; k < n; k++) {
    const v = sampleAt(span, (first + k + phase) * dt);
    y[k] = sign * (q ? q * Math.round(v / q) : v);
  }
  const driveStep = input.driveInterval_s ?? dt;
  const m = Math.ceil(input.profile.duration_s / driveStep) + 2;
  const drive = new Float64Array(m);
  for (let j = 0; j < m; j++) drive[j] = input.profile.value((j + phase) * driveStep);
  return { first, y, drive, driveStep_s: driveStep, phase };
}

function argmax(y: Float64Array): number {
  let best = 0;
  for (let i = 1; i < y.length; i++) if ((y[i] as number) > (y[best] as number)) best = i;
  return best;
}

/** Linear crossing of `level` between i − 1 and i: its place u in the interval and the rise per sample. */
function crossingAt(y: Float64Array, i: number, level: number): { u: number; rise: number } {
  const y0 = y[i - 1] as number;
  const rise = (y[i] as number) - y0;
  return { u: rise > 0 ? (level - y0) / rise : 1, rise };
}

/** The drive's 50 % rise and fall on the clean heater samples, s after the onset (pickers.ts heaterOnset / heaterCentre). */
function driveTimes(s: PhaseSamples): { rise_s: number; fall_s: number } | null {
  const c = driveCrossings(s.drive);
  return c ? { rise_s: (c.rise + s.phase) * s.driveStep_s, fall_s: (c.fall + s.phase) * s.driveStep_s } : null;
}

/** The drive's 50 % rise and fall in sample units from its first. */
function driveCrossings(drive: Float64Array): { rise: number; fall: number } | null {
  const iPeak = argmax(drive);
  const half = 0.5 * (drive[iPeak] as number);
  if (!(half > 0)) return null;
  let i = iPeak;
  while (i > 0 && (drive[i - 1] as number) >= half) i--;
  if (i === 0) return null;
  const r = crossingAt(drive, i, half);
  let j = iPeak;
  while (j < drive.length - 1 && (drive[j + 1] as number) >= half) j++;
  if (j >= drive.length - 1) return null;
  const v0 = drive[j] as number;
  const v1 = drive[j + 1] as number;
  const fall = v0 !== v1 ? j + (v0 - half) / (v0 - v1) : j + 1;
  return { rise: i - 1 + r.u, fall };
}

interface PhasePick {
  /** Delay, s. */
  delay_s: number;
  /** Variance from the noise, s². */
  variance_s2: number;
  /** Rise per sample at the crossing, in noise sd (edge pickers). */
  stepSigma?: number;
}

function edgePick(s: PhaseSamples, input: PickerTimingInput, kind: 'threshold' | 'fraction', vMax: number): PhasePick | null {
  const { y } = s;
  const sigma = input.noise;
  const N = Math.max(8, input.baselineSamples);
  let i: number;
  let levelVar: number;
  let level: number;
  if (kind === 'threshold') {
    const k = input.thresholdSigma;
    level = k * sigma;
    i = 0;
    while (i < y.length && (y[i] as number) < level) i++;
    if (i === 0 || i >= y.length) return null;
    levelVar = 1 / N + (k * k) / (2 * N);
  } else {
    const f = input.fraction;
    const iPeak = argmax(y);
    level = f * (y[iPeak] as number);
    if (!(level > 0)) return null;
    i = iPeak;
    while (i > 0 && (y[i - 1] as number) >= level) i--;
    if (i === 0) return null;
    levelVar = (1 - f) ** 2 / N + f * f * vMax;
  }
  const c = crossingAt(y, i, level);
  if (!(c.rise > 0)) return null;
  const onset = driveTimes(s);
  if (!onset) return null;
  const dt = input.sampleInterval_s;
  const t = (s.first + i - 1 + c.u + s.phase) * dt;
  const slope = c.rise / dt;
  const interpolation = (1 - c.u) ** 2 + c.u ** 2;
  return { delay_s: t - onset.rise_s, variance_s2: (sigma * sigma * (interpolation + levelVar)) / (slope * slope), stepSigma: c.rise / sigma };
}

/**
 * The least-squares parabola through y[lo..hi] at u = index − centre, its vertex u* = −b/2c and the
 * vertex's variance for noise σ per point, σ² gᵀ(XᵀX)⁻¹g with g the gradient of u* in (a, b, c) (parabola.ts does the
 * same; written out here because the planner calls it thousands of times per keystroke). Null
 * when the parabola opens upwards or the points do not fix it.
 */
function vertexOf(y: Float64Array, lo: number, hi: number, centre: number, sigma: number): { u: number; uVar: number } | null {
  if (hi - lo + 1 < 3) return null;
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let s4 = 0;
  let t0 = 0;
  let t1 = 0;
  let t2 = 0;
  for (let k = lo; k <= hi; k++) {
    const u = k - centre;
    const u2 = u * u;
    const v = y[k] as number;
    s0 += 1;
    s1 += u;
    s2 += u2;
    s3 += u2 * u;
    s4 += u2 * u2;
    t0 += v;
    t1 += v * u;
    t2 += v * u2;
  }
  // Inverse of the symmetric normal matrix [[s0, s1, s2], [s1, s2, s3], [s2, s3, s4]] by cofactors.
  const c00 = s2 * s4 - s3 * s3;
  const c01 = s2 * s3 - s1 * s4;
  const c02 = s1 * s3 - s2 * s2;
  const c11 = s0 * s4 - s2 * s2;
  const c12 = s1 * s2 - s0 * s3;
  const c22 = s0 * s2 - s1 * s1;
  const det = s0 * c00 + s1 * c01 + s2 * c02;
  if (!(Math.abs(det) > 0)) return null;
  const b = (c01 * t0 + c11 * t1 + c12 * t2) / det;
  const c = (c02 * t0 + c12 * t1 + c22 * t2) / det;
  if (!(c < 0) || !Number.isFinite(b)) return null;
  const gb = -1 / (2 * c);
  const gc = b / (2 * c * c);
  const variance = (sigma * sigma * (gb * gb * c11 + 2 * gb * gc * c12 + gc * gc * c22)) / det;
  const u = Math.max(lo - centre, Math.min(hi - centre, -b / (2 * c)));
  return { u, uVar: Math.max(0, variance) };
}

function peakPick(s: PhaseSamples, input: PickerTimingInput, top: { meanShift: number; variance: number }, chances: () => Float64Array): PhasePick | null {
  const { y } = s;
  const sigma = input.noise;
  const iPeak = argmax(y);
  const highest = y[iPeak] as number;
  if (!(highest > 0) || iPeak === 0 || iPeak === y.length - 1) return null;
  const level = PEAK_FIT_LEVEL * highest;
  const { lo, hi, capped } = peakRun(y, iPeak, level);
  const centre = driveTimes(s);
  if (!centre) return null;
  const dt = input.sampleInterval_s;
  const reference = (centre.rise_s + centre.fall_s) / 2 / dt;
  if (capped) return cappedPeak(s, input, top, reference, chances());
  const fixed = vertexOf(y, lo, hi, iPeak, sigma);
  if (!fixed) return null;
  // The run's ends toggle: p the chance a sample's status differs from the clean run's, against
  // the noisy level 0.5·max, whose mean sits μσ/2 above half the clean top (the maximum's bias).
  let shift = 0;
  let toggles = 0;
  if (!capped) {
    const noisyLevel = level + 0.5 * top.meanShift * sigma;
    const levelSd = sigma * Math.sqrt(1 + 0.25 * top.variance);
    const tries: [number, number, number, boolean][] = [
      [lo + 1, hi, lo, true],
      [lo - 1, hi, lo - 1, false],
      [lo, hi - 1, hi, true],
      [lo, hi + 1, hi + 1, false],
    ];
    for (const [a, b, which, inside] of tries) {
      if (a < 0 || b > y.length - 1 || a > iPeak - 1 || b < iPeak + 1) continue;
      const d = ((y[which] as number) - noisyLevel) / levelSd;
      const p = normalCdf(inside ? -d : d);
      if (p < 1e-6) continue;
      const other = vertexOf(y, a, b, iPeak, sigma);
      if (!other) continue;
      shift += p * (other.u - fixed.u);
      toggles += p * (1 - p) * (other.u - fixed.u) ** 2;
    }
  }
  const t = (s.first + iPeak + fixed.u + s.phase) * dt;
  return { delay_s: t + shift * dt - reference * dt, variance_s2: (fixed.uVar + toggles) * dt * dt };
}

/** The peak picker's run around `iPeak`: grown backwards, then forwards, to at most 201 intervals (pickers.ts). */
function peakRun(y: Float64Array, iPeak: number, level: number): { lo: number; hi: number; capped: boolean } {
  let lo = iPeak;
  let hi = iPeak;
  while (lo > 0 && hi - lo < PEAK_MAX_POINTS && (y[lo - 1] as number) >= level) lo--;
  while (hi < y.length - 1 && hi - lo < PEAK_MAX_POINTS && (y[hi + 1] as number) >= level) hi++;
  return { lo: Math.min(lo, iPeak - 1), hi: Math.max(hi, iPeak + 1), capped: hi - lo >= PEAK_MAX_POINTS };
}

/** Candidates for the largest sample kept at most (the strongest), when a broad top makes many. */
const MAX_PEAK_CANDIDATES = 16;

/** Width of the bins of gaps below the largest sample, σ (as in normal-maximum.ts). */
const WIN_BIN_SIGMAS = 0.05;
/** Gaps beyond this many σ below the largest cannot win. */
const WIN_GAP_SIGMAS = 6;

/**
 * P(a sample at gap d·σ below the largest is the largest of all, noise included), per bin of d:
 * ∫ φ(x + d) Πₖ Φ(x + dₖ) / Φ(x + d) dx over the samples' own gaps (order statistics; binned, so
 * thousands of samples on a flat top cost what a few do).
 */
function winChances(y: Float64Array, sigma: number): Float64Array {
  const highest = y[argmax(y)] as number;
  const counts = new Float64Array(Math.ceil(WIN_GAP_SIGMAS / WIN_BIN_SIGMAS) + 1);
  for (let j = 0; j < y.length; j++) {
    const d = (highest - (y[j] as number)) / sigma;
    if (d < WIN_GAP_SIGMAS) {
      const b = Math.round(d / WIN_BIN_SIGMAS);
      counts[b] = (counts[b] as number) + 1;
    }
  }
  const grid = 241;
  const h = 14 / (grid - 1);
  const chance = new Float64Array(counts.length);
  for (let g = 0; g < grid; g++) {
    const x = -7 + g * h;
    let all = 1;
    for (let b = 0; b < counts.length; b++) if ((counts[b] as number) > 0) all *= normalCdf(x + b * WIN_BIN_SIGMAS) ** (counts[b] as number);
    if (all === 0) continue;
    for (let b = 0; b < counts.length; b++) {
      if (!((counts[b] as number) > 0)) continue;
      const z = x + b * WIN_BIN_SIGMAS;
      const cdf = normalCdf(z);
      if (cdf > 0) chance[b] = (chance[b] as number) + (Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI)) * (all / cdf) * h;
    }
  }
  return chance;
}

/**
 * A top broader than the run (201 intervals): the run hangs on the largest sample, grown backwards
 * first, so where noise puts that sample moves the whole fit. P(sample j is the largest) =
 * ∫ φ(x − μⱼ) Πₖ≠ⱼ Φ(x − μₖ) dx (independent normals, order statistics); the pick's mean and
 * variance are taken over those j, each with its fixed-run vertex variance. Derived here.
 */
function cappedPeak(s: PhaseSamples, input: PickerTimingInput, top: { meanShift: number; variance: number }, reference: number, binWeight: Float64Array): PhasePick | null {
  const { y } = s;
  const sigma = input.noise;
  const highest = y[argmax(y)] as number;
  const gaps: { j: number; d: number }[] = [];
  for (let j = 0; j < y.length; j++) {
    const d = (highest - (y[j] as number)) / sigma;
    if (d < WIN_GAP_SIGMAS) gaps.push({ j, d });
  }
  const weights = gaps.map((c) => binWeight[Math.min(binWeight.length - 1, Math.round(c.d / WIN_BIN_SIGMAS))] as number);
  let strongest = 0;
  for (const w of weights) strongest = Math.max(strongest, w);
  // Every candidate that can win, thinned evenly (each kept one standing for `stride`) when many.
  const able = [...gaps.keys()].filter((k) => (weights[k] as number) > 1e-4 * strongest);
  const stride = Math.max(1, Math.ceil(able.length / MAX_PEAK_CANDIDATES));
  const order = able.filter((_, n) => n % stride === 0);
  let total = 0;
  const picks: { t: number; w: number; v: number }[] = [];
  const level = PEAK_FIT_LEVEL * (highest + top.meanShift * sigma);
  for (const k of order) {
    const j = (gaps[k] as { j: number }).j;
    if (j === 0 || j === y.length - 1) continue;
    const run = peakRun(y, j, level);
    const vertex = vertexOf(y, run.lo, run.hi, j, sigma);
    if (!vertex) continue;
    const w = (weights[k] as number) * stride;
    picks.push({ t: j + vertex.u, w, v: vertex.uVar });
    total += w;
  }
  if (!(total > 0)) return null;
  let mean = 0;
  for (const p of picks) mean += (p.w / total) * p.t;
  let variance = 0;
  for (const p of picks) variance += (p.w / total) * ((p.t - mean) ** 2 + p.v);
  const dt = input.sampleInterval_s;
  return { delay_s: (s.first + mean + s.phase - reference) * dt, variance_s2: variance * dt * dt };
}

/** The converter's template: the drive samples above 2 % of its peak, with one sample before (trace-pick.ts heaterTemplate). */
function template(drive: Float64Array): { values: Float64Array; first: number } | null {
  const top = drive[argmax(drive)] as number;
  if (!(top > 0)) return null;
  const edge = TEMPLATE_EDGE_FRACTION * top;
  let k0 = 0;
  while (k0 < drive.length && (drive[k0] as number) <= edge) k0++;
  if (k0 >= drive.length) return null;
  k0 = Math.max(0, k0 - 1);
  let k1 = k0 + 1;
  while (k1 < drive.length - 1 && (drive[k1] as number) > edge) k1++;
  return { values: drive.slice(k0, k1 + 1), first: k0 };
}

function correlation(y: Float64Array, t: Float64Array, lag: number): number {
  let acc = 0;
  const m = t.length;
  for (let j = 0; j < m; j++) {
    const k = lag + j;
    if (k >= 0 && k < y.length) acc += (t[j] as number) * (y[k] as number);
  }
  return acc;
}

/** The lag (template start against the samples) of the correlation's highest point: a coarse search, then halving strides. */
function bestLag(y: Float64Array, t: Float64Array, near: number | null): number {
  const m = t.length;
  let best: number;
  let stride: number;
  if (near === null) {
    stride = Math.max(1, Math.floor(m / 8));
    best = 0;
    let bestScore = Number.NEGATIVE_INFINITY;
    for (let lag = -m + 1; lag < y.length; lag += stride) {
      const c = correlation(y, t, lag);
      if (c > bestScore) {
        bestScore = c;
        best = lag;
      }
    }
  } else {
    best = near;
    stride = 2;
  }
  let score = correlation(y, t, best);
  for (; stride >= 1; stride = stride === 1 ? 0 : Math.max(1, Math.floor(stride / 2))) {
    for (let moved = true; moved; ) {
      moved = false;
      for (const lag of [best - stride, best + stride]) {
        const c = correlation(y, t, lag);
        if (c > score) {
          score = c;
          best = lag;
          moved = true;
        }
      }
    }
  }
  return best;
}

function xcorrPick(s: PhaseSamples, input: PickerTimingInput, near: number | null): (PhasePick & { lag: number }) | null {
  const dt = input.sampleInterval_s;
  let drive = s.drive;
  if (s.driveStep_s !== dt) {
    // The template lives on the sensor's own samples.
    drive = new Float64Array(Math.ceil(input.profile.duration_s / dt) + 2);
    for (let j = 0; j < drive.length; j++) drive[j] = input.profile.value((j + s.phase) * dt);
  }
  const made = template(drive);
  if (!made) return null;
  const T = made.values;
  const L = bestLag(s.y, T, near);
  const cm = correlation(s.y, T, L - 1);
  const c0 = correlation(s.y, T, L);
  const cp = correlation(s.y, T, L + 1);
  const D = cm - 2 * c0 + cp;
  if (!(D < 0)) return null;
  const raw = (0.5 * (cm - cp)) / D;
  const offset = Math.max(-0.5, Math.min(0.5, raw));
  const R = [0, 1, 2].map((d) => {
    let acc = 0;
    for (let j = 0; j + d < T.length; j++) acc += (T[j] as number) * (T[j + d] as number);
    return acc;
  });
  const g = [0.5 - offset, 2 * offset, -0.5 - offset].map((x) => x / D);
  let v = 0;
  for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) v += (g[a] as number) * (g[b] as number) * (R[Math.abs(a - b)] as number);
  // Template sample j sits at (first_T + j + φ)Δt and meets signal sample L + j at (first_y + L + j + φ)Δt.
  const delay = (s.first + L - made.first + offset) * dt;
  return { delay_s: delay, variance_s2: input.noise * input.noise * Math.max(0, v) * dt * dt, lag: L };
}

function combine(picks: (PhasePick | null)[]): number | null {
  const good = picks.filter((p): p is PhasePick => p !== null);
  // A feature the picker misses at most phases is not one it times.
  if (good.length < picks.length / 2) return null;
  let mean = 0;
  let noise = 0;
  for (const p of good) {
    mean += p.delay_s / good.length;
    noise += p.variance_s2 / good.length;
  }
  let sampling = 0;
  for (const p of good) sampling += (p.delay_s - mean) ** 2 / good.length;
  return Math.sqrt(noise + sampling);
}

/**
 * Each picker's one-sigma timing, s, for the predicted pulse `input.span` in noise `input.noise`
 * per sample of the averaged record (see the derivations above). Cheap: PHASES passes over the
 * span's samples, a handful of parabola fits and a correlation refined around one lag. Small-noise
 * figures: below `TIMING_SNR_LIMIT` or an edge step under `TIMING_STEP_LIMIT_SIGMA` they are lower
 * limits. Returns null figures for a picker that finds no feature (a threshold above the pulse).
 */
export function pickerTiming(input: PickerTimingInput): PickerTiming {
  const span = input.span;
  const samplesInSpan = ((span.values.length - 1) * span.step_s + input.profile.duration_s) / input.sampleInterval_s;
  if (samplesInSpan > MAX_SPAN_SAMPLES) {
    // Thinned k-fold (see MAX_SPAN_SAMPLES): the correlation and the peak with σ/√k, the edges with σ.
    const k = Math.ceil(samplesInSpan / MAX_SPAN_SAMPLES);
    const coarse = {
      ...input,
      sampleInterval_s: k * input.sampleInterval_s,
      baselineSamples: Math.max(8, Math.floor(input.baselineSamples / k)),
      // The heater channel keeps a step that resolves the drive (its onset and centre), within budget.
      driveInterval_s: Math.min(k * input.sampleInterval_s, Math.max(input.sampleInterval_s, input.profile.duration_s / 2000)),
    };
    const edges = pickerTimingOnSamples(coarse);
    const averaged = pickerTimingOnSamples({ ...coarse, noise: input.noise / Math.sqrt(k) });
    return { sd_s: { threshold: edges.sd_s.threshold, fraction: edges.sd_s.fraction, peak: averaged.sd_s.peak, xcorr: averaged.sd_s.xcorr }, edgeStepSigma: edges.edgeStepSigma, thinned: k };
  }
  return pickerTimingOnSamples(input);
}

function pickerTimingOnSamples(input: PickerTimingInput): PickerTiming {
  const phases = Array.from({ length: PHASES }, (_, p) => (p + 0.5) / PHASES);
  const sampled = phases.map((phase) => samples(input, phase));
  const none: PickerTiming = { sd_s: { threshold: null, fraction: null, peak: null, xcorr: null }, edgeStepSigma: null, thinned: 1 };
  if (!(input.noise > 0) || sampled.every((s) => s.y.length < 3)) return none;
  // The top's noise: the largest of the samples near the peak (one phase; a flat top hardly depends on it).
  const middle = sampled[PHASES >> 1] as PhaseSamples;
  const top = normalMaximum(middle.y, input.noise);
  const vMax = top.variance;
  const threshold = sampled.map((s) => edgePick(s, input, 'threshold', vMax));
  const fraction = sampled.map((s) => edgePick(s, input, 'fraction', vMax));
  // Chances of each gap below the top to hold the largest sample: one phase (a broad top hardly depends on it), when needed.
  let chances: Float64Array | null = null;
  const peak = sampled.map((s) => peakPick(s, input, top, () => {
    chances ??= winChances(middle.y, input.noise);
    return chances;
  }));
  const first = xcorrPick(middle, input, null);
  const xcorr = sampled.map((s) => (s === middle ? first : first ? xcorrPick(s, input, first.lag + middle.first - s.first) : null));
  let step: number | null = null;
  for (const p of [...threshold, ...fraction]) if (p?.stepSigma !== undefined) step = step === null ? p.stepSigma : Math.min(step, p.stepSigma);
  return { sd_s: { threshold: combine(threshold), fraction: combine(fraction), peak: combine(peak), xcorr: combine(xcorr) }, edgeStepSigma: step, thinned: 1 };
}
