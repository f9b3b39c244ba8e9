/**
 * The results of a delay batch as CSV bytes, streamed: the text of the columns declared in
 * delay-batch's RESULT_COLUMNS (the page's table export reads the same table), written straight
 * into UTF-8 chunks ({@link CsvByteWriter}). A batch without pressures is converted and written
 * block by block ({@link delayBatchCsvBytes}), so its results are never held whole; a batch with
 * pressures is converted whole first, since a later row's pressure can settle rows long before it.
 * Runs in node and in a browser Web Worker.
 */
import { CsvByteWriter } from './csv-byte-writer';
import {
  type BatchShape,
  checkDelayBatch,
  clearDelayResults,
  columnsOf,
  convertDelayBatch,
  type DelayBatch,
  type DelayBatchResults,
  type DelayBatchSettings,
  type DelayRow,
  delayResultHeader,
  delayRowConverter,
  emptyDelayResults,
  type ResultColumn,
  type ResultUnits,
} from './delay-batch';

/** Bytes per chunk of {@link delayResultCsvBytes}. */
const CSV_CHUNK_BYTES = 1 << 16;

/** The CSV of result blocks (tables of consecutive rows, in order) under one header, in chunks; see {@link delayResultCsvBytes}. */
function* csvBytesOfBlocks(shape: BatchShape, units: ResultUnits, chunkBytes: number, blocks: Iterable<DelayBatchResults>): Generator<Uint8Array, void, Uint8Array | undefined> {
  const columns = columnsOf(shape);
  const out = new CsvByteWriter(columns.length, chunkBytes);
  const header = delayResultHeader(shape, units);
  for (let c = 0; c < header.length; c++) {
    if (c > 0) out.comma();
    out.text(header[c] as string);
  }
  out.newline();
  for (const results of blocks) {
    for (let i = 0; i < results.count; i++) {
      if (out.full()) {
        const done = yield out.take();
        if (done) out.giveBack(done);
      }
      for (let c = 0; c < columns.length; c++) {
        if (c > 0) out.comma();
        const cell = (columns[c] as ResultColumn).cell(results, i, units);
        if (typeof cell === 'number') out.number(cell, c);
        else if (cell != null) out.text(cell);
      }
      out.newline();
    }
  }
  if (out.size > 0) yield out.take();
}

/**
 * The results as CSV, UTF-8 bytes in chunks of about 64 kB (whole lines), for writing a batch of
 * any length without holding its text: the same text as {@link delayResultsToCsv}. Cells go
 * straight into the chunk's bytes ({@link CsvByteWriter}): no string per number, cell or row,
 * and a number that repeats down its column (the default distance) or within a few cells (the
 * chosen T and its Ti) is converted to text once. A reader done with a chunk when it asks for
 * the next may pass it back (`next(chunk)`): its memory then serves again.
 */
export function* delayResultCsvBytes(results: DelayBatchResults, units: ResultUnits = {}, chunkBytes = CSV_CHUNK_BYTES): Generator<Uint8Array, void, Uint8Array | undefined> {
  yield* csvBytesOfBlocks(results.batch, units, chunkBytes, [results]);
}

/**
 * The results as CSV text in chunks of about 64 k characters (whole lines): {@link delayResultCsvBytes}
 * decoded, chunk by chunk.
 */
export function* delayResultCsvChunks(results: DelayBatchResults, units: ResultUnits = {}, chunkChars = CSV_CHUNK_BYTES): Generator<string, void, undefined> {
  const decoder = new TextDecoder();
  const chunks = delayResultCsvBytes(results, units, chunkChars);
  for (let next = chunks.next(); !next.done; ) {
    const bytes = next.value;
    yield decoder.decode(bytes);
    // Decoded: the bytes serve the next chunk.
    next = chunks.next(bytes);
  }
}

/** The results as CSV text (RFC 4180 quoting, LF line ends, a header row first), columns in `units` where given. */
export function delayResultsToCsv(results: DelayBatchResults, units: ResultUnits = {}): string {
  let text = '';
  for (const chunk of delayResultCsvChunks(results, units)) text += chunk;
  return text;
}

/** Rows converted per block of {@link delayBatchCsvBytes}. */
const BLOCK_ROWS = 4096;

/**
 * A batch converted ({@link convertDelayBatch}) and written as CSV chunks
 * ({@link delayResultCsvBytes}), the same bytes, holding as little as it can: without pressures
 * no later row can settle an earlier one, so rows are converted and written a block at a time
 * into one reused table (`blockRows` rows; a batch no longer than that is converted whole); with
 * pressures the batch is converted whole first. Throws (before any chunk) what convertDelayBatch
 * throws: every row is checked first.
 */
export function delayBatchCsvBytes(
  batch: DelayBatch,
  settings: DelayBatchSettings,
  units: ResultUnits = {},
  chunkBytes = CSV_CHUNK_BYTES,
  blockRows = BLOCK_ROWS,
): Generator<Uint8Array, void, Uint8Array | undefined> {
  if (batch.hasPressure || batch.rows.length <= blockRows) return delayResultCsvBytes(convertDelayBatch(batch, settings), units, chunkBytes);
  checkDelayBatch(batch, settings);
  return csvBytesOfBlocks(batch, units, chunkBytes, blocksOf(batch, settings, blockRows));
}

/** The batch converted block by block into one reused table (valid until the next block). */
function* blocksOf(batch: DelayBatch, settings: DelayBatchSettings, blockRows: number): Generator<DelayBatchResults, void, undefined> {
  const convert = delayRowConverter(settings, false);
  const block = emptyDelayResults(batch, blockRows);
  for (let from = 0; from < batch.rows.length; from += blockRows) {
    const rows = batch.rows.slice(from, from + blockRows);
    clearDelayResults(block);
    block.batch = { ...batch, rows };
    block.count = rows.length;
    for (let i = 0; i < rows.length; i++) convert(block, i, rows[i] as DelayRow);
    yield block;
  }
}
