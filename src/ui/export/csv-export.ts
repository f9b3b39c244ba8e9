/**
 * Tables as CSV files: the RFC 4180 writer of src/io (csv-common.ts) behind a small helper every
 * table's export button uses. Numbers go out unrounded (shortest round-trip form) in the units the
 * header names, so a spreadsheet gets every digit the page computed.
 */
import { type CsvCell, writeCsv } from '../../io/csv-common';
import { downloadBlob } from './download';

/** A table as it will be written: a header row and rows of cells. */
export interface CsvTableData {
  header: readonly string[];
  rows: readonly (readonly CsvCell[])[];
}

/** The table as CSV text (RFC 4180, CRLF line ends as the RFC has them). */
export function tableCsv(table: CsvTableData): string {
  return writeCsv(table.header, table.rows, '\r\n');
}

/** Offers the table as a CSV download. */
export function downloadCsv(table: CsvTableData, fileName: string): void {
  downloadBlob(new Blob([tableCsv(table)], { type: 'text/csv;charset=utf-8' }), fileName.endsWith('.csv') ? fileName : `${fileName}.csv`);
}
