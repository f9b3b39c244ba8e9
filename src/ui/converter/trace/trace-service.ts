/**
 * What the trace worker does, apart from the worker itself, so it can be tested in node: reads a
 * file as a stream of bytes through the incremental CSV parser (the text is never held), reports
 * progress a few times a second, stops on cancel, keeps the parsed numbers by file id, picks
 * arrivals, and sends samples back as transferable typed arrays.
 */
import { CsvInputError } from '../../../io/csv-common';
import { type TraceCsv, TraceCsvParser } from '../../../io/trace-csv';
import { pickTraceArrival } from '../../../io/trace-pick';
import { PhysicsError } from '../../../physics';
import type { TraceInfo, TraceRequest, TraceResponse, TraceSamples } from './trace-protocol';

/** Least time between two progress messages, ms (the bar moves smoothly; the page is not flooded). */
const PROGRESS_INTERVAL_MS = 80;
/** Bytes fed at a time when a Blob cannot be streamed (then read whole, fed in slices). */
const SLICE_BYTES = 1 << 20;

export type Send = (message: TraceResponse, transfer?: Transferable[]) => void;

export class TraceService {
  private readonly traces = new Map<string, TraceCsv>();
  private readonly jobs = new Map<string, AbortController>();

  constructor(private readonly send: Send) {}

  /** Handles one request; the answer arrives through `send`. */
  handle(message: TraceRequest): Promise<void> | undefined {
    switch (message.type) {
      case 'parse':
        return this.parse(message.id, message.file, message.sizeLimitBytes);
      case 'cancel':
        this.jobs.get(message.id)?.abort();
        return undefined;
      case 'pick':
        this.answer(message.request, () => {
          const trace = this.trace(message.id);
          this.send({ type: 'picked', request: message.request, pick: pickTraceArrival(trace, message.options) });
        });
        return undefined;
      case 'samples':
        this.answer(message.request, () => {
          const samples = samplesOf(this.trace(message.id));
          this.send({ type: 'samples', request: message.request, samples }, [samples.time_s.buffer, ...samples.channels.map((c) => c.values.buffer)]);
        });
        return undefined;
      case 'forget':
        this.jobs.get(message.id)?.abort();
        this.traces.delete(message.id);
        return undefined;
    }
  }

  /** Ids of the traces held (tests). */
  held(): string[] {
    return [...this.traces.keys()];
  }

  private trace(id: string): TraceCsv {
    const trace = this.traces.get(id);
    if (!trace) throw new CsvInputError('no-data', 'this file is no longer loaded; drop it again');
    return trace;
  }

  private answer(request: number, work: () => void): void {
    try {
      work();
    } catch (error) {
      this.send({ type: 'request-failed', request, message: messageOf(error) });
    }
  }

  private async parse(id: string, file: Blob, sizeLimitBytes: number): Promise<void> {
    const controller = new AbortController();
    this.jobs.set(id, controller);
    let last = Number.NEGATIVE_INFINITY;
    let parser: TraceCsvParser | null = null;
    try {
      // The constructor refuses an oversize file at once, before any byte is read.
      parser = new TraceCsvParser({
        totalBytes: file.size,
        sizeLimitBytes,
        signal: controller.signal,
        onProgress: (p) => {
          const now = Date.now();
          if (!p.done && now - last < PROGRESS_INTERVAL_MS) return;
          last = now;
          this.send({ type: 'progress', id, bytes: p.bytes, totalBytes: file.size, rows: p.rows });
        },
      });
      await feedAll(parser, file, controller.signal);
      const trace = parser.finish();
      if (controller.signal.aborted) throw new CsvInputError('cancelled', 'reading the trace was cancelled');
      this.traces.set(id, trace);
      this.send({ type: 'parsed', id, info: infoOf(trace) });
    } catch (error) {
      parser?.cancel();
      const cancelled = controller.signal.aborted || (error instanceof CsvInputError && error.problem === 'cancelled');
      this.send({ type: 'parse-failed', id, message: cancelled ? 'cancelled before it was read' : messageOf(error), cancelled });
    } finally {
      this.jobs.delete(id);
    }
  }
}

/** Streams the blob's bytes into the parser, stopping when the signal aborts. */
async function feedAll(parser: TraceCsvParser, file: Blob, signal: AbortSignal): Promise<void> {
  if (typeof file.stream === 'function') {
    const reader = (file.stream() as ReadableStream<Uint8Array>).getReader();
    try {
      for (;;) {
        const { done, value } = await reader.read();
        if (done) return;
        if (signal.aborted) throw new CsvInputError('cancelled', 'reading the trace was cancelled');
        parser.feed(value);
      }
    } finally {
      await reader.cancel().catch(() => undefined);
    }
  }
  // No streams (older engines, jsdom): read the bytes, feed them in slices, yield between slices.
  const bytes = new Uint8Array(await file.arrayBuffer());
  for (let at = 0; at < bytes.length; at += SLICE_BYTES) {
    if (signal.aborted) throw new CsvInputError('cancelled', 'reading the trace was cancelled');
    parser.feed(bytes.subarray(at, at + SLICE_BYTES));
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
}

function infoOf(trace: TraceCsv): TraceInfo {
  const t = trace.time_s;
  return {
    rows: trace.metadata.rows,
    channels: trace.channels.map((c) => c.name),
    timeColumn: trace.metadata.timeColumn,
    timeUnit: trace.timeUnit ?? null,
    fields: { ...trace.metadata.fields },
    firstTime_s: t[0] ?? 0,
    lastTime_s: t[t.length - 1] ?? 0,
    bytes: trace.metadata.bytes,
  };
}

/** Copies of the numbers for the page: time as float64, channels as float32 (half the memory). */
function samplesOf(trace: TraceCsv): TraceSamples {
  return {
    time_s: trace.time_s.slice(),
    channels: trace.channels.map((c) => ({ name: c.name, values: Float32Array.from(c.values) })),
  };
}

/** One line for the user: CSV and kernel errors as they are, anything else with its text. */
export function messageOf(error: unknown): string {
  if (error instanceof CsvInputError || error instanceof PhysicsError) return error.message;
  return error instanceof Error ? `${error.name}: ${error.message}` : String(error);
}
