/**
 * Writing long outputs (a CSV of 100 000 rows) chunk by chunk, so the text is never held whole,
 * waiting while standard output drains and stopping quietly when the reader has closed the pipe.
 */
import type { CliIo } from './io';

/**
 * Writes each chunk to stdout as it is made; before each, waits until stdout can take it.
 * Returns false (having stopped early, without making the remaining chunks) when the reader has
 * gone, true when every chunk was written.
 */
export async function writeChunks(io: CliIo, chunks: Iterable<string>): Promise<boolean> {
  for (const chunk of chunks) {
    if (io.ready && !(await io.ready())) return false;
    io.stdout(chunk);
  }
  return true;
}
