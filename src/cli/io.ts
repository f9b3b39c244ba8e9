/**
 * Where the command line writes, and how it reads files. Writers are injected so tests can run
 * main() in-process and read the output. Files are read with a byte cap: a device or pipe that
 * never ends (/dev/zero), or a file larger than it claims, stops at the cap with a one-line error.
 */
import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { formatFileSize } from '../io/byte-size';
import { UsageError } from './errors';

/** Writers for standard output and standard error; each call receives complete text. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /**
   * UTF-8 bytes for standard output (long outputs made as bytes); absent: they are decoded and
   * given to stdout. Returns true when it is done with them (written or copied), so the writer
   * may fill them again; false while they may still be read.
   */
  stdoutBytes?(bytes: Uint8Array): boolean;
  /**
   * Long outputs (see writeChunks in output.ts) ask this before each chunk: true once stdout can
   * take more (waiting while its buffer drains), false when the reader has gone (a closed pipe):
   * stop writing. Absent: always ready.
   */
  ready?(): boolean | Promise<boolean>;
  /**
   * The open file descriptor a "-" operand reads; absent: 0, the process's own standard input.
   * In-process runs (tests) give one of their own, so a "-" never waits on the test runner's input.
   */
  stdinFd?: number;
}

/** The descriptor "-" reads during the current run of main() (see CliIo.stdinFd). */
let standardInputFd = 0;

/** Runs `body` with "-" reading `fd` (absent: the process's standard input), then restores the previous one. */
export async function withStandardInput<T>(fd: number | undefined, body: () => Promise<T>): Promise<T> {
  const previous = standardInputFd;
  standardInputFd = fd ?? 0;
  try {
    return await body();
  } finally {
    standardInputFd = previous;
  }
}

/** Writers bound to the real process streams. */
export const processIo: CliIo = {
  stdout: (text) => {
    process.stdout.write(text);
  },
  stdoutBytes: (bytes) => {
    process.stdout.write(bytes);
    // Nothing left queued: the bytes were written at once (a file), not kept for later (a pipe).
    return process.stdout.writableLength === 0;
  },
  stderr: (text) => {
    process.stderr.write(text);
  },
  ready: () => {
    const out = process.stdout;
    if (out.destroyed || out.errored) return false;
    if (!out.writableNeedDrain) return true;
    return new Promise<boolean>((resolve) => {
      const done = () => {
        out.off('drain', done);
        out.off('close', done);
        resolve(!out.destroyed && !out.errored);
      };
      out.on('drain', done);
      out.on('close', done);
    });
  },
};

/** How a path reads in a message: "-" is standard input. */
export function shownPath(path: string): string {
  return path === '-' ? 'standard input' : path;
}

function errorCode(error: unknown): string {
  return typeof error === 'object' && error !== null && 'code' in error ? String(error.code) : '';
}

/** A file error in words ("no such file"), without the raw system text when a plain one exists. */
export function describeFileError(error: unknown): string {
  const reasons: Readonly<Record<string, string>> = {
    ENOENT: 'no such file',
    EISDIR: 'it is a directory',
    EACCES: 'permission denied',
    EPERM: 'permission denied',
  };
  return reasons[errorCode(error)] ?? (error instanceof Error ? error.message : String(error));
}

const sleeper = new Int32Array(new SharedArrayBuffer(4));

/**
 * Reads a whole file ("-" for standard input) as bytes, stopping as soon as more than `capBytes`
 * arrive, whatever size the file claims: then a one-line UsageError naming the file and the cap.
 * @param what the file's role in messages ("plan file", "sensor file").
 */
export function readFileCapped(path: string, what: string, capBytes: number): Uint8Array {
  let fd: number;
  const own = path !== '-';
  try {
    fd = own ? openSync(path, 'r') : standardInputFd;
  } catch (error) {
    throw new UsageError(`cannot read ${what} "${shownPath(path)}": ${describeFileError(error)}`);
  }
  // One buffer, sized from the file when it is a regular file (read straight into, no copies),
  // doubled while a pipe or a growing file keeps giving more, never beyond the cap + 1.
  let buffer: Uint8Array;
  let total = 0;
  try {
    let size = -1;
    try {
      const stat = fstatSync(fd);
      if (stat.isFile()) size = stat.size;
    } catch {
      size = -1;
    }
    buffer = new Uint8Array(Math.min(size >= 0 ? size + 1 : 1024 * 1024, capBytes + 1));
    for (;;) {
      if (total === buffer.length) {
        const grown = new Uint8Array(Math.min(2 * buffer.length, capBytes + 1));
        grown.set(buffer);
        buffer = grown;
      }
      let n: number;
      try {
        n = readSync(fd, buffer, total, buffer.length - total, null);
      } catch (error) {
        // A non-blocking standard input has nothing yet: wait a moment and read again.
        if (errorCode(error) === 'EAGAIN') {
          Atomics.wait(sleeper, 0, 0, 5);
          continue;
        }
        if (errorCode(error) === 'EOF') break;
        throw new UsageError(`cannot read ${what} "${shownPath(path)}": ${describeFileError(error)}`);
      }
      if (n === 0) break;
      total += n;
      if (total > capBytes) {
        throw new UsageError(`${what} "${shownPath(path)}" is larger than the ${formatFileSize(capBytes)} a ${what} may have (stopped reading there)`);
      }
    }
  } finally {
    if (own) closeSync(fd);
  }
  return buffer.subarray(0, total);
}
