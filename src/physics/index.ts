/**
 * Sekundo's property kernel: liquid helium-4 along the saturated vapour pressure, as functions of
 * T90 in kelvin, SI units throughout. Pure TypeScript: no React, no DOM, nothing outside this folder.
 */
export * from './constants';
export { ConvergenceError, InvalidInputError, NonFiniteInputError, OutOfRangeError, PhysicsError, requireInRange } from './errors';
export { density } from './density';
export { entropy } from './entropy';
export { firstSound } from './first-sound';
export { normalFraction, superfluidFraction } from './fractions';
export { specificHeat } from './heat-capacity';
export { landauGas, landauSecondSound, type LandauGas } from './landau';
export { nonlinearity } from './nonlinearity';
export {
  type HeliumProperties,
  heliumProperties,
  NO_SECOND_SOUND_REASON,
  NO_VAPOUR_PRESSURE_REASON,
  PROPERTIES_RANGE_K,
} from './properties';
export {
  SECOND_SOUND_CRITICAL_JOIN_K,
  SECOND_SOUND_MEASURED_MIN_K,
  type SecondSoundRegion,
  secondSound,
  secondSoundRegion,
  secondSoundSd,
  secondSoundSlope,
} from './second-sound';
export { DB1998, ITS90, LANDAU, PROPERTY_CATALOGUE, type PropertyInfo, type PropertyKey } from './catalogue';
export { twoFluidSecondSound } from './two-fluid';
export {
  ITS90_PRESSURE_RANGE_PA,
  ITS90_RANGE_K,
  temperatureFromVapourPressure,
  VAPOUR_PRESSURE_RANGE_PA,
  VAPOUR_TEMPERATURE_RANGE_K,
  type VapourPressureResult,
  type VapourPressureScale,
  vapourPressure,
} from './vapour-pressure';
export { coldLength, type ColdLength, PATH_LENGTH_RANGE_M, SPACER_MATERIALS, type SpacerMaterial, spacerMaterial } from './contraction';
export { imageSources, MAX_ECHO_ORDER, type ReflectingPlane, type SourceImage, type Vec3 } from './image-sources';
export { computePlan, computePlanSteps } from './planner';
export { type CachedSensor, SensorResultCache } from './sensor-cache';
export {
  checkPlanInput,
  heaterArea_m2,
  heaterFace,
  PLAN_LIMITS,
  type PlanHeater,
  type PlanInput,
  type PlanReflector,
  type PlanSensor,
  type TemperatureTargetKind,
} from './plan-input';
export type {
  EchoArrival,
  HeaterPlanResult,
  PlanePlanResult,
  PlanResult,
  PlanWarning,
  SensorPlanResult,
  UnreachableReason,
  WarningCode,
} from './plan-result';
export {
  COUNTERFLOW_CAUTION_OF_U2,
  COUNTERFLOW_NOTE_M_S,
  COUNTERFLOW_STOP_OF_U2,
  LAMBDA_SHIFT_K_PER_PA,
  LARGE_AMPLITUDE_K,
  SAMPLES_PER_EDGE,
  STRONG_FLUX_CAUTION_OF_LIMIT,
} from './plan-warnings';
export { DEFAULT_FRACTION, DEFAULT_THRESHOLD_SIGMA, MAX_TARGET_DISTANCE_M } from './sensor-plan';
export { ON_PLANE_M } from './plan-geometry';
export {
  faceArea,
  faceReach,
  type HeaterFace,
  nearestEdge_m,
  planeWaveRange_m,
  ringAngleInsideDisk,
  ringAngleInsideRectangle,
  ringAngleOnFace,
} from './heater-face';
export { addPistonPulse, type FootPoint, MAX_PHI_SAMPLES, type PistonCase } from './piston-response';
export {
  GORTER_MELLINK_A_M_S_KG,
  gorterMellinkConstant,
  heatConductivityFunctionUnchecked,
  strongHeatingFlux,
  timeToLambda,
} from './gorter-mellink';
export { KAPITZA_CONDUCTANCE_W_M2K4, kapitzaConductance, type WallReflection, wallReflection } from './wall-reflection';
export { CUSTOM_PULSE_MAX_POINTS, PULSE_WIDTH_RANGE_S, type PulseProfile, type PulseShape, pulseProfile } from './pulse-shape';
export {
  type HeaterGeometry,
  type Medium,
  type PointMount,
  type PulseSource,
  type ReceivedPulse,
  receivedPulse,
  type SampledSignal,
  type SensorPoint,
} from './received-pulse';
export {
  secondSoundCurvature,
  secondSoundRelativeSd,
  shortestDistanceForResolution,
  type ShortestDistance,
  shortestDistanceForTarget,
  type TemperatureSpread,
  temperatureSpread,
} from './temperature-resolution';
export { calibratePathFromSweep, type PathCalibration, type SweepPoint } from './calibrate-path';
export {
  type Choice,
  type ChoiceRule,
  chooseAlongSeries,
  chooseCandidate,
  distanceInSd,
  EVIDENCE_SD_LIMITS,
  type SeriesAmbiguity,
  type SeriesChoice,
  type SeriesChoiceBy,
  type SeriesChooser,
  seriesChooser,
} from './choose-candidate';
export { type DistanceDelay, type DistanceFit, fitDistances } from './fit-distances';
export {
  type Branch,
  checkDelayReading,
  convertDelay,
  DELAY_LIMITS,
  type DelayConversion,
  type DelayReading,
  SPEED_RANGE_M_S,
  type TemperatureCandidate,
  temperatureCandidates,
} from './invert-delay';
export {
  type Baseline,
  baselineOf,
  heaterCentre,
  heaterOnset,
  heaterStart,
  MIN_BASELINE_SAMPLES,
  type Pick,
  PICKER_KINDS,
  PICKER_LIMITS,
  type PickerKind,
  type PickOptions,
  pickArrival,
  requireInsideWindow,
  TEMPLATE_EDGE_FRACTION,
  timeText,
  type Trace,
  uniformStep,
} from './pickers';
export { SECOND_SOUND_EXTREMA, type SpeedExtremum } from './second-sound-extrema';
export { INTERVAL_K, type IntervalReach, speedBandTemperatures, type TemperatureInterval } from './temperature-interval';
export {
  candidateWarnings,
  EVIDENCE_LIMIT_SD,
  evidenceWarning,
  type ReadingWarning,
  type ReadingWarningCode,
  speedSigmasFromTurn,
} from './reading-warnings';
export { type ConfidenceRegion, type LocateOptions, type LocateResult, LOCATE_SPEED_RANGE_M_S, locateSource, type SensorArrival, speedPriorAt } from './locate-source';
export type { SpeedPrior } from './arrival-fit';
export { bestAddedSensor, type LayoutOptions, type LayoutScore, layoutQuality, type SensorPlacement, sensorPlaceAllowed } from './layout-quality';
export { insideBody, type SurfaceConstraint } from './surface-constraint';
export { requireSeed, SEED_RANGE, SeededRandom } from './seeded-random';
export {
  addSampled,
  cleanChannel,
  DEFAULT_RECORD_SETTINGS,
  driveChannel,
  EXACT_SHOTS_LIMIT,
  noiseFreeRecord,
  RECORD_SETTING_LIMITS,
  type RecordModel,
  type RecordSettings,
  recordModel,
  recordTimes,
  scopeRange,
  type SensorRecordModel,
  type SyntheticRecord,
  syntheticRecord,
} from './synthetic-record';
export { delayTemperature, type RehearsalSensorSummary, SD_RATIO_NOTE, type SensorPicks, summariseSensor } from './rehearsal-summary';
export { driveCentre, driveHalfRise, type FeatureSettings, featureDelay, predictionSpan } from './picker-features';
export { delayBound } from './delay-bound';
export { type PickerTiming, type PickerTimingInput, type PickerTimingSds, pickerTiming, TIMING_SNR_LIMIT } from './picker-timing';
export { normalCdf, normalMaximum } from './normal-maximum';
export {
  MUTUAL_FRICTION_B_POWER_LAW,
  MUTUAL_FRICTION_B_POWER_LAW_FROM_K,
  MUTUAL_FRICTION_B_PRIME_POWER_LAW,
  MUTUAL_FRICTION_B_PRIME_POWER_LAW_FROM_K,
  MUTUAL_FRICTION_RANGE_K,
  mutualFrictionB,
  mutualFrictionBPrime,
} from './mutual-friction';
export { HELIUM4_ATOM_MASS_KG, PLANCK_J_S, QUANTUM_OF_CIRCULATION_M2_S } from './quantum-of-circulation';
export {
  type AmplitudeReading,
  type LineDensity,
  lineDensityFromAmplitude,
  lineDensityFromWidth,
  lineDensityGeometry,
  TANGLE_GEOMETRIES,
  type TangleGeometry,
  type TangleGeometryInfo,
} from './line-density';
export {
  coldGap,
  DETECTION_SD,
  FRESNEL_CAUTION,
  FRESNEL_NOTE,
  modeFrequency,
  planResonator,
  RESONATOR_LIMITS,
  type ResonatorMode,
  type ResonatorNote,
  type ResonatorPlan,
  type ResonatorPlanInput,
} from './resonator-modes';
export { FIT_MAX_ITERATIONS, fitResonance, type ResonanceFit, type ResonanceWarning, resonanceAt, SWEEP_MIN_POINTS, type SweepData } from './resonance-fit';
export {
  type ModeFromNeighbour,
  modeFromNeighbour,
  type ResonanceReading,
  RESONANCE_LIMITS,
  type ResonanceTemperature,
  temperatureFromResonance,
} from './resonance-temperature';
export { analyseLockin, LOCKIN_MAX_ROWS, type LockinOptions, type LockinRecord, type LockinSeries, noiseFromDifferences } from './lockin-inverse';
