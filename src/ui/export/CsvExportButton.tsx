import { type CsvTableData, downloadCsv } from './csv-export';

interface CsvExportButtonProps {
  /** Builds the table when the button is pressed (values as shown, in the header's units). */
  table: () => CsvTableData | null;
  /** File name, e.g. "helium-properties-1.8K.csv". */
  fileName: string;
  /** What is exported, for the accessible name: "the property table". */
  what: string;
  disabled?: boolean;
}

/** A small "CSV" button beside a table: downloads the table as a CSV file. */
export function CsvExportButton({ table, fileName, what, disabled = false }: CsvExportButtonProps) {
  return (
    <button
      type="button"
      className="export-button"
      disabled={disabled}
      aria-label={`Download ${what} as CSV`}
      title={`Download ${what} as CSV (${fileName})`}
      onClick={() => {
        const data = table();
        if (data) downloadCsv(data, fileName);
      }}
    >
      <DownloadIcon /> CSV
    </button>
  );
}

/** An arrow into a tray: "download". Decorative. */
export function DownloadIcon() {
  return (
    <svg className="export-button__icon" width="12" height="12" viewBox="0 0 12 12" aria-hidden="true" focusable="false">
      <path d="M6 1.5v6M3.4 5.2 6 7.8l2.6-2.6M1.5 9v1.5h9V9" fill="none" stroke="currentColor" strokeWidth="1.4" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
