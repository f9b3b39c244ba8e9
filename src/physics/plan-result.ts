import type { PickerKind } from './pickers';
import type { HeliumProperties } from './properties';
import type { SampledSignal } from './received-pulse';
import type { TemperatureTargetKind } from './plan-input';

/* What the measurement planner returns: per heater, per plane, per sensor, and its warnings. */

export type WarningCode =
  | 'no-second-sound'
  | 'model-region'
  | 'near-lambda'
  | 'lambda-head'
  | 'large-amplitude'
  | 'shock'
  | 'strong-flux'
  | 'counterflow'
  | 'behind-plane'
  | 'plane-through-heater'
  | 'echo-overlap'
  | 'range-ambiguity'
  | 'record-too-short'
  | 'coarse-sampling'
  | 'bath-heating'
  | 'low-snr'
  | 'insensitive';

export interface PlanWarning {
  code: WarningCode;
  severity: 'info' | 'caution' | 'stop';
  message: string;
  /** The number behind the warning and the limit it crossed, in SI units. */
  value: number;
  limit: number;
  sensorId: string | null;
}

export interface EchoArrival {
  order: number;
  arrival_s: number;
  amplitude_K: number;
  path: readonly string[];
}

/** Why the shortest distance for the target is not given. */
export type UnreachableReason = 'model-sd' | 'insensitive' | 'beyond-range' | 'no-signal';

export interface SensorPlanResult {
  id: string;
  label: string;
  /** Cold path length (shortest, heater face to sensor), m. */
  pathLength_m: number;
  /** One-sigma uncertainty of that length (measurement and contraction), m. */
  pathLengthSd_m: number;
  /** First-sound arrival including the sensor lag, s after the pulse onset. */
  firstSoundArrival_s: number;
  /** Second-sound arrival including the sensor lag, s after the pulse onset; null in He I or when no wave reaches it. */
  secondSoundArrival_s: number | null;
  /** Peak |δT| of the direct pulse at the sensor, K. */
  amplitude_K: number | null;
  signal_V: number | null;
  snrSingle: number | null;
  snrAveraged: number | null;
  pulsesForTargetSnr: number | null;
  echoes: EchoArrival[];
  /** Predicted δT(t) at the sensor, as non-overlapping segments in time order, K. */
  waveform: SampledSignal[];
  /**
   * One-sigma arrival time of one averaged reading, s: the fraction picker at half the peak (the
   * converter's default picker) on the predicted pulse (`timingSdByPicker_s.fraction`, picker-timing.ts).
   */
  timingSd_s: number | null;
  /**
   * One-sigma arrival time of one averaged reading for each picker at the converter's defaults
   * (threshold 5σ, fraction 0.5, peak, cross-correlation with the drive), s; null without a signal,
   * and per picker null when the pulse has no such feature (a threshold above its peak).
   */
  timingSdByPicker_s: Record<PickerKind, number | null> | null;
  /**
   * Whether the timing figures are small-noise lower limits rather than estimates: the SNR after
   * averaging is below 10 (picker-timing.ts); missed crossings and noise peaks then widen the spread.
   */
  timingLowerLimit: boolean;
  /** One-sigma temperature from timing and distance, K. */
  temperatureSd_K: number | null;
  /**
   * One-sigma of a temperature change between readings, from timing alone, K: the distance error
   * is the same for every reading, so changes are resolved better than the absolute value.
   */
  temperatureChangeSd_K: number | null;
  /** The absolute sd with the u2 table's own uncertainty added, K. */
  temperatureSdWithModel_K: number | null;
  insensitive: boolean;
  /** Whether the sd the target is judged by (see `targetKind`) is at or below the target; null without a signal. */
  meetsTarget: boolean | null;
  /** absolute: judged by `temperatureSdWithModel_K`; change: by `temperatureChangeSd_K`. */
  targetKind: TemperatureTargetKind;
  /** Shortest distance that reaches the target with this sensor's timing, m; null when not reachable. */
  shortestDistanceForTarget_m: number | null;
  /** Why no shortest distance is given (null when one is). */
  shortestDistanceUnreachable: UnreachableReason | null;
  /** One line saying why, with its number (empty when reachable). */
  shortestDistanceNote: string;
  /** The sensor lies on a reflecting plane: it sees (1 + R) times the incident wave. */
  onPlane: string | null;
}

/** A reflecting plane as used: cold position, R and where R comes from. */
export interface PlanePlanResult {
  label: string;
  axis: 'x' | 'y' | 'z';
  /** Cold position, m. */
  position_m: number;
  reflection: number;
  /** solid-wall: (Z − h)/(Z + h); measured: the user's R; heater-plate: the heater's own wall (added when not listed). */
  source: 'solid-wall' | 'measured' | 'heater-plate';
  /** One line: the reason for R. */
  note: string;
}

export interface HeaterPlanResult {
  flux_W_m2: number;
  power_W: number;
  energyPerPulse_J: number;
  averagePower_W: number;
  /** δT of a plane wave at the heater face, q/(ρ c_p u2), K; null in He I. */
  faceDeltaT_K: number | null;
  counterflowVelocity_m_s: number | null;
  shockDistance_m: number | null;
  /** Which edge of the pulse steepens (leading where α2 > 0, below about 1.88–1.90 K); null in He I. */
  shockEdge: 'leading' | 'trailing' | null;
  effectiveRise_s: number;
  duration_s: number;
  /** Distance along the axis up to which the plane-wave value holds for the whole pulse, m; null without a face (a point source, or the plane-wave limit itself). */
  planeWaveRange_m: number | null;
  /** The edge that sets it, m (disk radius, or half the rectangle's shorter side). */
  planeWaveEdge_m: number | null;
  /** Flux at which the heater face reaches Tλ within the pulse (Gorter–Mellink, estimate), W/m²; null in He I. */
  strongHeatingFlux_W_m2: number | null;
  /** Z = ρ c_p u2, W/(m²·K); h the Kapitza conductance used; null in He I. */
  wallImpedance_W_m2K: number | null;
  kapitzaConductance_W_m2K: number | null;
  /** R of a solid wall at this temperature; null in He I. */
  wallReflection: number | null;
}

export interface PlanResult {
  temperature_K: number;
  properties: HeliumProperties;
  heater: HeaterPlanResult;
  /** Relative heater flux f(t) for the timeline. */
  heaterPulse: SampledSignal;
  planes: PlanePlanResult[];
  sensors: SensorPlanResult[];
  warnings: PlanWarning[];
  record: { start_s: number; end_s: number; sampleInterval_s: number };
  /** Hydrostatic pressure of the liquid over the setup, Pa. */
  headPressure_Pa: number;
}
