import { InvalidInputError, requireInRange } from './errors';
import { faceReach } from './heater-face';
import { heaterFace, type PlanInput } from './plan-input';
import type { PlanResult, SensorPlanResult } from './plan-result';
import { pulseProfile, type PulseProfile } from './pulse-shape';
import type { SampledSignal } from './received-pulse';
import { SeededRandom } from './seeded-random';

/*
 * Synthetic digitiser records of a planned measurement: what the scope would show for one averaged
 * reading, per sensor, with the plan's own numbers.
 *  - Signal: the planner's predicted δT(t) at each sensor (finite heater, sensor lag, echoes:
 *    `SensorPlanResult.waveform`) times the responsivity, in volts, read at each sample instant by
 *    linear interpolation of the planner's grid. Optionally a first-sound pickup: a copy of the
 *    drive's time course through the sensor's lag at the first-sound arrival, scaled to a given
 *    share of the direct second-sound peak (the plan format has no such figure; it is a rehearsal
 *    setting, off by default).
 *  - Time: the file's axis is −pre-trigger + i/rate. The trigger is not locked to the sample clock,
 *    so the heater onset falls at a random phase within one sample, drawn per record (uniform);
 *    the shots averaged into one record share it. This is what puts the Δt/√12 of sampling into
 *    the timing.
 *  - Noise: white and Gaussian, the sensor's single-shot rms per sample divided by √(pulses
 *    averaged), drawn per record, channel and block of 4096 samples from the seeded stream
 *    (seed, trial, channel, block).
 *  - Quantisation (when a resolution in bits is given): each shot is rounded to the digitiser's step
 *    q = 2·range/2^bits and clipped to ±range before averaging. Up to 8 shots are simulated one by
 *    one; beyond that the averaged record is clean + noise of rms √(σ² + q²/12)/√N when σ ≥ q/2 (the
 *    noise dithers the rounding, common practice, no source) and the rounded clean record + σ/√N
 *    otherwise (rounding without dither does not average away). Without a range, each channel's
 *    range is the smallest of 1-2-5 × 10ⁿ V that holds its peak plus 5 single-shot sd, as a person
 *    setting up the scope would choose it (common practice, no source).
 *  - Heater channel: the relative drive f(t) (0–1), noise-free, at the same instants.
 */

/** How the rehearsal's records are made, beyond the plan. */
export interface RecordSettings {
  /** Digitiser resolution, bits (4–24), or null: no quantisation. */
  resolutionBits: number | null;
  /** Full scale ±range of every sensor channel, V, or null: each channel's own range (see above). */
  range_V: number | null;
  /** First-sound pickup as a share of the direct second-sound peak (0: none), 0–10. */
  firstSoundPickup: number;
}

export const RECORD_SETTING_LIMITS = {
  resolutionBits: [4, 24],
  range_V: [1e-9, 1e3],
  firstSoundPickup: [0, 10],
  /** Samples per record: 20 million (160 MB per channel) keeps a trial within a browser's memory. */
  samples: [16, 20_000_000],
} as const;

export const DEFAULT_RECORD_SETTINGS: RecordSettings = { resolutionBits: null, range_V: null, firstSoundPickup: 0 };

/** Shots simulated one by one when quantising; more are averaged in the dithered approximation. */
export const EXACT_SHOTS_LIMIT = 8;

/** One sensor as the record generator sees it. */
export interface SensorRecordModel {
  id: string;
  label: string;
  /** Planned second-sound arrival (direct path + sensor lag), s after the heater onset. */
  planned_s: number;
  /** Sensor lag, s (the offset t0 a lab subtracts). */
  lag_s: number;
  /** Cold path length, m, and the transit it takes at the plan's u₂ (path / u₂), s. */
  pathLength_m: number;
  transit_s: number;
  /** Predicted signal, V, on the planner's grids (direct pulse, echoes and pickup). */
  signal: SampledSignal[];
  /** The planner's prediction alone (direct pulse and echoes, no pickup), V, on its own grid. */
  prediction: SampledSignal[];
  /** Largest |signal| of the direct pulse, V, and its sign. */
  peak_V: number;
  polarity: 'positive' | 'negative';
  /** Single-shot noise rms, V; rms of the averaged record, V. */
  shotNoise_V: number;
  recordNoise_V: number;
  /** ± full scale, V, and the quantisation step, V (null: not quantised). */
  range_V: number | null;
  step_V: number | null;
  /** How long the direct pulse lasts at this sensor: drive + spread over the face + 6 lags, s. */
  pulseWindow_s: number;
  plan: SensorPlanResult;
}

export interface RecordModel {
  /** First sample's time on the file's axis (−pre-trigger), s; sample interval, s; samples per record. */
  start_s: number;
  step_s: number;
  samples: number;
  shots: number;
  profile: PulseProfile;
  sensors: SensorRecordModel[];
  settings: RecordSettings;
  seed: number;
}

/** One synthetic record (one averaged reading): the file's time axis, the drive and each sensor, V. */
export interface SyntheticRecord {
  trial: number;
  time_s: Float64Array;
  heater: Float64Array;
  sensors: Float64Array[];
  /** Where the heater onset falls on the file's axis, s (−phase × Δt). */
  onset_s: number;
}

/** 1-2-5 × 10ⁿ V: the smallest that holds `level`. */
export function scopeRange(level_V: number): number {
  const decade = 10 ** Math.floor(Math.log10(level_V));
  for (const m of [1, 2, 5, 10]) if (m * decade >= level_V) return m * decade;
  return 10 * decade;
}

function checkSettings(s: RecordSettings): void {
  const L = RECORD_SETTING_LIMITS;
  if (s.resolutionBits !== null) {
    requireInRange('resolution', s.resolutionBits, L.resolutionBits[0], L.resolutionBits[1], 'bits');
    if (!Number.isInteger(s.resolutionBits)) throw new InvalidInputError('resolution', `must be a whole number of bits, ${L.resolutionBits[0]}–${L.resolutionBits[1]}`);
  }
  if (s.range_V !== null) requireInRange('range', s.range_V, L.range_V[0], L.range_V[1], 'V');
  requireInRange('first-sound pickup', s.firstSoundPickup, L.firstSoundPickup[0], L.firstSoundPickup[1], 'of the second-sound peak');
}

/** The drive f(t) through a first-order lag, on a grid fine enough for its edges, starting at the onset. */
function laggedDrive(profile: PulseProfile, lag_s: number): SampledSignal {
  const step = Math.max(Math.min(profile.effectiveRise_s, lag_s > 0 ? lag_s : Number.POSITIVE_INFINITY) / 10, (profile.duration_s + 6 * lag_s) / 20000);
  const n = Math.ceil((profile.duration_s + 6 * lag_s) / step) + 2;
  const values = new Float64Array(n);
  const k = lag_s > 0 ? 1 - Math.exp(-step / lag_s) : 1;
  let y = 0;
  for (let i = 0; i < n; i++) {
    const t = i * step;
    const f = (profile.integral(t + step / 2) - profile.integral(t - step / 2)) / step;
    y += k * (f - y);
    values[i] = y;
  }
  return { start_s: 0, step_s: step, values };
}

function scaled(signal: SampledSignal, factor: number, shift_s = 0): SampledSignal {
  const values = new Float64Array(signal.values.length);
  for (let i = 0; i < values.length; i++) values[i] = (signal.values[i] as number) * factor;
  return { start_s: signal.start_s + shift_s, step_s: signal.step_s, values };
}

/**
 * Everything the records of a plan share: the time axis, the drive, each sensor's predicted
 * signal in volts, its noise and range. Sensors without a second-sound arrival (He I, behind a
 * plane, no signal) are left out. Throws InvalidInputError naming the field for bad settings, a
 * record longer than 20 million samples, or a plan with no sensor to rehearse.
 */
export function recordModel(plan: PlanInput, result: PlanResult, settings: RecordSettings, seed: number): RecordModel {
  checkSettings(settings);
  const d = plan.digitiser;
  const step_s = 1 / d.sampleRate_Hz;
  const samples = Math.round(d.recordLength_s * d.sampleRate_Hz);
  if (samples < RECORD_SETTING_LIMITS.samples[0] || samples > RECORD_SETTING_LIMITS.samples[1]) {
    throw new InvalidInputError(
      'record',
      `record length × sample rate gives ${samples} samples; a rehearsal takes ${RECORD_SETTING_LIMITS.samples[0]} to ${RECORD_SETTING_LIMITS.samples[1].toLocaleString('en')} per record`,
    );
  }
  const h = plan.heater;
  const profile = pulseProfile(h.shape, h.width_s, h.riseTime_s);
  const face = heaterFace(h);
  const u2 = result.properties.secondSound_m_s;
  const sensors: SensorRecordModel[] = [];
  plan.sensors.forEach((input, i) => {
    const s = result.sensors[i] as SensorPlanResult;
    if (s.secondSoundArrival_s === null || s.amplitude_K === null || !(s.amplitude_K > 0) || u2 === null) return;
    const volts = input.responsivity_V_K;
    const prediction = s.waveform.map((w) => scaled(w, volts));
    const signal = [...prediction];
    let spread = 0;
    if (face) {
      const p = input.position_m;
      const r = Math.sqrt(input.area_m2 / Math.PI);
      spread = Math.max(0, (Math.hypot(p[2], faceReach(face, p[0], p[1]).farthest_m + r) - s.pathLength_m) / u2);
    }
    const pulseWindow = profile.duration_s + spread + 6 * input.lag_s;
    // The direct pulse's extreme (its sign sets the pickers' polarity, as a person would set it).
    let peak = 0;
    for (const w of signal) {
      for (let k = 0; k < w.values.length; k++) {
        const t = w.start_s + k * w.step_s;
        if (t < s.secondSoundArrival_s - input.lag_s || t > s.secondSoundArrival_s + pulseWindow) continue;
        const v = w.values[k] as number;
        if (Math.abs(v) > Math.abs(peak)) peak = v;
      }
    }
    if (settings.firstSoundPickup > 0) {
      signal.push(scaled(laggedDrive(profile, input.lag_s), settings.firstSoundPickup * Math.abs(peak), s.firstSoundArrival_s - input.lag_s));
    }
    const recordNoise = input.noise_V / Math.sqrt(h.averages);
    let range: number | null = null;
    let stepV: number | null = null;
    if (settings.resolutionBits !== null) {
      let top = 0;
      for (const w of signal) for (const v of w.values) top = Math.max(top, Math.abs(v));
      range = settings.range_V ?? scopeRange(top + 5 * input.noise_V);
      stepV = (2 * range) / 2 ** settings.resolutionBits;
    }
    sensors.push({
      id: s.id,
      label: s.label,
      planned_s: s.secondSoundArrival_s,
      lag_s: input.lag_s,
      pathLength_m: s.pathLength_m,
      transit_s: s.pathLength_m / u2,
      signal,
      prediction,
      peak_V: Math.abs(peak),
      polarity: peak < 0 ? 'negative' : 'positive',
      shotNoise_V: input.noise_V,
      recordNoise_V: recordNoise,
      range_V: range,
      step_V: stepV,
      pulseWindow_s: pulseWindow,
      plan: s,
    });
  });
  if (sensors.length === 0) throw new InvalidInputError('sensors', 'no sensor receives a second-sound pulse in this plan, so there is nothing to rehearse');
  return { start_s: -d.preTrigger_s, step_s, samples, shots: h.averages, profile, sensors, settings, seed };
}

/**
 * Adds `signal` (linear between its samples, zero outside) read at t = first_s + i·step_s into `out`,
 * for the indices `from`–`to` (default: all).
 */
export function addSampled(out: Float64Array, first_s: number, step_s: number, signal: SampledSignal, from = 0, to = out.length - 1): void {
  const v = signal.values;
  const n = v.length;
  if (n === 0) return;
  const end = signal.start_s + (n - 1) * signal.step_s;
  const i0 = Math.max(from, Math.ceil((signal.start_s - first_s) / step_s));
  const i1 = Math.min(to, Math.floor((end - first_s) / step_s));
  for (let i = i0; i <= i1; i++) {
    const x = (first_s + i * step_s - signal.start_s) / signal.step_s;
    const k = Math.min(n - 2, Math.max(0, Math.floor(x)));
    const f = x - k;
    out[i] = (out[i] as number) + (1 - f) * (v[k] as number) + f * (n > 1 ? (v[k + 1] as number) : 0);
  }
}

/**
 * The clean (noise-free) signal of sensor `s` at the record's instants, with the heater onset at
 * `onset_s` on the file's axis; only inside `ranges` when given (zero elsewhere).
 */
export function cleanChannel(model: RecordModel, s: SensorRecordModel, onset_s: number, ranges: NoiseRanges = null): Float64Array {
  const out = new Float64Array(model.samples);
  // Physical time since the onset of sample i: start + i·Δt − onset.
  for (const w of s.signal) {
    if (ranges === null) addSampled(out, model.start_s - onset_s, model.step_s, w);
    else for (const [a, z] of ranges) addSampled(out, model.start_s - onset_s, model.step_s, w, a, z);
  }
  return out;
}

function quantise(x: number, range: number, q: number): number {
  const clipped = Math.max(-range, Math.min(range - q, x));
  return q * Math.round(clipped / q);
}

/**
 * Samples per noise block: each block of a channel draws from its own stream (seed, trial, channel,
 * block), so a caller that reads only some samples (the rehearsal's pickers read the pre-trigger
 * part and the search window) can draw only the blocks it needs and get the same numbers there.
 */
export const NOISE_BLOCK = 4096;

/** Sample ranges [first, last] (inclusive) that must carry noise; null: all of them. */
export type NoiseRanges = readonly (readonly [number, number])[] | null;

function blockNeeded(b: number, n: number, ranges: NoiseRanges): boolean {
  if (ranges === null) return true;
  const lo = b * NOISE_BLOCK;
  const hi = Math.min(n, lo + NOISE_BLOCK) - 1;
  return ranges.some(([a, z]) => a <= hi && z >= lo);
}

/** Adds white noise of rms `sd` in blocks (see {@link NOISE_BLOCK}), only to the blocks `ranges` touch. */
function addBlockNoise(values: Float64Array, sd: number, key: { seed: number; trial: number; channel: number }, ranges: NoiseRanges): void {
  const n = values.length;
  for (let b = 0; b * NOISE_BLOCK < n; b++) {
    if (!blockNeeded(b, n, ranges)) continue;
    const random = new SeededRandom(key.seed, key.trial, key.channel, b);
    const end = Math.min(n, (b + 1) * NOISE_BLOCK);
    for (let i = b * NOISE_BLOCK; i < end; i++) values[i] = (values[i] as number) + sd * random.normal();
  }
}

/** The averaged record of one channel from its clean samples (which it may overwrite). */
function noisyChannel(model: RecordModel, s: SensorRecordModel, clean: Float64Array, key: { seed: number; trial: number; channel: number }, ranges: NoiseRanges): Float64Array {
  const n = clean.length;
  if (s.step_V === null || s.range_V === null) {
    addBlockNoise(clean, s.recordNoise_V, key, ranges);
    return clean;
  }
  const q = s.step_V;
  const range = s.range_V;
  const shots = model.shots;
  const out = new Float64Array(n);
  if (shots <= EXACT_SHOTS_LIMIT) {
    // Shot by shot, every sample (rounding is not linear, so each shot is made whole).
    const random = new SeededRandom(key.seed, key.trial, key.channel);
    const shot = new Float64Array(n);
    for (let k = 0; k < shots; k++) {
      shot.set(clean);
      random.addNormal(shot, s.shotNoise_V);
      for (let i = 0; i < n; i++) out[i] = (out[i] as number) + quantise(shot[i] as number, range, q) / shots;
    }
    return out;
  }
  const dithered = s.shotNoise_V >= q / 2;
  for (let i = 0; i < n; i++) {
    const c = Math.max(-range, Math.min(range - q, clean[i] as number));
    out[i] = dithered ? c : quantise(c, range, q);
  }
  addBlockNoise(out, dithered ? Math.sqrt(s.shotNoise_V ** 2 + (q * q) / 12) / Math.sqrt(shots) : s.recordNoise_V, key, ranges);
  return out;
}

/** Time axis of a record on the file's clock, s. */
export function recordTimes(model: RecordModel): Float64Array {
  const t = new Float64Array(model.samples);
  for (let i = 0; i < t.length; i++) t[i] = model.start_s + i * model.step_s;
  return t;
}

/** The drive f(t) at the record's instants with the onset at `onset_s` on the file's axis. */
export function driveChannel(model: RecordModel, onset_s: number): Float64Array {
  const out = new Float64Array(model.samples);
  const first = model.start_s - onset_s;
  const i0 = Math.max(0, Math.floor(-first / model.step_s));
  const i1 = Math.min(model.samples - 1, Math.ceil((model.profile.duration_s - first) / model.step_s));
  for (let i = i0; i <= i1; i++) out[i] = model.profile.value(first + i * model.step_s);
  return out;
}

/**
 * Record number `trial` (0-based) of the model: the same seed and trial give the same numbers,
 * whatever other trials were made. Streams: (seed, trial, 0) for the trigger phase, (seed, trial,
 * 1 + sensor index, block) for each sensor's noise. `ranges` (per sensor, sample ranges) makes only
 * the samples a caller reads: the signal inside them and the noise of the blocks they touch, the
 * same numbers there as in the whole record (elsewhere the channel is left unmade).
 */
export function syntheticRecord(model: RecordModel, trial: number, times: Float64Array = recordTimes(model), ranges: readonly NoiseRanges[] | null = null): SyntheticRecord {
  const phase = new SeededRandom(model.seed, trial, 0).uniform();
  const onset_s = -phase * model.step_s;
  const sensors = model.sensors.map((s, j) => noisyChannel(model, s, cleanChannel(model, s, onset_s, ranges?.[j] ?? null), { seed: model.seed, trial, channel: 1 + j }, ranges?.[j] ?? null));
  return { trial, time_s: times, heater: driveChannel(model, onset_s), sensors, onset_s };
}

/**
 * A record without noise (trigger phase 0), for what the pickers find on the bare prediction. The
 * pre-trigger samples alternate ±(the record's noise rms), so a picker measures that noise (and a
 * threshold picker its kσ level) while the signal itself stays clean.
 */
export function noiseFreeRecord(model: RecordModel, times: Float64Array = recordTimes(model)): SyntheticRecord {
  const sensors = model.sensors.map((s) => {
    const clean = cleanChannel(model, s, 0);
    for (let i = 0; i < clean.length && (times[i] as number) < 0; i++) clean[i] = (clean[i] as number) + (i % 2 === 0 ? 1 : -1) * s.recordNoise_V;
    return clean;
  });
  return { trial: -1, time_s: times, heater: driveChannel(model, 0), sensors, onset_s: 0 };
}
