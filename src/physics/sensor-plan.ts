import type { HeaterFace } from './heater-face';
import { faceReach } from './heater-face';
import type { SourceImage, Vec3 } from './image-sources';
import { planeUnder } from './plan-geometry';
import type { PlanInput, PlanSensor } from './plan-input';
import type { EchoArrival, PlanePlanResult, PlanWarning, SensorPlanResult, UnreachableReason } from './plan-result';
import { predictionSpan } from './picker-features';
import { pickerTiming, TIMING_SNR_LIMIT } from './picker-timing';
import { fmt, sensorWarnings } from './plan-warnings';
import type { HeliumProperties } from './properties';
import type { PulseProfile } from './pulse-shape';
import { type Medium, type ReceivedPulse, receivedPulse, type SampledSignal } from './received-pulse';
import { secondSoundRelativeSd, shortestDistanceForTarget, temperatureSpread } from './temperature-resolution';

/*
 * One sensor of the plan: the direct pulse and its echoes (image sources), signal and SNR, timing
 * and how finely the delay pins the temperature, and the sensor's own warnings.
 */

/**
 * The planner's headline timing sd is the fraction picker's at half the peak, the converter's
 * default (src/cli/commands/trace.ts, the trace lab); the others stand in when it finds no feature.
 */
const HEADLINE_ORDER = ['fraction', 'threshold', 'xcorr', 'peak'] as const;
/** The converter's defaults: threshold 5 noise sd, fraction 0.5 of the peak (pickers.ts). */
export const DEFAULT_THRESHOLD_SIGMA = 5;
export const DEFAULT_FRACTION = 0.5;

/** Time steps per effective rise time in the predicted waveforms. */
const STEPS_PER_RISE = 10;
/**
 * Time steps per sensor time constant: a first-order lag smooths anything shorter, and at this
 * many the peak of a short pulse seen through the lag is right to about 1 % (error ≈ step/(2τ)).
 */
const STEPS_PER_LAG = 50;
/** Most samples in one predicted arrival; the step grows instead. */
const MAX_SAMPLES_PER_ARRIVAL = 1500;
/**
 * Longest distance offered for a target, m: past any second-sound cell in a cryostat insert, and
 * far beyond the path this sensor's timing was worked out for (common practice, no source).
 */
export const MAX_TARGET_DISTANCE_M = 1;

export interface SensorContext {
  plan: PlanInput;
  sensor: PlanSensor;
  /** Cold position, m. */
  position: Vec3;
  pathSd: number;
  props: HeliumProperties;
  medium: Medium | null;
  profile: PulseProfile;
  flux: number;
  face: HeaterFace | null;
  images: readonly SourceImage[];
  planes: readonly PlanePlanResult[];
  warnings: PlanWarning[];
  faceDeltaT: number | null;
  shockDistance: number | null;
  /** A plane stands between heater and sensor: no wave reaches it. */
  blocked: boolean;
}

function peakAbs(values: Float64Array): number {
  let m = 0;
  for (const v of values) m = Math.max(m, Math.abs(v));
  return m;
}

/** Sums signals on a common step into non-overlapping segments (signals on one step grid). */
export function mergeSegments(signals: SampledSignal[]): SampledSignal[] {
  if (signals.length === 0) return [];
  const step = (signals[0] as SampledSignal).step_s;
  const spans = signals
    .map((s) => ({ s, i0: Math.round(s.start_s / step), i1: Math.round(s.start_s / step) + s.values.length - 1 }))
    .sort((a, b) => a.i0 - b.i0);
  const groups: (typeof spans)[] = [];
  let lastEnd = Number.NEGATIVE_INFINITY;
  for (const span of spans) {
    const last = groups[groups.length - 1];
    if (last && span.i0 <= lastEnd + 1) last.push(span);
    else groups.push([span]);
    lastEnd = last && span.i0 <= lastEnd + 1 ? Math.max(lastEnd, span.i1) : span.i1;
  }
  return groups.map((group) => {
    let i0 = Number.POSITIVE_INFINITY;
    let i1 = Number.NEGATIVE_INFINITY;
    for (const g of group) {
      i0 = Math.min(i0, g.i0);
      i1 = Math.max(i1, g.i1);
    }
    const values = new Float64Array(i1 - i0 + 1);
    for (const g of group) {
      const offset = g.i0 - i0;
      const v = g.s.values;
      for (let k = 0; k < v.length; k++) values[offset + k] = (values[offset + k] as number) + (v[k] as number);
    }
    return { start_s: i0 * step, step_s: step, values };
  });
}

/** Peak over steepest slope of a pulse (its segments on one grid), s; null without a slope. */
function steepestEdge(segments: SampledSignal[], peak: number): number | null {
  let slope = 0;
  for (const w of mergeSegments(segments)) {
    for (let k = 1; k < w.values.length; k++) slope = Math.max(slope, Math.abs((w.values[k] as number) - (w.values[k - 1] as number)) / w.step_s);
  }
  return slope > 0 && peak > 0 ? peak / slope : null;
}

/** Shortest straight path from the heater's face (or centre) to a position, m. */
function directPath(plan: PlanInput, face: HeaterFace | null, p: Vec3): number {
  if (plan.heater.geometry === 'plane-wave') return p[2];
  if (!face) return Math.hypot(...p);
  return Math.hypot(p[2], faceReach(face, p[0], p[1]).nearest_m);
}

export function sensorResult(c: SensorContext): SensorPlanResult {
  const { plan, sensor, props, profile, position } = c;
  const h = plan.heater;
  const sensorRadius = Math.sqrt(sensor.area_m2 / Math.PI);
  const directLength = directPath(plan, c.face, position);
  const under = planeUnder(position, c.planes);
  const base: SensorPlanResult = {
    id: sensor.id,
    label: sensor.label,
    pathLength_m: directLength,
    pathLengthSd_m: c.pathSd,
    firstSoundArrival_s: directLength / props.firstSound_m_s + sensor.lag_s,
    secondSoundArrival_s: null,
    amplitude_K: null,
    signal_V: null,
    snrSingle: null,
    snrAveraged: null,
    pulsesForTargetSnr: null,
    echoes: [],
    waveform: [],
    timingSd_s: null,
    timingSdByPicker_s: null,
    timingLowerLimit: false,
    temperatureSd_K: null,
    temperatureChangeSd_K: null,
    temperatureSdWithModel_K: null,
    insensitive: false,
    meetsTarget: null,
    targetKind: plan.targets.temperatureKind,
    shortestDistanceForTarget_m: null,
    shortestDistanceUnreachable: null,
    shortestDistanceNote: '',
    onPlane: under?.label ?? null,
  };
  if (!c.medium || c.blocked) return base;
  const medium = c.medium;
  const u2 = medium.secondSound_m_s;

  // Time step: resolve the edges, but keep each arrival's samples bounded.
  let spread = 0;
  if (c.face) {
    const reach = faceReach(c.face, position[0], position[1]);
    spread = (Math.hypot(position[2], reach.farthest_m + sensorRadius) - directLength) / u2;
  }
  const window = profile.duration_s + spread + 6 * sensor.lag_s;
  const step = Math.max(profile.effectiveRise_s / STEPS_PER_RISE, sensor.lag_s / STEPS_PER_LAG, window / MAX_SAMPLES_PER_ARRIVAL);

  const arrivals: { image: SourceImage; pulse: ReceivedPulse }[] = c.images.map((image) => ({
    image,
    pulse: receivedPulse(
      { geometry: h.geometry, peakFlux_W_m2: c.flux, peakPower_W: h.power_W, face: c.face, mount: h.mount, profile, centre: image.position, amplitudeFactor: image.factor },
      { position, radius_m: sensorRadius, lag_s: sensor.lag_s },
      medium,
      step,
    ),
  }));
  const direct = arrivals[0] as (typeof arrivals)[number];
  // Group arrivals that coincide (a reflector through the sensor, or symmetric paths) with each other.
  const groups: (typeof arrivals)[] = [];
  for (const a of [...arrivals].sort((x, y) => x.pulse.arrival_s - y.pulse.arrival_s)) {
    const last = groups[groups.length - 1];
    if (last && Math.abs((last[0] as (typeof arrivals)[number]).pulse.arrival_s - a.pulse.arrival_s) < step / 2) last.push(a);
    else groups.push([a]);
  }
  const grouped = groups.map((g) => {
    const merged = mergeSegments(g.map((x) => x.pulse.signal));
    let amplitude = 0;
    for (const m of merged) amplitude = Math.max(amplitude, peakAbs(m.values));
    return {
      members: g,
      arrival_s: (g[0] as (typeof arrivals)[number]).pulse.arrival_s + sensor.lag_s,
      amplitude,
      order: Math.min(...g.map((x) => x.image.order)),
    };
  });
  const directGroup = grouped.find((g) => g.members.includes(direct)) as (typeof grouped)[number];
  const echoes: EchoArrival[] = grouped
    .filter((g) => g !== directGroup && g.order <= plan.echoOrder && g.arrival_s > directGroup.arrival_s)
    .map((g) => ({ order: g.order, arrival_s: g.arrival_s, amplitude_K: g.amplitude, path: (g.members[0] as (typeof arrivals)[number]).image.path }));
  const waveform = mergeSegments(arrivals.map((a) => a.pulse.signal));

  const amplitude = directGroup.amplitude;
  const arrival = directGroup.arrival_s;
  const signal = amplitude * sensor.responsivity_V_K;
  const snrSingle = signal / sensor.noise_V;
  const snrAveraged = snrSingle * Math.sqrt(h.averages);
  // The edge the pickers meet: the direct pulse's height over its steepest slope on the predicted
  // waveform (the old √(rise² + lag² + spread²) overstated it 3–30-fold where the lag or the
  // heater's size rounds the pulse, and is kept only where the prediction has no slope).
  const riseAtSensor = steepestEdge(directGroup.members.map((m) => m.pulse.signal), amplitude) ?? Math.hypot(profile.effectiveRise_s, sensor.lag_s, spread);
  const travel = arrival - sensor.lag_s;
  const pickers = snrAveraged > 0 ? directPulseTiming(plan, sensor, profile, waveform, { arrival, window, travel, amplitude }) : null;
  const headline = pickers ? (HEADLINE_ORDER.map((k) => pickers.sd_s[k]).find((v) => v !== null) ?? null) : null;
  const timing = headline !== null ? timingFigures(plan, { snrSingle, timingSd: headline, travel, pathSd: c.pathSd, directLength }) : null;
  const lowerLimit = pickers !== null && snrAveraged < TIMING_SNR_LIMIT;

  sensorWarnings(c.warnings, plan, sensor, c, { arrival, amplitude, echoes, snrAveraged, pulsesForTarget: timing?.pulsesForTarget ?? null, riseAtSensor, spreadT: timing?.spreadT ?? null, directLength, spread });

  return {
    ...base,
    secondSoundArrival_s: arrival,
    amplitude_K: amplitude,
    signal_V: signal,
    snrSingle,
    snrAveraged,
    pulsesForTargetSnr: timing?.pulsesForTarget ?? null,
    echoes,
    waveform,
    timingSd_s: timing?.timingSd ?? null,
    timingSdByPicker_s: pickers?.sd_s ?? null,
    timingLowerLimit: lowerLimit,
    temperatureSd_K: timing?.spreadT.sd_K ?? null,
    temperatureChangeSd_K: timing?.changeT.sd_K ?? null,
    temperatureSdWithModel_K: timing?.withModel.sd_K ?? null,
    insensitive: timing?.spreadT.insensitive ?? false,
    meetsTarget: timing?.meets ?? null,
    shortestDistanceForTarget_m: timing?.shortest ?? null,
    shortestDistanceUnreachable: timing ? timing.unreachable : 'no-signal',
    shortestDistanceNote: timing ? timing.note : 'Not reachable: the predicted signal is zero.',
  };
}

/**
 * Each picker's timing on the predicted pulse (direct pulse and any echo inside its window), in the
 * averaged record's noise, with the converter's default settings (picker-timing.ts).
 */
function directPulseTiming(plan: PlanInput, sensor: PlanSensor, profile: PulseProfile, waveform: SampledSignal[], f: { arrival: number; window: number; travel: number; amplitude: number }) {
  // The rehearsal's search window (rehearse-run.ts: the pulse's own length either side of the
  // arrival, from no earlier than half of it) to the pulse's end, and the drive's length past it for
  // the correlation's template.
  // Two of the planner's steps before the pulse at least: each point averages the signal over its step.
  const gridStep = waveform[0]?.step_s ?? 0;
  const from = Math.min(f.travel - 2 * gridStep, Math.max(0.5 * f.travel, f.arrival - f.window));
  const span = predictionSpan(waveform, from, f.arrival + f.window + profile.duration_s);
  if (!span) return null;
  let peak = 0;
  for (const v of span.values) if (Math.abs(v) > Math.abs(peak)) peak = v;
  const d = plan.digitiser;
  return pickerTiming({
    span,
    profile,
    polarity: peak < 0 ? 'negative' : 'positive',
    noise: sensor.noise_V / sensor.responsivity_V_K / Math.sqrt(plan.heater.averages),
    sampleInterval_s: 1 / d.sampleRate_Hz,
    baselineSamples: Math.round(d.preTrigger_s * d.sampleRate_Hz),
    thresholdSigma: DEFAULT_THRESHOLD_SIGMA,
    fraction: DEFAULT_FRACTION,
  });
}

/** Timing and temperature resolution of one sensor with a signal above zero and a timing sd. */
function timingFigures(plan: PlanInput, f: { snrSingle: number; timingSd: number; travel: number; pathSd: number; directLength: number }) {
  const T = plan.temperature_K;
  const pulsesForTarget = Math.ceil((plan.targets.snr / f.snrSingle) ** 2);
  const timingSd = f.timingSd;
  // The relative part of the speed's sd: the travel time alone (the lag is no part of the path).
  const relTiming = timingSd / f.travel;
  const relSpeedSd = Math.hypot(f.pathSd / f.directLength, relTiming);
  // Relative speed uncertainties above 1 mean the reading says nothing; they are capped there.
  const spreadT = temperatureSpread(T, Math.min(1, relSpeedSd));
  const changeT = temperatureSpread(T, Math.min(1, relTiming));
  const withModel = temperatureSpread(T, Math.min(1, Math.hypot(relSpeedSd, secondSoundRelativeSd(T))));
  const kind = plan.targets.temperatureKind;
  const judged = kind === 'absolute' ? withModel.sd_K : changeT.sd_K;
  const target = plan.targets.temperatureSd_K;
  const meets = judged <= target;
  let shortest: number | null = null;
  let unreachable: UnreachableReason | null = null;
  let note = '';
  const what = kind === 'absolute' ? 'an absolute reading (u₂ curve included)' : 'a change between readings';
  if (spreadT.insensitive) {
    unreachable = 'insensitive';
    note = `Not reachable here: u₂ has an extremum near ${fmt(T, 4)} K, so the delay hardly changes with temperature at any distance.`;
  } else if (Number.isFinite(timingSd)) {
    const found = shortestDistanceForTarget(T, { sd_K: target, kind }, Math.min(timingSd, 1e3), f.pathSd, MAX_TARGET_DISTANCE_M);
    if (found.ok) shortest = found.distance_m;
    else {
      unreachable = found.reason;
      note =
        found.reason === 'model-sd'
          ? `Not reachable for ${what}: the u₂ curve's own uncertainty gives ${fmt(found.figure * 1e3, 2)} mK at ${fmt(T, 4)} K, at or above the ${fmt(target * 1e3, 2)} mK target, and no distance removes it (a change target can still be met).`
          : found.reason === 'insensitive'
            ? `Not reachable here: u₂ has an extremum at ${fmt(T, 4)} K.`
            : `Not reachable for ${what}: it would take about ${fmt(found.figure, 2)} m with this sensor's timing, beyond the ${MAX_TARGET_DISTANCE_M} m a second-sound path in an insert can have (and the signal falls with distance).`;
    }
  } else {
    unreachable = 'no-signal';
    note = 'Not reachable: the timing is undefined.';
  }
  return { pulsesForTarget: Number.isFinite(pulsesForTarget) ? pulsesForTarget : null, timingSd, spreadT, changeT, withModel, meets, shortest, unreachable, note };
}
