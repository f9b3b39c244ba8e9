/**
 * Every command given malformed flags, values, units and files: the result is either success
 * (status 0) or bad input (status 2 with exactly one line on stderr) — never an internal error,
 * never a stack trace. Arguments are drawn from each command's own flag table plus a vocabulary
 * of awkward values and files from the malformed-input corpus. RUNS cases per command.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadAllCommands } from '../../src/cli/commands/index';
import { expectJsonUsageError, expectUsageError, run } from '../support/cli-harness';

const COMMANDS = await loadAllCommands();

const RUNS = 150;

const scratch = mkdtempSync(join(tmpdir(), 'sekundo-cli-fuzz-'));
const files = {
  empty: join(scratch, 'empty.csv'),
  binary: join(scratch, 'binary.csv'),
  ragged: join(scratch, 'ragged.csv'),
  good: join(scratch, 'good.csv'),
  missing: join(scratch, 'does-not-exist.csv'),
};
writeFileSync(files.empty, '');
writeFileSync(files.binary, Buffer.from([0, 1, 2, 255, 254, 0, 17, 80, 75, 3, 4]));
writeFileSync(files.ragged, 'time,a,b\n0,1,2\n1e-6,3\n2e-6,4,5,6\n');
writeFileSync(files.good, 'x_m,y_m,z_m,arrival_s,distance_m,delay_s\n0.1,0,0,0.005,0.01,0.0005\n0,0.1,0,0.006,0.02,0.001\n0,0,0.1,0.007,0.03,0.0015\n0.1,0.1,0,0.008,0.04,0.002\n');
const corpusPlans = fileURLToPath(new URL('../corpus/plans/', import.meta.url));
const demoPlan = fileURLToPath(new URL('../../public/demo-plan.json', import.meta.url));
const FILE_VALUES = [...Object.values(files), demoPlan, join(corpusPlans, 'truncated.json'), join(corpusPlans, 'proto-key.json'), join(corpusPlans, 'deep-nesting.json'), scratch];

const VALUES = [
  '1.8K', '1800mK', '1.8', '-1', '0', '1e308', '-1e308', 'NaN', 'Infinity', '', ' ', '1.8 furlongs', 'K', '50mm', '2.5ms', '1W/cm2',
  '1638Pa', '1atm', '20m/s', '5us', '3', '0.4', 'threshold', 'xcorr', 'bogus', '1,2,3,4', '0,0,0,0.1', '--json', '-', '=', '1e-400', '0x10', '½',
];

/**
 * Per command: flags always given first, and flags left out of the fuzzing. `rehearse` runs few
 * trials (a default rehearsal of the 10 MS/s demo takes seconds) and never writes files here (its
 * own tests cover --write-traces, in a temporary folder).
 */
const FIXED: Readonly<Record<string, { first: string[]; skip: string[] }>> = {
  rehearse: { first: ['--trials', '2'], skip: ['write-traces', 'trace-files', 'trials'] },
};

function argvFor(command: (typeof COMMANDS)[number]) {
  const fixed = FIXED[command.name] ?? { first: [], skip: [] };
  const flagNames = command.flags.filter((f) => !fixed.skip.includes(f.name)).map((f) => `--${f.name}`);
  const token = fc.oneof(
    { weight: 6, arbitrary: fc.tuple(fc.constantFrom(...flagNames), fc.constantFrom(...VALUES)).map(([f, v]) => [f, v]) },
    { weight: 2, arbitrary: fc.tuple(fc.constantFrom(...flagNames), fc.constantFrom(...VALUES)).map(([f, v]) => [`${f}=${v}`]) },
    { weight: 1, arbitrary: fc.constantFrom(...flagNames).map((f) => [f]) },
    { weight: 1, arbitrary: fc.constantFrom('--nope', '-x', '--', '--json', 'extra').map((t) => [t]) },
  );
  const operand = command.operands && command.operands.length > 0 ? fc.constantFrom(...FILE_VALUES).map((f) => [f]) : fc.constant([] as string[]);
  // `watch` follows a folder until interrupted: every case looks twice, quickly, and ends (--once).
  return fc.tuple(operand, fc.array(token, { maxLength: 6 })).map(([op, tokens]) => {
    const flat = tokens.flat();
    const ending =
      command.name !== 'watch'
        ? []
        : [...(flat.includes('--once') ? [] : ['--once']), ...(flat.some((t) => t.startsWith('--interval')) ? [] : ['--interval', '0.1s'])];
    return [command.name, ...op, ...fixed.first, ...ending, ...flat];
  });
}

describe('every command, malformed input: status 0 or 2 with one line, never a stack trace', () => {
  it.each(COMMANDS.map((c) => [c.name, c] as const))('%s', async (_name, command) => {
    await fc.assert(
      fc.asyncProperty(argvFor(command), async (argv) => {
        const result = await run(...argv);
        expect([0, 2], `${argv.join(' ')} → ${result.status}: ${result.stderr}`).toContain(result.status);
        if (result.status === 2 && argv.includes('--json')) expectJsonUsageError(result);
        else if (result.status === 2) expectUsageError(result);
        else expect(result.stderr).not.toMatch(/\bat .*\.(ts|js|mjs):\d+/);
      }),
      { numRuns: RUNS },
    );
  }, 120_000);
});
