import { useState } from 'react';

/** Rows shown at once in a long editable table: a page of rows keeps every keystroke quick. */
export const TABLE_PAGE_ROWS = 50;

/**
 * The page of a long table to show: `start`–`end` (end exclusive) and the pager under the table.
 * Tables shorter than a page show every row and no pager. Only the rows on screen are rendered,
 * so a 10 000-point pulse or 500 sensors cost what 50 rows cost.
 */
export function usePagedRows(
  count: number,
  pageRows = TABLE_PAGE_ROWS,
): { start: number; end: number; pager: (what: string) => React.ReactNode; showRow: (index: number) => void } {
  const [page, setPage] = useState(0);
  const pages = Math.max(1, Math.ceil(count / pageRows));
  const current = Math.min(page, pages - 1);
  const start = current * pageRows;
  const end = Math.min(count, start + pageRows);
  const pager = (what: string) =>
    count <= pageRows ? null : (
      <nav className="table-pager" aria-label={`Pages of ${what}`}>
        <button type="button" className="button button--small" disabled={current === 0} onClick={() => setPage(0)}>
          First
        </button>
        <button type="button" className="button button--small" disabled={current === 0} onClick={() => setPage(current - 1)}>
          Earlier {what}
        </button>
        <span className="table-pager__where" aria-live="polite">
          {what} {start + 1}–{end} of {count}
        </span>
        <button type="button" className="button button--small" disabled={current >= pages - 1} onClick={() => setPage(current + 1)}>
          Later {what}
        </button>
        <button type="button" className="button button--small" disabled={current >= pages - 1} onClick={() => setPage(pages - 1)}>
          Last
        </button>
      </nav>
    );
  /** Turns to the page holding row `index` (0-based; a row just added, for one). */
  const showRow = (index: number) => setPage(Math.max(0, Math.floor(index / pageRows)));
  return { start, end, pager, showRow };
}
