/**
 * A trace CSV read from a stream of bytes or a File/Blob, with progress and cancellation: the
 * streaming parser (trace-csv.ts) fed chunk by chunk, as a Web Worker reads a file.
 */
import { type TraceCsv, TraceCsvParser, type TraceParseOptions } from './trace-csv';

/**
 * Parses a trace from a stream of byte chunks (e.g. `file.stream()` in a Web Worker), with
 * progress and cancellation through the options. Throws {@link CsvInputError}.
 */
export async function parseTraceCsvStream(stream: ReadableStream<Uint8Array>, options: TraceParseOptions = {}): Promise<TraceCsv> {
  const parser = new TraceCsvParser(options);
  const reader = stream.getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      parser.feed(value);
    }
    return parser.finish();
  } catch (error) {
    await reader.cancel().catch(() => undefined);
    throw error;
  } finally {
    reader.releaseLock();
  }
}

/** Parses a File or Blob (its size gives the progress fraction). */
export function parseTraceCsvBlob(blob: Blob, options: TraceParseOptions = {}): Promise<TraceCsv> {
  return parseTraceCsvStream(blob.stream() as ReadableStream<Uint8Array>, { totalBytes: blob.size, ...options });
}
