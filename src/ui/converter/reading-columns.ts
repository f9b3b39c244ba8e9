/**
 * The columns every exported series of readings shares — the trace lab's series and the followed
 * folder's: the pick, the speed, the candidates and the chosen temperature with its sd split into
 * the measurement's part and the u₂ curve's part, and its 68 % and 95 % intervals. One writer for
 * the header and the cells, so the two exports cannot drift apart.
 */
import type { CsvCell } from '../../io/csv-common';
import type { TemperatureCandidate } from '../../physics';
import { csvColumn, inViewUnit, type UnitViews } from '../units/unit-views';

/** What the shared columns need of a chosen temperature. */
export type ChosenTemperature = Pick<TemperatureCandidate, 'temperature_K' | 'sd_K' | 'sdMeasurement_K' | 'sdCurve_K' | 'interval68_K' | 'interval95_K'>;

/** One reading as the shared columns show it; absent numbers are empty cells. */
export interface ReadingColumns {
  delay_s: number | null | undefined;
  delaySd_s: number | null | undefined;
  snr: number | null | undefined;
  speed_m_s: number | null | undefined;
  speedSd_m_s: number | null | undefined;
  /** How many candidate temperatures the speed gave; null when it gave none (no conversion). */
  candidates: number | null;
  /** The chosen candidate, 0-based; null when none is chosen. */
  chosen: number | null;
  /** Why that one, in words ("" when nothing is chosen). */
  chosenBy: string;
  temperature: ChosenTemperature | undefined;
}

const TEMPERATURE_COLUMNS = ['T', 'T_sd', 'T_sd_meas', 'T_sd_curve', 'T_lo68', 'T_hi68', 'T_lo95', 'T_hi95'];

/** The shared header, with the display units in the temperature and time columns' names. */
export function readingHeader(units: UnitViews): string[] {
  const { temperature, time } = units;
  return [
    csvColumn('delay', time),
    csvColumn('delay_sd', time),
    'snr',
    'speed_m_s',
    'speed_sd_m_s',
    'candidates',
    'chosen',
    'chosen_by',
    ...TEMPERATURE_COLUMNS.map((name) => csvColumn(name, temperature)),
  ];
}

/** The shared cells of one reading, in full precision in the display units (the chosen index 1-based). */
export function readingCells(r: ReadingColumns, units: UnitViews): CsvCell[] {
  const { temperature, time } = units;
  const c = r.temperature;
  return [
    inViewUnit(r.delay_s, time),
    inViewUnit(r.delaySd_s, time),
    r.snr,
    r.speed_m_s,
    r.speedSd_m_s,
    r.candidates,
    r.chosen === null ? null : r.chosen + 1,
    r.chosenBy,
    ...[c?.temperature_K, c?.sd_K, c?.sdMeasurement_K, c?.sdCurve_K, c?.interval68_K[0], c?.interval68_K[1], c?.interval95_K[0], c?.interval95_K[1]].map((v) => inViewUnit(v, temperature)),
  ];
}
