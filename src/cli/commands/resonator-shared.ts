/**
 * Pieces shared by the resonator commands (resonator, sweep, lockin): the gap, spacer, geometry
 * and temperature flags, reading a sweep file and fitting it, and the temperature B(T) is taken at.
 */
import { parseSweepCsv, type SweepCsv } from '../../io/resonance-csv';
import {
  coldGap,
  fitResonance,
  MUTUAL_FRICTION_RANGE_K,
  PROPERTIES_RANGE_K,
  requireInRange,
  RESONANCE_LIMITS,
  type ResonanceFit,
  SPACER_MATERIALS,
  spacerMaterial,
  TANGLE_GEOMETRIES,
  type TangleGeometry,
  lineDensityGeometry,
  temperatureFromVapourPressure,
} from '../../physics';
import { BASE_UNIT } from '../../io/quantity';
import type { NumberFlag, ParsedArgs, QuantityArg, QuantityFlag, TextFlag } from '../args';
import { UsageError } from '../errors';
import { formatRange } from '../format';
import { computeFor } from '../kernel-call';
import { fromFile, PRESSURE_FLAG as DELAY_PRESSURE_FLAG, readInputFile } from './convert-shared';

export const GAP_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'gap',
  dimension: 'length',
  placeholder: 'd',
  range: RESONANCE_LIMITS.gap_m,
  help: 'plate gap: cold, or measured warm with --spacer (contracted like the planner\'s paths)',
};

export const GAP_SD_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'gap-sd',
  dimension: 'length',
  placeholder: 'σd',
  range: RESONANCE_LIMITS.gapSd_m,
  help: 'one-sigma uncertainty of the gap as measured (default 0)',
};

export const SPACER_FLAG: TextFlag = {
  kind: 'text',
  name: 'spacer',
  placeholder: 'MATERIAL',
  help: `the gap was measured warm on this spacer: ${SPACER_MATERIALS.map((m) => m.id).join(', ')} (default: the gap is cold)`,
};

export const GEOMETRY_FLAG: TextFlag = {
  kind: 'text',
  name: 'geometry',
  placeholder: 'TANGLE',
  help: `tangle geometry for the line density: ${TANGLE_GEOMETRIES.map((g) => `${g.id} (${g.factor === 6 * Math.PI ? '6π' : g.factor === 4 * Math.PI ? '4π' : '8π'})`).join(', ')} (default isotropic)`,
};

export const TEMPERATURE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'temperature',
  dimension: 'temperature',
  placeholder: 'T',
  range: PROPERTIES_RANGE_K,
  help: 'bath temperature T90: for B(T), and it chooses among the candidate temperatures',
};

/** `delay`'s --pressure (same range and unit), read here also as the temperature for B(T). */
export const PRESSURE_FLAG: QuantityFlag = {
  ...DELAY_PRESSURE_FLAG,
  help: 'bath vapour pressure (ITS-90): the temperature for B(T), and it chooses among the candidates',
};

export const MODE_FLAG: NumberFlag = { kind: 'number', name: 'mode', placeholder: 'n', range: RESONANCE_LIMITS.mode, integer: true, help: 'mode number n of the swept resonance (with --gap: temperatures)' };

export const REFERENCE_FLAG: TextFlag = { kind: 'text', name: 'reference', placeholder: 'REF', help: 'a vortex-free sweep of the same mode at the same drive (CSV like FILE)' };

/** A quantity flag's SI value after its own range check (the error names the flag and the range). */
export function inRange(arg: QuantityArg): number {
  return computeFor(arg, (v) => requireInRange(arg.spec.name.replace(/-/g, ' '), v, arg.spec.range[0], arg.spec.range[1], BASE_UNIT[arg.spec.dimension]));
}

/** An optional quantity flag's SI value after its range check, or undefined. */
export function optionalInRange(args: ParsedArgs, spec: QuantityFlag): number | undefined {
  const arg = args.quantity(spec.name);
  return arg ? inRange(arg) : undefined;
}

/** The cold gap from --gap, --gap-sd and --spacer, or undefined without --gap. */
export function readGap(args: ParsedArgs): { gapAsGiven_m: number; gap_m: number; sd_m: number; spacer: string | null } | undefined {
  const gap = args.quantity(GAP_FLAG.name);
  const sdArg = args.quantity(GAP_SD_FLAG.name);
  const spacer = args.text(SPACER_FLAG.name) ?? null;
  if (!gap) {
    for (const flag of [GAP_SD_FLAG, SPACER_FLAG]) if (args.has(flag.name)) throw new UsageError(`--${flag.name} needs --gap`);
    return undefined;
  }
  if (spacer !== null) {
    try {
      spacerMaterial(spacer);
    } catch {
      throw new UsageError(`--spacer "${spacer}" is not a known material; known: ${SPACER_MATERIALS.map((m) => m.id).join(', ')}`);
    }
  }
  const sd = sdArg ? inRange(sdArg) : 0;
  inRange(gap);
  const cold = computeFor(gap, (v) => coldGap(v, sd, spacer));
  return { gapAsGiven_m: gap.value, gap_m: cold.gap_m, sd_m: cold.sd_m, spacer };
}

/** --geometry, checked. */
export function readGeometry(args: ParsedArgs): TangleGeometry {
  const text = args.text(GEOMETRY_FLAG.name);
  if (text === undefined) return 'isotropic';
  try {
    return lineDensityGeometry(text).id;
  } catch {
    throw new UsageError(`--geometry "${text}" is not known; give one of ${TANGLE_GEOMETRIES.map((g) => g.id).join(', ')}`);
  }
}

/** The bath temperature given by --temperature or --pressure (not both), with where it came from. */
export function readBath(command: string, args: ParsedArgs): { temperature_K: number; from: 'temperature' | 'pressure'; pressure_Pa?: number } | undefined {
  const T = args.quantity(TEMPERATURE_FLAG.name);
  const p = args.quantity(PRESSURE_FLAG.name);
  if (T && p) throw new UsageError(`"sekundo ${command}" takes --temperature or --pressure for the bath, not both`);
  if (T) return { temperature_K: inRange(T), from: 'temperature' };
  if (p) {
    inRange(p);
    const result = computeFor(p, (v) => temperatureFromVapourPressure(v));
    return { temperature_K: result.temperature_K, from: 'pressure', pressure_Pa: p.value };
  }
  return undefined;
}

/** "--temperature 1.2 K is below 1.2864 K, where B is given": the B range as a usage error. */
export function requireMutualFrictionRange(T: number, what: string): void {
  if (T < MUTUAL_FRICTION_RANGE_K[0] || T > MUTUAL_FRICTION_RANGE_K[1]) {
    throw new UsageError(
      `${what} ${T.toFixed(4)} K is outside ${formatRange(MUTUAL_FRICTION_RANGE_K, 'K')}, where the published mutual friction B is given: no line density there`,
    );
  }
}

/** Reads and fits one sweep file; every refusal is one line naming the file's role and path. */
export function readAndFit(path: string, role: 'sweep file' | 'reference file'): { data: SweepCsv; fit: ResonanceFit } {
  const bytes = readInputFile(path, role);
  const data = fromFile(role, path, () => parseSweepCsv(bytes));
  const fit = fromFile(role, path, () => fitResonance(data));
  return { data, fit };
}

/** A fit as the commands print it in JSON. */
export interface ResonanceJson {
  frequency_Hz: number;
  frequencySd_Hz: number;
  width_Hz: number;
  widthSd_Hz: number;
  amplitude: number;
  amplitudeSd: number;
  q: number;
  qSd: number;
  phase_rad: number | null;
  phaseSd_rad: number | null;
  kind: 'complex' | 'amplitude';
  points: number;
  residualSd: number;
  residualCorrelation: number;
  background: ResonanceFit['background'];
  warnings: ResonanceFit['warnings'];
}

export function resonanceJson(fit: ResonanceFit): ResonanceJson {
  return {
    frequency_Hz: fit.frequency_Hz,
    frequencySd_Hz: fit.frequencySd_Hz,
    width_Hz: fit.width_Hz,
    widthSd_Hz: fit.widthSd_Hz,
    amplitude: fit.amplitude,
    amplitudeSd: fit.amplitudeSd,
    q: fit.q,
    qSd: fit.qSd,
    phase_rad: fit.phase_rad,
    phaseSd_rad: fit.phaseSd_rad,
    kind: fit.kind,
    points: fit.points,
    residualSd: fit.residualSd,
    residualCorrelation: fit.residualCorrelation,
    background: fit.background,
    warnings: fit.warnings,
  };
}

