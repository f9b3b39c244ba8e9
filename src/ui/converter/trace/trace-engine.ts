import type { TracePick, TracePickOptions } from '../../../io/trace-pick';
import { createTracePort } from './trace-port';
import type { TraceInfo, TracePort, TraceResponse, TraceSamples } from './trace-protocol';
import { TRACE_FILE_LIMIT_BYTES } from './trace-protocol';

/** Progress of one file being read. */
export interface ParseProgress {
  bytes: number;
  totalBytes: number;
  rows: number;
}

/** A file that could not be read: the message names the line and the problem, or says it was cancelled. */
export class TraceReadError extends Error {
  override name = 'TraceReadError';
  constructor(
    message: string,
    readonly cancelled: boolean,
  ) {
    super(message);
  }
}

interface ParseJob {
  resolve: (info: TraceInfo) => void;
  reject: (error: TraceReadError) => void;
  onProgress: (progress: ParseProgress) => void;
}

interface Pending {
  resolve: (value: never) => void;
  reject: (error: Error) => void;
}

/**
 * The page's client of the trace worker: promises for parse, pick and samples; progress by
 * callback; cancel by file id. One worker serves every file, so a pick can be answered between
 * the chunks of a long parse.
 */
export class TraceEngine {
  private readonly parses = new Map<string, ParseJob>();
  private readonly pending = new Map<number, Pending>();
  private nextRequest = 1;
  private broken: string | null = null;

  constructor(private readonly port: TracePort) {
    port.listen((message) => this.receive(message));
    port.onFailure((message) => this.fail(message));
  }

  /** Reads a file in the worker; resolves with what it holds, rejects with a {@link TraceReadError}. */
  parse(id: string, file: Blob, onProgress: (progress: ParseProgress) => void, sizeLimitBytes = TRACE_FILE_LIMIT_BYTES): Promise<TraceInfo> {
    if (this.broken !== null) return Promise.reject(new TraceReadError(this.broken, false));
    return new Promise((resolve, reject) => {
      this.parses.set(id, { resolve, reject, onProgress });
      this.port.post({ type: 'parse', id, file, sizeLimitBytes });
    });
  }

  /** Stops reading a file; its parse promise rejects as cancelled. */
  cancel(id: string): void {
    this.port.post({ type: 'cancel', id });
  }

  /** Picks the arrival in a file already read. */
  pick(id: string, options: TracePickOptions): Promise<TracePick> {
    return this.request<TracePick>((request) => this.port.post({ type: 'pick', request, id, options }));
  }

  /** A copy of a file's samples (transferred, not cloned). */
  samples(id: string): Promise<TraceSamples> {
    return this.request<TraceSamples>((request) => this.port.post({ type: 'samples', request, id }));
  }

  /** Drops a file's numbers from the worker. */
  forget(id: string): void {
    this.port.post({ type: 'forget', id });
  }

  private request<T>(send: (request: number) => void): Promise<T> {
    if (this.broken !== null) return Promise.reject(new Error(this.broken));
    const request = this.nextRequest++;
    return new Promise<T>((resolve, reject) => {
      this.pending.set(request, { resolve: resolve as (value: never) => void, reject });
      send(request);
    });
  }

  private receive(message: TraceResponse): void {
    switch (message.type) {
      case 'progress':
        this.parses.get(message.id)?.onProgress({ bytes: message.bytes, totalBytes: message.totalBytes, rows: message.rows });
        return;
      case 'parsed':
        this.parses.get(message.id)?.resolve(message.info);
        this.parses.delete(message.id);
        return;
      case 'parse-failed':
        this.parses.get(message.id)?.reject(new TraceReadError(message.message, message.cancelled));
        this.parses.delete(message.id);
        return;
      case 'picked':
        this.settle(message.request, (p) => p.resolve(message.pick as never));
        return;
      case 'samples':
        this.settle(message.request, (p) => p.resolve(message.samples as never));
        return;
      case 'request-failed':
        this.settle(message.request, (p) => p.reject(new Error(message.message)));
        return;
    }
  }

  private settle(request: number, how: (pending: Pending) => void): void {
    const pending = this.pending.get(request);
    if (!pending) return;
    this.pending.delete(request);
    how(pending);
  }

  private fail(message: string): void {
    this.broken = `The trace reader failed: ${message}. Reload the page to try again.`;
    for (const job of this.parses.values()) job.reject(new TraceReadError(this.broken, false));
    for (const p of this.pending.values()) p.reject(new Error(this.broken));
    this.parses.clear();
    this.pending.clear();
  }
}

let engine: TraceEngine | null = null;

/** The page's one trace engine, started on first use. */
export function traceEngine(): TraceEngine {
  engine ??= new TraceEngine(createTracePort());
  return engine;
}
