/**
 * Messages between the page and the trace worker. The worker reads digitiser CSV files (streamed,
 * never held as text), keeps the numbers, picks arrivals on request, and sends samples back as
 * transferable typed arrays. Everything here is structured-cloneable.
 */
import type { TracePick, TracePickOptions } from '../../../io/trace-pick';

/** Largest trace file the page reads, bytes (256 MiB): a 200 MB file stays usable, bigger ones are refused. */
export const TRACE_FILE_LIMIT_BYTES = 256 * 1024 * 1024;
/** Most trace files in one session (a series of shots). */
export const TRACE_FILE_COUNT_LIMIT = 500;
/** Most bytes of trace files held at once (the numbers take about as much memory as the text). */
export const TRACE_TOTAL_LIMIT_BYTES = 768 * 1024 * 1024;

/** What the page learns about a parsed file (the numbers stay in the worker until asked for). */
/** Which way the pulse goes on the sensor channel; automatic follows the larger excursion. */
export type Polarity = 'auto' | 'positive' | 'negative';

export interface TraceInfo {
  rows: number;
  /** Channel names, file order, time excluded. */
  channels: string[];
  timeColumn: string;
  /** Time unit named in the header, if any. */
  timeUnit: string | null;
  /** "key: value" header lines. */
  fields: Record<string, string>;
  /** First and last time, s (file axis). */
  firstTime_s: number;
  lastTime_s: number;
  bytes: number;
}

/** One file's samples: time in full precision, channel values as float32 (drawing only). */
export interface TraceSamples {
  time_s: Float64Array;
  channels: { name: string; values: Float32Array }[];
}

export type TraceRequest =
  | { type: 'parse'; id: string; file: Blob; sizeLimitBytes: number }
  | { type: 'cancel'; id: string }
  | { type: 'pick'; request: number; id: string; options: TracePickOptions }
  | { type: 'samples'; request: number; id: string }
  | { type: 'forget'; id: string };

export type TraceResponse =
  | { type: 'progress'; id: string; bytes: number; totalBytes: number; rows: number }
  | { type: 'parsed'; id: string; info: TraceInfo }
  | { type: 'parse-failed'; id: string; message: string; cancelled: boolean }
  | { type: 'picked'; request: number; pick: TracePick }
  | { type: 'samples'; request: number; samples: TraceSamples }
  | { type: 'request-failed'; request: number; message: string };

/** The two ends of the channel between page and worker (a Worker, or an in-process stand-in in tests). */
export interface TracePort {
  post(message: TraceRequest): void;
  listen(handler: (message: TraceResponse) => void): void;
  /** Called when the worker itself fails (cannot load, crashed). */
  onFailure(handler: (message: string) => void): void;
}
