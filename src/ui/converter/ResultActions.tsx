import { useState } from 'react';
import { copyText, downloadText, type ExportContent } from './export-text';

interface ResultActionsProps {
  /** What the buttons act on, e.g. "result", "series"; part of their accessible names. */
  what: string;
  /** Builds the content at click time from the current inputs (null: nothing to export). */
  content: () => ExportContent | null;
}

/** Copy and Export buttons for a result, with a short status line saying what happened. */
export function ResultActions({ what, content }: ResultActionsProps) {
  const [status, setStatus] = useState('');
  const copy = async () => {
    const c = content();
    if (!c) return setStatus('Nothing to copy yet.');
    setStatus((await copyText(c.tsv)) ? `Copied the ${what} (tab-separated).` : 'The browser did not allow copying; use Export CSV instead.');
  };
  const save = () => {
    const c = content();
    if (!c) return setStatus('Nothing to export yet.');
    downloadText(c.fileName, c.csv);
    setStatus(`Saved ${c.fileName}.`);
  };
  return (
    <div className="result-actions">
      <button type="button" className="button" onClick={copy} aria-label={`Copy the ${what}`}>
        Copy
      </button>
      <button type="button" className="button" onClick={save} aria-label={`Export the ${what} as CSV`}>
        Export CSV
      </button>
      <span className="result-actions__status" role="status">
        {status}
      </span>
    </div>
  );
}
