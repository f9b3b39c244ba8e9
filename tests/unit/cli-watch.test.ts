/**
 * `sekundo watch` against a temporary folder that the test fills with synthetic traces (invented
 * data, tests/support/watch-traces.ts): once (--once, in-process) and as a long-running process
 * that the test feeds over time — a file written in pieces, a bad file in the middle, a file
 * renamed, a file that vanishes — and stops with SIGINT. Expected temperatures are the ones the
 * traces were made for (the kernel's own u₂; the picker's tolerance is the check here, not u₂).
 */
import { type ChildProcess, spawn } from 'node:child_process';
import { closeSync, mkdtempSync, openSync, renameSync, rmSync, unlinkSync, writeFileSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { expectUsageError, run } from '../support/cli-harness';
import { BAD_TRACE_TEXT, pause, watchTraceText } from '../support/watch-traces';

const scratch = mkdtempSync(join(tmpdir(), 'sekundo-watch-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** A fresh empty folder for one test. */
function folder(): string {
  return mkdtempSync(join(scratch, 'run-'));
}

const BASE = ['--distance', '50mm', '--heater-column', 'heater_V', '--interval', '0.1s'];
// The invented traces are read to about 5 mK here (a pick on 0.5 mV of noise at 1 MS/s).
const PICK_TOLERANCE_K = 0.02;

describe('sekundo watch --once', () => {
  it('reads every settled file in the folder, oldest first, and reports a bad one on stderr without stopping', async () => {
    const dir = folder();
    const temps = [1.86, 1.85, 1.84];
    writeFileSync(join(dir, 'shot-1.csv'), watchTraceText(temps[0] as number, '2026-11-03T15:00:00Z', 1));
    writeFileSync(join(dir, 'shot-2-bad.csv'), BAD_TRACE_TEXT);
    writeFileSync(join(dir, 'shot-3.csv'), watchTraceText(temps[1] as number, '2026-11-03T15:02:00Z', 2));
    writeFileSync(join(dir, 'shot-4.csv'), watchTraceText(temps[2] as number, null, 3));
    writeFileSync(join(dir, 'notes.txt'), 'not a trace; not matched by *.csv');
    const result = await run('watch', dir, ...BASE, '--once', '--near', '1.86K', '--json');
    expect(result.status).toBe(0);
    const lines = result.stdout.trim().split('\n').map((l) => JSON.parse(l));
    expect(lines.map((l) => l.file)).toEqual(['shot-1.csv', 'shot-3.csv', 'shot-4.csv']);
    lines.forEach((l, i) => {
      expect(Object.keys(l)).toEqual(['file', 'time', 'time_from', 'delay_s', 'delay_sd_s', 'temperature_K', 'sd_K', 'sd_meas_K', 'sd_curve_K', 'chosen_by', 'warnings']);
      // The measurement's part and the u₂ curve's part, kept apart; together (in quadrature, to the
      // spread's small second-order term) the whole sd.
      expect(Math.abs(Math.hypot(l.sd_meas_K, l.sd_curve_K) / l.sd_K - 1)).toBeLessThan(1e-3);
      expect(l.sd_curve_K).toBeGreaterThan(0);
      expect(l.temperature_K).toBeCloseTo(temps[i] as number, 1);
      expect(Math.abs(l.temperature_K - (temps[i] as number))).toBeLessThan(PICK_TOLERANCE_K);
      expect(l.sd_K).toBeGreaterThan(0);
    });
    expect(lines.map((l) => l.chosen_by)).toEqual(['expected', 'continuity', 'continuity']);
    expect(lines[0]).toMatchObject({ time: '2026-11-03T15:00:00.000Z', time_from: 'header' });
    // No timestamp in its header: the file's modification time, and it says so.
    expect(lines[2].time_from).toBe('file modified');
    expect(Math.abs(Date.parse(lines[2].time) - Date.now())).toBeLessThan(120_000);
    const errors = result.stderr.trim().split('\n');
    expect(errors).toHaveLength(1);
    expect(JSON.parse(errors[0] as string).error).toMatch(/shot-2-bad\.csv/);
  });

  it('prints CSV with a header line by default; the file that has its own vapour pressure is decided by it', async () => {
    const dir = folder();
    // 1.8 K: ITS-90 vapour pressure 1638 Pa (Preston-Thomas 1990), written into the header.
    writeFileSync(join(dir, 'a.csv'), watchTraceText(1.8, '2026-11-03T15:00:00Z', 4, '1638 Pa'));
    writeFileSync(join(dir, 'b.csv'), watchTraceText(1.79, '2026-11-03T15:01:00Z', 5));
    const result = await run('watch', dir, ...BASE, '--once');
    expect(result.status).toBe(0);
    const [header, ...rows] = result.stdout.trim().split('\n');
    expect(header).toBe('file,time,time_from,delay_s,delay_sd_s,temperature_K,sd_K,sd_meas_K,sd_curve_K,chosen_by,warnings');
    expect(rows).toHaveLength(2);
    const cells = rows.map((r) => r.split(','));
    expect(cells.map((c) => c[9])).toEqual(['vapour pressure in the file', 'continuity']);
    expect(Math.abs(Number(cells[0]?.[5]) - 1.8)).toBeLessThan(PICK_TOLERANCE_K);
    expect(result.stderr).toBe('sekundo: watch ended: 2 files read\n');
  });

  it('without a start rule several candidates stay undecided, and the line says why', async () => {
    const dir = folder();
    writeFileSync(join(dir, 'a.csv'), watchTraceText(1.86, '2026-11-03T15:00:00Z', 6));
    const result = await run('watch', dir, ...BASE, '--once', '--json');
    const line = JSON.parse(result.stdout.trim());
    expect(line).toMatchObject({ temperature_K: null, sd_K: null, sd_meas_K: null, sd_curve_K: null, chosen_by: 'undecided' });
    expect(line.warnings.join(' ')).toMatch(/Undecided: 3 temperatures have this speed/);
  });

  it.each([
    [['watch', '--distance', '50mm'], /needs a folder/],
    [['watch', '/no/such/folder/here', '--distance', '50mm'], /cannot read the folder .*no such folder/],
    [['watch', '.', '--once'], /needs --distance/],
    [['watch', '.', '--distance', '50mm', '--pattern', 'a/*.csv'], /--pattern: .*names a folder/],
    [['watch', '.', '--distance', '50mm', '--interval', '1ms'], /interval/],
    [['watch', '.', '--distance', '50mm', '--picker', 'magic'], /not a picker/],
  ])('refuses %j with one line', async (argv, message) => {
    expect(expectUsageError(await run(...argv))).toMatch(message);
  });

  it('a file instead of a folder is refused', async () => {
    const dir = folder();
    const file = join(dir, 'x.csv');
    writeFileSync(file, 'a');
    expect(expectUsageError(await run('watch', file, '--distance', '50mm'))).toMatch(/is not a folder/);
  });
});

const BIN = fileURLToPath(new URL('../../bin/sekundo.mjs', import.meta.url));

/** A running `sekundo watch` with its output collected as it comes. */
function startWatch(dir: string, extra: string[]): { child: ChildProcess; out: () => string; err: () => string; exited: Promise<number | null> } {
  const child = spawn(process.execPath, [BIN, 'watch', dir, ...extra], { stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stdout?.on('data', (d: Buffer) => {
    out += d.toString();
  });
  child.stderr?.on('data', (d: Buffer) => {
    err += d.toString();
  });
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, out: () => out, err: () => err, exited };
}

async function until(what: string, test: () => boolean, timeout_ms = 20_000): Promise<void> {
  const end = Date.now() + timeout_ms;
  while (!test()) {
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await pause(50);
  }
}

describe('sekundo watch, running while the folder fills', () => {
  it('prints each file once as it settles, survives pieces, a bad file, a rename and a vanished file, and ends cleanly on SIGINT', async () => {
    const dir = folder();
    const w = startWatch(dir, ['--distance', '50mm', '--heater-column', 'heater_V', '--interval', '0.5s', '--near', '1.86K']);
    try {
      await until('the header line', () => w.out().startsWith('file,time,'));
      const rows = () => w.out().trim().split('\n').slice(1).filter((l) => l !== '');
      const files = () => rows().map((r) => r.split(',')[0]);

      writeFileSync(join(dir, 'shot-1.csv'), watchTraceText(1.86, '2026-11-03T15:00:00Z', 11));
      await until('shot-1', () => files().includes('shot-1.csv'));

      // Written in pieces, 100 ms apart: never the same size in two looks 0.5 s apart until done.
      const text = watchTraceText(1.85, '2026-11-03T15:01:00Z', 12);
      const fd = openSync(join(dir, 'shot-2.csv'), 'w');
      const pieces = 8;
      for (let i = 0; i < pieces; i++) {
        writeSync(fd, text.slice((i * text.length) / pieces, ((i + 1) * text.length) / pieces));
        await pause(100);
      }
      closeSync(fd);
      await until('shot-2', () => files().includes('shot-2.csv'));

      writeFileSync(join(dir, 'shot-3-bad.csv'), BAD_TRACE_TEXT);
      await until('the bad file on stderr', () => /shot-3-bad\.csv/.test(w.err()));

      renameSync(join(dir, 'shot-1.csv'), join(dir, 'shot-1-kept.csv'));
      writeFileSync(join(dir, 'shot-5.csv'), 'time_s,heater_V,sensor_V\n0,0,0\n');
      unlinkSync(join(dir, 'shot-5.csv'));
      writeFileSync(join(dir, 'shot-4.csv'), watchTraceText(1.84, '2026-11-03T15:03:00Z', 14));
      await until('shot-4', () => files().includes('shot-4.csv'));
      await pause(1200);

      expect(files()).toEqual(['shot-1.csv', 'shot-2.csv', 'shot-4.csv']);
      const temps = rows().map((r) => Number(r.split(',')[5]));
      for (const [i, T] of [1.86, 1.85, 1.84].entries()) expect(Math.abs((temps[i] as number) - T)).toBeLessThan(PICK_TOLERANCE_K);
      w.child.kill('SIGINT');
      expect(await w.exited).toBe(0);
      const errors = w.err().trim().split('\n');
      expect(errors).toHaveLength(2);
      expect(errors[0]).toMatch(/^sekundo: trace file ".*shot-3-bad\.csv"/);
      expect(errors[1]).toBe('sekundo: watch ended: 3 files read, 1 not read');
    } finally {
      if (w.child.exitCode === null) w.child.kill('SIGKILL');
    }
  }, 60_000);
});
