/**
 * `sekundo locate`: synthetic scenarios written as CSV from a stated model, t_i = t0 + |x − s_i|/u
 * plus seeded Gaussian timing noise of a stated sd, read back through the command line. A least-
 * squares fit must recover the known source within a few of its own sds (coverage of honest
 * uncertainties: Bevington & Robinson, Data Reduction and Error Analysis, ch. 8). Every bad input
 * gives status 2 and one line on stderr.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { arrivalsOf as kernelInputsOf, locateResultsToCsv, locateSensorsToCsv, parseLocateCsv, sensorOutcomes } from '../../src/io/locate-csv';
import { locateSource, secondSound, type Vec3 } from '../../src/physics';
import { expectUsageError, run, runJson as runJsonAs } from '../support/cli-harness';
import { gaussian, seededRandom } from '../support/synthetic-trace';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const U2_1_8K = secondSound(1.8); // this kernel's u2 at 1.8 K (D&B 1998 curve: 19.90 m/s)

// biome-ignore lint/suspicious/noExplicitAny: JSON output is checked field by field below
type Json = any;
const runJson = (...argv: string[]) => runJsonAs<Json>(...argv);

let dir = '';
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'sekundo-locate-'));
});
afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

let fileCounter = 0;
function writeCsvFile(text: string): string {
  fileCounter += 1;
  const path = join(dir, `sensors-${fileCounter}.csv`);
  writeFileSync(path, text);
  return path;
}

/** A stated model: sensors, a true source, emission time, speed and timing sd, with a noise seed. */
interface Scenario {
  sensors: readonly Vec3[];
  source: Vec3;
  t0_s: number;
  speed_m_s: number;
  sd_s: number;
  seed: number;
  /** Extra delay added to some sensors (an outlier), s. */
  late?: Readonly<Record<number, number>>;
}

function arrivalsOf(s: Scenario): number[] {
  const noise = gaussian(seededRandom(s.seed));
  return s.sensors.map((p, i) => s.t0_s + Math.hypot(p[0] - s.source[0], p[1] - s.source[1], p[2] - s.source[2]) / s.speed_m_s + s.sd_s * noise() + (s.late?.[i] ?? 0));
}

/** The scenario as CSV in the CLI format (SI columns, full precision, labels S1…). */
function scenarioCsv(s: Scenario, withSd = true): string {
  const t = arrivalsOf(s);
  const header = withSd ? 'label,x_m,y_m,z_m,arrival_s,arrival_sd_s' : 'label,x_m,y_m,z_m,arrival_s';
  const rows = s.sensors.map((p, i) => [`S${i + 1}`, ...p, t[i], ...(withSd ? [s.sd_s] : [])].join(','));
  return `${header}\n${rows.join('\n')}\n`;
}

/** Eight sensors on two rings of a frame around a test cell (an invented layout). */
const FRAME: readonly Vec3[] = [
  [0.15, 0, 0.05],
  [0, 0.15, 0.05],
  [-0.15, 0, 0.05],
  [0, -0.15, 0.05],
  [0.106, 0.106, -0.05],
  [-0.106, 0.106, -0.05],
  [-0.106, -0.106, -0.05],
  [0.106, -0.106, -0.05],
];

function expectWithin3Sd(json: Json, source: Vec3): void {
  expect(json.degenerate).toBe(false);
  expect(json.sourceSd_m).not.toBeNull();
  for (const k of [0, 1, 2]) {
    const sd = json.sourceSd_m[k] as number;
    expect(sd).toBeGreaterThan(0);
    expect(Math.abs((json.source_m[k] as number) - (source[k] as number))).toBeLessThan(3 * sd);
  }
}

describe('sekundo locate: recovers a known source from synthetic arrival times', () => {
  const sources: readonly [string, Vec3, number][] = [
    ['near the equator of the cell', [-0.048, 0.091, 0.004], 11],
    ['near the axis, above the upper ring', [0.01, -0.02, 0.08], 12],
    ['off-centre, low', [0.07, 0.03, -0.03], 13],
  ];
  it.each(sources)('source %s, 1.8 K, 20 µs timing sd, seed %#', async (_name, source, seed) => {
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 3.5e-4, speed_m_s: U2_1_8K, sd_s: 20e-6, seed };
    const json = await runJson('locate', writeCsvFile(scenarioCsv(scenario)), '--temperature', '1.8K');
    expectWithin3Sd(json, source);
    expect(Math.abs(json.offset_s - scenario.t0_s)).toBeLessThan(3 * json.offsetSd_s);
    // The speed is fitted under the prior of u2's own sd (0.25 %): it stays within a few prior sds of u2.
    expect(json.speedPrior.speed_m_s).toBe(U2_1_8K);
    expect(Math.abs(json.speed_m_s - U2_1_8K)).toBeLessThan(3 * json.speedPrior.sd_m_s);
    expect(json.speedSd_m_s).toBeGreaterThan(0);
    expect(json.residuals_s).toHaveLength(8);
    expect(json.labels).toEqual(['S1', 'S2', 'S3', 'S4', 'S5', 'S6', 'S7', 'S8']);
    expect(json.lines).toEqual([2, 3, 4, 5, 6, 7, 8, 9]);
    expect(json.outliers).toEqual([]);
    expect(json.degreesOfFreedom).toBe(4);
    // Sds scale with the timing sd: 20 µs at ~20 m/s is 0.4 mm of path; geometry multiplies it a few times.
    for (const sd of json.sourceSd_m) expect(sd).toBeLessThan(5e-3);
  });

  it('reads units from column names (x_mm, arrival_ms, arrival_sd_us) and --speed in cm/s', async () => {
    const source: Vec3 = [0.02, 0.03, 0.01];
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 0, speed_m_s: 19.5, sd_s: 10e-6, seed: 21 };
    const t = arrivalsOf(scenario);
    const rows = FRAME.map((p, i) => [p[0] * 1e3, p[1] * 1e3, p[2] * 1e3, (t[i] as number) * 1e3, 10].join(','));
    const path = writeCsvFile(`# made-up frame, millimetres and milliseconds\nx_mm,y_mm,z_mm,arrival_ms,arrival_sd_us\n${rows.join('\n')}\n`);
    const json = await runJson('locate', path, '--speed', '1950cm/s');
    expect(json.speed_m_s).toBe(19.5);
    expect(json.temperature_K).toBeNull();
    expectWithin3Sd(json, source);
    expect(json.sensors[0].label).toBe('S1');
    expect(json.sensors[0].arrivalSd_s).toBeCloseTo(10e-6, 15);
  });

  it('--arrival-sd applies where the file gives no sd, and sets the scale of the uncertainties', async () => {
    const source: Vec3 = [0.01, 0.02, 0.0];
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 1e-3, speed_m_s: U2_1_8K, sd_s: 5e-6, seed: 5 };
    const path = writeCsvFile(scenarioCsv(scenario, false));
    // The speed held fixed, so the sds scale with the timing sd alone.
    const small = await runJson('locate', path, '--temperature', '1.8K', '--no-speed-prior', '--arrival-sd', '5us');
    const large = await runJson('locate', path, '--temperature', '1.8K', '--no-speed-prior', '--arrival-sd', '50us');
    expectWithin3Sd(small, source);
    expect(small.defaultArrivalSd_s).toBeCloseTo(5e-6, 15);
    // The same data: ten times the stated sd gives ten times the sds (no Birge scaling below χ²/dof = 1).
    if (large.chiSquare / large.degreesOfFreedom <= 1 && small.chiSquare / small.degreesOfFreedom <= 1) {
      expect(large.sourceSd_m[0] / small.sourceSd_m[0]).toBeCloseTo(10, 6);
    } else {
      expect(large.sourceSd_m[0]).toBeGreaterThanOrEqual(small.sourceSd_m[0]);
    }
  });

  it('--fit-speed recovers a known effective speed (strong pulses run faster than u₂)', async () => {
    const effective = 21.4; // m/s, an invented effective speed above u2(1.8 K)
    const source: Vec3 = [-0.03, 0.05, 0.01];
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 2e-4, speed_m_s: effective, sd_s: 10e-6, seed: 31 };
    const path = writeCsvFile(scenarioCsv(scenario));
    const json = await runJson('locate', path, '--temperature', '1.8K', '--fit-speed');
    expect(json.fitSpeed).toBe(true);
    expect(json.speedSd_m_s).toBeGreaterThan(0);
    expect(Math.abs(json.speed_m_s - effective)).toBeLessThan(3 * json.speedSd_m_s);
    // Eight sensors 0.1–0.25 m away with 10 µs timing pin the speed to a few per cent.
    expect(json.speedSd_m_s).toBeLessThan(0.05 * effective);
    expectWithin3Sd(json, source);
    expect(json.degreesOfFreedom).toBe(3);
    // With --no-speed-prior the speed stays u2 and has no sd.
    const fixed = await runJson('locate', path, '--temperature', '1.8K', '--no-speed-prior');
    expect(fixed.speed_m_s).toBe(U2_1_8K);
    expect(fixed.speedSd_m_s).toBeNull();
  });

  it('a source on a sphere (a cavity wall) stays on it with --sphere in millimetres', async () => {
    const R = 0.103;
    const source: Vec3 = [R * Math.sin(1.4) * Math.cos(2.1), R * Math.sin(1.4) * Math.sin(2.1), R * Math.cos(1.4)];
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 0, speed_m_s: U2_1_8K, sd_s: 20e-6, seed: 41 };
    const json = await runJson('locate', writeCsvFile(scenarioCsv(scenario)), '--temperature', '1.8K', '--sphere', '0,0,0,103mm');
    expect(Math.hypot(...(json.source_m as [number, number, number])) - R).toBeCloseTo(0, 9);
    expectWithin3Sd(json, source);
    expect(json.constraint).toEqual({ kind: 'sphere', centre_m: [0, 0, 0], radius_m: R });
    expect(json.regions.sigma1.semiAxes_m).toHaveLength(2);
    expect(json.degreesOfFreedom).toBe(5);
  });

  it('--cylinder and --plane hold the source on their surfaces', async () => {
    const cylSource: Vec3 = [0.08 * Math.cos(0.7), 0.08 * Math.sin(0.7), 0.02];
    const cyl = await runJson(
      'locate',
      writeCsvFile(scenarioCsv({ sensors: FRAME, source: cylSource, t0_s: 0, speed_m_s: U2_1_8K, sd_s: 20e-6, seed: 51 })),
      '--temperature',
      '1.8K',
      '--cylinder',
      '0,0,0,0,0,2,80mm',
    );
    expect(Math.hypot(cyl.source_m[0], cyl.source_m[1])).toBeCloseTo(0.08, 9);
    expectWithin3Sd(cyl, cylSource);
    const planeSource: Vec3 = [0.03, -0.04, 0.02];
    const plane = await runJson(
      'locate',
      writeCsvFile(scenarioCsv({ sensors: FRAME, source: planeSource, t0_s: 0, speed_m_s: U2_1_8K, sd_s: 20e-6, seed: 52 })),
      '--temperature',
      '1.8K',
      '--plane',
      '0,0,20mm,0,0,1',
    );
    expect(plane.source_m[2]).toBeCloseTo(0.02, 9);
    expectWithin3Sd({ ...plane, sourceSd_m: [plane.sourceSd_m[0], plane.sourceSd_m[1], 1] }, planeSource);
  });

  it('flags a late sensor as an outlier and --drop-outliers leaves it out', async () => {
    const source: Vec3 = [0.02, 0.04, 0.0];
    const scenario: Scenario = { sensors: [...FRAME, [0, 0, 0.16], [0, 0, -0.16]], source, t0_s: 0, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 61, late: { 6: 300e-6 } };
    const path = writeCsvFile(scenarioCsv(scenario));
    const plain = await runJson('locate', path, '--temperature', '1.8K');
    expect(plain.outliers).toContain(6);
    expect(plain.outlierLabels).toContain('S7');
    expect(plain.sensors[6].status).toBe('outlier');
    const robust = await runJson('locate', path, '--temperature', '1.8K', '--drop-outliers');
    expect(robust.dropped).toEqual([6]);
    expect(robust.droppedLabels).toEqual(['S7']);
    expect(robust.sensors[6].status).toBe('dropped');
    expectWithin3Sd(robust, source);
    const text = await run('locate', path, '--temperature', '1.8K', '--drop-outliers');
    expect(text.stdout).toMatch(/S7 .*OUTLIER, left out of the fit/);
  });

  it('a sensor without an arrival is listed, not fitted, with the arrival the source predicts there', async () => {
    const source: Vec3 = [0.01, 0.0, 0.02];
    const scenario: Scenario = { sensors: FRAME, source, t0_s: 0, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 71 };
    const lines = scenarioCsv(scenario).trimEnd().split('\n');
    lines[3] = lines[3]?.replace(/,[^,]*,([^,]*)$/, ',,$1') ?? '';
    const json = await runJson('locate', writeCsvFile(`${lines.join('\n')}\n`), '--temperature', '1.8K');
    expect(json.residuals_s).toHaveLength(7);
    expect(json.labels).not.toContain('S3');
    expect(json.sensors[2]).toMatchObject({ label: 'S3', arrival_s: null, residual_s: null, status: 'no arrival' });
    const s3 = FRAME[2] as Vec3;
    const expected = json.offset_s + Math.hypot(s3[0] - json.source_m[0], s3[1] - json.source_m[1], s3[2] - json.source_m[2]) / json.speed_m_s;
    expect(json.sensors[2].predictedArrival_s).toBeCloseTo(expected, 12);
  });

  it('prints a readable report without --json', async () => {
    const scenario: Scenario = { sensors: FRAME, source: [0.01, 0.02, 0.0], t0_s: 0, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 81 };
    const { status, stdout, stderr } = await run('locate', writeCsvFile(scenarioCsv(scenario)), '--temperature', '1.8K');
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toMatch(/^Source location from 8 arrival times/);
    expect(stdout).toMatch(/Source \(mm\)\s+10\.\d\d\s+20\.\d\d\s+-?0\.\d\d/);
    expect(stdout).toContain('u₂ at 1.80000 K');
    expect(stdout).toContain('1σ region');
    expect(stdout).not.toContain('DEGENERATE');
    expect(stdout).not.toMatch(/NaN|undefined|Infinity/);
  });
});

describe('sekundo locate: degenerate layouts are reported, not hidden', () => {
  const LINE: readonly Vec3[] = [0, 1, 2, 3, 4, 5].map((i) => [0.04 * i - 0.1, 0, 0] as Vec3);
  const csv = () => scenarioCsv({ sensors: LINE, source: [0.02, 0.05, 0.03], t0_s: 0, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 91 });

  it('sensors on a line: JSON says degenerate with null sds and a note', async () => {
    const json = await runJson('locate', writeCsvFile(csv()), '--temperature', '1.8K');
    expect(json.degenerate).toBe(true);
    expect(json.sourceSd_m).toBeNull();
    expect(json.covariance_m2).toBeNull();
    expect(json.regions).toBeNull();
    expect(json.notes.join(' ')).toMatch(/on a line/);
  });

  it('sensors on a line: the text report says so plainly and prints no sds', async () => {
    const { status, stdout } = await run('locate', writeCsvFile(csv()), '--temperature', '1.8K');
    expect(status).toBe(0);
    expect(stdout).toContain('DEGENERATE LAYOUT: these sensors cannot fix the source');
    expect(stdout).toMatch(/Fit stopped at \(mm\)/);
    expect(stdout).toMatch(/1σ \(mm\)\s+—\s+—\s+—/);
    expect(stdout).toMatch(/on a line/);
    expect(stdout).not.toMatch(/NaN|Infinity/);
  });
});

describe('sekundo locate: bad input is one line on stderr, status 2', () => {
  const good = () => writeCsvFile(scenarioCsv({ sensors: FRAME, source: [0, 0, 0], t0_s: 0, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 1 }));
  const header = 'label,x_m,y_m,z_m,arrival_s\n';
  const fileCases: readonly [name: string, text: string, expected: readonly string[]][] = [
    ['empty file', '', ['is empty']],
    ['header only', header, ['no sensor rows']],
    ['missing column', 'label,x_m,y_m,arrival_s\nA,0,0,0.01\n', ['no column "z_m"', 'x_m, y_m, z_m, arrival_s']],
    ['not a number, line named', `${header}A,0.1,0,0,0.01\nB,0.1,abc,0,0.01\n`, ['line 3', 'column "y_m"', '"abc" is not a number']],
    ['ragged row', `${header}A,0.1,0,0,0.01\nB,0.1,0,0\n`, ['line 3', 'ragged row']],
    ['NaN arrival', `${header}A,0.1,0,0,NaN\n`, ['line 2', '"NaN" is not a finite number']],
    ['coordinate out of range', `# comment\n${header}A,150,0,0,0.01\n`, ['line 3', 'x_m (in m) 150 is outside the valid range -100 to 100']],
    ['negative sd', 'x_m,y_m,z_m,arrival_s,arrival_sd_s\n0,0,0,0.01,-1e-6\n', ['line 2', 'arrival_sd_s (in s) -0.000001 is outside']],
    ['repeated label', `${header}A,0.1,0,0,0.01\nA,0.2,0,0,0.01\n`, ['line 3', 'label "A" is already used on line 2']],
    ['binary', 'x_m\0y_m', ['binary']],
    ['too few sensors', `${header}A,0.1,0,0,0.01\nB,0,0.1,0,0.01\nC,0,0,0.1,0.01\n`, ['3 sensors with an arrival time', 'at least 5']],
    ['too few with blanks', `${header}A,0.1,0,0,0.01\nB,0,0.1,0,\nC,0,0,0.1,0.01\nD,0.1,0.1,0,0.01\nE,0,0.1,0.1,0.01\n`, ['4 sensors with an arrival time (1 without)', 'at least 5']],
  ];
  it.each(fileCases)('%s', async (_name, text, expected) => {
    const path = writeCsvFile(text);
    const line = expectUsageError(await run('locate', path, '--temperature', '1.8K'));
    expect(line).toContain(`sensor file "${path}"`);
    for (const fragment of expected) expect(line).toContain(fragment);
  });

  it('too few sensors for a fitted speed says how many are needed', async () => {
    const rows = FRAME.slice(0, 5).map((p, i) => `S${i},${p.join(',')},0.01`);
    const line = expectUsageError(await run('locate', writeCsvFile(`label,x_m,y_m,z_m,arrival_s\n${rows.join('\n')}\n`), '--temperature', '1.8K', '--fit-speed'));
    expect(line).toContain('fitting 5 unknowns (x, y, z, t0, speed) with a check needs at least 6');
  });

  const flagCases: readonly [name: string, argv: () => string[], expected: readonly string[]][] = [
    ['no file', () => ['locate', '--temperature', '1.8K'], ['needs a CSV file']],
    ['missing file', () => ['locate', join(dir, 'absent.csv'), '--temperature', '1.8K'], ['cannot read sensor file', 'no such file']],
    ['neither speed nor temperature', () => ['locate', good()], ['needs --temperature', 'or --speed']],
    ['both speed and temperature', () => ['locate', good(), '--temperature', '1.8K', '--speed', '20m/s'], ['--temperature or --speed, not both']],
    ['temperature above Tλ', () => ['locate', good(), '--temperature', '2.5K'], ['--temperature 2.5 K is outside the valid range 0.3–2.1768 K', 'He I']],
    ['temperature at Tλ: no speed', () => ['locate', good(), '--temperature', '2.1768K'], ['u₂ is 0 m/s there']],
    ['speed with a wrong unit', () => ['locate', good(), '--speed', '20km/h'], ['--speed', 'unknown unit "km/h"', 'm/s, cm/s, mm/s']],
    ['speed zero', () => ['locate', good(), '--speed', '0'], ['--speed 0 m/s is outside the valid range 0.001–10000 m/s']],
    ['arrival sd zero', () => ['locate', good(), '--speed', '20m/s', '--arrival-sd', '0'], ['--arrival-sd 0 s is outside the valid range']],
    ['arrival sd not a time', () => ['locate', good(), '--speed', '20m/s', '--arrival-sd', '5mm'], ['--arrival-sd', 'unknown unit "mm"']],
    ['outlier limit out of range', () => ['locate', good(), '--speed', '20m/s', '--outlier-limit', '0.5'], ['--outlier-limit 0.5 is outside the valid range 1–100']],
    ['sphere with three values', () => ['locate', good(), '--speed', '20m/s', '--sphere', '0,0,1'], ['--sphere needs 4 comma-separated values cx,cy,cz,R', 'got 3']],
    ['sphere with a bad unit', () => ['locate', good(), '--speed', '20m/s', '--sphere', '0,0,0,10K'], ['--sphere: R', 'unknown unit "K"']],
    ['sphere of radius zero', () => ['locate', good(), '--speed', '20m/s', '--sphere', '0,0,0,0'], ['--sphere "0,0,0,0": radius 0 m is outside the valid range']],
    ['cylinder axis zero', () => ['locate', good(), '--speed', '20m/s', '--cylinder', '0,0,0,0,0,0,0.05'], ['axis direction 0,0,0 must not be zero']],
    ['plane normal not a number', () => ['locate', good(), '--speed', '20m/s', '--plane', '0,0,0,0,0,up'], ['--plane: nz "up" is not a number']],
    ['two surfaces', () => ['locate', good(), '--speed', '20m/s', '--sphere', '0,0,0,0.1', '--plane', '0,0,0,0,0,1'], ['at most one surface', '--sphere and --plane']],
    ['unknown flag', () => ['locate', good(), '--speed', '20m/s', '--robust'], ['unknown flag --robust', '--drop-outliers']],
    ['second file', () => ['locate', good(), good(), '--speed', '20m/s'], ['unexpected argument']],
  ];
  it.each(flagCases)('%s', async (_name, argv, expected) => {
    const line = expectUsageError(await run(...argv()));
    for (const fragment of expected) expect(line).toContain(fragment);
  });
});

describe('sekundo locate: help, the demo, a real process', () => {
  it('has its own help with every flag, the columns and the surfaces', async () => {
    const { status, stdout } = await run('locate', '--help');
    expect(status).toBe(0);
    for (const flag of ['--temperature', '--speed', '--fit-speed', '--arrival-sd', '--drop-outliers', '--outlier-limit', '--sphere', '--cylinder', '--plane', '--json']) {
      expect(stdout).toContain(flag);
    }
    expect(stdout).toContain('x_m, y_m, z_m, arrival_s');
    expect(stdout).toContain('m/s, cm/s, mm/s');
  });

  it('the demo file reads as sensor input: eight sensors on an invented frame', () => {
    const input = parseLocateCsv(readFileSync(join(REPO_ROOT, 'public/demo-locate.csv')));
    expect(input.sensors).toHaveLength(8);
    expect(input.sensors.map((s) => s.label)).toContain('L225');
  });

  it('node bin/sekundo.mjs locate public/demo-locate.csv --temperature 1.8K --json', () => {
    const result = spawnSync(process.execPath, ['bin/sekundo.mjs', 'locate', 'public/demo-locate.csv', '--temperature', '1.8K', '--json'], {
      cwd: REPO_ROOT,
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const json = JSON.parse(result.stdout) as Json;
    expect(json.source_m).toHaveLength(3);
    expect(json.sourceSd_m).toHaveLength(3);
    expect(json.outlierLabels).toEqual(['L225']);
  }, 60_000);
});

describe('locate CSV: written files read back', () => {
  const scenario: Scenario = { sensors: FRAME, source: [0.01, 0.02, 0.03], t0_s: 1e-4, speed_m_s: U2_1_8K, sd_s: 10e-6, seed: 101 };

  it('sensors written in the input format read back exactly (labels with commas and quotes too)', () => {
    const input = parseLocateCsv(scenarioCsv(scenario));
    const sensors = input.sensors.map((s, i) => (i === 0 ? { ...s, label: 'north, "top"' } : i === 1 ? { ...s, arrival_s: null, arrivalSd_s: null } : s));
    expect(parseLocateCsv(locateSensorsToCsv(sensors)).sensors).toEqual(sensors);
  });

  it('a results file carries the source in comments and reads back as the same sensors', () => {
    const { sensors } = parseLocateCsv(scenarioCsv(scenario));
    const { arrivals, indices } = kernelInputsOf(sensors);
    const result = locateSource(arrivals, { speed_m_s: U2_1_8K, fitSpeed: false, arrivalSd_s: 1e-5, constraint: { kind: 'none' }, dropOutliers: false });
    const text = locateResultsToCsv(sensors, sensorOutcomes(sensors, indices, result), result, {
      speedFrom: 'u2 at 1.8 K',
      fitSpeed: false,
      defaultArrivalSd_s: 1e-5,
      constraint: { kind: 'sphere', centre_m: [0, 0, 0], radius_m: 0.1 },
      dropOutliers: false,
    });
    expect(text).toContain(`# source_m (x y z): ${result.source_m.join(' ')}`);
    expect(text).toContain('surface: sphere centre 0 0 0 m, radius 0.1 m');
    expect(text.split('\n').find((l) => l.startsWith('label,'))).toBe('label,x_m,y_m,z_m,arrival_s,arrival_sd_s,predicted_arrival_s,residual_s,normalised_residual,status');
    expect(parseLocateCsv(text).sensors).toEqual(sensors);
  });
});
