/**
 * `sekundo locate FILE (--temperature <T> | --speed <u>) [--fit-speed] [--arrival-sd <σt>] …`:
 * where a heat source (a quench spot, a calibration heater) sits, from second-sound arrival times
 * at several sensors (src/io/locate-csv for the file, kernel locateSource for the fit).
 */
import {
  arrivalsOf,
  LOCATE_ARRIVAL_SD_RANGE_S,
  LOCATE_POSITION_RANGE_M,
  type LocateSensor,
  parseLocateCsv,
  type SensorOutcome,
  type SensorStatus,
  sensorOutcomes,
} from '../../io/locate-csv';
import { parseQuantity, QuantityParseError } from '../../io/quantity';
import {
  LOCATE_SPEED_RANGE_M_S,
  type LocateResult,
  locateSource,
  MODEL_MIN_K,
  PhysicsError,
  requireInRange,
  type SurfaceConstraint,
  secondSound,
  speedPriorAt,
  T_LAMBDA_K,
  type Vec3,
} from '../../physics';
import type { BooleanFlag, NumberFlag, OperandSpec, ParsedArgs, QuantityFlag, TextFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { ABSENT, alignTable, formatPlain, formatSignificant } from '../format';
import { computeFor } from '../kernel-call';
import { fromFile, readInputFile } from './convert-shared';
import { formatKelvin, JSON_FLAG, writeJson } from './shared';

/** Default one-sigma timing uncertainty, s (5 µs: a few samples of a fast digitiser; common practice, no source). */
export const LOCATE_DEFAULT_ARRIVAL_SD_S = 5e-6;
/** Default outlier limit, in sds of the residual (the kernel's default). */
export const LOCATE_DEFAULT_OUTLIER_SIGMA = 3;
/** Radii the kernel takes for a sphere or cylinder, m. */
const RADIUS_RANGE = [1e-6, 100] as const;

const FILE_OPERAND: OperandSpec = {
  name: 'file',
  placeholder: 'FILE',
  help: 'a CSV with columns x_m, y_m, z_m, arrival_s, optionally arrival_sd_s and label ("-" reads standard input)',
};

const TEMPERATURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature',
  dimension: 'temperature',
  placeholder: 'T',
  range: [MODEL_MIN_K, T_LAMBDA_K],
  help: 'bath temperature T90: the speed is u₂ there (give this or --speed)',
};

const SPEED_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'speed',
  dimension: 'speed',
  placeholder: 'u',
  range: LOCATE_SPEED_RANGE_M_S,
  help: 'speed of the front (give this or --temperature); the start value with --fit-speed',
};

const TEMPERATURE_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature-sd',
  dimension: 'temperature',
  placeholder: 'σT',
  range: [0, 1],
  help: 'one-sigma uncertainty of --temperature (default 0): widens the speed prior by |du₂/dT|·σT',
};

const NO_SPEED_PRIOR_FLAG: BooleanFlag = {
  kind: 'boolean',
  name: 'no-speed-prior',
  help: "with --temperature: hold the speed fixed at u₂(T) instead of fitting it under a prior of u₂'s own sd (and --temperature-sd)",
};

const FIT_SPEED_FLAG: BooleanFlag = {
  kind: 'boolean',
  name: 'fit-speed',
  help: 'fit an effective speed too (strong pulses often travel faster than u₂); needs one more sensor',
};

const ARRIVAL_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'arrival-sd',
  dimension: 'time',
  placeholder: 'σt',
  range: LOCATE_ARRIVAL_SD_RANGE_S,
  help: 'one-sigma timing uncertainty of sensors without arrival_sd_s (default 5 µs)',
};

const DROP_OUTLIERS_FLAG: BooleanFlag = {
  kind: 'boolean',
  name: 'drop-outliers',
  help: 'refit without the worst sensor while its residual exceeds the outlier limit',
};

const OUTLIER_LIMIT_FLAG: NumberFlag = {
  kind: 'number',
  name: 'outlier-limit',
  placeholder: 'k',
  range: [1, 100],
  help: `residual, in sds, above which a sensor is an outlier (default ${LOCATE_DEFAULT_OUTLIER_SIGMA})`,
};

const SPHERE_FLAG: TextFlag = {
  kind: 'text',
  name: 'sphere',
  placeholder: 'cx,cy,cz,R',
  help: 'the source lies on a sphere: centre and radius in metres (or with a length unit: 0,0,0,103mm)',
};

const CYLINDER_FLAG: TextFlag = {
  kind: 'text',
  name: 'cylinder',
  placeholder: 'px,py,pz,dx,dy,dz,R',
  help: 'the source lies on a cylinder: a point of its axis (m), the axis direction (any length), radius (m)',
};

const PLANE_FLAG: TextFlag = {
  kind: 'text',
  name: 'plane',
  placeholder: 'px,py,pz,nx,ny,nz',
  help: 'the source lies on a plane: a point of it (m) and its normal (any length)',
};

const SURFACE_FLAGS = [SPHERE_FLAG, CYLINDER_FLAG, PLANE_FLAG] as const;

/** One sensor in the JSON: the input row and its outcome. */
export interface LocateSensorJson extends LocateSensor, SensorOutcome {
  line: number;
}

/** What `locate --json` prints. */
export interface LocateJson {
  file: string;
  source_m: Vec3;
  /** One-sigma per coordinate, m; null when the layout cannot fix the source (degenerate). */
  sourceSd_m: Vec3 | null;
  offset_s: number;
  offsetSd_s: number | null;
  speed_m_s: number;
  /** Null when the speed is fixed, or when degenerate. */
  speedSd_m_s: number | null;
  /** Per sensor with an arrival time, in file order (the sensors the kernel saw). */
  residuals_s: number[];
  normalisedResiduals: number[];
  /** Indices into residuals_s of sensors beyond the outlier limit. */
  outliers: number[];
  /** Indices into residuals_s of sensors the robust refit left out. */
  dropped: number[];
  /** Label and file line of each entry of residuals_s. */
  labels: string[];
  lines: number[];
  outlierLabels: string[];
  droppedLabels: string[];
  chiSquare: number;
  degreesOfFreedom: number;
  degenerate: boolean;
  notes: string[];
  covariance_m2: number[][] | null;
  /** Semi-axes (m, largest first) of the joint 1σ (68.3 %) and 2σ (95.4 %) regions; null when degenerate. */
  regions: { sigma1: RegionJson; sigma2: RegionJson } | null;
  /** The bath temperature the speed came from, K; null when --speed was given. */
  temperature_K: number | null;
  /** Its one-sigma, K (0 when not given); null with --speed. */
  temperatureSd_K: number | null;
  /** The prior the speed was fitted under (u₂ at the temperature, its sd), or null: a fixed or freely fitted speed. */
  speedPrior: { speed_m_s: number; sd_m_s: number } | null;
  fitSpeed: boolean;
  defaultArrivalSd_s: number;
  outlierLimit: number;
  dropOutliers: boolean;
  constraint: SurfaceConstraint;
  sensors: LocateSensorJson[];
}

interface RegionJson {
  semiAxes_m: number[];
  /** Unit vectors of the semi-axes (Cartesian), one per semi-axis. */
  axes: number[][];
  deltaChiSquare: number;
}

/** The `locate` command. */
export const locateCommand: Command = {
  name: 'locate',
  summary: 'arrival times at several sensors (CSV) → where the heat source is, with its uncertainty',
  synopsis: [
    'locate FILE (--temperature <T> | --speed <u>) [--fit-speed] [--arrival-sd <σt>] [--json]',
    'locate FILE … [--drop-outliers] [--outlier-limit <k>] [--sphere <cx,cy,cz,R> | --cylinder <px,py,pz,dx,dy,dz,R> | --plane <px,py,pz,nx,ny,nz>]',
  ],
  description:
    'Finds the point x and emission time t0 that best explain the arrival times t_i = t0 + |x − s_i|/u at ' +
    'sensors s_i (weighted least squares; optionally the speed u too). The file is a CSV with a header row ' +
    'and the columns x_m, y_m, z_m, arrival_s (a unit in the name scales a column: x_mm, arrival_ms, …), ' +
    'optionally arrival_sd_s and label; a blank arrival is a sensor without a reading, shown but not ' +
    'fitted. The speed is u₂ at --temperature, or --speed as given. The source may be held on a sphere, a ' +
    'cylinder or a plane (a cavity wall), written as comma-separated numbers in metres (a length unit may ' +
    'follow each, e.g. 0,0,0,103mm). Sds are scaled up by √(χ²/dof) when the residuals scatter more than ' +
    'the stated timing sds. With --temperature the speed is fitted under a prior: u₂ there, with the u₂ ' +
    "curve's own sd and |du₂/dT|·--temperature-sd (so the regions hold when the helium's real speed differs " +
    'from the table by that much); --no-speed-prior holds it fixed instead, --fit-speed fits it freely. ' +
    'Outliers are the sensors a robust refit finds beyond --outlier-limit (the worst left out while one ' +
    'exceeds it), also when --drop-outliers is not given and the reported fit keeps them. ' +
    'Sensors on a line (or a fit that cannot fix the source) are reported as ' +
    'degenerate, with null sds. With --json, prints {source_m, sourceSd_m, offset_s, offsetSd_s, speed_m_s, ' +
    'speedSd_m_s, residuals_s, outliers, dropped, labels, lines, chiSquare, degreesOfFreedom, degenerate, ' +
    'notes, covariance_m2, regions, sensors, temperature_K, temperatureSd_K, speedPrior, …}; outliers and dropped index residuals_s.',
  flags: [
    TEMPERATURE_FLAG,
    TEMPERATURE_SD_FLAG,
    NO_SPEED_PRIOR_FLAG,
    SPEED_FLAG,
    FIT_SPEED_FLAG,
    ARRIVAL_SD_FLAG,
    DROP_OUTLIERS_FLAG,
    OUTLIER_LIMIT_FLAG,
    SPHERE_FLAG,
    CYLINDER_FLAG,
    PLANE_FLAG,
    JSON_FLAG,
  ],
  operands: [FILE_OPERAND],
  examples: [
    'locate public/demo-locate.csv --temperature 1.8K',
    'locate arrivals.csv --speed 20m/s --fit-speed --arrival-sd 5us --json',
    'locate arrivals.csv --temperature 1.9K --sphere 0,0,0,103mm --drop-outliers',
    'locate arrivals.csv --temperature 1.8K --cylinder 0,0,0,0,0,1,0.05',
    'locate arrivals.csv --temperature 1.8K --temperature-sd 2mK',
  ],
  run(args, io) {
    const result = computeLocate(args);
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderLocate(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

/** Reads the flags and the file, locates the source and collects what the command reports. */
export function computeLocate(args: ParsedArgs): LocateJson {
  const path = args.operand(FILE_OPERAND.name);
  if (path === undefined) {
    throw new UsageError('"sekundo locate" needs a CSV file of x_m, y_m, z_m, arrival_s, e.g. sekundo locate arrivals.csv --temperature 1.8K');
  }
  const { speed_m_s, temperature_K } = readSpeed(args);
  const temperatureSdArg = args.quantity(TEMPERATURE_SD_FLAG.name);
  if ((temperatureSdArg || args.flag(NO_SPEED_PRIOR_FLAG.name)) && temperature_K === null) {
    throw new UsageError(`--${temperatureSdArg ? TEMPERATURE_SD_FLAG.name : NO_SPEED_PRIOR_FLAG.name} needs --temperature: the speed prior is u₂ at the bath temperature`);
  }
  const temperatureSd_K = temperatureSdArg ? computeFor(temperatureSdArg, (v) => requireInRange('temperature sd', v, 0, 1, 'K')) : 0;
  const sdArg = args.quantity(ARRIVAL_SD_FLAG.name);
  const defaultArrivalSd_s = sdArg
    ? computeFor(sdArg, (v) => requireInRange('arrival sd', v, LOCATE_ARRIVAL_SD_RANGE_S[0], LOCATE_ARRIVAL_SD_RANGE_S[1], 's'))
    : LOCATE_DEFAULT_ARRIVAL_SD_S;
  const constraint = readConstraint(args);
  const fitSpeed = args.flag(FIT_SPEED_FLAG.name);
  const speedPrior = temperature_K !== null && !fitSpeed && !args.flag(NO_SPEED_PRIOR_FLAG.name) ? speedPriorAt(temperature_K, temperatureSd_K) : null;
  const dropOutliers = args.flag(DROP_OUTLIERS_FLAG.name);
  const outlierLimit = args.number(OUTLIER_LIMIT_FLAG.name)?.value ?? LOCATE_DEFAULT_OUTLIER_SIGMA;

  const bytes = readInputFile(path, 'sensor file');
  const input = fromFile('sensor file', path, () => parseLocateCsv(bytes));
  const { arrivals, indices } = arrivalsOf(input.sensors);
  const unknowns = (constraint.kind === 'none' ? 3 : 2) + 1 + (fitSpeed ? 1 : 0);
  if (arrivals.length < unknowns + 1) {
    const blank = input.sensors.length - arrivals.length;
    throw new UsageError(
      `sensor file "${shownName(path)}": ${arrivals.length} sensor${arrivals.length === 1 ? '' : 's'} with an arrival time` +
        `${blank > 0 ? ` (${blank} without)` : ''}; fitting ${unknowns} unknowns (${unknownsInWords(constraint, fitSpeed)}) with a check needs at least ${unknowns + 1}`,
    );
  }
  const result = fromFile('sensor file', path, () =>
    locateSource(arrivals, { speed_m_s, fitSpeed, arrivalSd_s: defaultArrivalSd_s, constraint, dropOutliers, outlierSigma: outlierLimit, speedPrior }),
  );
  return toJson(path, input.sensors, input.lines, indices, result, {
    temperature_K,
    temperatureSd_K: temperature_K === null ? null : temperatureSd_K,
    speedPrior,
    fitSpeed,
    defaultArrivalSd_s,
    outlierLimit,
    dropOutliers,
    constraint,
  });
}

function shownName(path: string): string {
  return path === '-' ? 'standard input' : path;
}

function unknownsInWords(constraint: SurfaceConstraint, fitSpeed: boolean): string {
  const position = constraint.kind === 'none' ? 'x, y, z' : `2 coordinates on the ${constraint.kind}`;
  return `${position}, t0${fitSpeed ? ', speed' : ''}`;
}

/** The speed: u₂ at --temperature, or --speed; exactly one of them. */
function readSpeed(args: ParsedArgs): { speed_m_s: number; temperature_K: number | null } {
  const temperature = args.quantity(TEMPERATURE_FLAG.name);
  const speed = args.quantity(SPEED_FLAG.name);
  if (temperature && speed) throw new UsageError('"sekundo locate" takes --temperature or --speed, not both');
  if (speed) {
    return { speed_m_s: computeFor(speed, (v) => requireInRange('speed', v, LOCATE_SPEED_RANGE_M_S[0], LOCATE_SPEED_RANGE_M_S[1], 'm/s')), temperature_K: null };
  }
  if (!temperature) {
    throw new UsageError(
      `"sekundo locate" needs --temperature (the speed is u₂ there, ${formatPlain(MODEL_MIN_K)}–${formatPlain(T_LAMBDA_K)} K) or --speed, e.g. --temperature 1.8K or --speed 20m/s`,
    );
  }
  const u2 = computeFor(temperature, (T) => secondSound(T));
  if (!(u2 >= LOCATE_SPEED_RANGE_M_S[0])) {
    throw new UsageError(`--temperature ${temperature.text.trim()}: u₂ is ${formatSignificant(u2, 3)} m/s there, too slow to locate a source; choose a bath temperature further below Tλ = ${T_LAMBDA_K} K`);
  }
  return { speed_m_s: u2, temperature_K: temperature.value };
}

/** At most one of --sphere, --cylinder, --plane, read into a constraint (metres). */
function readConstraint(args: ParsedArgs): SurfaceConstraint {
  const given = SURFACE_FLAGS.filter((f) => args.text(f.name) !== undefined);
  if (given.length > 1) throw new UsageError(`give at most one surface: ${given.map((f) => `--${f.name}`).join(' and ')} were both given`);
  const flag = given[0];
  if (!flag) return { kind: 'none' };
  const text = args.text(flag.name) ?? '';
  if (flag === SPHERE_FLAG) {
    const [cx = 0, cy = 0, cz = 0, R] = surfaceNumbers(flag, text, ['L', 'L', 'L', 'L']);
    return { kind: 'sphere', centre_m: [cx, cy, cz], radius_m: radius(flag, text, R) };
  }
  if (flag === CYLINDER_FLAG) {
    const [px = 0, py = 0, pz = 0, dx, dy, dz, R] = surfaceNumbers(flag, text, ['L', 'L', 'L', 'N', 'N', 'N', 'L']);
    return { kind: 'cylinder', axisPoint_m: [px, py, pz], axisDirection: direction(flag, text, [dx, dy, dz], 'axis direction'), radius_m: radius(flag, text, R) };
  }
  const [px = 0, py = 0, pz = 0, nx, ny, nz] = surfaceNumbers(flag, text, ['L', 'L', 'L', 'N', 'N', 'N']);
  return { kind: 'plane', point_m: [px, py, pz], normal: direction(flag, text, [nx, ny, nz], 'normal') };
}

type Part = 'L' | 'N';
const PLAIN_NUMBER = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Comma-separated values: 'L' a length (bare = metres, units allowed), 'N' a plain number. */
function surfaceNumbers(flag: TextFlag, text: string, parts: readonly Part[]): number[] {
  const cells = text.split(',').map((c) => c.trim());
  const hint = `--${flag.name} needs ${parts.length} comma-separated values ${flag.placeholder} (lengths in metres or with a unit, e.g. 103mm)`;
  if (cells.length !== parts.length) throw new UsageError(`${hint}; got ${cells.length} in "${text}"`);
  return cells.map((cell, i) => {
    const name = flag.placeholder.split(',')[i] ?? `value ${i + 1}`;
    if (parts[i] === 'N') {
      const value = PLAIN_NUMBER.test(cell) ? Number(cell) : Number.NaN;
      if (!Number.isFinite(value)) throw new UsageError(`--${flag.name}: ${name} "${cell}" is not a number (a direction component, no unit)`);
      return value;
    }
    let value: number;
    try {
      value = parseQuantity(cell, 'length');
    } catch (error) {
      if (error instanceof QuantityParseError) throw new UsageError(`--${flag.name}: ${name} ${error.detail}; accepted units: ${error.acceptedUnits.join(', ')}`);
      throw error;
    }
    const [lo, hi] = LOCATE_POSITION_RANGE_M;
    if (value < lo || value > hi) throw new UsageError(`--${flag.name}: ${name} ${formatPlain(value)} m is outside the valid range ${lo} to ${hi} m`);
    return value;
  });
}

function radius(flag: TextFlag, text: string, R: number | undefined): number {
  try {
    return requireInRange('radius', R ?? Number.NaN, RADIUS_RANGE[0], RADIUS_RANGE[1], 'm');
  } catch (error) {
    if (error instanceof PhysicsError) throw new UsageError(`--${flag.name} "${text}": ${error.message}`);
    throw error;
  }
}

function direction(flag: TextFlag, text: string, v: (number | undefined)[], what: string): Vec3 {
  const [a = 0, b = 0, c = 0] = v;
  if (!(Math.hypot(a, b, c) > 0)) throw new UsageError(`--${flag.name} "${text}": the ${what} ${a},${b},${c} must not be zero`);
  return [a, b, c];
}

interface RunChoice {
  temperature_K: number | null;
  temperatureSd_K: number | null;
  speedPrior: { speed_m_s: number; sd_m_s: number } | null;
  fitSpeed: boolean;
  defaultArrivalSd_s: number;
  outlierLimit: number;
  dropOutliers: boolean;
  constraint: SurfaceConstraint;
}

function toJson(file: string, sensors: LocateSensor[], lines: number[], indices: number[], r: LocateResult, run: RunChoice): LocateJson {
  const outcomes = sensorOutcomes(sensors, indices, r);
  const labelOf = (k: number) => sensors[indices[k] ?? -1]?.label ?? '';
  const region = (g: NonNullable<LocateResult['regions']>['sigma1']): RegionJson => ({
    semiAxes_m: g.semiAxes_m,
    axes: g.semiAxes_m.map((_, j) => g.directions.map((row) => row[j] ?? 0)),
    deltaChiSquare: g.deltaChiSquare,
  });
  return {
    file,
    source_m: r.source_m,
    sourceSd_m: r.sourceSd_m,
    offset_s: r.offset_s,
    offsetSd_s: r.offsetSd_s,
    speed_m_s: r.speed_m_s,
    speedSd_m_s: r.speedSd_m_s,
    residuals_s: r.residuals_s,
    normalisedResiduals: r.normalisedResiduals,
    outliers: r.outliers,
    dropped: r.dropped,
    labels: indices.map((i) => sensors[i]?.label ?? ''),
    lines: indices.map((i) => lines[i] ?? 0),
    outlierLabels: r.outliers.map(labelOf),
    droppedLabels: r.dropped.map(labelOf),
    chiSquare: r.chiSquare,
    degreesOfFreedom: r.degreesOfFreedom,
    degenerate: r.degenerate,
    notes: r.notes,
    covariance_m2: r.covariance_m2,
    regions: r.regions ? { sigma1: region(r.regions.sigma1), sigma2: region(r.regions.sigma2) } : null,
    ...run,
    sensors: sensors.map((s, i) => ({ ...s, ...(outcomes[i] as SensorOutcome), line: lines[i] ?? 0 })),
  };
}

/** Positions to 0.01 mm, arrivals to 0.1 µs, residuals to 0.1 µs; sds to two significant digits. */
const fixed = (x: number, decimals: number) => {
  const text = x.toFixed(decimals);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
};
const mm = (m: number) => fixed(m * 1e3, 2);
const mmSd = (m: number) => formatSignificant(m * 1e3, 2);
const us = (s: number) => fixed(s * 1e6, 1);
const msText = (s: number) => fixed(s * 1e3, 4);

const STATUS_TEXT: Record<SensorStatus, string> = {
  fitted: '',
  outlier: 'OUTLIER (kept in the fit)',
  dropped: 'OUTLIER, left out of the fit',
  'no arrival': 'no arrival time: not fitted',
};

/** The human-readable result of `locate`. */
export function renderLocate(r: LocateJson): string[] {
  const fitted = r.residuals_s.length;
  const lines: string[] = [];
  lines.push(`Source location from ${fitted} arrival time${fitted === 1 ? '' : 's'} (${r.sensors.length} sensors in ${shownName(r.file)})`);
  if (r.degenerate) {
    lines.push('', 'DEGENERATE LAYOUT: these sensors cannot fix the source. The point below is where the fit stopped,', 'not a located source; no uncertainties can be given.');
  }
  lines.push('');
  const speedFrom = r.temperature_K === null ? 'as given' : `u₂ at ${formatKelvin(r.temperature_K)} K`;
  const speedFitted = r.fitSpeed || r.speedPrior !== null;
  const speed = speedFitted
    ? `${formatSignificant(r.speed_m_s)} ± ${r.speedSd_m_s === null ? ABSENT : formatSignificant(r.speedSd_m_s, 2)} m/s`
    : `${formatSignificant(r.speed_m_s)} m/s`;
  const how = r.speedPrior
    ? `fitted under the prior ${speedFrom} = ${formatSignificant(r.speedPrior.speed_m_s)} ± ${formatSignificant(r.speedPrior.sd_m_s, 2)} m/s (u₂ curve sd${r.temperatureSd_K ? ' and temperature sd' : ''})`
    : r.fitSpeed
      ? `fitted freely, starting from ${speedFrom}`
      : `fixed, ${speedFrom}`;
  const settings: string[][] = [
    ['Speed', speed, how],
    ['Timing sd', `${us(r.defaultArrivalSd_s)} µs`, 'for sensors without arrival_sd_s'],
    ['Surface', describeSurface(r.constraint), ''],
    ['Outliers', `beyond ${formatPlain(r.outlierLimit)} sd`, r.dropOutliers ? 'robust refit: the worst is left out while beyond the limit' : 'found by a robust refit, flagged, kept in the fit'],
  ];
  lines.push(...alignTable(settings, ['left', 'left', 'left']));
  lines.push('');
  const sd = r.sourceSd_m;
  const position: string[][] = [
    ['', 'x', 'y', 'z'],
    [r.degenerate ? 'Fit stopped at (mm)' : 'Source (mm)', mm(r.source_m[0]), mm(r.source_m[1]), mm(r.source_m[2])],
    ['1σ (mm)', ...(sd ? [mmSd(sd[0]), mmSd(sd[1]), mmSd(sd[2])] : [ABSENT, ABSENT, ABSENT])],
  ];
  lines.push(...alignTable(position, ['left', 'right', 'right', 'right']));
  lines.push('');
  const fit: string[][] = [
    ['Offset t0', `${us(r.offset_s)} ± ${r.offsetSd_s === null ? ABSENT : formatSignificant(r.offsetSd_s * 1e6, 2)} µs`, 'emission time on the file’s clock'],
    ['χ²', formatSignificant(r.chiSquare, 3), `${r.degreesOfFreedom} degree${r.degreesOfFreedom === 1 ? '' : 's'} of freedom`],
  ];
  if (r.regions) {
    const axes = (g: RegionJson) => `${g.semiAxes_m.map(mmSd).join(' × ')} mm`;
    const joint = r.regions.sigma1.semiAxes_m.length === 3 ? 'x, y, z jointly' : 'on the surface';
    fit.push(
      ['1σ region', axes(r.regions.sigma1), `semi-axes, 68.3 % (Δχ² = ${formatPlain(r.regions.sigma1.deltaChiSquare)}, ${joint})`],
      ['2σ region', axes(r.regions.sigma2), `semi-axes, 95.4 % (Δχ² = ${formatPlain(r.regions.sigma2.deltaChiSquare)})`],
    );
  }
  lines.push(...alignTable(fit, ['left', 'left', 'left']));
  lines.push('', 'Sensors:');
  const rows: string[][] = [
    ['label', 'line', 'x (mm)', 'y (mm)', 'z (mm)', 'arrival (ms)', 'residual (µs)', 'residual/σ', 'status'],
    ...r.sensors.map((s) => [
      s.label,
      String(s.line),
      mm(s.position_m[0]),
      mm(s.position_m[1]),
      mm(s.position_m[2]),
      s.arrival_s === null ? ABSENT : msText(s.arrival_s),
      s.residual_s === null ? ABSENT : us(s.residual_s),
      s.normalisedResidual === null ? ABSENT : formatSignificant(s.normalisedResidual, 3),
      STATUS_TEXT[s.status],
    ]),
  ];
  lines.push(...alignTable(rows, ['left', 'right', 'right', 'right', 'right', 'right', 'right', 'right', 'left']).map((l) => `  ${l}`));
  if (r.notes.length > 0) {
    lines.push('', 'Notes:');
    for (const note of r.notes) lines.push(`  ${note}`);
  }
  return lines;
}

function describeSurface(c: SurfaceConstraint): string {
  const p = (v: readonly number[]) => v.map(mm).join(', ');
  const d = (v: readonly number[]) => v.map((x) => formatPlain(x)).join(', ');
  switch (c.kind) {
    case 'none':
      return 'none (free in 3-D)';
    case 'sphere':
      return `sphere, centre (${p(c.centre_m)}) mm, radius ${mm(c.radius_m)} mm`;
    case 'cylinder':
      return `cylinder, axis through (${p(c.axisPoint_m)}) mm along (${d(c.axisDirection)}), radius ${mm(c.radius_m)} mm`;
    case 'plane':
      return `plane through (${p(c.point_m)}) mm, normal (${d(c.normal)})`;
  }
}
