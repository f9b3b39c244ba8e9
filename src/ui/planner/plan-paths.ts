/*
 * Plan-file paths ("heater.riseTime_s", "sensors[2].lag_s") as the page labels them, so a message
 * from the schema or the kernel names the field the user sees.
 */

const TOP: Readonly<Record<string, string>> = {
  plan: 'Plan',
  name: 'Plan name',
  notes: 'Notes',
  bath: 'Bath',
  'bath.temperature_K': 'Bath temperature',
  'bath.vapourPressure_Pa': 'Vapour pressure',
  'bath.liquidDepth_m': 'Liquid depth',
  heater: 'Heater',
  'heater.geometry': 'Heater geometry',
  'heater.area_m2': 'Heater area',
  'heater.radius_m': 'Heater radius',
  'heater.power_W': 'Heater power',
  'heater.flux_W_m2': 'Heat flux',
  'heater.shape': 'Pulse shape',
  'heater.shape.custom': 'Pulse points',
  'heater.width_s': 'Pulse width',
  'heater.riseTime_s': 'Rise time',
  'heater.repetitionRate_Hz': 'Repetition rate',
  'heater.averages': 'Pulses averaged',
  sensors: 'Sensors',
  spacer: 'Spacer',
  'spacer.materialId': 'Spacer material',
  'spacer.measuredWarm': 'Measured warm',
  reflectors: 'Reflecting planes',
  echoOrder: 'Echo order',
  digitiser: 'Digitiser',
  'digitiser.sampleRate_Hz': 'Sample rate',
  'digitiser.recordLength_s': 'Record length',
  'digitiser.preTrigger_s': 'Pre-trigger',
  targets: 'Targets',
  'targets.snr': 'Target SNR',
  'targets.temperatureSd_K': 'Target temperature sd',
};

const SENSOR_FIELDS: Readonly<Record<string, string>> = {
  id: 'id',
  label: 'label',
  distance_m: 'distance',
  position_m: 'position',
  'position_m[0]': 'x',
  'position_m[1]': 'y',
  'position_m[2]': 'z',
  distanceSd_m: 'distance sd',
  area_m2: 'area',
  responsivity_V_K: 'responsivity',
  noise_V: 'noise',
  lag_s: 'lag',
};

const REFLECTOR_FIELDS: Readonly<Record<string, string>> = {
  label: 'label',
  axis: 'axis',
  position_m: 'position',
  reflection: 'reflection R',
};

/** The page's name for a plan-file path, or the path itself when it has none. */
export function describePlanPath(path: string): string {
  const top = TOP[path];
  if (top) return top;
  const sensor = /^sensors\[(\d+)\](?:\.(.+))?$/.exec(path);
  if (sensor) {
    const field = sensor[2] === undefined ? '' : ` ${SENSOR_FIELDS[sensor[2]] ?? sensor[2]}`;
    return `Sensor ${Number(sensor[1]) + 1}${field}`;
  }
  const plane = /^reflectors\[(\d+)\](?:\.(.+))?$/.exec(path);
  if (plane) {
    const field = plane[2] === undefined ? '' : ` ${REFLECTOR_FIELDS[plane[2]] ?? plane[2]}`;
    return `Plane ${Number(plane[1]) + 1}${field}`;
  }
  const point = /^heater\.shape\.custom\[(\d+)\](?:\[(\d)\])?$/.exec(path);
  if (point) {
    const part = point[2] === undefined ? '' : point[2] === '0' ? ' time' : ' amplitude';
    return `Pulse point ${Number(point[1]) + 1}${part}`;
  }
  return path;
}

/** "heater.riseTime_s: must be …" → "Rise time: must be …"; other text is returned as it is. */
export function describePlanMessage(message: string): string {
  const match = /^([A-Za-z_][\w.[\]]*): (.*)$/s.exec(message);
  if (!match) return message;
  const [, path = '', rest = ''] = match;
  return `${describePlanPath(path)}: ${rest}`;
}
