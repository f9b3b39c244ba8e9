/**
 * Long command-line outputs are streamed and a closed pipe ends the command quietly; the CLI
 * bundle (scripts/build-cli.mjs, what `npx sekundo` runs after `npm ci`) prints what the sources
 * print. Delays are invented; the results are the kernel's own, compared text for text.
 */
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import type { CliIo } from '../../src/cli/io';
import { main } from '../../src/cli/main';
import { convertDelayBatch, parseDelayCsv } from '../../src/io/delay-batch';
import { delayResultCsvChunks, delayResultsToCsv } from '../../src/io/delay-results-csv';
import { run } from '../support/cli-harness';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const scratch = mkdtempSync(join(tmpdir(), 'sekundo-cli-stream-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** `rows` invented delays from 2.3 to 2.7 ms (at 50 mm: 18.5–21.7 m/s, one to three candidates). */
function delaysCsv(rows: number): string {
  let text = 'delay_s\n';
  for (let i = 0; i < rows; i++) text += `${(2.3e-3 + (0.4e-3 * ((i * 7919) % rows)) / rows).toPrecision(9)}\n`;
  return text;
}

const ROWS = 20_000;
const bigDelays = join(scratch, 'delays.csv');
writeFileSync(bigDelays, delaysCsv(ROWS));

/** Runs main() in-process, keeping each stdout write apart; `readyFor` writes are accepted. */
async function runChunks(argv: string[], readyFor = Number.POSITIVE_INFINITY) {
  const chunks: string[] = [];
  let stderr = '';
  let asked = 0;
  const io: CliIo = {
    stdout: (text) => {
      chunks.push(text);
    },
    stderr: (text) => {
      stderr += text;
    },
    ready: async () => {
      asked++;
      return asked <= readyFor;
    },
  };
  const status = await main(argv, io);
  return { status, chunks, stderr };
}

describe('delay --input streams its CSV', () => {
  it(`writes ${ROWS} rows in chunks of about 64 k characters, never the whole text at once, the same text as delayResultsToCsv`, async () => {
    const { status, chunks, stderr } = await runChunks(['delay', '--input', bigDelays, '--distance', '50mm', '--delay-sd', '1us']);
    expect(status).toBe(0);
    expect(stderr).toBe('');
    const whole = delayResultsToCsv(convertDelayBatch(parseDelayCsv(delaysCsv(ROWS)), { distance_m: 0.05, delaySd_s: 1e-6 }));
    expect(chunks.join('')).toBe(whole);
    expect(chunks.length).toBeGreaterThan(whole.length / (70 * 1024));
    for (const chunk of chunks) {
      expect(chunk.length).toBeLessThan(66 * 1024);
      expect(chunk.endsWith('\n')).toBe(true);
    }
  });

  it('writes UTF-8 bytes where the writer takes them, reusing a chunk it is done with: the same text', async () => {
    const decoder = new TextDecoder();
    let text = '';
    const buffers = new Set<ArrayBufferLike>();
    let writes = 0;
    const io: CliIo = {
      stdout: (t) => {
        text += t;
      },
      stderr: () => {},
      stdoutBytes: (bytes) => {
        text += decoder.decode(bytes);
        buffers.add(bytes.buffer);
        writes++;
        return true;
      },
    };
    expect(await main(['delay', '--input', bigDelays, '--distance', '50mm', '--delay-sd', '1us'], io)).toBe(0);
    expect(text).toBe(delayResultsToCsv(convertDelayBatch(parseDelayCsv(delaysCsv(ROWS)), { distance_m: 0.05, delaySd_s: 1e-6 })));
    expect(writes).toBeGreaterThan(10);
    expect(buffers.size).toBeLessThanOrEqual(2);
  });

  it('stops at the next chunk, quietly and with status 0, when the reader has gone', async () => {
    const { status, chunks, stderr } = await runChunks(['delay', '--input', bigDelays, '--distance', '50mm'], 2);
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(chunks).toHaveLength(2);
  });

  it('the chunked writer gives the same text for every chunk size, header first', () => {
    const results = convertDelayBatch(parseDelayCsv('timestamp,delay_ms,pressure_mbar\n"a, b",2.5,16.38\nc,2.45,\nd,2.6,\n', { column: 'delay_ms' }), { distance_m: 0.05 });
    const whole = delayResultsToCsv(results);
    for (const size of [1, 10, 100, 1 << 16]) expect([...delayResultCsvChunks(results, {}, size)].join('')).toBe(whole);
    expect([...delayResultCsvChunks(results, {}, 1)]).toHaveLength(4);
    const inUnits = [...delayResultCsvChunks(results, { temperature: 'mK', length: 'mm', time: 'us', pressure: 'mbar' }, 1)];
    expect(inUnits[0]).toBe(
      'line,timestamp,delay_us,distance_mm,pressure_mbar,speed_m_s,speedSd_m_s,candidates,chosen,chosen_by,T_mK,T_sd_mK,T_sd_meas_mK,T_sd_curve_mK,T_lo68_mK,T_hi68_mK,T_lo95_mK,T_hi95_mK,evidence_sd,alternatives,guess,warnings,T1_mK,T1_sd_mK,T1_branch,T1_note,T2_mK,T2_sd_mK,T2_branch,T2_note,T3_mK,T3_sd_mK,T3_branch,T3_note\n',
    );
    expect(inUnits[1]?.startsWith('2,"a, b",2500,50,16.38,20,0,3,')).toBe(true);
  });
});

/** Spawns the real program with its stdout pipe already closed by the reader. */
function runWithClosedPipe(args: string[]): Promise<{ status: number | null; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['bin/sekundo.mjs', ...args], { cwd: REPO_ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout.destroy();
    let stderr = '';
    child.stderr.on('data', (d: Buffer) => {
      stderr += d.toString();
    });
    child.on('error', reject);
    child.on('close', (status) => resolve({ status, stderr }));
  });
}

describe('a closed pipe (`sekundo … | head -1`) ends the command quietly', () => {
  it.each([
    ['delay --input (streamed CSV)', ['delay', '--input', bigDelays, '--distance', '50mm']],
    ['props --json (one write)', ['props', '--temperature', '1.8K', '--json']],
    ['--help', ['--help']],
  ])('%s: status 0, nothing on stderr, no EPIPE stack trace', async (_name, args) => {
    const { status, stderr } = await runWithClosedPipe(args);
    expect(stderr).toBe('');
    expect(status).toBe(0);
  });
});

describe('the CLI bundle prints what the sources print', () => {
  const outdir = join(scratch, 'bundle');
  const built = spawnSync(process.execPath, ['scripts/build-cli.mjs', '--outdir', outdir], { cwd: REPO_ROOT, encoding: 'utf8' });
  const trace = join(scratch, 'trace.csv');
  const rows = ['time_us,heater,sensor'];
  for (let i = 0; i < 4000; i++) {
    const t = i - 500;
    rows.push(`${t},${t >= 0 && t < 50 ? 1 : 0},${(0.02 + (t >= 2500 && t < 2600 ? 1e-3 : 0) + 1e-6 * Math.sin(i * 1.7)).toExponential(6)}`);
  }
  writeFileSync(trace, `${rows.join('\n')}\n`);
  const small = join(scratch, 'small.csv');
  writeFileSync(small, delaysCsv(300));

  it('builds', () => {
    expect(built.stderr).toBe('');
    expect(built.status).toBe(0);
  });

  it.each([
    [['--version']],
    [['--help']],
    [['props', '--temperature', '1.8K']],
    [['props', '--temperature', '1.8K', '--json']],
    [['delay', '--distance', '50mm', '--delay', '2.5ms', '--pressure', '1638.2Pa']],
    [['delay', '--input', small, '--distance', '50mm', '--delay-sd', '1us']],
    [['trace', trace, '--distance', '50mm', '--heater-column', 'heater', '--json']],
    [['props', '--temperature', '5K']],
    [['nonsense']],
  ])('sekundo %j', async (argv) => {
    const bundled = spawnSync(process.execPath, [join(outdir, 'sekundo.mjs'), ...argv], { cwd: REPO_ROOT, encoding: 'utf8' });
    const source = await run(...argv);
    expect({ status: bundled.status, stdout: bundled.stdout, stderr: bundled.stderr }).toEqual(source);
  });
});
