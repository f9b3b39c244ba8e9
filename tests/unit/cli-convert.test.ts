/**
 * The converter commands: `sekundo delay`, `sekundo trace`, `sekundo fit`, in-process (plus one
 * real process). Traces are written as CSV here from a stated model (below); delays and
 * distances are invented; 1638.2 Pa ↔ 1.800 K is ITS-90's helium-4 vapour-pressure scale.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gaussian, seededRandom } from '../support/synthetic-trace';
import { expectUsageError, run, runJson as runJsonAs } from '../support/cli-harness';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));



interface Candidate {
  temperature_K: number;
  sd_K: number;
  slope_m_s_K: number;
  branch: string;
}

interface Json {
  [key: string]: unknown;
  candidates: Candidate[];
  chosen: number | null;
}

const runJson = (...argv: string[]) => runJsonAs<Json>(...argv);

function num(json: Json, key: string): number {
  const value = json[key];
  if (typeof value !== 'number') throw new Error(`${key} is not a number: ${String(value)}`);
  return value;
}


let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sekundo-convert-'));
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

function file(name: string, text: string): string {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
}

describe('sekundo delay (one delay)', () => {
  it('50 mm in 2.5 ms: 20 m/s and three candidate temperatures, coldest first, none chosen', async () => {
    const json = await runJson('delay', '--distance', '50mm', '--delay', '2.5ms');
    expect(num(json, 'speed_m_s')).toBeCloseTo(20, 12); // 0.05 m / 0.0025 s
    expect(num(json, 'speedSd_m_s')).toBe(0);
    expect(json.candidates).toHaveLength(3);
    expect(json.candidates.map((c) => c.branch)).toEqual(['low', 'middle', 'high']);
    const temps = json.candidates.map((c) => c.temperature_K);
    expect([...temps].sort((a, b) => a - b)).toEqual(temps);
    for (const c of json.candidates) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining(['temperature_K', 'sd_K', 'slope_m_s_K', 'branch', 'insensitive', 'region', 'kind']));
      expect(c.sd_K).toBeGreaterThan(0);
    }
    expect(json.chosen).toBeNull();
  });

  it('--pressure 1638.2Pa chooses the candidate near 1.800 K (ITS-90)', async () => {
    const json = await runJson('delay', '--distance', '50mm', '--delay', '2.5ms', '--pressure', '1638.2Pa');
    expect(json.chosen).toBe(2);
    const chosen = json.candidates[2] as Candidate;
    const others = json.candidates.filter((_, i) => i !== 2);
    for (const c of others) expect(Math.abs(c.temperature_K - 1.8)).toBeGreaterThan(Math.abs(chosen.temperature_K - 1.8));
    expect(json.choice).toContain('1.8000 K');
  });

  it('--near chooses the nearest candidate; a single candidate is chosen on its own', async () => {
    expect((await runJson('delay', '--distance', '50mm', '--delay', '2.5ms', '--near', '0.95K')).chosen).toBe(0);
    expect((await runJson('delay', '--distance', '50mm', '--delay', '2.5ms', '--near', '1.45K')).chosen).toBe(1);
    const fast = await runJson('delay', '--distance', '50mm', '--delay', '2ms'); // 25 m/s: above the maximum
    expect(fast.candidates).toHaveLength(1);
    expect(fast.chosen).toBe(0);
  });

  it('propagates the distance and delay sds and subtracts the offset', async () => {
    const json = await runJson('delay', '--distance', '50mm', '--delay', '2.6ms', '--distance-sd', '20um', '--delay-sd', '1us', '--offset', '0.1ms', '--offset-sd', '1us');
    expect(num(json, 'speed_m_s')).toBeCloseTo(20, 12);
    // σu/u = √((σd/d)² + (σt² + σt0²)/(t − t0)²)
    expect(num(json, 'speedSd_m_s')).toBeCloseTo(20 * Math.hypot(20e-6 / 0.05, Math.hypot(1e-6, 1e-6) / 2.5e-3), 12);
  });

  it('prints a table with the speed, the candidates and why none is chosen', async () => {
    const { status, stdout } = await run('delay', '--distance', '50mm', '--delay', '2.5ms');
    expect(status).toBe(0);
    expect(stdout).toMatch(/Speed\s+u = d\/\(t − t0\)\s+20\.000/);
    expect(stdout).toContain('Temperatures with this speed (3)');
    expect(stdout).toMatch(/\n\s+1\s+0\.9\d{4}\s/);
    expect(stdout).toContain('give --pressure or --near');
    const chosen = await run('delay', '--distance', '50mm', '--delay', '2.5ms', '--pressure', '1638.2Pa');
    expect(chosen.stdout).toMatch(/\n\s+3\*\s+1\.7\d{4}/);
  });
});

describe('sekundo delay --input (a CSV of delays)', () => {
  it('writes a CSV: header row, one row per input row, delay column delay_s', async () => {
    const path = file('delays.csv', 'delay_s,pressure_Pa\n0.0025,1638.2\n0.00251,\n# pause\n0.00252,\n');
    const { status, stdout, stderr } = await run('delay', '--input', path, '--distance', '50mm', '--delay-sd', '1us');
    expect(stderr).toBe('');
    expect(status).toBe(0);
    const rows = Papa.parse<string[]>(stdout.trimEnd(), { delimiter: ',' }).data;
    expect(rows).toHaveLength(4);
    const header = rows[0] ?? [];
    expect(header.slice(0, 11)).toEqual(['line', 'delay_s', 'distance_m', 'pressure_Pa', 'speed_m_s', 'speedSd_m_s', 'candidates', 'chosen', 'chosen_by', 'T_K', 'T_sd_K']);
    expect(rows.slice(1).map((r) => r[0])).toEqual(['2', '3', '5']);
    expect(rows.slice(1).map((r) => r[header.indexOf('chosen_by')])).toEqual(['pressure', 'continuity', 'continuity']);
    expect(Number(rows[1]?.[header.indexOf('speed_m_s')])).toBeCloseTo(20, 12);
  });

  it('--column names the delay column, whose name carries its unit', async () => {
    const path = file('log.csv', 'timestamp,tof_ms\n10:00,2.5\n10:01,2.0\n');
    const { stdout } = await run('delay', '--input', path, '--column', 'tof_ms', '--distance', '50mm', '--near', '1.8K');
    const rows = Papa.parse<string[]>(stdout.trimEnd(), { delimiter: ',' }).data;
    expect(rows[0]?.slice(0, 5)).toEqual(['line', 'timestamp', 'tof_ms', 'distance_m', 'speed_m_s']);
    expect(rows[1]?.slice(0, 5)).toEqual(['2', '10:00', '2.5', '0.05', '20']);
    expect(rows[2]?.[4]).toBe('25');
  });
});

/*
 * Synthetic trace model (all numbers invented): sampled every 1 µs from −500 µs for 4000
 * samples. The heater drive is a Hann pulse (raised cosine, 0.5 − 0.5 cos(2πt/W)) of width
 * W = 16 µs and amplitude 1 V starting at h0 = 300 µs, noise-free; its 50 % onset is then
 * exactly h0 + W/4 = 304 µs. The sensor sees the same shape, 1 mV high, starting τ = 2500.37 µs
 * after the drive, on a 20 mV baseline with white Gaussian noise of 50 µV (SNR 20), seeded.
 * Where each picker's feature sits in the noiseless model, as a delay from the heater's matching
 * feature (its 50 % onset; for the peak picker its centre, peak to peak):
 *   threshold (5σ = a quarter of the peak): Hann crossing of 1/4 at W/6 → τ − W/12;
 *   fraction (half height): τ;   peak: τ (the sensor's peak at τ + W/2 from the drive's at W/2);
 *   xcorr with the drive as template: τ.
 * Without a heater column, time zero is the file's t = 0 and the xcorr default (a half-height
 * rectangle) reports the leading half-height point: h0 + τ + W/4.
 */
const STEP = 1e-6;
const W = 16e-6;
const H0 = 300e-6;
const TAU = 2500.37e-6;
const ONSET = H0 + W / 4;
const hann = (t: number) => (t <= 0 || t >= W ? 0 : 0.5 - 0.5 * Math.cos((2 * Math.PI * t) / W));

function traceCsv(seed: number): string {
  const noise = gaussian(seededRandom(seed));
  const lines = [`# invented bench, shot with seed ${seed}`, 'Sample interval: 1 us', 'Time (us),heater,sensor'];
  for (let i = 0; i < 4000; i++) {
    const t = (i - 500) * STEP;
    lines.push(`${i - 500},${hann(t - H0).toFixed(9)},${(0.02 + 1e-3 * hann(t - H0 - TAU) + 5e-5 * noise()).toExponential(7)}`);
  }
  return `${lines.join('\n')}\n`;
}

const EXPECTED_DELAY: Readonly<Record<string, number>> = {
  threshold: TAU - W / 12,
  fraction: TAU,
  peak: TAU,
  xcorr: TAU,
};
const SEEDS = [1, 2, 3, 4, 5];

describe('sekundo trace on synthetic traces (SNR 20)', () => {
  it.each(['threshold', 'fraction', 'peak', 'xcorr'].flatMap((picker) => SEEDS.map((seed) => [picker, seed] as const)))(
    '%s recovers the delay from the heater onset within one sample interval (seed %i)',
    async (picker, seed) => {
      const path = file(`shot-${seed}.csv`, traceCsv(seed));
      const json = await runJson('trace', path, '--distance', '50mm', '--heater-column', 'heater', '--sensor-column', 'sensor', '--picker', picker);
      expect(json.picker).toBe(picker);
      expect(Math.abs(num(json, 'delay_s') - (EXPECTED_DELAY[picker] as number))).toBeLessThan(STEP);
      expect(num(json, 'arrival_s')).toBeCloseTo(num(json, 'delay_s') + num(json, 'referenceTime_s'), 12);
      expect(json.reference).toBe(picker === 'peak' ? 'peak to peak' : 'onset to onset');
      expect(num(json, 'referenceTime_s')).toBeCloseTo(picker === 'peak' ? H0 + W / 2 : ONSET, 7);
      expect(num(json, 'arrivalSd_s')).toBeGreaterThan(0);
      expect(num(json, 'arrivalSd_s')).toBeLessThan(STEP);
      expect(json.candidates).toHaveLength(3);
      expect(num(json, 'speed_m_s')).toBeCloseTo(0.05 / num(json, 'delay_s'), 12);
      if (picker === 'xcorr') expect(json.template).toBe('heater drive');
    },
  );

  it('the heater column moves time zero to the drive onset', async () => {
    const path = file('shot-onset.csv', traceCsv(11));
    const withHeater = await runJson('trace', path, '--heater-column', 'heater');
    const without = await runJson('trace', path, '--sensor-column', 'sensor');
    expect(num(withHeater, 'timeZero_s')).toBeCloseTo(ONSET, 12);
    expect(withHeater.timeZero).toBe('heater onset');
    expect(without.timeZero).toBe('file t = 0');
    expect(num(without, 'timeZero_s')).toBe(0);
    // The same edge, measured from two zeros; the baselines (before each zero) differ slightly, so
    // the picks agree to well within a hundredth of a sample, not exactly.
    expect(Math.abs(num(without, 'delay_s') - num(withHeater, 'delay_s') - ONSET)).toBeLessThan(0.01 * STEP);
    expect(Math.abs(num(without, 'delay_s') - (H0 + TAU + W / 4))).toBeLessThan(STEP);
  });

  it('without a heater column, xcorr uses a half-height rectangle and finds the leading half-height point', async () => {
    for (const seed of SEEDS) {
      const json = await runJson('trace', file(`shot-rect-${seed}.csv`, traceCsv(seed)), '--picker', 'xcorr');
      expect(json.sensor).toBe('sensor'); // the channel named "heater" is passed over by default
      expect(json.template).toBe('half-height rectangle');
      expect(Math.abs(num(json, 'delay_s') - (H0 + TAU + W / 4))).toBeLessThan(STEP);
    }
  });

  it('without --distance reports the arrival only', async () => {
    const json = await runJson('trace', file('shot-arrival.csv', traceCsv(7)), '--heater-column', 'heater');
    expect(json.candidates).toEqual([]);
    expect(json.speed_m_s).toBeNull();
    expect(json.chosen).toBeNull();
  });

  it('warns in the table when the pick has a low SNR (a window without the pulse)', async () => {
    const { status, stdout } = await run('trace', file('shot-empty.csv', traceCsv(9)), '--heater-column', 'heater', '--picker', 'peak', '--to', '1ms');
    expect(status).toBe(0);
    expect(stdout).toMatch(/Warning: SNR [\d.]+ is low: the pick may be noise/);
  });

  it('--pressure chooses among the candidates; the table says which', async () => {
    const { status, stdout } = await run('trace', file('shot-table.csv', traceCsv(8)), '--distance', '50mm', '--heater-column', 'heater', '--pressure', '1638.2Pa');
    expect(status).toBe(0);
    expect(stdout).toContain('Time zero  heater onset, 304.00');
    expect(stdout).toMatch(/Chosen: 3, 1\.7\d{4} K: nearest to 1\.8000 K/);
  });
});

describe('sekundo fit', () => {
  it('recovers the speed and the offset from exact data', async () => {
    // Invented exact delays: u2 = 20 m/s, t0 = 100 µs at 10, 20, 30 and 40 mm.
    const rows = [0.01, 0.02, 0.03, 0.04].map((d) => `${d},${100e-6 + d / 20}`);
    const json = await runJson('fit', file('fit.csv', `distance_m,delay_s\n${rows.join('\n')}\n`), '--pressure', '1638.2Pa');
    expect(Math.abs(num(json, 'speed_m_s') - 20)).toBeLessThan(1e-9);
    expect(Math.abs(num(json, 'offset_s') - 100e-6)).toBeLessThan(1e-15);
    expect(json.residuals_s).toHaveLength(4);
    for (const key of ['speedSd_m_s', 'offsetSd_s', 'covariance', 'correlation', 'weighted', 'lines']) expect(json).toHaveProperty(key);
    expect(json.candidates).toHaveLength(3);
    expect(json.chosen).toBe(2);
  });

  it('prints a table with the speed, the offset and the residuals by line', async () => {
    const path = file('fit-sd.csv', 'distance_mm,delay_us,delay_sd_us\n10,600.5,1\n20,1099.5,1\n30,1600.2,1\n');
    const { status, stdout } = await run('fit', path);
    expect(status).toBe(0);
    expect(stdout).toContain('weighted by delay_sd_s');
    expect(stdout).toMatch(/Offset t0\s+\d/);
    expect(stdout).toMatch(/Residuals:\n\s+line\s+residual \(µs\)\n\s+2\s/);
  });
});

describe('bad input: one line on stderr, status 2', () => {
  const cases: readonly [name: string, argv: () => string[], expected: readonly string[]][] = [
    ['delay without --distance', () => ['delay', '--delay', '2.5ms'], ['needs --distance', '0.000001–100 m']],
    ['delay without --delay', () => ['delay', '--distance', '50mm'], ['needs --delay']],
    ['distance out of range', () => ['delay', '--distance', '-5mm', '--delay', '2.5ms'], ['--distance -5mm (= -0.005 m) is outside the valid range']],
    ['delay unit wrong', () => ['delay', '--distance', '50mm', '--delay', '2.5K'], ['--delay', 'unknown unit "K"', 's, ms, us']],
    ['speed beyond second sound', () => ['delay', '--distance', '50mm', '--delay', '1us'], ['50000 m/s', 'outside the range of second sound']],
    ['offset not less than the delay', () => ['delay', '--distance', '50mm', '--delay', '2.5ms', '--offset', '3ms'], ['--offset 3ms', 'must be less than the delay']],
    ['negative sd', () => ['delay', '--distance', '50mm', '--delay', '2.5ms', '--delay-sd', '-1us'], ['--delay-sd', 'outside the valid range']],
    ['pressure and near', () => ['delay', '--distance', '50mm', '--delay', '2.5ms', '--pressure', '1638Pa', '--near', '1.8K'], ['--pressure or --near', 'not both']],
    ['pressure out of range', () => ['delay', '--distance', '50mm', '--delay', '2.5ms', '--pressure', '3bar'], ['--pressure 3bar', 'outside the valid range']],
    ['--column without --input', () => ['delay', '--distance', '50mm', '--delay', '2.5ms', '--column', 'x'], ['--column needs --input']],
    ['--delay with --input', () => ['delay', '--input', file('d1.csv', 'delay_s\n0.0025\n'), '--delay', '2ms'], ['--delay cannot be used with --input']],
    ['missing input file', () => ['delay', '--input', join(dir, 'nope.csv'), '--distance', '5cm'], ['cannot read delay file', 'no such file']],
    ['malformed delay row', () => ['delay', '--input', file('d3.csv', 'delay_s\n0.0025\n0.0026,7\n'), '--distance', '5cm'], ['delay file', 'line 3', 'ragged row']],
    ['no distance anywhere', () => ['delay', '--input', file('d4.csv', 'delay_s\n0.0025\n')], ['line 2', 'no distance_m', 'give --distance']],
    ['unknown delay column', () => ['delay', '--input', file('d5.csv', 'delay_s\n0.0025\n'), '--distance', '5cm', '--column', 'tof'], ['no column "tof"', 'columns: delay_s']],
    ['trace without a file', () => ['trace', '--distance', '50mm'], ['needs a trace file']],
    ['trace file missing', () => ['trace', join(dir, 'nope.csv')], ['cannot read trace file', 'no such file']],
    ['unknown picker', () => ['trace', file('t1.csv', traceCsv(1)), '--picker', 'median'], ['--picker "median"', 'threshold, fraction, peak, xcorr']],
    ['unknown channel', () => ['trace', file('t2.csv', traceCsv(1)), '--sensor-column', 'bolo'], ['no channel "bolo"', 'channels: heater, sensor']],
    ['threshold with another picker', () => ['trace', file('t3.csv', traceCsv(1)), '--threshold', '6'], ['--threshold applies to --picker threshold']],
    ['threshold out of range', () => ['trace', file('t4.csv', traceCsv(1)), '--picker', 'threshold', '--threshold', '0.5'], ['--threshold 0.5 is outside the valid range 1–1000']],
    ['ragged trace row', () => ['trace', file('t5.csv', 'time,v\n0,1\n1,2\n2,3\n3,4,5\n')], ['trace file', 'line 5', 'ragged row']],
    ['NaN in a trace', () => ['trace', file('t6.csv', 'time,v\n0,1\n1,2\n2,3\n3,NaN\n')], ['line 5', 'column "v"', 'not a finite number']],
    ['empty trace file', () => ['trace', file('t7.csv', '')], ['trace file', 'the file is empty']],
    ['no pre-trigger samples', () => ['trace', file('t8.csv', ['t,v', ...Array.from({ length: 40 }, (_, i) => `${i},${Math.sin(i)}`)].join('\n'))], ['pre-trigger', 'give --heater-column']],
    ['fit without a file', () => ['fit'], ['needs a CSV file']],
    ['fit with a bad row', () => ['fit', file('f1.csv', 'distance_m,delay_s\n0.01,0.0006\n0.02,oops\n0.03,0.0016\n')], ['fit file', 'line 3', '"oops" is not a number']],
    ['fit with too few rows', () => ['fit', file('f2.csv', 'distance_m,delay_s\n0.01,0.0006\n0.02,0.0011\n')], ['at least 3 rows']],
    ['fit at one distance', () => ['fit', file('f3.csv', 'distance_m,delay_s\n0.01,0.0006\n0.01,0.0007\n0.01,0.0008\n')], ['fit file', 'two different distances']],
  ];
  it.each(cases)('%s', async (_name, argv, expected) => {
    const line = expectUsageError(await run(...argv()));
    for (const fragment of expected) expect(line).toContain(fragment);
  });
});

describe('help', () => {
  it.each(['delay', 'trace', 'fit'])('sekundo %s --help lists its flags, units and ranges', async (name) => {
    const { status, stdout } = await run(name, '--help');
    expect(status).toBe(0);
    expect(stdout).toContain(`sekundo ${name}`);
    expect(stdout).toContain('--pressure <p>');
    expect(stdout).toContain('valid range');
  });

  it('sekundo --help lists the converter commands', async () => {
    const { stdout } = await run('--help');
    for (const name of ['delay', 'trace', 'fit', '--heater-column', '--input', '--picker']) expect(stdout).toContain(name);
  });
});

describe('a real process', () => {
  const SPAWN_TIMEOUT_MS = 60_000;
  it(
    'node bin/sekundo.mjs delay --distance 50mm --delay 2.5ms --json prints 20 m/s and three candidates',
    () => {
      const result = spawnSync(process.execPath, ['bin/sekundo.mjs', 'delay', '--distance', '50mm', '--delay', '2.5ms', '--json'], {
        cwd: REPO_ROOT,
        encoding: 'utf8',
        timeout: SPAWN_TIMEOUT_MS,
      });
      expect(result.status).toBe(0);
      const json = JSON.parse(result.stdout) as Json;
      expect(num(json, 'speed_m_s')).toBeCloseTo(20, 12);
      expect(json.candidates).toHaveLength(3);
    },
    SPAWN_TIMEOUT_MS,
  );
});
