/**
 * `sekundo fit FILE.csv [--json]`: delays at several distances (one bath temperature) → the
 * second-sound speed and the common offset t0 from a weighted straight line t = t0 + d/u₂, with
 * their sds, the residuals and the temperature candidates (src/io/fit-csv, kernel fitDistances).
 */
import { parseFitCsv } from '../../io/fit-csv';
import { type DistanceFit, fitDistances } from '../../physics';
import type { OperandSpec } from '../args';
import type { Command } from '../command';
import { EXIT_OK, UsageError } from '../errors';
import { alignTable, formatSignificant } from '../format';
import {
  type ChoiceResult,
  chooseFor,
  fromFile,
  INTERVAL_LEGEND,
  NEAR_FLAG,
  PRESSURE_FLAG,
  PRESSURE_SD_FLAG,
  readChoiceRule,
  readInputFile,
  renderCandidates,
  renderWarnings,
} from './convert-shared';
import { JSON_FLAG, writeJson } from './shared';

const FILE_OPERAND: OperandSpec = {
  name: 'file',
  placeholder: 'FILE',
  help: 'a CSV with columns distance_m, delay_s and optionally delay_sd_s',
};

/** The JSON printed by `fit`. */
export interface FitJson extends Omit<DistanceFit, 'candidates'>, ChoiceResult {
  file: string;
  /** Line of each point in the file, in the order of residuals_s. */
  lines: number[];
}

/** The `fit` command. */
export const fitCommand: Command = {
  name: 'fit',
  summary: 'delays at several distances (CSV) → speed, offset t0, residuals and candidate temperatures',
  synopsis: ['fit FILE [--pressure <p> | --near <T>] [--json]'],
  description:
    'Fits t = t0 + d/u₂ to delays measured at several heater–sensor distances at one bath temperature ' +
    '(a weighted straight line; weights 1/σ² from delay_sd_s when every row has one, else equal weights ' +
    'with the sds scaled by the scatter). The file is a CSV with a header row and the columns distance_m ' +
    'and delay_s (a unit in the name scales a column: distance_mm, delay_us, …), optionally delay_sd_s; ' +
    'at least 3 rows at 2 or more distances. Prints the speed, the offset t0 (lags and electronics), ' +
    'their sds and correlation, the residuals and every temperature with the fitted speed; --pressure or ' +
    '--near chooses one. Each candidate has its 68 % and 95 % intervals (the fitted speed\'s interval mapped ' +
    'through u₂(T)) and its sd in the measurement\'s and the u₂ curve\'s parts, as in "sekundo delay". With ' +
    '--json, prints {speed_m_s, speedSd_m_s, offset_s, offsetSd_s, residuals_s, candidates (each with ' +
    'interval68_K, interval95_K, sdMeasurement_K, sdCurve_K, evidenceSd), chosen, choice, warnings, covariance, ' +
    'correlation, chiSquare, degreesOfFreedom, weighted, lines}.',
  flags: [PRESSURE_FLAG, PRESSURE_SD_FLAG, NEAR_FLAG, JSON_FLAG],
  operands: [FILE_OPERAND],
  examples: ['fit distances.csv', 'fit distances.csv --pressure 1638Pa --json'],
  run(args, io) {
    const path = args.operand(FILE_OPERAND.name);
    if (path === undefined) throw new UsageError('"sekundo fit" needs a CSV file of distance_m, delay_s, e.g. sekundo fit distances.csv');
    const choice = readChoiceRule('fit', args);
    const bytes = readInputFile(path, 'fit file');
    const input = fromFile('fit file', path, () => parseFitCsv(bytes));
    const fit = fromFile('fit file', path, () => fitDistances(input.points));
    const result: FitJson = { file: path, ...fit, lines: input.lines, ...chooseFor(fit.candidates, choice, fit) };
    if (args.flag(JSON_FLAG.name)) writeJson(io, result);
    else io.stdout(`${renderFit(result).join('\n')}\n`);
    return EXIT_OK;
  },
};

/** The human-readable result of `fit`. */
export function renderFit(r: FitJson): string[] {
  const us = (s: number) => formatSignificant(s * 1e6, 4);
  const head = alignTable(
    [
      ['Points', String(r.residuals_s.length), r.weighted ? 'weighted by delay_sd_s' : 'equal weights, sds from the scatter'],
      ['Speed', `${formatSignificant(r.speed_m_s)} ± ${formatSignificant(r.speedSd_m_s, 2)}`, 'm/s'],
      ['Offset t0', `${us(r.offset_s)} ± ${formatSignificant(r.offsetSd_s * 1e6, 2)}`, 'µs'],
      ['Correlation', formatSignificant(r.correlation, 3), 'speed with offset'],
      ['χ²', `${formatSignificant(r.chiSquare, 3)}`, `${r.degreesOfFreedom} degrees of freedom`],
    ],
    ['left', 'right', 'left'],
  );
  const residuals = alignTable(
    [['line', 'residual (µs)'], ...r.residuals_s.map((x, i) => [String(r.lines[i] ?? ''), us(x)])],
    ['right', 'right'],
  );
  const chosen = r.chosen === null ? null : r.candidates[r.chosen];
  return [
    ...head,
    '',
    'Residuals:',
    ...residuals.map((l) => `  ${l}`),
    '',
    `Temperatures with this speed (${r.candidates.length}):`,
    ...renderCandidates(r.candidates, r.chosen).map((l) => `  ${l}`),
    '',
    `  ${INTERVAL_LEGEND}`,
    '',
    chosen ? `Chosen: ${(r.chosen ?? 0) + 1}, ${chosen.temperature_K.toFixed(5)} K: ${r.choice}` : `Not chosen: ${r.choice}`,
    ...renderWarnings(r.warnings),
  ];
}
