/**
 * Results as text for the clipboard and as CSV files. Downloads go through a Blob and an object URL;
 * nothing is ever written as HTML, so file names and cells from the user stay plain text.
 */
import { type CsvCell, csvCell, neutraliseFormula, writeCsv } from '../../io/csv-common';
import type { Choice, TemperatureCandidate } from '../../physics';
import type { DisplayUnitView } from '../units/use-display-unit';

/** What a result's Copy and Export buttons act on. */
export interface ExportContent {
  fileName: string;
  csv: string;
  /** Text for the clipboard (tab-separated, pastes into a spreadsheet). */
  tsv: string;
}
import { csvColumn } from '../units/unit-views';

/** Columns describing one candidate, after the context columns; temperatures in the display unit. */
function candidateColumns(temperature: DisplayUnitView<'temperature'>): string[] {
  return [
    'candidate',
    csvColumn('T', temperature),
    csvColumn('T_sd', temperature),
    ...['T_sd_meas', 'T_sd_curve', 'T_lo68', 'T_hi68', 'T_lo95', 'T_hi95'].map((name) => csvColumn(name, temperature)),
    'reaches95',
    'evidence_sd',
    'slope_m_s_K',
    'branch',
    'region',
    'kind',
    'insensitive',
    'chosen',
    'choice',
  ];
}

/** A table of candidates, one row each, every row led by the same context cells (the reading, the fit). */
export interface CandidateTable {
  header: string[];
  rows: CsvCell[][];
}

export function candidateTable(
  context: readonly (readonly [string, CsvCell])[],
  candidates: readonly TemperatureCandidate[],
  choice: Choice | null,
  temperature: DisplayUnitView<'temperature'>,
): CandidateTable {
  const columns = candidateColumns(temperature);
  const header = [...context.map(([name]) => name), ...columns];
  const lead = context.map(([, value]) => value);
  const rows = candidates.map((c, i): CsvCell[] => [
    ...lead,
    i + 1,
    temperature.fromSi(c.temperature_K),
    temperature.fromSi(c.sd_K),
    temperature.fromSi(c.sdMeasurement_K),
    temperature.fromSi(c.sdCurve_K),
    temperature.fromSi(c.interval68_K[0]),
    temperature.fromSi(c.interval68_K[1]),
    temperature.fromSi(c.interval95_K[0]),
    temperature.fromSi(c.interval95_K[1]),
    c.reaches95.join(' '),
    choice?.evidenceSd[i] ?? null,
    c.slope_m_s_K,
    c.branch,
    c.region,
    c.kind,
    c.insensitive,
    choice?.index === i,
    choice?.index === i ? choice.reason : '',
  ]);
  if (rows.length === 0) rows.push([...lead, ...columns.map(() => null)]);
  return { header, rows };
}

/** A table as Copy and Export take it: a CSV file (RFC 4180, LF) named `fileName`, and tab-separated text. */
export function tableExport(fileName: string, table: { header: readonly string[]; rows: readonly (readonly CsvCell[])[] }): ExportContent {
  return { fileName, csv: writeCsv(table.header, table.rows), tsv: tableTsv(table) };
}

/** The table as tab-separated text (pastes into a spreadsheet). */
export function tableTsv(table: { header: readonly string[]; rows: readonly (readonly CsvCell[])[] }): string {
  const cell = (c: CsvCell) => (typeof c === 'string' ? neutraliseFormula(c).replace(/[\t\r\n]+/g, ' ') : csvCell(c));
  return `${[table.header.map(cell).join('\t'), ...table.rows.map((r) => r.map(cell).join('\t'))].join('\n')}\n`;
}

/** Offers text as a file download (nothing leaves the browser). */
export function downloadText(fileName: string, text: string, type = 'text/csv;charset=utf-8'): void {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
}

/** Puts text on the clipboard; resolves false when the browser refuses. */
export async function copyText(text: string): Promise<boolean> {
  try {
    if (!navigator.clipboard) return false;
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

/** A file name from a source name: "shot 17.csv" → "shot-17-temperatures.csv". */
export function exportName(base: string, suffix: string): string {
  const stem = base
    .replace(/\.[^.]*$/, '')
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .slice(0, 60);
  return `${stem || 'sekundo'}-${suffix}.csv`;
}
