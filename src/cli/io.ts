/**
 * Where the command line writes. Injected so tests can run main() in-process and read the output.
 */

/** Writers for standard output and standard error; each call receives complete text. */
export interface CliIo {
  stdout(text: string): void;
  stderr(text: string): void;
}

/** Writers bound to the real process streams. */
export const processIo: CliIo = {
  stdout: (text) => {
    process.stdout.write(text);
  },
  stderr: (text) => {
    process.stderr.write(text);
  },
};
