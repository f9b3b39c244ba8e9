/**
 * A CSV table written straight into bytes (UTF-8), chunk by chunk, cell for cell as
 * {@link csvCell} writes it (shortest round-trip numbers, neutralised and quoted text), for
 * tables of any length: no string per cell, per row or per chunk is made, numbers are written as
 * digits into the chunk ({@link writeShortestNumber}), and a number written again soon — down
 * its column (a default on every row) or within a few cells (a chosen value beside its copy) —
 * is copied rather than converted again. Runs in node and in a browser Web Worker.
 */
import { csvCell } from './csv-common';
import { SHORTEST_NUMBER_MAX_BYTES, writeShortestNumber } from './shortest-number-text';

/** Numbers remembered for copying within a few cells: a direct-mapped table by the double's bits (a power of two). */
const RECENT = 64;
const bits = new Float64Array(1);
const words32 = new Uint32Array(bits.buffer);
/** Text cells up to this length have their bytes remembered (codes, notes); longer ones are encoded each time. */
const WORD_MAX_CHARS = 32;
const WORDS_KEPT = 256;
const encoder = new TextEncoder();

export class CsvByteWriter {
  private buffer: Uint8Array;
  private pos = 0;
  /** Per column: the last number written, where its bytes start in the buffer and their length. */
  private readonly columnValue: Float64Array;
  private readonly columnStart: Int32Array;
  private readonly columnLength: Int32Array;
  /** Numbers written lately (any column), likewise, each in the slot its bits choose. */
  private readonly recentValue = new Float64Array(RECENT).fill(Number.NaN);
  private readonly recentStart = new Int32Array(RECENT);
  private readonly recentLength = new Int32Array(RECENT);
  private readonly words = new Map<string, Uint8Array>();
  private spare: Uint8Array | null = null;

  /**
   * @param columns how many columns the table has (numbers repeated down a column are copied).
   * @param chunkBytes the size at which {@link full} says to take the chunk.
   */
  constructor(
    columns: number,
    private readonly chunkBytes: number,
  ) {
    this.buffer = new Uint8Array(this.capacity());
    this.columnValue = new Float64Array(columns).fill(Number.NaN);
    this.columnStart = new Int32Array(columns);
    this.columnLength = new Int32Array(columns);
  }

  private capacity(): number {
    return Math.max(this.chunkBytes, 256) + 4096;
  }

  /** Room for `n` more bytes (a long row grows the chunk; what is written keeps its place). */
  private ensure(n: number): void {
    if (this.pos + n <= this.buffer.length) return;
    const grown = new Uint8Array(Math.max(2 * this.buffer.length, this.pos + n));
    grown.set(this.buffer.subarray(0, this.pos));
    this.buffer = grown;
  }

  /** Bytes written since the last {@link take}. */
  get size(): number {
    return this.pos;
  }

  /** True once the chunk has reached its size: take it before the next row. */
  full(): boolean {
    return this.pos >= this.chunkBytes;
  }

  /**
   * The chunk written so far; the writer starts a new one. The bytes handed over are not written
   * again unless they are given back ({@link giveBack}).
   */
  take(): Uint8Array {
    const chunk = this.buffer.subarray(0, this.pos);
    this.buffer = this.spare ?? new Uint8Array(this.capacity());
    this.spare = null;
    this.pos = 0;
    // Remembered bytes lay in the chunk just handed over.
    this.columnValue.fill(Number.NaN);
    this.recentValue.fill(Number.NaN);
    return chunk;
  }

  /**
   * A chunk from {@link take} whose reader is done with it (written out, or copied): its memory
   * serves the next chunk, so a long table does not allocate a buffer per chunk.
   */
  giveBack(chunk: Uint8Array): void {
    if (chunk.byteOffset === 0 && chunk.buffer.byteLength === this.capacity() && chunk.buffer !== this.buffer.buffer) this.spare = new Uint8Array(chunk.buffer as ArrayBuffer);
  }

  /** The cell delimiter. */
  comma(): void {
    this.ensure(1);
    this.buffer[this.pos++] = 44;
  }

  /** The end of a row. */
  newline(): void {
    this.ensure(1);
    this.buffer[this.pos++] = 10;
  }

  private copy(from: number, length: number): void {
    const b = this.buffer;
    let p = this.pos;
    for (let i = 0; i < length; i++) b[p++] = b[from + i] as number;
    this.pos = p;
  }

  /** A number cell of column `column`, as {@link csvCell} writes it (empty when not finite). */
  number(x: number, column: number): void {
    if (!Number.isFinite(x)) return;
    this.ensure(SHORTEST_NUMBER_MAX_BYTES);
    if (x === this.columnValue[column]) {
      this.copy(this.columnStart[column] as number, this.columnLength[column] as number);
      return;
    }
    const start = this.pos;
    if (Number.isSafeInteger(x) && x < 1e9 && x > -1e9) {
      this.integer(x);
    } else {
      bits[0] = x;
      const slot = ((words32[0] as number) ^ (words32[1] as number)) & (RECENT - 1);
      if (this.recentValue[slot] === x) this.copy(this.recentStart[slot] as number, this.recentLength[slot] as number);
      else {
        this.pos = writeShortestNumber(x, this.buffer, start);
        this.recentValue[slot] = x;
        this.recentStart[slot] = start;
        this.recentLength[slot] = this.pos - start;
      }
    }
    this.columnValue[column] = x;
    this.columnStart[column] = start;
    this.columnLength[column] = this.pos - start;
  }

  /** An integer of at most 9 digits. */
  private integer(x: number): void {
    const b = this.buffer;
    let v = x;
    if (v < 0) {
      b[this.pos++] = 45;
      v = -v;
    }
    let digits = 1;
    for (let t = v; t >= 10; t = (t / 10) | 0) digits++;
    let p = this.pos + digits;
    this.pos = p;
    do {
      const q = (v / 10) | 0;
      b[--p] = 48 + v - q * 10;
      v = q;
    } while (v > 0);
  }

  /** A text cell, as {@link csvCell} writes it (formula-like text neutralised, quoted where needed); empty text is an empty cell. */
  text(cell: string | boolean): void {
    if (cell === '') return;
    if (typeof cell === 'string' && cell.length <= WORD_MAX_CHARS) {
      let bytes = this.words.get(cell);
      if (bytes === undefined) {
        bytes = encoder.encode(csvCell(cell));
        if (this.words.size >= WORDS_KEPT) this.words.clear();
        this.words.set(cell, bytes);
      }
      this.ensure(bytes.length);
      this.buffer.set(bytes, this.pos);
      this.pos += bytes.length;
      return;
    }
    const text = csvCell(cell);
    this.ensure(3 * text.length);
    this.pos += encoder.encodeInto(text, this.buffer.subarray(this.pos)).written;
  }
}
