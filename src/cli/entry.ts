/**
 * The program `sekundo`: runs main() on the process arguments and sets the exit status. This is
 * the CLI bundle's entry point (scripts/build-cli.mjs) and what bin/sekundo.mjs runs through tsx
 * when the bundle is missing or stale.
 *
 * A reader that goes away (`sekundo … | head -1`) closes the pipe: writes then fail with EPIPE.
 * That ends the command quietly with status 0 — the long outputs stop at the next chunk
 * (io.ready() says false) and nothing is printed — instead of Node's unhandled-error stack trace.
 */
import { main } from './main';

process.stdout.on('error', (error: NodeJS.ErrnoException) => {
  if (error.code === 'EPIPE' || error.code === 'ERR_STREAM_DESTROYED') return;
  process.stderr.write(`sekundo: cannot write the output: ${error.message.replace(/\s*[\r\n]+\s*/g, ' ')}\n`);
  process.exit(1);
});

process.exitCode = await main(process.argv.slice(2));
