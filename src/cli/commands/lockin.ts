/**
 * `sekundo lockin FILE.csv --reference REF.csv`: a lock-in record (time, x, y) at a fixed drive →
 * the vortex line density L(t) and the drift of the resonance centre f₀(t) (and of T), with sds,
 * by the inverse-plane analysis against the vortex-free reference sweep (kernel analyseLockin).
 * Rows as CSV, or one JSON object with --json.
 */
import { parseLockinCsv } from '../../io/resonance-csv';
import { analyseLockin, type LockinSeries, RESONANCE_LIMITS, temperatureFromResonance } from '../../physics';
import type { NumberFlag, OperandSpec, QuantityFlag } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { writeChunks } from '../output';
import { kernelCall } from '../kernel-call';
import { lockinCsvChunks } from '../../io/lockin-export';
import { fromFile, readInputFile } from './convert-shared';
import {
  GAP_FLAG,
  GAP_SD_FLAG,
  GEOMETRY_FLAG,
  MODE_FLAG,
  optionalInRange,
  PRESSURE_FLAG,
  readAndFit,
  readBath,
  readGap,
  readGeometry,
  REFERENCE_FLAG,
  requireMutualFrictionRange,
  type ResonanceJson,
  resonanceJson,
  SPACER_FLAG,
  TEMPERATURE_FLAG,
} from './resonator-shared';
import { JSON_FLAG, writeJson } from './shared';

const FILE_OPERAND: OperandSpec = { name: 'file', placeholder: 'FILE', help: 'a lock-in record CSV: time_s, x, y' };

const DRIVE_FLAG: QuantityFlag = {
  kind: 'quantity',
  name: 'drive',
  dimension: 'frequency',
  placeholder: 'f',
  range: RESONANCE_LIMITS.frequency_Hz,
  help: 'the fixed drive frequency of the record (default: the reference\'s fitted centre)',
};

const NOISE_FLAG: NumberFlag = {
  kind: 'number',
  name: 'noise',
  placeholder: 'σ',
  range: [0, 1e6],
  help: 'noise per component in the record\'s signal unit (default: from successive differences of the record)',
};

/** One row of the output. */
export interface LockinRowJson {
  time_s: number;
  lineDensity_m2: number;
  lineDensitySd_m2: number;
  frequencyShift_Hz: number;
  frequencyShiftSd_Hz: number;
  temperatureShift_K: number | null;
  temperatureShiftSd_K: number | null;
}

/** The JSON printed by `lockin`. */
export interface LockinJson {
  file: string;
  reference: ResonanceJson;
  drive_Hz: number;
  temperature_K: number;
  temperatureFrom: 'temperature' | 'pressure' | 'reference resonance';
  noise: number;
  noiseFrom: 'given' | 'record';
  mutualFrictionB: number;
  mutualFrictionBPrime: number;
  dfdT_Hz_K: number;
  geometry: string;
  notes: string[];
  rows: LockinRowJson[];
}

export const lockinCommand: Command = {
  name: 'lockin',
  summary: 'a lock-in record at a fixed drive (CSV) → line density L(t) and the drift of f₀ (and T), with sds',
  synopsis: ['lockin FILE --reference <REF> [--drive <f>] [--temperature <T> | --pressure <p> | --gap <d> --mode <n>] [--geometry <G>] [--noise <σ>] [--json]'],
  description:
    'Reads a lock-in record at one drive frequency (columns time_s, x, y; a unit in a name scales it) against a ' +
    'vortex-free reference sweep of the same mode at the same drive amplitude (--reference, fitted as "sekundo sweep" ' +
    'does, with x and y). The inverse response w = (A₀Δ₀/2) e^{iφ}/(Z − background) = Δ/2 + i(f_d − f₀) moves along its ' +
    'real axis when the resonance widens (vortices) and along its imaginary axis when it shifts (temperature or pressure ' +
    'drift), so each row gives L = 6π(Δ − Δ₀)/(B κ) (isotropic tangle; --geometry for others) and δf₀ = f₀(t) − f₀,ref, ' +
    'and δT = δf₀/(df₀/dT) away from the u₂ extremes. sds per row: the record\'s noise (from successive differences ' +
    'unless --noise) and the reference fit\'s covariance. B(T) needs the bath temperature: --temperature, --pressure, ' +
    'or --gap and --mode (the reference\'s resonance, when it gives one temperature). Without --json writes CSV: ' +
    'time_s, lineDensity_m2, lineDensitySd_m2, frequencyShift_Hz, frequencyShiftSd_Hz, temperatureShift_K, ' +
    'temperatureShiftSd_K. With --json prints {rows: [{time_s, lineDensity_m2, lineDensitySd_m2, frequencyShift_Hz, ' +
    'frequencyShiftSd_Hz, …}], reference, drive_Hz, noise, notes, …}.',
  flags: [REFERENCE_FLAG, DRIVE_FLAG, TEMPERATURE_FLAG, PRESSURE_FLAG, GAP_FLAG, GAP_SD_FLAG, SPACER_FLAG, MODE_FLAG, GEOMETRY_FLAG, NOISE_FLAG, JSON_FLAG],
  operands: [FILE_OPERAND],
  examples: [
    'lockin public/demo-resonator-lockin.csv --reference public/demo-resonator-reference.csv --temperature 1.85K > line-density.csv',
    'lockin record.csv --reference ref.csv --drive 7.8094kHz --pressure 2.3kPa --json',
  ],
  async run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) throw new UsageError('"sekundo lockin" needs a lock-in record CSV (time_s, x, y) and --reference REF.csv');
    const referencePath = args.text(REFERENCE_FLAG.name);
    if (referencePath === undefined) throw new UsageError('"sekundo lockin" needs --reference REF.csv: a vortex-free sweep of the same mode (x and y)');
    const bath = readBath('lockin', args);
    const gap = readGap(args);
    const modeArg = args.number(MODE_FLAG.name);
    if (modeArg && !gap) throw new UsageError('--mode needs --gap: the speed is 2 d f₀/n');
    if (gap && !modeArg) throw new UsageError('--gap needs --mode here: with both, the reference resonance gives the bath temperature');
    const drive = optionalInRange(args, DRIVE_FLAG);
    const noise = args.number(NOISE_FLAG.name)?.value;
    const geometry = readGeometry(args);
    const { fit } = readAndFit(referencePath, 'reference file');
    if (fit.kind !== 'complex') throw new UsageError(`reference file "${referencePath}": the inverse-plane analysis needs x and y (in-phase and quadrature), not amplitude alone`);
    let temperature_K: number;
    let temperatureFrom: LockinJson['temperatureFrom'];
    if (bath) {
      temperature_K = bath.temperature_K;
      temperatureFrom = bath.from;
    } else if (gap && modeArg) {
      const r = kernelCall(() => temperatureFromResonance({ frequency_Hz: fit.frequency_Hz, frequencySd_Hz: fit.frequencySd_Hz, gap_m: gap.gap_m, gapSd_m: gap.sd_m, mode: modeArg.value }));
      const only = r.candidates.length === 1 ? r.candidates[0] : undefined;
      if (!only) throw new UsageError(`the reference resonance gives ${r.candidates.length} candidate temperatures: give --temperature or --pressure to choose`);
      temperature_K = only.temperature_K;
      temperatureFrom = 'reference resonance';
    } else {
      throw new UsageError('"sekundo lockin" needs the bath temperature for B(T): --temperature, --pressure, or --gap with --mode');
    }
    requireMutualFrictionRange(temperature_K, 'the bath temperature');
    const bytes = readInputFile(path, 'lock-in file');
    const record = fromFile('lock-in file', path, () => parseLockinCsv(bytes));
    const series = fromFile('lock-in file', path, () =>
      analyseLockin(record, fit, { temperature_K, geometry, ...(drive === undefined ? {} : { drive_Hz: drive }), ...(noise === undefined ? {} : { noise }) }),
    );
    if (args.flag(JSON_FLAG.name)) {
      const result: LockinJson = {
        file: path,
        reference: resonanceJson(fit),
        drive_Hz: series.drive_Hz,
        temperature_K,
        temperatureFrom,
        noise: series.noise,
        noiseFrom: series.noiseFrom,
        mutualFrictionB: series.mutualFrictionB,
        mutualFrictionBPrime: series.mutualFrictionBPrime,
        dfdT_Hz_K: series.dfdT_Hz_K,
        geometry,
        notes: series.notes,
        rows: lockinRows(series),
      };
      writeJson(io, result);
      return EXIT_OK;
    }
    await writeChunks(io, lockinCsvChunks(series));
    return EXIT_OK;
  },
};

/** The series as JSON rows. */
export function lockinRows(s: LockinSeries): LockinRowJson[] {
  return Array.from(s.time_s, (t, i) => ({
    time_s: t,
    lineDensity_m2: s.lineDensity_m2[i] as number,
    lineDensitySd_m2: s.lineDensitySd_m2[i] as number,
    frequencyShift_Hz: s.frequencyShift_Hz[i] as number,
    frequencyShiftSd_Hz: s.frequencyShiftSd_Hz[i] as number,
    temperatureShift_K: s.temperatureShift_K ? (s.temperatureShift_K[i] as number) : null,
    temperatureShiftSd_K: s.temperatureShiftSd_K ? (s.temperatureShiftSd_K[i] as number) : null,
  }));
}

