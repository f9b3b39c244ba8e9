/**
 * Where the command line writes. Injected so tests can run main() in-process and read the output.
 */

/** Writers for standard output and standard error; each call receives complete text. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /**
   * Long outputs (see writeChunks in output.ts) ask this before each chunk: true once stdout can
   * take more (waiting while its buffer drains), false when the reader has gone (a closed pipe):
   * stop writing. Absent: always ready.
   */
  ready?(): boolean | Promise<boolean>;
}

/** Writers bound to the real process streams. */
export const processIo: CliIo = {
  stdout: (text) => {
    process.stdout.write(text);
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
