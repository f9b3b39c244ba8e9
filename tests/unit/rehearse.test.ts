import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { recordCsv } from '../../src/io/rehearse-csv';
import { DEFAULT_REHEARSAL_OPTIONS, type RehearsalOptions, rehearse } from '../../src/io/rehearse-run';
import { parseTraceCsv } from '../../src/io/trace-csv';
import { computePlan, delayBound, type PlanInput, predictionSpan, recordModel, SeededRandom, syntheticRecord } from '../../src/physics';
import { expectUsageError, run, runJson } from '../support/cli-harness';

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DEMO_PATH = join(REPO_ROOT, 'public/demo-plan.json');
const KAY_CRB = 'Kay, Fundamentals of Statistical Signal Processing: Estimation Theory (1993) §3.11: σ_τ = σ/√(Σ ṡ²) for a delay in white noise';
const XOSHIRO = 'Blackman & Vigna, ACM TOMS 47 (2021) 36: xoshiro128** reference algorithm';

const scratch = mkdtempSync(join(tmpdir(), 'sekundo-rehearse-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** An unbounded film heater (the plane-wave limit) and one sensor: the pulse arrives with the drive's own shape. */
function filmPlan(o: { rise_s: number; noise_V: number; rate_Hz?: number; lag_s?: number; averages?: number }): PlanInput {
  return {
    temperature_K: 1.8,
    liquidDepth_m: 0.1,
    heater: { geometry: 'plane-wave', width_m: 0.01, height_m: 0.01, radius_m: 0.005, mount: 'wall', area_m2: 1e-4, power_W: 0.05, shape: { kind: 'rectangle' }, width_s: 50e-6, riseTime_s: o.rise_s, repetitionRate_Hz: 5, averages: o.averages ?? 1 },
    sensors: [{ id: 's20', label: 'sensor at 20 mm', position_m: [0, 0, 0.02], distanceSd_m: 0, area_m2: 0, responsivity_V_K: 1, noise_V: o.noise_V, lag_s: o.lag_s ?? 0 }],
    spacer: { materialId: 'stainless-304', measuredWarm: false },
    reflectors: [],
    echoOrder: 0,
    digitiser: { sampleRate_Hz: o.rate_Hz ?? 1e6, recordLength_s: 0.004, preTrigger_s: 0.0005 },
    targets: { snr: 10, temperatureSd_K: 1e-3, temperatureKind: 'change' },
  };
}

const options = (o: Partial<RehearsalOptions>): RehearsalOptions => ({ ...DEFAULT_REHEARSAL_OPTIONS, ...o });

describe('seeded random numbers', () => {
  it(`xoshiro128** gives the reference algorithm's words (${XOSHIRO})`, () => {
    // The reference C code rewritten independently in BigInt, from the same splitmix32 seeding.
    const random = new SeededRandom(12345, 7);
    const internal = random as unknown as { s0: number; s1: number; s2: number; s3: number };
    const s = [internal.s0, internal.s1, internal.s2, internal.s3].map((x) => BigInt.asUintN(32, BigInt(x)));
    const mask = (x: bigint) => BigInt.asUintN(32, x);
    const rotl = (x: bigint, k: bigint) => mask((x << k) | (x >> (32n - k)));
    for (let n = 0; n < 50; n++) {
      const [s0, s1, s2, s3] = s as [bigint, bigint, bigint, bigint];
      const expected = mask(rotl(mask(s1 * 5n), 7n) * 9n);
      const t = mask(s1 << 9n);
      const n2 = s2 ^ s0;
      const n3 = s3 ^ s1;
      s[1] = s1 ^ n2;
      s[0] = s0 ^ n3;
      s[2] = n2 ^ t;
      s[3] = rotl(n3, 11n);
      expect(random.nextUint32()).toBe(Number(expected));
    }
  });

  it('the first word of state {1, 2, 3, 4} is 11520 (rotl(2·5, 7)·9, from the algorithm)', () => {
    const random = new SeededRandom(0);
    Object.assign(random, { s0: 1, s1: 2, s2: 3, s3: 4 });
    expect(random.nextUint32()).toBe(11520);
  });

  it('normal deviates have mean 0 and sd 1 (100 000 draws; tolerances 4 standard errors, common practice, no source)', () => {
    const random = new SeededRandom(42);
    const n = 100_000;
    let sum = 0;
    let sq = 0;
    for (let i = 0; i < n; i++) {
      const x = random.normal();
      sum += x;
      sq += x * x;
    }
    const mean = sum / n;
    const sd = Math.sqrt(sq / n - mean * mean);
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(sd - 1)).toBeLessThan(4 / Math.sqrt(2 * n));
  });

  it('streams are keyed: (seed, trial, channel) does not depend on other streams drawn', () => {
    const a = new SeededRandom(9, 3, 1).uniform();
    new SeededRandom(9, 3, 0).uniform();
    expect(new SeededRandom(9, 3, 1).uniform()).toBe(a);
    expect(new SeededRandom(9, 3, 2).uniform()).not.toBe(a);
    expect(new SeededRandom(10, 3, 1).uniform()).not.toBe(a);
  });

  it.each([-1, 1.5, 2e9, Number.NaN])('refuses the seed %s, naming the range', (seed) => {
    expect(() => new SeededRandom(seed)).toThrow(/seed.*0 to 1000000000/);
  });
});

describe('rehearsal of a film heater (the pulse keeps the drive shape)', () => {
  const input = filmPlan({ rise_s: 10e-6, noise_V: 1e-6 });
  const result = computePlan(input);

  it(`cross-correlation at high SNR: the rehearsed timing sd agrees with the planner's analytic sd for it within 20 %, and with the Cramér–Rao bound (${KAY_CRB})`, () => {
    const sensor = result.sensors[0];
    expect(sensor?.snrAveraged).toBeGreaterThan(50);
    const r = rehearse(input, result, options({ picker: 'xcorr', trials: 400, seed: 11 }));
    const s = r.sensors[0];
    // The bound by hand for a trapezoid of height A and edges t_r: Σ ṡ² = 2(A/t_r)²·(t_r/Δt).
    const A = (sensor?.amplitude_K ?? 0) * 1;
    const hand = 1e-6 / Math.sqrt((2 * (A / 10e-6) ** 2 * 10e-6) / 1e-6);
    // The planner's grid averages each point over its step, which rounds the corners a little: 5 %.
    expect(Math.abs((s?.boundTimingSd_s ?? 0) / hand - 1)).toBeLessThan(0.05);
    // 400 trials estimate an sd to about 1/√800 = 3.5 %: 20 % is over five of those.
    expect(Math.abs((s?.arrivalSd_s ?? 0) / hand - 1)).toBeLessThan(0.2);
    // The planner's own figure for this picker (picker-timing.ts), taken from the plan result, not recomputed here.
    const planned = sensor?.timingSdByPicker_s?.xcorr ?? Number.NaN;
    expect(s?.analyticTimingSd_s).toBe(planned);
    expect(Math.abs((s?.arrivalSd_s ?? 0) / planned - 1)).toBeLessThan(0.2);
    expect(s?.failedShare).toBe(0);
  });

  it("notes where the rehearsal and the planner's figure differ by more than ×1.5, and names the cause (SNR 3 after averaging)", () => {
    // Small-noise figures fail at low SNR (common practice, no source): noise peaks move the fraction picker's level and crossing.
    const noisy = filmPlan({ rise_s: 10e-6, noise_V: 20e-6 });
    const planned = computePlan(noisy);
    expect(planned.sensors[0]?.snrAveraged).toBeLessThan(4);
    expect(planned.sensors[0]?.timingLowerLimit).toBe(true);
    const r = rehearse(noisy, planned, options({ picker: 'fraction', trials: 200, seed: 2 }));
    const s = r.sensors[0];
    expect(s?.sdRatio).toBeGreaterThan(1.5);
    expect(s?.notes.join(' ')).toMatch(/wider than a factor 1\.5.*SNR after averaging is only/);
  });

  it.each(['threshold', 'peak', 'xcorr'] as const)('%s: the true arrival of a drive-shaped pulse is the planned one (to 5–10 % of a sample), and the picks are unbiased to 3 standard errors', (picker) => {
    // Like with like from the drive (onset to onset, peak to peak): a delayed copy of the drive is delayed by d/u₂ at every feature, except
    // the threshold's kσ level, which sits low on the edge: t_r·(5σ/A − 1/2) from the 50 % point (geometry of a ramp, no source needed).
    // 5 % of a sample: the planner's grid averages each point over a tenth of the rise, which rounds the ramp's corners by that much.
    const r = rehearse(input, result, options({ picker, trials: 200, seed: 5 }));
    const s = r.sensors[0];
    const planned = result.sensors[0]?.secondSoundArrival_s ?? 0;
    const A = result.sensors[0]?.amplitude_K ?? 0;
    const expected = picker === 'threshold' ? planned + 10e-6 * (5e-6 / A - 0.5) : planned;
    // The peak's parabola over a flat top hangs on the ends of its run, which the grid places to a fraction of a step: 10 %.
    expect(Math.abs((s?.arrival_s ?? 0) - expected)).toBeLessThan(picker === 'peak' ? 0.1e-6 : 0.05e-6);
    const standardError = (s?.arrivalSd_s ?? 0) / Math.sqrt(s?.picks ?? 1);
    // Linear interpolation between samples on the 10-sample ramp adds a few ns at most.
    expect(Math.abs(s?.arrivalBias_s ?? 1)).toBeLessThan(3 * standardError + 5e-9);
  });

  it('fraction: the noisy top raises the 50 % level, so picks come late by f·E[max of the top samples]·σ/slope (order statistics: E[max of 40 normals] = 2.16, Tippett 1925)', () => {
    const r = rehearse(input, result, options({ picker: 'fraction', trials: 300, seed: 5 }));
    const s = r.sensors[0];
    expect(Math.abs((s?.arrival_s ?? 0) - (result.sensors[0]?.secondSoundArrival_s ?? 0))).toBeLessThan(0.05e-6);
    // 40 samples on the flat top (50 µs wide less the 10 µs edges), the slope A/t_r: 0.5·2.16σ·t_r/A.
    const A = result.sensors[0]?.amplitude_K ?? 0;
    const expected = 0.5 * 2.16 * 1e-6 * (10e-6 / A);
    // The samples on the last part of each edge join the top, and the level's own noise adds scatter: 35 %.
    expect(Math.abs((s?.arrivalBias_s ?? 0) / expected - 1)).toBeLessThan(0.35);
  });

  it('the same seed gives the same numbers; another seed other numbers', () => {
    const a = rehearse(input, result, options({ picker: 'fraction', trials: 20, seed: 77 }));
    const b = rehearse(input, result, options({ picker: 'fraction', trials: 20, seed: 77 }));
    const c = rehearse(input, result, options({ picker: 'fraction', trials: 20, seed: 78 }));
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    expect(c.sensors[0]?.arrivalSd_s).not.toBe(a.sensors[0]?.arrivalSd_s);
    const model = recordModel(input, result, DEFAULT_REHEARSAL_OPTIONS, 77);
    expect(Array.from(syntheticRecord(model, 13).sensors[0] ?? [])).toEqual(Array.from(syntheticRecord(model, 13).sensors[0] ?? []));
  });

  it('a record has the plan noise over √(pulses averaged) before the pulse (chi-square bound, common practice, no source)', () => {
    const averaged = filmPlan({ rise_s: 10e-6, noise_V: 4e-6, averages: 16 });
    const model = recordModel(averaged, computePlan(averaged), DEFAULT_REHEARSAL_OPTIONS, 3);
    const record = syntheticRecord(model, 0);
    const pre = (record.sensors[0] ?? new Float64Array()).slice(0, 480);
    const sd = Math.sqrt(pre.reduce((a, v) => a + v * v, 0) / pre.length);
    // 480 samples give the sd to 1/√960 ≈ 3 %.
    expect(Math.abs(sd / 1e-6 - 1)).toBeLessThan(0.15);
  });

  it('quantises to the digitiser step when a resolution is given (8 bits on ±10 µV: steps of 78 nV)', () => {
    const coarse = filmPlan({ rise_s: 10e-6, noise_V: 1e-6, averages: 1 });
    const model = recordModel(coarse, computePlan(coarse), { resolutionBits: 8, range_V: 1e-5, firstSoundPickup: 0 }, 3);
    const values = syntheticRecord(model, 0).sensors[0] ?? new Float64Array();
    const q = 2e-5 / 256;
    for (const v of values.slice(0, 200)) expect(Math.abs(v / q - Math.round(v / q))).toBeLessThan(1e-6);
    expect(Math.max(...values)).toBeLessThanOrEqual(1e-5);
  });

  it('a first-sound pickup appears at the first-sound arrival when asked for, and not otherwise', () => {
    const model = recordModel(input, result, { resolutionBits: null, range_V: null, firstSoundPickup: 0.5 }, 1);
    const bare = recordModel(input, result, DEFAULT_REHEARSAL_OPTIONS, 1);
    const t1 = result.sensors[0]?.firstSoundArrival_s ?? 0;
    const at = Math.round((t1 + 30e-6 + 0.0005) * 1e6);
    const withPickup = syntheticRecord(model, 0).sensors[0]?.[at] ?? 0;
    const without = syntheticRecord(bare, 0).sensors[0]?.[at] ?? 0;
    expect(withPickup - without).toBeCloseTo(0.5 * (result.sensors[0]?.amplitude_K ?? 0), 7);
  });

  it('the bound follows σ/√(Σṡ²): four times the noise, four times the bound', () => {
    const span = predictionSpan(result.sensors[0]?.waveform ?? [], 0, 0.002);
    expect(span).not.toBeNull();
    if (!span) return;
    expect((delayBound(span, 4e-6, 1e-6) ?? 0) / (delayBound(span, 1e-6, 1e-6) ?? 1)).toBeCloseTo(4, 12);
  });
});

describe('rehearsal of the demo plan', () => {
  const parsed = parsePlanFile(readFileSync(DEMO_PATH, 'utf8'));
  if (!parsed.ok) throw new Error('demo plan');
  const input = planFileToInput(parsed.plan);
  const result = computePlan(input);

  it('every sensor gets figures, temperatures through the converter inversion near the plan temperature, and no failed picks', () => {
    const r = rehearse(input, result, options({ picker: 'fraction', trials: 10, seed: 1 }));
    expect(r.sensors.map((s) => s.id)).toEqual(['b10', 'b25', 'b35x', 'b50']);
    for (const s of r.sensors) {
      expect(s.failedShare).toBe(0);
      expect(Math.abs(s.temperatureBias_K ?? 1)).toBeLessThan(5 * (s.analyticTemperatureSd_K ?? 0));
      // The finite heater and the lag move the 50 % point off the planner's arrival, and the summary says by how much.
      expect(s.featureOffset_s).not.toBeNull();
      expect(s.notes.join(' ')).toMatch(/feature sits/);
    }
  });

  it("a written trace read back by `sekundo trace` gives the rehearsal's own pick of that record, and the true arrival within the rehearsed bias and 4 sd", async () => {
    const dir = join(scratch, 'demo');
    const json = await runJson<{ sensors: { id: string; arrival_s: number; arrivalBias_s: number; arrivalSd_s: number; window: { from_s: number; to_s: number } }[]; traces: string[] }>(
      'rehearse', DEMO_PATH, '--picker', 'fraction', '--trials', '4', '--seed', '3', '--write-traces', dir, '--trace-files', '2',
    );
    expect(readdirSync(dir).sort()).toEqual(['rehearsal-trial-001.csv', 'rehearsal-trial-002.csv']);
    expect(json.traces).toHaveLength(2);
    const own = rehearse(input, result, options({ picker: 'fraction', trials: 4, seed: 3 }));
    for (const s of json.sensors) {
      const back = await runJson<{ delay_s: number; reference: string }>(
        'trace', join(dir, 'rehearsal-trial-002.csv'), '--heater-column', 'heater', '--sensor-column', s.id, '--picker', 'fraction',
        // The rehearsal's own search window, as a lab would set it (an echo past it is larger than the pulse).
        '--from', `${(s.window.from_s * 1e6).toFixed(3)}us`, '--to', `${(s.window.to_s * 1e6).toFixed(3)}us`,
      );
      expect(back.reference).toBe('onset to onset');
      const picked = own.sensors.find((x) => x.id === s.id)?.kept[1]?.delay_s ?? 0;
      // The file holds 7 significant digits: the pick moves by far less than a nanosecond.
      expect(Math.abs(back.delay_s - picked)).toBeLessThan(1e-9);
      expect(Math.abs(back.delay_s - s.arrival_s - s.arrivalBias_s)).toBeLessThan(4 * s.arrivalSd_s + 1e-9);
    }
  });
});

describe('the written trace file', () => {
  it('has time_s, heater and one column per sensor id, and reads back to the same numbers (7 digits)', () => {
    const input = filmPlan({ rise_s: 10e-6, noise_V: 1e-6 });
    const result = computePlan(input);
    const model = recordModel(input, result, DEFAULT_REHEARSAL_OPTIONS, 4);
    const record = syntheticRecord(model, 2);
    const text = recordCsv(model, record, { planName: 'film', trials: 5, seed: 4 });
    const path = join(scratch, 'film.csv');
    writeFileSync(path, text);
    const back = parseTraceCsv(readFileSync(path));
    expect(back.metadata.columns).toEqual(['time_s', 'heater', 's20']);
    expect(back.time_s.length).toBe(record.time_s.length);
    const sensor = back.channels[1]?.values ?? new Float64Array();
    for (let i = 0; i < sensor.length; i += 97) {
      const v = record.sensors[0]?.[i] ?? 0;
      expect(Math.abs((sensor[i] ?? 0) - v)).toBeLessThanOrEqual(1e-6 * Math.abs(v));
    }
  });

  it('a written trace read back by `sekundo trace` gives the planned arrival within one sample: a film-like heater, no lag (xcorr and fraction)', async () => {
    const plan = JSON.parse(readFileSync(DEMO_PATH, 'utf8'));
    // A disk far wider than the path: its edge wave comes long after the pulse, so the sensor sees the plane wave.
    plan.heater = { geometry: 'disk', radius_m: 0.03, flux_W_m2: 1000, shape: 'rectangle', width_s: 5e-5, riseTime_s: 1e-5, repetitionRate_Hz: 5, averages: 4 };
    plan.sensors = [{ id: 'near', label: 'near', distance_m: 0.01, distanceSd_m: 0, area_m2: 0, responsivity_V_K: 2, noise_V: 1e-6, lag_s: 0 }];
    plan.reflectors = [];
    plan.digitiser = { sampleRate_Hz: 1e6, recordLength_s: 0.002, preTrigger_s: 0.0002 };
    const planPath = join(scratch, 'disk-plan.json');
    writeFileSync(planPath, JSON.stringify(plan));
    const planned = (await runJson<{ sensors: { secondSoundArrival_s: number }[] }>('plan', planPath)).sensors[0]?.secondSoundArrival_s ?? 0;
    for (const picker of ['xcorr', 'fraction']) {
      const dir = join(scratch, `disk-${picker}`);
      await runJson('rehearse', planPath, '--picker', picker, '--trials', '2', '--write-traces', dir, '--trace-files', '1');
      const back = await runJson<{ delay_s: number }>('trace', join(dir, 'rehearsal-trial-001.csv'), '--heater-column', 'heater', '--sensor-column', 'near', '--picker', picker, '--from', '300us');
      expect(Math.abs(back.delay_s - planned)).toBeLessThan(1e-6);
    }
  });
});

describe('sekundo rehearse: input', () => {
  it.each([
    [['--trials', '1'], /--trials 1 is outside the valid range 2–100000/],
    [['--trials', '2.5'], /--trials/],
    [['--seed', '-4'], /--seed -4 is outside the valid range 0–1000000000/],
    [['--picker', 'edge'], /--picker "edge" is not a picker; choose one of threshold, fraction, peak, xcorr/],
    [['--bits', '30'], /--bits 30 is outside the valid range 4–24/],
    [['--range', '1V'], /--range needs --bits/],
    [['--threshold', '4'], /--threshold applies to --picker threshold/],
    [['--trace-files', '2'], /--trace-files needs --write-traces/],
    [['--first-sound-pickup', '11'], /--first-sound-pickup 11 is outside the valid range 0–10/],
  ])('%j: one line naming the flag and its range', async (flags, message) => {
    expect(expectUsageError(await run('rehearse', DEMO_PATH, ...flags))).toMatch(message);
  });

  it('without a plan file: says how to call it', async () => {
    expect(expectUsageError(await run('rehearse'))).toMatch(/needs a plan file/);
  });

  it('the readable table names every sensor, the picker and the bound', async () => {
    const result = await run('rehearse', DEMO_PATH, '--trials', '3', '--picker', 'peak');
    expect(result.status).toBe(0);
    expect(result.stdout).toMatch(/3 synthetic records, peak picker, seed 1/);
    for (const id of ['b10', 'b25', 'b35x', 'b50']) expect(result.stdout).toMatch(new RegExp(`^${id}\\s`, 'm'));
    expect(result.stdout).toMatch(/Bound \(µs\)/);
  });
});
