/**
 * Sekundo's property kernel: liquid helium-4 along the saturated vapour pressure, as functions of
 * T90 in kelvin, SI units throughout. Pure TypeScript: no React, no DOM, nothing outside this folder.
 */
export * from './constants';
export { ConvergenceError, NonFiniteInputError, OutOfRangeError, PhysicsError, requireInRange } from './errors';
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
