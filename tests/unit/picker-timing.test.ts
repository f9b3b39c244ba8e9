import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { DEFAULT_REHEARSAL_OPTIONS, type RehearsalOptions, rehearse } from '../../src/io/rehearse-run';
import { computePlan, normalCdf, normalMaximum, type PickerKind, type PlanInput, SeededRandom } from '../../src/physics';

/*
 * The planner's analytic timing sd of each picker (src/physics/picker-timing.ts) against seeded
 * Monte Carlo: synthetic records through the converter's own pickers (the rehearsal). This is the
 * check that the derivations beside the formulas are right. Trials: an sd from n picks is known to
 * about 1/√(2n) (3.5 % at 400, 5.8 % at 150, normal theory); the tolerances are 20 % (film) and 25 %
 * (demo: four sensors, two of them with a broad top whose fit window hangs on the largest sample),
 * over three of those standard errors.
 */

const REPO_ROOT = fileURLToPath(new URL('../..', import.meta.url));
const options = (o: Partial<RehearsalOptions>): RehearsalOptions => ({ ...DEFAULT_REHEARSAL_OPTIONS, ...o });

/** An unbounded film heater (the plane-wave limit), one sensor at 20 mm, 1 MS/s. */
function filmPlan(o: { noise_V: number; lag_s?: number }): PlanInput {
  return {
    temperature_K: 1.8,
    liquidDepth_m: 0.1,
    heater: { geometry: 'plane-wave', width_m: 0.01, height_m: 0.01, radius_m: 0.005, mount: 'wall', area_m2: 1e-4, power_W: 0.05, shape: { kind: 'rectangle' }, width_s: 50e-6, riseTime_s: 10e-6, repetitionRate_Hz: 5, averages: 1 },
    sensors: [{ id: 's20', label: 'sensor at 20 mm', position_m: [0, 0, 0.02], distanceSd_m: 0, area_m2: 0, responsivity_V_K: 1, noise_V: o.noise_V, lag_s: o.lag_s ?? 0 }],
    spacer: { materialId: 'stainless-304', measuredWarm: false },
    reflectors: [],
    echoOrder: 0,
    digitiser: { sampleRate_Hz: 1e6, recordLength_s: 0.004, preTrigger_s: 0.0005 },
    targets: { snr: 10, temperatureSd_K: 1e-3, temperatureKind: 'change' },
  };
}

function demoPlan(): PlanInput {
  const parsed = parsePlanFile(readFileSync(join(REPO_ROOT, 'public/demo-plan.json'), 'utf8'));
  if (!parsed.ok) throw new Error('demo plan');
  return planFileToInput(parsed.plan);
}

describe('normal order statistics for the fraction and peak pickers', () => {
  it('Φ(1.96) = 0.97500, Φ(−1) = 0.15866 (Abramowitz & Stegun 1964, table 26.1; A&S 7.1.26 holds 1.5e-7)', () => {
    expect(Math.abs(normalCdf(1.96) - 0.975002)).toBeLessThan(3e-7);
    expect(Math.abs(normalCdf(-1) - 0.158655)).toBeLessThan(3e-7);
  });

  it('the largest of 40 standard normals has mean 2.161 (Tippett 1925) and the variance a seeded Monte Carlo gives (20 000 draws, 5 standard errors)', () => {
    const m = normalMaximum(new Float64Array(40), 1);
    expect(Math.abs(m.meanShift - 2.161)).toBeLessThan(0.005);
    const random = new SeededRandom(19);
    const n = 20_000;
    let s1 = 0;
    let s2 = 0;
    for (let k = 0; k < n; k++) {
      let top = Number.NEGATIVE_INFINITY;
      for (let j = 0; j < 40; j++) top = Math.max(top, random.normal());
      s1 += top;
      s2 += top * top;
    }
    const variance = s2 / n - (s1 / n) ** 2;
    // The sd of a sample variance is about variance·√(2/n) for a near-normal maximum: 1 % here.
    expect(Math.abs(m.variance / variance - 1)).toBeLessThan(0.05);
    expect(normalMaximum([0], 1)).toEqual({ meanShift: expect.closeTo(0, 3), variance: expect.closeTo(1, 2) });
  });
});

describe('analytic timing of each picker against a seeded rehearsal, film heater (rectangle drive, 10-sample edges, SNR 59)', { timeout: 60_000 }, () => {
  const input = filmPlan({ noise_V: 1e-6 });
  const result = computePlan(input);
  const planned = result.sensors[0];

  it.each(['threshold', 'fraction', 'peak', 'xcorr'] as const)('%s: the rehearsed sd is within 20 % of the planner’s figure for it (derivations in picker-timing.ts)', (picker) => {
    expect(planned?.snrAveraged).toBeGreaterThan(50);
    const analytic = planned?.timingSdByPicker_s?.[picker] ?? Number.NaN;
    const r = rehearse(input, result, options({ picker, trials: 400, seed: 23 }));
    const s = r.sensors[0];
    expect(s?.failedShare).toBe(0);
    expect(s?.analyticTimingSd_s).toBe(analytic);
    expect(Math.abs((s?.arrivalSd_s ?? 0) / analytic - 1)).toBeLessThan(0.2);
  });

  it('a sensor lag of 20 µs: the pulse is smoothed, so the drive-template correlation sits above the Cramér–Rao bound, and the planner’s figure follows the rehearsal within 20 %', () => {
    const lagged = filmPlan({ noise_V: 1e-6, lag_s: 20e-6 });
    const res = computePlan(lagged);
    const analytic = res.sensors[0]?.timingSdByPicker_s?.xcorr ?? Number.NaN;
    const r = rehearse(lagged, res, options({ picker: 'xcorr', trials: 400, seed: 29 }));
    const s = r.sensors[0];
    expect(analytic).toBeGreaterThan(1.1 * (s?.boundTimingSd_s ?? Number.POSITIVE_INFINITY));
    expect(Math.abs((s?.arrivalSd_s ?? 0) / analytic - 1)).toBeLessThan(0.2);
  });
});

describe('the demo plan (four bolometers, 10 MS/s, 100 µs pulse, echoes; records cut to 4 ms)', { timeout: 180_000 }, () => {
  // The records end at 4 ms instead of 20 ms: every direct arrival (the last at 2.52 ms) and the
  // first echoes are in them, the pickers' figures do not depend on the record's tail, and the
  // correlations take a fifth of the time.
  const demo = demoPlan();
  const input: PlanInput = { ...demo, digitiser: { ...demo.digitiser, recordLength_s: 0.004 } };
  const result = computePlan(input);

  it('the planner’s headline timing sd (fraction picker at 0.5) is within a factor 1.5 of a rehearsal with that picker, for every sensor', () => {
    // The old figure, √((rise at the sensor/SNR)² + Δt²/12), was 3–5 × the rehearsed spread here.
    const r = rehearse(input, result, options({ picker: 'fraction', trials: 150, seed: 31 }));
    for (const s of r.sensors) {
      const headline = result.sensors.find((p) => p.id === s.id)?.timingSd_s ?? Number.NaN;
      const ratio = (s.arrivalSd_s ?? 0) / headline;
      expect(ratio, s.id).toBeGreaterThan(1 / 1.5);
      expect(ratio, s.id).toBeLessThan(1.5);
    }
  });

  // The cross-correlation scans some 40 000 lags per pick at 10 MS/s: 100 trials for it (its sd known to
  // 7 %, the 25 % still over three of those), 150 for the others.
  it.each(['fraction', 'peak', 'xcorr'] as const)('%s: every sensor’s rehearsed sd is within 25 % of the planner’s figure for that picker', (picker: PickerKind) => {
    const r = rehearse(input, result, options({ picker, trials: picker === 'xcorr' ? 100 : 150, seed: 37 }));
    for (const s of r.sensors) {
      const analytic = result.sensors.find((p) => p.id === s.id)?.timingSdByPicker_s?.[picker] ?? Number.NaN;
      expect(Math.abs((s.arrivalSd_s ?? 0) / analytic - 1), `${s.id}: ${s.arrivalSd_s} vs ${analytic}`).toBeLessThan(0.25);
    }
  });
});
