import { useId } from 'react';
import { formatSignificant } from '../units/format-number';

/** A file size for people: "290 KiB", "1.5 MiB". */
export function fileSize(bytes: number): string {
  return bytes >= 1048576 ? `${formatSignificant(bytes / 1048576, 3)} MiB` : `${formatSignificant(bytes / 1024, 3)} KiB`;
}

interface ReadProgressProps {
  /** What is being read: "Reading run-12.csv (file 2 of 3)". */
  label: string;
  bytes: number;
  totalBytes: number;
  rows: number;
  onCancel: () => void;
  /** The cancel button's words. */
  cancelLabel: string;
}

/** A file being read in the background: a progress bar with bytes and rows, and a button that stops it. */
export function ReadProgress({ label, bytes, totalBytes, rows, onCancel, cancelLabel }: ReadProgressProps) {
  const labelId = useId();
  const percent = totalBytes > 0 ? Math.min(100, (100 * bytes) / totalBytes) : 0;
  return (
    <div className="read-progress">
      <div className="read-progress__head">
        <span id={labelId}>{label}</span>
        <span className="read-progress__numbers">
          {fileSize(bytes)} of {fileSize(totalBytes)} · {rows.toLocaleString('en')} rows
        </span>
      </div>
      <div className="read-progress__row">
        <div
          className="read-progress__track"
          role="progressbar"
          aria-labelledby={labelId}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={Math.round(percent)}
          aria-valuetext={`${Math.round(percent)} %`}
        >
          <div className="read-progress__bar" style={{ width: `${percent}%` }} />
        </div>
        <button type="button" className="button button--small" onClick={onCancel}>
          {cancelLabel}
        </button>
      </div>
    </div>
  );
}
