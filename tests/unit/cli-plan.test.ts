import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseFlags, type QuantityArg } from '../../src/cli/args';
import { UsageError } from '../../src/cli/errors';
import { computeFor, kernelCall } from '../../src/cli/kernel-call';
import { heliumProperties, InvalidInputError } from '../../src/physics';
import { expectUsageError, run, runJson as runJsonAs } from '../support/cli-harness';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DEMO_PATH = join(REPO_ROOT, 'public/demo-plan.json');
const DEMO_TEXT = readFileSync(DEMO_PATH, 'utf8');

// Sources of the numbers below.
const DB1998_U2 = 'Donnelly & Barenghi 1998 second-sound spline: u2(1.8 K) = 19.90 m/s';
const DB1998_U1 = 'Donnelly & Barenghi 1998 first-sound spline, this kernel: u1(1.8 K) = 231.29 m/s';
const PLANE_WAVE = 'PHYSICS notes §4, from the reference data: 1 W/cm² at 1.8 K gives δT = q/(ρ c_p u2) ≈ 1.17 mK';
const IMAGES = 'method of images (PHYSICS notes §3): parallel plates at spacing d give echoes at (2k+1)d/u2, × R per bounce';
const WALL = 'method of images: at a reflecting wall the incident and reflected pulses add, (1 + R)·δT';



// biome-ignore lint/suspicious/noExplicitAny: JSON output is checked field by field below
type Json = any;

const runJson = (...argv: string[]) => runJsonAs<Json>(...argv);


const ARRIVALS_1_8K_50MM = ['arrivals', '--temperature', '1.8K', '--distance', '50mm'];

describe('sekundo arrivals: hand-worked checks', () => {
  it(`second sound over 50 mm at 1.8 K arrives at d/u2 = 0.05/19.90 s ≈ 2.512 ms (${DB1998_U2})`, async () => {
    // u2 is quoted to ±0.005 m/s, so the arrival is known to d/u2 · 0.005/19.90 ≈ 0.63 µs.
    const expected = 0.05 / 19.9;
    const tolerance = expected * (0.005 / 19.9);
    const json = await runJson(...ARRIVALS_1_8K_50MM);
    expect(Math.abs(json.secondSoundArrival_s - expected)).toBeLessThanOrEqual(tolerance);
    // And exactly d/u2 with this kernel's u2 (regression; one division).
    expect(json.secondSoundArrival_s).toBeCloseTo(0.05 / (heliumProperties(1.8).secondSound_m_s as number), 15);
  });

  it(`first sound over 50 mm at 1.8 K arrives at 0.05/231.29 s ≈ 0.2162 ms (${DB1998_U1})`, async () => {
    // u1 quoted to ±0.005 m/s.
    const expected = 0.05 / 231.29;
    const json = await runJson(...ARRIVALS_1_8K_50MM);
    expect(Math.abs(json.firstSoundArrival_s - expected)).toBeLessThanOrEqual(expected * (0.005 / 231.29));
    expect(json.firstSoundArrival_s * 1e3).toBeCloseTo(0.2162, 4);
  });

  it(`1 W/cm² at 1.8 K: the incident pulse is ≈ 1.17 mK (${PLANE_WAVE})`, async () => {
    // Quoted to three digits: half a unit in the last is 0.005 mK.
    const TOLERANCE_K = 0.005e-3;
    const bare = await runJson(...ARRIVALS_1_8K_50MM, '--flux', '1W/cm2', '--reflection', '0');
    expect(Math.abs(bare.amplitude_K - 1.17e-3)).toBeLessThanOrEqual(TOLERANCE_K);
    expect(Math.abs(bare.faceDeltaT_K / bare.amplitude_K - 1)).toBeLessThan(1e-12);
    const withPlates = await runJson(...ARRIVALS_1_8K_50MM, '--flux', '1W/cm2');
    expect(Math.abs(withPlates.faceDeltaT_K - 1.17e-3)).toBeLessThanOrEqual(TOLERANCE_K);
  });

  it(`on its reflecting plate the sensor sees (1 + R) times the incident pulse (${WALL})`, async () => {
    // Two samples of the same plateau added: agreement to rounding.
    const json = await runJson(...ARRIVALS_1_8K_50MM, '--flux', '1W/cm2', '--reflection', '0.4');
    expect(json.amplitude_K / json.faceDeltaT_K).toBeCloseTo(1.4, 12);
    const inverted = await runJson(...ARRIVALS_1_8K_50MM, '--reflection', '-0.5');
    expect(inverted.amplitude_K / inverted.faceDeltaT_K).toBeCloseTo(0.5, 12);
  });

  it('the incident pulse scales with the flux: 0.1 W/cm² (the default) gives a tenth of 1 W/cm²', async () => {
    const low = await runJson(...ARRIVALS_1_8K_50MM);
    const high = await runJson(...ARRIVALS_1_8K_50MM, '--flux', '1W/cm2');
    expect(low.flux_W_m2).toBe(1000);
    expect(low.faceDeltaT_K * 10).toBeCloseTo(high.faceDeltaT_K, 15);
  });

  it(`echo k arrives at (2k+1)·d/u2 after 2k reflections, R^2k as large (${IMAGES})`, async () => {
    // Arrivals are d/u2 times small whole numbers: agreement to rounding.
    // R = 0.6 keeps every image up to 13 reflections above the kernel's cut (|∏R| ≥ 1e-4).
    const json = await runJson(...ARRIVALS_1_8K_50MM, '--echo-order', '12', '--reflection', '0.6');
    const direct = json.secondSoundArrival_s;
    expect(json.echoes).toHaveLength(6);
    json.echoes.forEach((echo: Json, i: number) => {
      const k = i + 1;
      expect(echo.order).toBe(2 * k);
      expect(echo.arrival_s / direct).toBeCloseTo(2 * k + 1, 12);
      expect(echo.amplitude_K / json.amplitude_K).toBeCloseTo(0.6 ** (2 * k), 12);
    });
  });

  it('by default lists the echoes at 3d/u2 and 5d/u2 (up to 4 reflections)', async () => {
    const json = await runJson(...ARRIVALS_1_8K_50MM);
    expect(json.echoOrder).toBe(4);
    expect(json.echoes.map((e: Json) => e.order)).toEqual([2, 4]);
  });

  it('lists no echoes for --echo-order 0 or for plates that do not reflect', async () => {
    expect((await runJson(...ARRIVALS_1_8K_50MM, '--echo-order', '0')).echoes).toEqual([]);
    expect((await runJson(...ARRIVALS_1_8K_50MM, '--reflection', '0')).echoes).toEqual([]);
  });

  it('a sensor lag delays every second-sound arrival by the lag', async () => {
    const plain = await runJson(...ARRIVALS_1_8K_50MM);
    const lagged = await runJson(...ARRIVALS_1_8K_50MM, '--lag', '20us');
    expect(lagged.secondSoundArrival_s - plain.secondSoundArrival_s).toBeCloseTo(20e-6, 15);
    expect(lagged.echoes[0].arrival_s - plain.echoes[0].arrival_s).toBeCloseTo(20e-6, 15);
    expect(lagged.amplitude_K).toBeLessThan(plain.amplitude_K);
  });
});

describe('sekundo arrivals: warnings', () => {
  const codes = (json: Json): string[] => json.warnings.map((w: Json) => w.code);

  it('warns of a large amplitude at 2 W/cm² and not at 0.5 W/cm² (1 mK kept for thermometry, common practice)', async () => {
    // On its solid plate the sensor sees (1 + R) ≈ 2 times the incident 1.17 mK per W/cm².
    expect(codes(await runJson(...ARRIVALS_1_8K_50MM, '--flux', '2W/cm2'))).toContain('large-amplitude');
    expect(codes(await runJson(...ARRIVALS_1_8K_50MM, '--flux', '0.5W/cm2'))).toContain('large-amplitude');
    expect(codes(await runJson(...ARRIVALS_1_8K_50MM, '--flux', '0.4W/cm2'))).not.toContain('large-amplitude');
    expect(codes(await runJson(...ARRIVALS_1_8K_50MM, '--flux', '0.5W/cm2', '--reflection', '0'))).not.toContain('large-amplitude');
  });

  it('gives each warning as {code, severity, message}', async () => {
    const json = await runJson(...ARRIVALS_1_8K_50MM, '--flux', '2W/cm2');
    for (const w of json.warnings) {
      expect(Object.keys(w).sort()).toEqual(['code', 'message', 'severity']);
      expect(typeof w.message).toBe('string');
    }
  });

  it('leaves out warnings about the digitiser, repetition rate and noise it does not take', async () => {
    const found = codes(await runJson(...ARRIVALS_1_8K_50MM, '--flux', '2W/cm2', '--rise', '10ns'));
    for (const code of ['bath-heating', 'range-ambiguity', 'record-too-short', 'coarse-sampling', 'low-snr', 'insensitive']) {
      expect(found).not.toContain(code);
    }
  });

  it('above Tλ: first sound only, null second sound, a "stop" warning, status 0', async () => {
    const json = await runJson('arrivals', '--temperature', '2.5K', '--distance', '50mm');
    expect(json.secondSoundArrival_s).toBeNull();
    expect(json.amplitude_K).toBeNull();
    expect(json.faceDeltaT_K).toBeNull();
    expect(json.echoes).toEqual([]);
    expect(json.firstSoundArrival_s).toBeGreaterThan(0);
    expect(json.warnings).toContainEqual(expect.objectContaining({ code: 'no-second-sound', severity: 'stop' }));
  });
});

describe('sekundo arrivals: input and output', () => {
  it('prints the promised JSON fields', async () => {
    const json = await runJson(...ARRIVALS_1_8K_50MM);
    for (const key of ['secondSoundArrival_s', 'firstSoundArrival_s', 'amplitude_K', 'echoes', 'warnings']) expect(json).toHaveProperty(key);
    for (const echo of json.echoes) expect(Object.keys(echo).sort()).toEqual(['amplitude_K', 'arrival_s', 'order']);
    expect(json).toMatchObject({ temperature_K: 1.8, distance_m: 0.05, pulseWidth_s: 1e-4, riseTime_s: 1e-6, lag_s: 0, reflectionSource: 'solid-wall' });
    expect(json.reflection).toBeGreaterThan(0.999);
    expect(json.heater).toEqual({ geometry: 'plane-wave', width_m: null, height_m: null, diameter_m: null });
    expect(json.model).toMatch(/^Plane-wave limit: no heater size given/);
  });

  it('reads the same case in every unit alike', async () => {
    const reference = await run(...ARRIVALS_1_8K_50MM, '--flux', '1W/cm2', '--pulse', '100us', '--json');
    for (const argv of [
      ['--temperature', '1800mK', '--distance', '5cm', '--flux', '10000', '--pulse', '0.1ms'],
      ['--temperature=1.8', '--distance=0.05', '--flux=1 W/cm²', '--pulse=100µs'],
      ['--distance', '50 mm', '--temperature', '1.8 K', '--flux', '1000mW/cm2', '--pulse', '100 us'],
      ['--temperature', '1.8K', '--distance', '50000um', '--flux', '0.01W/mm2', '--pulse', '1e-4'],
    ]) {
      expect(await run('arrivals', ...argv, '--json')).toEqual(reference);
    }
  });

  it('a pulse shorter than 10 µs gets edges of a tenth of its width by default', async () => {
    const json = await runJson(...ARRIVALS_1_8K_50MM, '--pulse', '2us');
    expect(json.riseTime_s).toBeCloseTo(2e-7, 18);
  });

  it('prints a table of the waves, the incident pulse and the warnings', async () => {
    const { status, stdout, stderr } = await run(...ARRIVALS_1_8K_50MM, '--flux', '2W/cm2');
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toMatch(/first sound\s+0\.21618\s+—/); // DB1998 first sound, this kernel
    expect(stdout).toMatch(/second sound\s+2\.5122\s+4\.6847/); // this kernel, regression: (1 + R) × 2.3431 mK, R = 0.99932
    expect(stdout).toContain('Plane-wave limit: no heater size given');
    expect(stdout).toContain('Plates: solid wall, R = (Z − h)/(Z + h) = 0.9993');
    expect(stdout).toMatch(/echo, 2 reflections\s+7\.5366/); // 3 × 2.5122 ms
    expect(stdout).toContain('1800.00 mK');
    expect(stdout).toContain('Warnings:');
    expect(stdout).toContain('caution (large-amplitude)');
  });
});

describe('sekundo arrivals: heater size', () => {
  const ISSUE = ['arrivals', '--temperature', '1.95K', '--flux', '1W/cm2', '--pulse', '200us'];
  const FILM = ['--heater-width', '10mm', '--heater-height', '10mm'];

  it('with a size, the finite heater: the model line says up to where the plane-wave value holds (a²/(2u₂τ), Stepanishen 1971)', async () => {
    const json = await runJson(...ISSUE, '--distance', '25mm', ...FILM);
    expect(json.heater).toEqual({ geometry: 'rectangle', width_m: 0.01, height_m: 0.01, diameter_m: null });
    const u2 = json.secondSound_m_s;
    const tau = 201e-6; // 200 µs + 1 µs of edges
    expect(json.planeWaveRange_m).toBeCloseTo((0.005 ** 2 - (u2 * tau) ** 2) / (2 * u2 * tau), 12);
    expect(json.model).toMatch(/^Finite heater: a 10 mm × 10 mm rectangle/);
    expect(json.model).toMatch(/half the shorter side/);
  });

  it('far beyond the plane-wave range a slow sensor sees far less than the plane wave; without a size it would not', async () => {
    const finite = await runJson(...ISSUE, '--distance', '140mm', ...FILM, '--lag', '20us', '--reflection', '0');
    const plane = await runJson(...ISSUE, '--distance', '140mm', '--lag', '20us', '--reflection', '0');
    expect(finite.amplitude_K).toBeLessThan(0.5 * plane.amplitude_K);
    expect(plane.amplitude_K / plane.faceDeltaT_K).toBeGreaterThan(0.99);
  });

  it('a disk by its diameter', async () => {
    const json = await runJson(...ISSUE, '--distance', '25mm', '--heater-diameter', '8mm');
    expect(json.heater).toEqual({ geometry: 'disk', width_m: null, height_m: null, diameter_m: 0.008 });
    expect(json.model).toMatch(/8 mm disk.*the radius/);
  });

  it('refuses half a rectangle, or a rectangle and a diameter together, with one line naming the flags', async () => {
    const base = ['arrivals', '--temperature', '1.8K', '--distance', '25mm'];
    expect(expectUsageError(await run(...base, '--heater-width', '10mm'))).toContain('--heater-height is missing');
    expect(expectUsageError(await run(...base, '--heater-diameter', '5mm', '--heater-width', '1mm', '--heater-height', '1mm'))).toContain('not both');
    const tooWide = expectUsageError(await run(...base, '--heater-width', '2m', '--heater-height', '1mm'));
    expect(tooWide).toContain('--heater-width');
    expect(tooWide).toContain('is outside the valid range');
  });
});

describe('sekundo plan: the film heater and three bolometers at 1.95 K (tests/fixtures/issue-setup-plan.json)', () => {
  const PATH = join(REPO_ROOT, 'tests/fixtures/issue-setup-plan.json');

  it('reports the heater by its size, the plane-wave range, the heater plate as a solid wall, and the absolute target as not reachable with why', async () => {
    const { status, stdout } = await run('plan', PATH);
    expect(status).toBe(0);
    expect(stdout).toContain('rectangle 10 mm × 10 mm');
    expect(stdout).toMatch(/plane-wave value holds for the whole pulse up to about 1\.66 mm/);
    expect(stdout).toContain('heater plate z = 0 mm cold, R = 0.9994 (solid wall)');
    expect(stdout).toMatch(/b140: Not reachable for an absolute reading .*2\.2 mK at 1\.95 K/);
  });

  it('amplitudes fall with distance beyond the plane-wave range (20 µs bolometers), warnings as the page gives them', async () => {
    const json = await runJson('plan', PATH);
    const amplitudes = json.sensors.map((s: Json) => s.amplitude_K);
    expect(amplitudes[0]).toBeGreaterThan(amplitudes[1]);
    expect(amplitudes[1]).toBeGreaterThan(amplitudes[2]);
    expect(amplitudes[0]).toBeLessThan(json.heater.faceDeltaT_K);
    expect(json.warnings.map((w: Json) => `${w.severity} ${w.code}`)).toEqual(['info bath-heating', 'info counterflow', 'caution shock', 'caution shock', 'caution shock']);
    expect(json.heater.shockEdge).toBe('trailing');
  });
});

describe('sekundo plan: files of an older version', () => {
  const V1_PATH = join(REPO_ROOT, 'tests/fixtures/plan-version-1.json');

  it('opens a version-1 file and says, before the report, what was changed', async () => {
    const { status, stdout } = await run('plan', V1_PATH);
    expect(status).toBe(0);
    expect(stdout).toMatch(/^Note: this file is plan format version 1; it was read as version 2:/);
    expect(stdout).toContain('planar film of 1 cm² is now a 10 mm × 10 mm rectangle');
    expect(stdout).toContain('"glass lid" keeps its typed R = 0.9 as a measured value');
  });

  it('with --json, the same notes under "migrated"', async () => {
    const json = await runJson('plan', V1_PATH);
    expect(json.migrated[0].fromVersion).toBe(1);
    expect(json.migrated[0].changes).toHaveLength(4);
  });
});

describe('sekundo plan', () => {
  let dir = '';
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'sekundo-plan-'));
  });
  afterAll(() => {
    rmSync(dir, { recursive: true, force: true });
  });

  /** Writes the demo plan after `mutate` to a temporary file and returns its path. */
  function planFile(name: string, mutate: (plan: Json) => void = () => undefined): string {
    const plan = JSON.parse(DEMO_TEXT);
    mutate(plan);
    const path = join(dir, name);
    writeFileSync(path, JSON.stringify(plan, null, 2));
    return path;
  }

  it('prints, for every sensor, the arrivals, δT, echoes, SNR and σT with the promised names', async () => {
    const json = await runJson('plan', DEMO_PATH);
    expect(json.name).toContain('Orrin-2');
    expect(json.sensors.map((s: Json) => s.id)).toEqual(['b10', 'b25', 'b35x', 'b50']);
    for (const sensor of json.sensors) {
      for (const key of ['secondSoundArrival_s', 'firstSoundArrival_s', 'amplitude_K', 'echoes', 'temperatureSd_K', 'pathLength_m', 'snrAveraged']) {
        expect(sensor).toHaveProperty(key);
      }
      expect(sensor.secondSoundArrival_s).toBeGreaterThan(sensor.firstSoundArrival_s);
      for (const echo of sensor.echoes) for (const key of ['order', 'arrival_s', 'amplitude_K']) expect(echo).toHaveProperty(key);
      expect(sensor).not.toHaveProperty('waveform');
    }
    for (const w of json.warnings) for (const key of ['code', 'severity', 'message', 'sensorId']) expect(w).toHaveProperty(key);
    expect(json.warnings.filter((w: Json) => w.severity === 'stop')).toEqual([]);
    expect(json.heater).toMatchObject({ geometry: 'rectangle', width_m: 0.01, height_m: 0.01, shape: 'rectangle' });
    expect(json.heater.flux_W_m2).toBeCloseTo(1000, 9);
    expect(json.heater.power_W).toBeCloseTo(0.1, 15); // 0.1 W/cm² × 10 mm × 10 mm
    expect(json.planes.map((p: Json) => [p.label, p.source])).toEqual([
      ['bottom plate', 'solid-wall'],
      ['lid', 'solid-wall'],
    ]);
    expect(json.migrated).toEqual([]);
    expect(json).not.toHaveProperty('heaterPulse');
  });

  it('reads the bath from the vapour pressure: 1638.2 Pa ≈ 1.800 K on ITS-90', async () => {
    const json = await runJson('plan', DEMO_PATH);
    expect(Math.abs(json.temperature_K - 1.8)).toBeLessThanOrEqual(0.0005); // ITS-90, quoted to the mK
    expect(json.bath).toMatchObject({ vapourPressure_Pa: 1638.2, scale: 'ITS-90', liquidDepth_m: 0.25 });
  });

  it('contracts the warm distances: the 50 mm sensor is 50 × (1 − 0.003) mm away cold (stainless 304, from memory)', async () => {
    const json = await runJson('plan', DEMO_PATH);
    expect(json.sensors[3].pathLength_m).toBeCloseTo(0.05 * 0.997, 15);
    expect(json.sensors[3].secondSoundArrival_s).toBeCloseTo(0.05 * 0.997 / json.properties.secondSound_m_s + 20e-6, 12);
  });

  it('keeps the JSON short without --waveform, and adds plain-number waveforms with it', async () => {
    const short = await run('plan', DEMO_PATH, '--json');
    expect(short.stdout.length).toBeLessThan(30_000);
    const json = await runJson('plan', DEMO_PATH, '--waveform');
    for (const sensor of json.sensors) {
      expect(sensor.waveform.length).toBeGreaterThan(0);
      for (const segment of sensor.waveform) {
        expect(Array.isArray(segment.values)).toBe(true);
        expect(segment.values.every((v: unknown) => typeof v === 'number')).toBe(true);
      }
    }
    expect(json.heaterPulse.values.length).toBeGreaterThan(100);
  });

  it('prints a readable report: bath, heater, one row per sensor, echoes, warnings', async () => {
    const { status, stdout, stderr } = await run('plan', DEMO_PATH);
    expect(status).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toContain('from a vapour pressure of 1638.2 Pa (ITS-90)');
    expect(stdout).toMatch(/b50\s+Bolometer D, 50 mm\s+49\.850 ± 0\.021/); // 50 mm × 0.997
    expect(stdout).toContain('Echoes (reflections, path):');
    expect(stdout).toContain('lid → bottom plate');
    expect(stdout).toContain('info (bath-heating)');
  });

  it('above Tλ still plans (first sound only) and says why, with a "stop" warning', async () => {
    const path = planFile('he1.json', (p) => {
      p.bath = { temperature_K: 2.5, liquidDepth_m: 0.1 };
    });
    const json = await runJson('plan', path);
    expect(json.sensors.every((s: Json) => s.secondSoundArrival_s === null)).toBe(true);
    expect(json.warnings).toContainEqual(expect.objectContaining({ code: 'no-second-sound', severity: 'stop', sensorId: null }));
    const { stdout } = await run('plan', path);
    expect(stdout).toContain('stop (no-second-sound)');
  });

  describe('bad plan files: one line on stderr naming the field and the range, status 2', () => {
    const cases: readonly [name: string, mutate: (plan: Json) => void, expected: readonly string[]][] = [
      ['negative width', (p) => (p.heater.width_s = -1), ['is not valid', 'heater.width_s: must be 10 ns–10 s (got -1)']],
      ['missing label', (p) => delete p.sensors[2].label, ['sensors[2].label: required']],
      ['extra field', (p) => (p.heater.colour = 'red'), ['heater.colour: unknown field']],
      ['future version', (p) => (p.version = 9), ['version: this file is version 9, written by a newer Sekundo']],
      ['echo order', (p) => (p.echoOrder = 20), ['echoOrder: must be a whole number 0–12 (got 20)']],
      ['rise longer than the width', (p) => (p.heater.riseTime_s = 1), ['heater.riseTime_s: must be 100 ps–100 µs']],
      ['many problems', (p) => Object.assign(p, { bath: 1, heater: 2, sensors: 3, spacer: 4, digitiser: 5, targets: 6, name: 7 }), ['bath: must be an object', '; and 2 more']],
    ];
    it.each(cases)('%s', async (name, mutate, expected) => {
      const path = planFile(`${name.replace(/\W+/g, '-')}.json`, mutate);
      const line = expectUsageError(await run('plan', path));
      expect(line).toContain(`plan file "${path}"`);
      for (const fragment of expected) expect(line).toContain(fragment);
    });

    it('text that is not JSON', async () => {
      const path = join(dir, 'broken.json');
      writeFileSync(path, '{"format": "sekundo-plan", ');
      expect(expectUsageError(await run('plan', path))).toContain('plan: not valid JSON');
    });

    it('a file that does not exist', async () => {
      const line = expectUsageError(await run('plan', join(dir, 'missing.json')));
      expect(line).toMatch(/cannot read plan file ".*missing\.json": no such file$/);
    });

    it('a directory', async () => {
      const sub = join(dir, 'folder.json');
      mkdirSync(sub, { recursive: true });
      expect(expectUsageError(await run('plan', sub))).toContain('it is a directory');
    });

    it('a file too large to be a plan', async () => {
      const path = join(dir, 'huge.json');
      writeFileSync(path, ' '.repeat(4_000_001));
      expect(expectUsageError(await run('plan', path))).toContain('has 4000001 characters, more than the 4000000');
    });
  });
});

describe('bad command lines: one line on stderr, status 2', () => {
  const cases: readonly [name: string, argv: readonly string[], expected: readonly string[]][] = [
    ['arrivals without temperature', ['arrivals', '--distance', '50mm'], ['needs --temperature', '0.3–4.24 K']],
    ['arrivals without distance', ['arrivals', '--temperature', '1.8K'], ['needs --distance', '0.000001–100 m']],
    ['unknown flag', ['arrivals', '--temperature', '1.8K', '--distance', '50mm', '--power', '1W'], ['unknown flag --power', '--flux']],
    ['bad flux unit', [...ARRIVALS_1_8K_50MM, '--flux', '1W/cm3'], ['--flux', 'unknown unit "W/cm3"', 'W/m2, W/cm2, mW/cm2, W/mm2', 'valid range']],
    ['flux as a power', [...ARRIVALS_1_8K_50MM, '--flux', '1W'], ['--flux', 'unknown unit "W"']],
    ['flux NaN', [...ARRIVALS_1_8K_50MM, '--flux', 'NaN'], ['--flux must be a finite number']],
    ['flux too high', [...ARRIVALS_1_8K_50MM, '--flux', '2e9W/cm2'], ['--flux 2e9W/cm2', 'is outside the valid range', 'the power (flux × heater area) 1 nW–10 kW']],
    ['flux negative', [...ARRIVALS_1_8K_50MM, '--flux', '-1W/cm2'], ['--flux -1W/cm2', 'is outside the valid range']],
    ['temperature above range', ['arrivals', '--temperature', '5K', '--distance', '50mm'], ['--temperature 5 K is outside the valid range 0.3–4.24 K']],
    ['distance 0', ['arrivals', '--temperature', '1.8K', '--distance', '0'], ['--distance 0 m is outside the valid range 0.000001–100 m']],
    ['distance above range', ['arrivals', '--temperature', '1.8K', '--distance', '101m'], ['--distance 101 m is outside the valid range 0.000001–100 m']],
    ['pulse too long', [...ARRIVALS_1_8K_50MM, '--pulse', '20s'], ['--pulse 20 s is outside the valid range 1e-8–10 s']],
    ['rise longer than the pulse', [...ARRIVALS_1_8K_50MM, '--rise', '200us'], ['--rise 200us (= 0.0002 s) is outside the valid range 1e-10–0.0001 s', 'pulse width']],
    ['negative lag', [...ARRIVALS_1_8K_50MM, '--lag=-1us'], ['--lag -1us (= -0.000001 s) is outside the valid range 0–1 s']],
    ['echo order too high', [...ARRIVALS_1_8K_50MM, '--echo-order', '13'], ['--echo-order 13 is outside the valid range 0–12']],
    ['echo order not whole', [...ARRIVALS_1_8K_50MM, '--echo-order', '2.5'], ['--echo-order 2.5 is not a whole number; valid range 0–12']],
    ['echo order not a number', [...ARRIVALS_1_8K_50MM, '--echo-order', 'four'], ['--echo-order "four" is not a whole number; valid range 0–12']],
    ['reflection above 1', [...ARRIVALS_1_8K_50MM, '--reflection', '1.5'], ['--reflection 1.5 is outside the valid range -1 to 1']],
    ['reflection with a unit', [...ARRIVALS_1_8K_50MM, '--reflection', '0.4K'], ['--reflection "0.4K" is not a number; valid range -1 to 1']],
    ['reflection without a value', [...ARRIVALS_1_8K_50MM, '--reflection'], ['--reflection needs a value <R>', 'valid range -1 to 1']],
    ['stray argument', [...ARRIVALS_1_8K_50MM, '2W/cm2'], ['unexpected argument "2W/cm2"']],
    ['plan without a file', ['plan'], ['"sekundo plan" needs a plan file']],
    ['plan with two files', ['plan', 'a.json', 'b.json'], ['unexpected argument "b.json"']],
    ['plan --waveform without --json', ['plan', DEMO_PATH, '--waveform'], ['--waveform needs --json']],
    ['plan unknown flag', ['plan', DEMO_PATH, '--temperature', '1.8K'], ['unknown flag --temperature for "sekundo plan"', '--json, --waveform']],
  ];
  it.each(cases)('%s', async (_name, argv, expected) => {
    const line = expectUsageError(await run(...argv));
    for (const fragment of expected) expect(line).toContain(fragment);
  });
});

describe('kernel errors from a flag', () => {
  const temperature: QuantityArg = {
    spec: { kind: 'quantity', name: 'temperature', dimension: 'temperature', placeholder: 'T', range: [0.3, 4.24], help: '' },
    text: '1.8K',
    value: 1.8,
  };

  it('an InvalidInputError names the flag, what was typed and the kernel’s message', () => {
    const call = () =>
      computeFor(temperature, () => {
        throw new InvalidInputError('spacer material', 'unknown "steel"');
      });
    expect(call).toThrow(UsageError);
    expect(call).toThrow('--temperature 1.8K: spacer material: unknown "steel"');
  });

  it('kernelCall turns any kernel error into a usage error and lets other errors through', () => {
    expect(() =>
      kernelCall(() => {
        throw new InvalidInputError('echo order', 'must be a whole number 0–12');
      }),
    ).toThrow(new UsageError('echo order: must be a whole number 0–12'));
    expect(() =>
      kernelCall(() => {
        throw new TypeError('a bug');
      }),
    ).toThrow(TypeError);
  });
});

describe('flag parsing for the new commands', () => {
  it('fills positional operands in order, around flags', () => {
    const args = parseFlags('plan', ['--json', 'my plan.json'], [{ kind: 'boolean', name: 'json', help: '' }], [{ name: 'file', placeholder: 'FILE', help: '' }]);
    expect(args.operand('file')).toBe('my plan.json');
    expect(args.flag('json')).toBe(true);
    expect(args.has('file')).toBe(true);
  });

  it('reads negative and exponent numbers for number flags', () => {
    const specs = [{ kind: 'number', name: 'reflection', placeholder: 'R', range: [-1, 1], help: '' }] as const;
    expect(parseFlags('x', ['--reflection', '-0.4'], specs).number('reflection')?.value).toBe(-0.4);
    expect(parseFlags('x', ['--reflection=4e-1'], specs).number('reflection')?.value).toBe(0.4);
  });
});

describe('real process', () => {
  // Starts node and compiles the TypeScript through tsx.
  const SPAWN_TIMEOUT_MS = 60_000;

  it(
    'node bin/sekundo.mjs arrivals --temperature 1.8K --distance 50mm --json',
    () => {
      const result = spawnSync(process.execPath, ['bin/sekundo.mjs', ...ARRIVALS_1_8K_50MM, '--json'], {
        cwd: REPO_ROOT,
        encoding: 'utf8',
        timeout: SPAWN_TIMEOUT_MS,
      });
      expect(result.status).toBe(0);
      expect(result.stderr).toBe('');
      const json = JSON.parse(result.stdout);
      expect(Math.abs(json.secondSoundArrival_s - 0.05 / 19.9)).toBeLessThanOrEqual((0.05 / 19.9) * (0.005 / 19.9)); // DB1998
      expect(json.echoes[0].arrival_s / json.secondSoundArrival_s).toBeCloseTo(3, 12); // 3d/u2, images
      expect(Array.isArray(json.warnings)).toBe(true);
    },
    SPAWN_TIMEOUT_MS,
  );
});
