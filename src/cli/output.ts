/**
 * Writing long outputs (a CSV of 100 000 rows) chunk by chunk, so the text is never held whole,
 * waiting while standard output drains and stopping quietly when the reader has closed the pipe.
 */
import type { CliIo } from './io';

/**
 * Writes each chunk to stdout as it is made (text, or UTF-8 bytes: through `io.stdoutBytes` where
 * there is one, else decoded); before each, waits until stdout can take it. Byte chunks the
 * writer is done with go back to their source with the request for the next (`next(chunk)`), so
 * their memory serves again. Returns false (having stopped early, without making the remaining
 * chunks) when the reader has gone, true when every chunk was written.
 */
export async function writeChunks(io: CliIo, chunks: Iterable<string | Uint8Array>): Promise<boolean> {
  const it = chunks[Symbol.iterator]() as Iterator<string | Uint8Array, unknown, Uint8Array | undefined>;
  let decoder: TextDecoder | undefined;
  let done: Uint8Array | undefined;
  for (;;) {
    const next = it.next(done);
    if (next.done) return true;
    const chunk = next.value;
    done = undefined;
    if (io.ready && !(await io.ready())) {
      it.return?.();
      return false;
    }
    if (typeof chunk === 'string') io.stdout(chunk);
    else if (io.stdoutBytes) {
      if (io.stdoutBytes(chunk)) done = chunk;
    } else {
      decoder ??= new TextDecoder();
      io.stdout(decoder.decode(chunk));
      done = chunk;
    }
  }
}
