/**
 * The command line gives what the page gives: intervals, sd parts, the distance from the evidence
 * and a warnings list on every candidate and result of `delay`, `trace` and `fit`; the batch CSV's
 * new columns; `locate`'s speed prior (and the flags that change it) and robust outliers.
 * Numbers: 60.0 mm in 3.02 ms with 2.45 kPa (ITS-90: 1.9198 K); synthetic files written here.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { secondSound, vapourPressure } from '../../src/physics';
import { expectUsageError, run, runJson } from '../support/cli-harness';
import { SCENARIO_SENSORS } from '../support/locate-scenario';

// biome-ignore lint/suspicious/noExplicitAny: JSON output is checked field by field below
type Json = any;

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sekundo-honesty-'));
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});
const file = (name: string, text: string) => {
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
};

describe('delay', () => {
  it('--json: every candidate has interval68_K, interval95_K, sd parts and evidenceSd; the result a warnings list', async () => {
    const j = await runJson<Json>('delay', '--distance', '60.0mm', '--delay', '3.02ms', '--pressure', '2.45kPa');
    expect(j.chosen).toBe(2);
    for (const c of j.candidates) {
      expect(c.interval68_K).toHaveLength(2);
      expect(c.interval95_K[0]).toBeLessThan(c.interval68_K[0]);
      expect(c.interval95_K[1]).toBeGreaterThan(c.interval68_K[1]);
      expect(c.sdCurve_K).toBeGreaterThan(0);
      expect(c.sdMeasurement_K).toBe(0);
      expect(typeof c.evidenceSd).toBe('number');
    }
    expect(j.candidates[2].evidenceSd).toBeGreaterThan(3);
    expect(j.warnings).toContainEqual(expect.objectContaining({ code: 'evidence-disagrees', severity: 'caution', limit: 3 }));
  });

  it('text output: the intervals and sd parts in the table, the caution under it', async () => {
    const r = await run('delay', '--distance', '60.0mm', '--delay', '3.02ms', '--pressure', '2.45kPa');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/68 % \(K\).*95 % \(K\).*evidence \(sd\)/);
    expect(r.stdout).toMatch(/Caution: Delay and evidence disagree/);
  });

  it('without evidence, evidenceSd is null and several candidates draw an "undecided" note', async () => {
    const j = await runJson<Json>('delay', '--distance', '60.0mm', '--delay', '3.02ms');
    expect(j.candidates.every((c: Json) => c.evidenceSd === null)).toBe(true);
    expect(j.warnings.map((w: Json) => w.code)).toContain('undecided');
  });

  it('--pressure-sd needs --pressure, and is range-checked', async () => {
    expectUsageError(await run('delay', '--distance', '60mm', '--delay', '3ms', '--pressure-sd', '10Pa'));
    expectUsageError(await run('delay', '--distance', '60mm', '--delay', '3ms', '--pressure', '2.45kPa', '--pressure-sd', '-1Pa'));
  });

  it('--input: the CSV gains the chosen one’s parts and bounds, the evidence distance, alternatives and a guess past a turn', async () => {
    const temps = Array.from({ length: 31 }, (_, i) => 2.0 - i * 0.015);
    const lines = ['delay_s,pressure_Pa', ...temps.map((T, i) => `${(0.05 / secondSound(T)).toPrecision(12)},${i === 0 ? vapourPressure(T).pressure_Pa : ''}`)];
    const r = await run('delay', '--input', file('cool.csv', `${lines.join('\n')}\n`), '--distance', '50mm', '--delay-sd', '1us');
    expect(r.status).toBe(0);
    const [header = '', ...rows] = r.stdout.trim().split('\n');
    const cols = header.split(',');
    for (const name of ['T_sd_meas_K', 'T_sd_curve_K', 'T_lo68_K', 'T_hi68_K', 'T_lo95_K', 'T_hi95_K', 'evidence_sd', 'alternatives', 'guess', 'warnings']) expect(cols).toContain(name);
    const cell = (row: string, name: string) => row.split(',')[cols.indexOf(name)] ?? '';
    expect(Number(cell(rows[0] ?? '', 'evidence_sd'))).toBeLessThan(1);
    const last = rows[rows.length - 1] ?? '';
    expect(cell(last, 'chosen_by')).toBe('ambiguous');
    expect(cell(last, 'alternatives')).toMatch(/^\d \d$/);
    expect(cell(last, 'warnings')).toContain('series-ambiguous');
  });
});

describe('trace and fit', () => {
  it('fit --json: candidates with intervals and evidenceSd, and a warnings list', async () => {
    const u = secondSound(1.8);
    const csv = ['distance_m,delay_s', ...[0.02, 0.04, 0.06, 0.08].map((d, i) => `${d},${(1e-5 + d / u + (i % 2 ? 1e-7 : -1e-7)).toPrecision(12)}`)].join('\n');
    const j = await runJson<Json>('fit', file('fit.csv', `${csv}\n`), '--near', '1.8K');
    expect(j.candidates[j.chosen].interval95_K).toHaveLength(2);
    expect(j.candidates[j.chosen].evidenceSd).toBeLessThan(1);
    expect(Array.isArray(j.warnings)).toBe(true);
  });
});

describe('locate', () => {
  const u = secondSound(1.8);
  const src = [0.01, -0.02, 0.05] as const;
  const csv = (speed: number, late = -1) =>
    [
      'label,x_m,y_m,z_m,arrival_s',
      ...SCENARIO_SENSORS.map((s, i) => `S${i + 1},${s[0]},${s[1]},${s[2]},${(1e-4 + Math.hypot(s[0] - src[0], s[1] - src[1], s[2] - src[2]) / speed + (i === late ? 300e-6 : 0)).toPrecision(12)}`),
    ].join('\n');

  it('with --temperature the speed is fitted under the prior; --no-speed-prior holds it fixed', async () => {
    const path = file('loc.csv', `${csv(20.0)}\n`);
    const withPrior = await runJson<Json>('locate', path, '--temperature', '1.8K');
    expect(withPrior.speedPrior.speed_m_s).toBeCloseTo(u, 9);
    expect(withPrior.speedPrior.sd_m_s).toBeCloseTo(0.0025 * u, 6);
    expect(withPrior.speedSd_m_s).toBeGreaterThan(0);
    expect(withPrior.speed_m_s).toBeGreaterThan(u);
    const fixed = await runJson<Json>('locate', path, '--temperature', '1.8K', '--no-speed-prior');
    expect(fixed.speedPrior).toBeNull();
    expect(fixed.speed_m_s).toBe(u);
    const wider = await runJson<Json>('locate', path, '--temperature', '1.8K', '--temperature-sd', '5mK');
    expect(wider.speedPrior.sd_m_s).toBeGreaterThan(withPrior.speedPrior.sd_m_s);
    expectUsageError(await run('locate', path, '--speed', '20m/s', '--temperature-sd', '1mK'));
  });

  it('one sensor 300 µs late: only it is an outlier, without --drop-outliers', async () => {
    const j = await runJson<Json>('locate', file('late.csv', `${csv(u, 3)}\n`), '--temperature', '1.8K');
    expect(j.outlierLabels).toEqual(['S4']);
    expect(j.dropped).toEqual([]);
  });
});
