/**
 * Writing long outputs (a CSV of 100 000 rows) chunk by chunk, so the text is never held whole,
 * waiting while standard output drains and stopping quietly when the reader has closed the pipe.
 */
import type { CliIo } from './io';

/**
 * Writes each chunk to stdout as it is made (text, or UTF-8 bytes: through `io.stdoutBytes` where
 * there is one, else decoded); before each, waits until stdout can take it.
 * Returns false (having stopped early, without making the remaining chunks) when the reader has
 * gone, true when every chunk was written.
 */
export async function writeChunks(io: CliIo, chunks: Iterable<string | Uint8Array>): Promise<boolean> {
  let decoder: TextDecoder | undefined;
  for (const chunk of chunks) {
    if (io.ready && !(await io.ready())) return false;
    if (typeof chunk === 'string') io.stdout(chunk);
    else if (io.stdoutBytes) io.stdoutBytes(chunk);
    else {
      decoder ??= new TextDecoder();
      io.stdout(decoder.decode(chunk));
    }
  }
  return true;
}
