/**
 * The command line against hostile input: endless devices and oversize files stop at a byte cap;
 * every error is one short printable line (or one JSON object with --json); `locate -` reads
 * standard input; plan files in UTF-16 are read like traces; speeds far below any second sound and
 * time columns that count samples are refused. Expected behaviour is common practice, no source.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, mkdtempSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_ERROR_CHARS } from '../../src/cli/errors';
import { main } from '../../src/cli/main';
import { expectUsageError, run } from '../support/cli-harness';

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sekundo-hardening-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function file(name: string, content: string | Uint8Array): string {
  const path = join(dir, name);
  writeFileSync(path, content);
  return path;
}

/** Printable: no C0/C1 control character, no line or paragraph separator, no bidi override. */
function expectPrintable(line: string): void {
  // biome-ignore lint/suspicious/noControlCharactersInRegex: the test looks for exactly these characters
  expect(line).not.toMatch(/[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e]/);
  expect(line.length).toBeLessThanOrEqual(MAX_ERROR_CHARS + 'sekundo: '.length);
}

const DEMO_PLAN = readFileSync('public/demo-plan.json', 'utf8');

describe('endless or oversize input stops at a byte cap', () => {
  it.each([
    ['plan', ['plan', '/dev/zero']],
    ['locate', ['locate', '/dev/zero', '--temperature', '1.8K']],
    ['fit', ['fit', '/dev/zero']],
    ['delay --input', ['delay', '--input', '/dev/zero', '--distance', '25mm']],
  ])('%s /dev/zero ends with one line naming the cap', async (_name, argv) => {
    const line = expectUsageError(await run(...argv));
    expect(line).toMatch(/larger than the [\d.]+ MiB/);
    expectPrintable(line);
  }, 30_000);
});

describe('errors are one short printable line', () => {
  it('an escape sequence in a plan file does not reach the terminal', async () => {
    const path = file('escape.json', '\u001b[2J\u001b[H{"format": "sekundo-plan"}');
    const line = expectUsageError(await run('plan', path));
    expectPrintable(line);
    expect(line).toContain('\\x1b');
  });

  it('a PNG given as a plan file is one line saying it is not text', async () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52, 0x0a, 0x0d, 0x85, 0x2028 & 0xff]);
    const line = expectUsageError(await run('plan', file('picture.png', png)));
    expectPrintable(line);
    expect(line).toMatch(/binary|not text/);
  });

  it('a 5 MB line does not make a 5 MB error', async () => {
    const path = file('long.csv', `distance_m,${'x'.repeat(5_000_000)}\n0.025,0.001\n`);
    const line = expectUsageError(await run('delay', '--input', path, '--distance', '25mm'));
    expectPrintable(line);
  });

  it('a plan file with a 3 MB name gives a short error', async () => {
    const plan = JSON.parse(DEMO_PLAN) as Record<string, unknown>;
    plan.name = `\u202e${'n'.repeat(3_000_000)}`;
    const line = expectUsageError(await run('plan', file('long-name.json', JSON.stringify(plan))));
    expectPrintable(line);
  });

  it('with --json an error is one JSON object on stderr naming the field', async () => {
    const result = await run('delay', '--distance', '25mm', '--delay', 'soon', '--json');
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    const lines = result.stderr.split('\n').filter((l) => l !== '');
    expect(lines).toHaveLength(1);
    const error = JSON.parse(lines[0] ?? '') as { error: string; field: string | null };
    expect(error.field).toBe('--delay');
    expect(error.error).toMatch(/--delay/);
  });

  it('--json refused with --input is itself reported as a JSON object', async () => {
    const result = await run('delay', '--input', file('d2.csv', 'delay_s\n0.0025\n'), '--distance', '5cm', '--json');
    expect(result.status).toBe(2);
    expect(JSON.parse(result.stderr)).toEqual({ error: expect.stringContaining('--json cannot be used with --input'), field: '--json' });
  });

  it('with --json a file error names the file role', async () => {
    const result = await run('plan', file('bad.json', '{'), '--json');
    const error = JSON.parse(result.stderr) as { error: string; field: string | null };
    expect(error.field).toBe('plan file');
  });
});

describe('standard input and encodings', () => {
  it('locate - reads the sensor file from standard input', () => {
    const input = readFileSync('public/demo-locate.csv');
    const piped = spawnSync(process.execPath, ['bin/sekundo.mjs', 'locate', '-', '--temperature', '1.8K', '--json'], { input, encoding: 'utf8' });
    const named = spawnSync(process.execPath, ['bin/sekundo.mjs', 'locate', 'public/demo-locate.csv', '--temperature', '1.8K', '--json'], { encoding: 'utf8' });
    expect(piped.stderr).toBe('');
    expect(piped.status).toBe(0);
    const a = JSON.parse(piped.stdout) as { source: unknown };
    const b = JSON.parse(named.stdout) as { source: unknown };
    expect(a.source).toEqual(b.source);
  }, 30_000);

  it('in-process runs read "-" from the descriptor they are given, never from the runner\'s own input (which may never end)', async () => {
    // The harness's empty standard input: refused as an empty file at once, not waited on.
    const empty = expectUsageError(await run('locate', '-', '--temperature', '1.8K'));
    expect(empty).toContain('standard input');
    // A descriptor of a real file: read like the named file.
    const fd = openSync('public/demo-locate.csv', 'r');
    try {
      let stdout = '';
      const status = await main(['locate', '-', '--temperature', '1.8K', '--json'], { stdinFd: fd, stdout: (t) => (stdout += t), stderr: () => undefined });
      expect(status).toBe(0);
      const named = await run('locate', 'public/demo-locate.csv', '--temperature', '1.8K', '--json');
      expect((JSON.parse(stdout) as { source: unknown }).source).toEqual((JSON.parse(named.stdout) as { source: unknown }).source);
    } finally {
      closeSync(fd);
    }
  });

  it('a UTF-16 plan file with a byte-order mark is read like a UTF-8 one', async () => {
    const bytes = new Uint8Array(2 + DEMO_PLAN.length * 2);
    bytes[0] = 0xff;
    bytes[1] = 0xfe;
    for (let i = 0; i < DEMO_PLAN.length; i++) {
      const c = DEMO_PLAN.charCodeAt(i);
      bytes[2 + 2 * i] = c & 0xff;
      bytes[3 + 2 * i] = c >> 8;
    }
    const utf16 = await run('plan', file('utf16.json', bytes), '--json');
    const utf8 = await run('plan', 'public/demo-plan.json', '--json');
    expect(utf16.stderr).toBe('');
    expect(utf16.status).toBe(0);
    expect(JSON.parse(utf16.stdout).sensors).toEqual(JSON.parse(utf8.stdout).sensors);
  });
});

describe('readings far from any second sound', () => {
  it('delay --distance 25mm --delay 1000s is refused: far slower than any second sound', async () => {
    const line = expectUsageError(await run('delay', '--distance', '25mm', '--delay', '1000s'));
    expect(line).toMatch(/slower than any second sound/);
    expect(line).toMatch(/unit/);
  });

  it('a batch row far slower than second sound is refused, naming its line', async () => {
    const path = file('slow.csv', 'delay_s\n0.0014\n1000\n');
    const line = expectUsageError(await run('delay', '--input', path, '--distance', '25mm'));
    expect(line).toMatch(/line 3: .*slower than any second sound/);
  });

  it('a time column that counts samples (0, 1, 2, …) with no unit is refused', async () => {
    const rows = Array.from({ length: 400 }, (_, k) => k - 100).map((i) => `${i},${i > 200 && i < 260 ? 1 : 0.001 * Math.sin(i)}`);
    const path = file('samples.csv', `sample,sensor\n${rows.join('\n')}\n`);
    const line = expectUsageError(await run('trace', path, '--distance', '25mm'));
    expect(line).toMatch(/sample numbers/);
  });
});
