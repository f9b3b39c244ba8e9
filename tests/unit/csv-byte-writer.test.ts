/**
 * The byte writer of large CSV tables writes every cell as csvCell does (common practice, no
 * source: RFC 4180 quoting, the OWASP formula neutralising, JavaScript's shortest number text),
 * repeated or not, across chunks, in chunks it may reuse once handed back.
 */
import { describe, expect, it } from 'vitest';
import { CsvByteWriter } from '../../src/io/csv-byte-writer';
import { type CsvCell, csvCell } from '../../src/io/csv-common';

/** The rows through the writer (numbers by column), chunk by chunk, decoded. */
function written(rows: readonly (readonly CsvCell[])[], chunkBytes: number, giveBack: boolean): { text: string; chunks: number; buffers: Set<ArrayBufferLike> } {
  const columns = Math.max(...rows.map((r) => r.length));
  const out = new CsvByteWriter(columns, chunkBytes);
  const decoder = new TextDecoder();
  let text = '';
  let chunks = 0;
  const buffers = new Set<ArrayBufferLike>();
  const take = () => {
    const chunk = out.take();
    text += decoder.decode(chunk);
    chunks++;
    buffers.add(chunk.buffer);
    if (giveBack) out.giveBack(chunk);
  };
  for (const row of rows) {
    if (out.full()) take();
    row.forEach((cell, c) => {
      if (c > 0) out.comma();
      if (typeof cell === 'number') out.number(cell, c);
      else if (cell != null) out.text(cell);
    });
    out.newline();
  }
  if (out.size > 0) take();
  return { text, chunks, buffers };
}

const expected = (rows: readonly (readonly CsvCell[])[]) => rows.map((r) => `${r.map(csvCell).join(',')}\n`).join('');

const ROWS: CsvCell[][] = [];
for (let i = 0; i < 3000; i++) {
  const t = 1.2 + i * 1.37e-4;
  ROWS.push([i + 2, 0.05, t, 0.001 * (1 + (i % 7)), t, -0, i % 3 === 0 ? null : -3.5e-12 * i, Number.NaN, i % 5 === 0 ? '=1+1' : 'low', i % 11 === 0 ? 'a, "b"' : '', true, 'x'.repeat(40 + (i % 3)), 'µs ✓', 1e21 + i, 123456789012345680000]);
}

describe('CsvByteWriter', () => {
  it('writes every cell as csvCell does, numbers repeated down a column or within a row or not', () => {
    expect(written(ROWS, 1 << 16, false).text).toBe(expected(ROWS));
  });

  it('gives the same text for any chunk size, a chunk per row at size 1, whole rows per chunk', () => {
    const whole = expected(ROWS.slice(0, 200));
    for (const size of [1, 10, 333, 4096]) expect(written(ROWS.slice(0, 200), size, true).text).toBe(whole);
    expect(written(ROWS.slice(0, 200), 1, false).chunks).toBe(200);
  });

  it('reuses a chunk handed back, and never writes into one that was not', () => {
    const kept = written(ROWS, 2048, false);
    const reused = written(ROWS, 2048, true);
    expect(reused.text).toBe(kept.text);
    expect(kept.buffers.size).toBe(kept.chunks);
    expect(reused.buffers.size).toBeLessThanOrEqual(2);
  });

  it('grows a chunk for a cell longer than it (nothing written is lost)', () => {
    const rows: CsvCell[][] = [['a'.repeat(10_000), 1.5], ['b,'.repeat(9_000), 2.5], [0.1 + 0.2, 'é'.repeat(5_000)]];
    expect(written(rows, 64, false).text).toBe(expected(rows));
  });
});
