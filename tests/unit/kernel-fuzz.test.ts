/**
 * Property tests on every kernel entry point (fast-check): for any input, either a result whose
 * every number is finite and in its documented range, or a typed PhysicsError — never NaN,
 * Infinity, or a thrown non-error. Inputs mix valid values with NaN, ±∞, −0, negatives, tiny and
 * huge numbers. The number of cases per entry point is in RUNS (common practice, no source: enough
 * to reach every branch of these small functions many times within CI's time).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import * as K from '../../src/physics';

const RUNS = 400;

/** Any double, weighted towards the awkward ones. */
const anyNumber = fc.oneof(
  { weight: 4, arbitrary: fc.double() },
  { weight: 1, arbitrary: fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, -0, 0, -1, 1e308, -1e308, 5e-324) },
);
/** A number in [lo, hi] most of the time, anything otherwise. */
function mostly(lo: number, hi: number) {
  return fc.oneof({ weight: 5, arbitrary: fc.double({ min: lo, max: hi, noNaN: true }) }, { weight: 1, arbitrary: anyNumber });
}

/** Every number reachable in a result (arrays, typed arrays, objects) must be finite. */
function assertAllFinite(value: unknown, path = 'result'): void {
  if (typeof value === 'number') {
    expect(Number.isFinite(value), `${path} = ${value}`).toBe(true);
  } else if (ArrayBuffer.isView(value)) {
    const view = value as unknown as ArrayLike<number>;
    for (let i = 0; i < view.length; i++) expect(Number.isFinite(view[i]), `${path}[${i}] = ${view[i]}`).toBe(true);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => {
      assertAllFinite(v, `${path}[${i}]`);
    });
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (typeof v !== 'function') assertAllFinite(v, `${path}.${k}`);
    }
  }
}

/** Runs f; a thrown value must be a PhysicsError; a result is returned for further checks. */
function outcome<T>(f: () => T): { ok: true; value: T } | { ok: false } {
  try {
    return { ok: true, value: f() };
  } catch (e) {
    expect(e, String(e)).toBeInstanceOf(K.PhysicsError);
    expect((e as Error).message.length).toBeGreaterThan(10);
    return { ok: false };
  }
}

const temperatureFunctions: [string, (T: number) => number, [number, number]][] = [
  ['secondSound', K.secondSound, [0, 200]],
  ['secondSoundSlope', (T) => (T === K.T_LAMBDA_K ? 0 : K.secondSoundSlope(T)), [-1e9, 1e9]],
  ['secondSoundSd', K.secondSoundSd, [0, 200]],
  ['firstSound', K.firstSound, [150, 250]],
  ['density', K.density, [120, 150]],
  ['entropy', K.entropy, [0, 5000]],
  ['specificHeat', K.specificHeat, [0, 1e6]],
  ['normalFraction', K.normalFraction, [0, 1]],
  ['superfluidFraction', K.superfluidFraction, [0, 1]],
  ['nonlinearity', K.nonlinearity, [-1e12, 1e12]],
  ['twoFluidSecondSound', K.twoFluidSecondSound, [0, 200]],
  ['secondSoundRelativeSd', K.secondSoundRelativeSd, [0, 1]],
  ['mutualFrictionB', K.mutualFrictionB, [0.5, 100]],
  ['mutualFrictionBPrime', K.mutualFrictionBPrime, [-100, 1]],
];

describe('temperature functions: finite in range, or a typed error', () => {
  it.each(temperatureFunctions)('%s', (_name, f, [lo, hi]) => {
    fc.assert(
      fc.property(mostly(0.2, 4.3), (T) => {
        const r = outcome(() => f(T));
        if (r.ok) {
          expect(Number.isFinite(r.value)).toBe(true);
          expect(r.value).toBeGreaterThanOrEqual(lo);
          expect(r.value).toBeLessThanOrEqual(hi);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('heliumProperties', () => {
    fc.assert(
      fc.property(mostly(0.2, 4.3), (T) => {
        const r = outcome(() => K.heliumProperties(T));
        if (r.ok) assertAllFinite(r.value);
      }),
      { numRuns: RUNS },
    );
  });

  it('vapourPressure and its inverse', () => {
    fc.assert(
      fc.property(mostly(0.4, 5.1), mostly(1e-3, 2.5e5), (T, p) => {
        const a = outcome(() => K.vapourPressure(T));
        if (a.ok) expect(a.value.pressure_Pa).toBeGreaterThan(0);
        const b = outcome(() => K.temperatureFromVapourPressure(p));
        if (b.ok) {
          expect(b.value.temperature_K).toBeGreaterThanOrEqual(0.5 - 1e-9);
          expect(b.value.temperature_K).toBeLessThanOrEqual(5 + 1e-9);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('Landau sums', () => {
    fc.assert(
      fc.property(mostly(0, 2.5), mostly(100, 200), (T, rho) => {
        const a = outcome(() => K.landauGas(T));
        if (a.ok) assertAllFinite(a.value);
        const b = outcome(() => K.landauSecondSound(T, rho));
        if (b.ok) expect(b.value).toBeGreaterThan(0);
      }),
      { numRuns: RUNS },
    );
  });

  it('temperatureSpread and shortestDistanceForResolution', () => {
    fc.assert(
      fc.property(mostly(0.3, 2.18), mostly(0, 0.1), mostly(1e-6, 0.1), mostly(0, 1e-3), mostly(0, 1e-3), (T, rel, target, ts, ds) => {
        const a = outcome(() => K.temperatureSpread(T, rel));
        if (a.ok) assertAllFinite(a.value);
        const b = outcome(() => K.shortestDistanceForResolution(T, target, ts, ds));
        if (b.ok) expect(b.value >= 0).toBe(true);
      }),
      { numRuns: RUNS },
    );
  });
});

describe('converter entry points', () => {
  it('temperatureCandidates', () => {
    fc.assert(
      fc.property(mostly(0, 140), mostly(0, 0.2), (u, rel) => {
        const r = outcome(() => K.temperatureCandidates(u, rel));
        if (r.ok) {
          assertAllFinite(r.value);
          for (const c of r.value) {
            expect(c.temperature_K).toBeGreaterThanOrEqual(K.MODEL_MIN_K);
            expect(c.temperature_K).toBeLessThanOrEqual(K.T_LAMBDA_K);
          }
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('convertDelay', () => {
    fc.assert(
      fc.property(mostly(1e-4, 0.5), mostly(1e-5, 0.1), mostly(0, 1e-3), mostly(0, 1e-5), mostly(-1e-4, 1e-4), mostly(0, 1e-5), (d, t, dsd, tsd, t0, t0sd) => {
        const r = outcome(() => K.convertDelay({ distance_m: d, delay_s: t, distanceSd_m: dsd, delaySd_s: tsd, offset_s: t0, offsetSd_s: t0sd }));
        if (r.ok) assertAllFinite(r.value);
      }),
      { numRuns: RUNS },
    );
  });

  it('chooseCandidate and chooseAlongSeries', () => {
    const candidates = K.temperatureCandidates(19.5, 1e-4);
    fc.assert(
      fc.property(mostly(0.3, 4.2), mostly(0.001, 2e5), mostly(0, 4.3), mostly(0, 4.3), (T, p, a, b) => {
        for (const rule of [
          { kind: 'near', temperature_K: T },
          { kind: 'pressure', pressure_Pa: p },
          { kind: 'range', min_K: a, max_K: b },
        ] as K.ChoiceRule[]) {
          const r = outcome(() => K.chooseCandidate(candidates, rule));
          if (r.ok && r.value.index !== null) expect(r.value.index).toBeLessThan(candidates.length);
          outcome(() => K.chooseAlongSeries([candidates, candidates], rule));
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('fitDistances', () => {
    const point = fc.record({ distance_m: mostly(1e-3, 0.2), delay_s: mostly(1e-5, 0.02) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 0, maxLength: 8 }), (points) => {
        const r = outcome(() => K.fitDistances(points));
        if (r.ok) assertAllFinite(r.value);
      }),
      { numRuns: RUNS },
    );
  });

  it('calibratePathFromSweep', () => {
    const point = fc.record({ x: mostly(0, 100), delay_s: mostly(1e-4, 0.01) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 0, maxLength: 30 }), mostly(0, 1e-4), (points, t0) => {
        const r = outcome(() => K.calibratePathFromSweep(points, t0, 0));
        if (r.ok) assertAllFinite(r.value);
      }),
      { numRuns: RUNS },
    );
  });

  it('pickArrival and heaterOnset on arbitrary samples', () => {
    const kinds = fc.constantFrom(...K.PICKER_KINDS);
    fc.assert(
      fc.property(fc.array(mostly(-1, 1), { minLength: 0, maxLength: 200 }), kinds, mostly(1e-9, 1e-3), (values, kind, step) => {
        const n = values.length;
        const trace = { time_s: Float64Array.from({ length: n }, (_, i) => (i - n / 4) * step), values: Float64Array.from(values) };
        const template = Float64Array.from([0, 0.5, 1, 0.5, 0]);
        const r = outcome(() => K.pickArrival(trace, { kind, template }));
        if (r.ok) assertAllFinite(r.value);
        const h = outcome(() => K.heaterOnset(trace));
        if (h.ok) assertAllFinite(h.value);
        const c = outcome(() => K.heaterCentre(trace));
        if (c.ok) assertAllFinite(c.value);
        const s = outcome(() => K.heaterStart(trace));
        if (s.ok) expect(Number.isFinite(s.value)).toBe(true);
      }),
      { numRuns: RUNS },
    );
  });
});

describe('planner entry points', () => {
  const base = (): K.PlanInput => ({
    temperature_K: 1.8,
    liquidDepth_m: 0.1,
    heater: { geometry: 'rectangle', area_m2: 1e-4, width_m: 1e-2, height_m: 5e-3, radius_m: 5e-3, mount: 'wall', power_W: 0.1, shape: { kind: 'rectangle' }, width_s: 1e-4, riseTime_s: 1e-6, repetitionRate_Hz: 5, averages: 4 },
    sensors: [{ id: 'a', label: 'A', position_m: [0, 0, 0.02], distanceSd_m: 2e-5, area_m2: 1e-6, responsivity_V_K: 1, noise_V: 1e-6, lag_s: 1e-5 }],
    spacer: { materialId: 'copper', measuredWarm: true },
    reflectors: [
      { label: 'lid', axis: 'z', position_m: 0.05, reflection: null },
      { label: 'side', axis: 'x', position_m: 0.03, reflection: 0.4 },
    ],
    echoOrder: 2,
    digitiser: { sampleRate_Hz: 1e7, recordLength_s: 0.01, preTrigger_s: 1e-3 },
    targets: { snr: 10, temperatureSd_K: 1e-3, temperatureKind: 'absolute' },
  });

  it('computePlan with any numbers in a well-formed plan', () => {
    const geometry = fc.constantFrom<K.PlanInput['heater']['geometry']>('rectangle', 'disk', 'point', 'plane-wave');
    fc.assert(
      fc.property(
        geometry,
        mostly(0.3, 4.2),
        mostly(1e-3, 0.1),
        mostly(1e-3, 10),
        mostly(1e-6, 1e-2),
        mostly(1e-8, 1e-4),
        mostly(0.1, 1e3),
        mostly(-0.05, 0.05),
        mostly(0, 1e-4),
        mostly(1e5, 1e9),
        (g, T, z, P, width, rise, rate, x, lag, fs) => {
          const plan = base();
          plan.temperature_K = T;
          plan.heater = { ...plan.heater, geometry: g, power_W: P, width_s: width, riseTime_s: rise, repetitionRate_Hz: rate };
          plan.sensors = [{ ...(plan.sensors[0] as K.PlanSensor), position_m: [x, 0, z], lag_s: lag }];
          plan.digitiser = { ...plan.digitiser, sampleRate_Hz: fs };
          const r = outcome(() => K.computePlan(plan));
          if (r.ok) assertAllFinite({ ...r.value, properties: undefined });
        },
      ),
      { numRuns: RUNS / 4 },
    );
  });

  it('pulseProfile, imageSources, coldLength, receivedPulse', () => {
    fc.assert(
      fc.property(mostly(1e-8, 1), mostly(0, 1e-3), mostly(-1, 1), mostly(0, 0.2), fc.integer({ min: -2, max: 15 }), (w, rise, R, pos, order) => {
        const p = outcome(() => K.pulseProfile({ kind: 'rectangle' }, w, rise));
        if (p.ok) assertAllFinite({ d: p.value.duration_s, a: p.value.area_s, r: p.value.effectiveRise_s });
        outcome(() => K.pulseProfile({ kind: 'custom', points: [[0, 0], [w, R], [2 * w, 0]] }, 0, 0));
        const im = outcome(() => K.imageSources([0, 0, 0], [{ label: 'a', axis: 'z', position_m: pos, reflection: R }], order));
        if (im.ok) assertAllFinite(im.value);
        const c = outcome(() => K.coldLength(pos, 'ptfe'));
        if (c.ok) assertAllFinite(c.value);
        if (p.ok) {
          const r = outcome(() =>
            K.receivedPulse(
              { geometry: 'rectangle', peakFlux_W_m2: 1e3, peakPower_W: 0, face: { kind: 'rectangle', width_m: 5e-3, height_m: 2e-3 }, mount: 'wall', profile: p.value, centre: [0, 0, 0], amplitudeFactor: 1 },
              { position: [pos, 0, 0.01], radius_m: 1e-4, lag_s: rise },
              { density_kg_m3: 145, specificHeat_J_kgK: 2950, secondSound_m_s: 19.9 },
              Math.max(p.value.duration_s / 200, 1e-9),
            ),
          );
          if (r.ok) assertAllFinite(r.value);
        }
      }),
      { numRuns: RUNS / 2 },
    );
  });
});

describe('source location entry points', () => {
  it('speedPriorAt with any numbers', () => {
    fc.assert(
      fc.property(anyNumber, anyNumber, (T, sd) => {
        const r = outcome(() => K.speedPriorAt(T, sd));
        if (r.ok) {
          expect(r.value.speed_m_s).toBeGreaterThanOrEqual(0);
          expect(r.value.sd_m_s).toBeGreaterThanOrEqual(0);
        }
      }),
      { numRuns: RUNS },
    );
  });

  it('locateSource and layoutQuality with any numbers', () => {
    const sensor = fc.record({ position_m: fc.tuple(mostly(-0.2, 0.2), mostly(-0.2, 0.2), mostly(-0.2, 0.2)), arrival_s: mostly(0, 0.02) });
    fc.assert(
      fc.property(fc.array(sensor, { minLength: 0, maxLength: 9 }), mostly(1, 200), fc.boolean(), (sensors, u, fitSpeed) => {
        const r = outcome(() => K.locateSource(sensors, { speed_m_s: u, fitSpeed, arrivalSd_s: 5e-6, constraint: { kind: 'none' }, dropOutliers: false }));
        if (r.ok) assertAllFinite(r.value);
        const withPrior = outcome(() => K.locateSource(sensors, { speed_m_s: u, fitSpeed, arrivalSd_s: 5e-6, constraint: { kind: 'none' }, dropOutliers: true, speedPrior: { speed_m_s: u, sd_m_s: 0.01 * u } }));
        if (withPrior.ok) assertAllFinite(withPrior.value);
        const q = outcome(() => K.layoutQuality(sensors.map((s) => s.position_m), [[0, 0, 0.05]], { speed_m_s: u, arrivalSd_s: 5e-6, fitSpeed, constraint: { kind: 'none' } }));
        if (q.ok) for (const v of q.value) expect(v > 0).toBe(true);
      }),
      { numRuns: RUNS / 4 },
    );
  });
});

describe('resonator entry points', () => {
  it('planResonator, temperatureFromResonance, modeFromNeighbour and the line densities with any numbers', () => {
    fc.assert(
      fc.property(mostly(1e-4, 0.05), mostly(0.3, 2.2), mostly(1, 40), mostly(1, 1e5), mostly(1e-3, 10), mostly(1e-4, 0.1), (gap, T, n, f, width, noise) => {
        const plan = outcome(() => K.planResonator({ gap_m: gap, spacerId: null, temperature_K: T, modes: Math.round(n), plateDiameter_m: 0.02, targetSd_K: 1e-5, width0_Hz: width, amplitudeNoise: noise }));
        if (plan.ok) assertAllFinite(plan.value);
        const reading = outcome(() => K.temperatureFromResonance({ frequency_Hz: f, frequencySd_Hz: 0.01, gap_m: gap, gapSd_m: 1e-6, mode: Math.round(n) }));
        if (reading.ok) assertAllFinite(reading.value);
        const mode = outcome(() => K.modeFromNeighbour(f, 0.01, f * (1 + 1 / Math.max(1, Math.round(n))), 0.01));
        if (mode.ok) assertAllFinite(mode.value);
        const L = outcome(() => K.lineDensityFromWidth(width * 1.5, 0.01, width, 0.01, T));
        if (L.ok) assertAllFinite(L.value);
        const A = outcome(() => K.lineDensityFromAmplitude({ amplitude: noise, amplitudeSd: noise / 100, amplitude0: 2 * noise, amplitude0Sd: 0, width0_Hz: width, width0Sd_Hz: 0, temperature_K: T }));
        if (A.ok) assertAllFinite(A.value);
      }),
      { numRuns: RUNS },
    );
  });

  it('fitResonance with any sweep: finite results or a typed error', () => {
    const point = fc.tuple(mostly(-1, 1), mostly(-1, 1));
    fc.assert(
      fc.property(fc.array(point, { minLength: 0, maxLength: 60 }), mostly(1, 1e4), mostly(1e-3, 10), (points, start, step) => {
        const frequency_Hz = Float64Array.from(points, (_, i) => start + i * step);
        const x = Float64Array.from(points, (p) => p[0]);
        const y = Float64Array.from(points, (p) => p[1]);
        const complex = outcome(() => K.fitResonance({ frequency_Hz, x, y }));
        if (complex.ok) assertAllFinite(complex.value);
        const amplitude = outcome(() => K.fitResonance({ frequency_Hz, amplitude: x }));
        if (amplitude.ok) assertAllFinite(amplitude.value);
      }),
      { numRuns: RUNS / 4 },
    );
  });
});
