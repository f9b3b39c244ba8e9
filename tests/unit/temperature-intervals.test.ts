/**
 * Delay → temperature answers that never claim more than the data hold (PHYSICS notes §6):
 * intervals mapped through u₂(T), checked by seeded Monte Carlo against the kernel's own error
 * model; the distance of each candidate from its evidence; and a series through a turn of u₂.
 * The error model (test setting, invented apparatus): a 60.0 mm path known to 20 µm, delays read
 * to 1 µs, and the true speed of the helium differing from the tabulated u₂ by the curve's own sd
 * (Donnelly & Barenghi 1998, Table 4.1: 0.75 % below 1.13 K, 0.075 % at 1.6–1.7 K, 0.25 % elsewhere).
 * The coverage a correct interval must show is the normal distribution's: 68.27 % and 95.00 %.
 */
import { describe, expect, it } from 'vitest';
import { convertDelayBatch, type DelayBatch, delayResultList } from '../../src/io/delay-batch';
import { delayResultsToCsv } from '../../src/io/delay-results-csv';
import {
  chooseCandidate,
  convertDelay,
  SECOND_SOUND_EXTREMA,
  secondSound,
  secondSoundSd,
  seriesChooser,
  type TemperatureCandidate,
  temperatureFromVapourPressure,
  vapourPressure,
} from '../../src/physics';
import { gaussian, seededRandom } from '../support/synthetic-trace';

const D_M = 0.06;
const SD_D_M = 20e-6;
const SD_T_S = 1e-6;

/** One simulated reading at true temperature T: the delay a 60 mm path gives with real helium and timing noise. */
function reading(T: number, z: () => number) {
  const real = secondSound(T) + secondSoundSd(T) * z();
  const delay_s = D_M / real + SD_T_S * z();
  const distance_m = D_M + SD_D_M * z();
  return convertDelay({ distance_m, delay_s, distanceSd_m: SD_D_M, delaySd_s: SD_T_S, offset_s: 0, offsetSd_s: 0 });
}

/** The candidate perfect evidence would pick: the one nearest the truth. */
function nearestTo(candidates: readonly TemperatureCandidate[], T: number): TemperatureCandidate {
  return candidates.reduce((best, c) => (Math.abs(c.temperature_K - T) < Math.abs(best.temperature_K - T) ? c : best));
}

const inside = (T: number, [lo, hi]: readonly [number, number]) => T >= lo && T <= hi;

describe('68 % and 95 % intervals mapped through u₂(T): seeded Monte Carlo coverage', () => {
  // Both extrema of u₂ (1.118 K minimum, 1.651 K maximum, D&B 1998; Wang, Wagner & Donnelly 1987),
  // and four ordinary temperatures on the three branches.
  const TEMPERATURES_K = [1.0, 1.118, 1.3, 1.651, 1.8, 2.05];
  const TRIALS = 3000;
  // With 3000 trials the binomial sd of a 95 % coverage is 0.4 %, of a 68 % one 0.85 %.
  for (const T of TEMPERATURES_K) {
    it(`at ${T} K the 95 % interval holds the truth in ≥ 94 % of ${TRIALS} trials and the 68 % one in 65–71.5 %`, () => {
      const z = gaussian(seededRandom(Math.round(T * 1e4) + 7));
      let in68 = 0;
      let in95 = 0;
      for (let k = 0; k < TRIALS; k++) {
        const c = nearestTo(reading(T, z).candidates, T);
        if (inside(T, c.interval68_K)) in68++;
        if (inside(T, c.interval95_K)) in95++;
      }
      expect(in95 / TRIALS).toBeGreaterThanOrEqual(0.94);
      expect(in68 / TRIALS).toBeGreaterThanOrEqual(0.65);
      expect(in68 / TRIALS).toBeLessThanOrEqual(0.715);
    });
  }

  it('the first-order sd alone misses at the u₂ maximum: ±2 sd holds the truth in under 90 % (why intervals are needed)', () => {
    const T = SECOND_SOUND_EXTREMA.maximum.temperature_K;
    const z = gaussian(seededRandom(1651));
    let hits = 0;
    for (let k = 0; k < 2000; k++) {
      const c = nearestTo(reading(T, z).candidates, T);
      if (Math.abs(c.temperature_K - T) <= 2 * c.sd_K) hits++;
    }
    expect(hits / 2000).toBeLessThan(0.9);
  });
});

describe('intervals of one reading', () => {
  const at = (T: number, delaySd_s = SD_T_S) =>
    convertDelay({ distance_m: D_M, delay_s: D_M / secondSound(T), distanceSd_m: SD_D_M, delaySd_s, offset_s: 0, offsetSd_s: 0 });

  it('hold the candidate, nest (68 % inside 95 %) and are about ±1 and ±1.96 sd on a steep branch (1.8 K, 2.05 K)', () => {
    for (const T of [1.8, 2.05]) {
      const c = nearestTo(at(T).candidates, T);
      expect(c.interval68_K[0]).toBeLessThan(c.temperature_K);
      expect(c.interval68_K[1]).toBeGreaterThan(c.temperature_K);
      expect(c.interval95_K[0]).toBeLessThan(c.interval68_K[0]);
      expect(c.interval95_K[1]).toBeGreaterThan(c.interval68_K[1]);
      // Linear there: half-widths within 10 % of k·sd.
      expect((c.interval68_K[1] - c.interval68_K[0]) / 2 / c.sd_K).toBeCloseTo(1, 1);
      expect((c.interval95_K[1] - c.interval95_K[0]) / 2 / c.sd_K / 1.96).toBeCloseTo(1, 1);
      expect(c.reaches95).toEqual([]);
    }
  });

  it('at the u₂ maximum run across the turn, join both branches and say so; asymmetric beside it', () => {
    const conv = at(1.651);
    const mid = conv.candidates.find((c) => c.branch === 'middle') as TemperatureCandidate;
    const high = conv.candidates.find((c) => c.branch === 'high') as TemperatureCandidate;
    expect(mid.interval95_K).toEqual(high.interval95_K);
    expect(mid.reaches95).toContain('maximum');
    expect(mid.interval95_K[0]).toBeLessThan(mid.temperature_K);
    expect(high.interval95_K[1]).toBeGreaterThan(high.temperature_K);
    // At the minimum (1.118 K) the joined interval is lopsided: u₂ is flatter on its cold side (the
    // low branch) than on its warm side, so the interval reaches further down than up (D&B 1998 curve).
    const c = nearestTo(at(1.118).candidates, 1.118);
    expect(c.reaches95).toContain('minimum');
    expect(c.temperature_K - c.interval95_K[0]).toBeGreaterThan(1.2 * (c.interval95_K[1] - c.temperature_K));
  });

  it('keep the measurement part and the u₂ curve’s part apart, with the total', () => {
    const c = nearestTo(at(1.8, 5e-6).candidates, 1.8);
    expect(c.sdMeasurement_K).toBeGreaterThan(0);
    expect(c.sdCurve_K).toBeGreaterThan(0);
    // Far from an extremum the parts add in quadrature to the total (to 1e-3: each part carries
    // its own small second-order term of the curvature).
    expect(Math.hypot(c.sdMeasurement_K, c.sdCurve_K) / c.sd_K).toBeCloseTo(1, 3);
    // Without timing or distance uncertainty only the curve's part is left.
    const bare = nearestTo(convertDelay({ distance_m: D_M, delay_s: D_M / secondSound(1.8), distanceSd_m: 0, delaySd_s: 0, offset_s: 0, offsetSd_s: 0 }).candidates, 1.8);
    expect(bare.sdMeasurement_K).toBe(0);
    expect(bare.sdCurve_K).toBeCloseTo(bare.sd_K, 12);
  });

  it('near Tλ reach Tλ and are never narrower than the curve end’s 0.2 mK (D&B 1998 caution)', () => {
    const T = 2.1767;
    const c = nearestTo(at(T).candidates, T);
    expect(c.reaches95).toContain('Tλ');
    expect(c.sd_K).toBeGreaterThanOrEqual(2e-4 * 0.999);
  });
});

describe('the distance of each candidate from its evidence', () => {
  // 60.0 mm in 3.02 ms is 19.868 m/s; 2.45 kPa is 1.9198 K on ITS-90's helium-4 vapour-pressure scale.
  const conv = convertDelay({ distance_m: 0.06, delay_s: 3.02e-3, distanceSd_m: 0, delaySd_s: 0, offset_s: 0, offsetSd_s: 0 });

  it('ITS-90: 2.45 kPa is 1.9198 K', () => {
    expect(temperatureFromVapourPressure(2450).temperature_K).toBeCloseTo(1.9198, 4);
  });

  it('3.02 ms over 60.0 mm with 2.45 kPa: the chosen 1.805 K is over 3 sd from the gauge, and a caution says what to check', () => {
    const choice = chooseCandidate(conv.candidates, { kind: 'pressure', pressure_Pa: 2450 });
    const chosen = conv.candidates[choice.index as number] as TemperatureCandidate;
    expect(chosen.temperature_K).toBeCloseTo(1.805, 3);
    expect(choice.evidenceSd).toHaveLength(conv.candidates.length);
    const d = choice.evidenceSd[choice.index as number] as number;
    expect(d).toBeGreaterThan(10);
    const w = choice.warnings.find((x) => x.code === 'evidence-disagrees');
    expect(w).toMatchObject({ severity: 'caution', value: d, limit: 3 });
    for (const cause of ['distance', 'offset t0', 'gauge', 'head pressure']) expect(w?.message).toContain(cause);
  });

  it('a gauge sd widens the evidence: the distance in sd falls, and agreement draws no caution', () => {
    const wide = chooseCandidate(conv.candidates, { kind: 'pressure', pressure_Pa: 2450, pressureSd_Pa: 400 });
    const plain = chooseCandidate(conv.candidates, { kind: 'pressure', pressure_Pa: 2450 });
    expect(wide.evidenceSd[2] as number).toBeLessThan(plain.evidenceSd[2] as number);
    const agree = chooseCandidate(conv.candidates, { kind: 'pressure', pressure_Pa: vapourPressure(conv.candidates[2]?.temperature_K ?? 0).pressure_Pa });
    expect(agree.evidenceSd[2]).toBeCloseTo(0, 6);
    expect(agree.warnings).toEqual([]);
  });
});

describe('a series through a turn of u₂', () => {
  // Cooling from 2.05 K to 1.35 K in 10 mK steps through the u₂ maximum (1.651 K); a pressure only on row 1.
  const temps = Array.from({ length: 71 }, (_, i) => 2.05 - i * 0.01);
  const z = gaussian(seededRandom(205));
  const delays = temps.map((T) => D_M / (secondSound(T) * (1 + 4e-5 * z())));

  function batchOf(pressureRows: readonly number[]): DelayBatch {
    return {
      rows: delays.map((delay_s, i) => ({
        line: i + 2,
        delayAsWritten: delay_s,
        delay_s,
        ...(pressureRows.includes(i) ? { pressure_Pa: vapourPressure(temps[i] as number).pressure_Pa } : {}),
      })),
      delayColumn: 'delay_s',
      hasTimestamp: false,
      hasPressure: true,
    };
  }

  it('reports no false warming and no row chosen and confidently wrong: past the turn rows are ambiguous, both continuations kept', () => {
    const results = delayResultList(convertDelayBatch(batchOf([0]), { distance_m: D_M, distanceSd_m: SD_D_M, delaySd_s: SD_T_S }));
    let ambiguous = 0;
    results.forEach((r, i) => {
      const T = temps[i] as number;
      if (r.chosen !== null) {
        // Every chosen row holds the truth in its 95 % interval.
        expect(inside(T, (r.candidates[r.chosen] as TemperatureCandidate).interval95_K)).toBe(true);
      } else {
        expect(r.chosenBy).toBe('ambiguous');
        const [along, across] = r.ambiguous?.alternatives ?? [-1, -1];
        expect(r.candidates[along]?.branch).toBe('high');
        expect(r.candidates[across]?.branch).toBe('middle');
        // The continuation across the turn holds the truth in its 95 % interval; it is also the
        // labelled guess (the trend carries on).
        expect(inside(T, (r.candidates[across] as TemperatureCandidate).interval95_K)).toBe(true);
        expect(r.ambiguous?.guess).toBe(across);
        expect(r.warnings.map((w) => w.code)).toContain('series-ambiguous');
        ambiguous++;
      }
    });
    // Everything from near the maximum down to 1.35 K is undecided; nothing claims a warming.
    expect(ambiguous).toBeGreaterThan(30);
    const chosenTemps = results.flatMap((r) => (r.chosen === null ? [] : [r.candidates[r.chosen]?.temperature_K as number]));
    for (let i = 1; i < chosenTemps.length; i++) expect(chosenTemps[i] as number).toBeLessThan((chosenTemps[i - 1] as number) + 2e-3);
  });

  it('the first later row with its own pressure settles the branch back to the turn', () => {
    const results = delayResultList(convertDelayBatch(batchOf([0, 60]), { distance_m: D_M, distanceSd_m: SD_D_M, delaySd_s: SD_T_S }));
    const settled = results.filter((r) => r.chosenBy === 'settled');
    expect(settled.length).toBeGreaterThan(10);
    results.forEach((r, i) => {
      if (i > 60) return;
      expect(r.chosen).not.toBeNull();
      // Settled rows near the turn have an interval that spans both branches, so it holds the truth.
      expect(inside(temps[i] as number, (r.candidates[r.chosen as number] as TemperatureCandidate).interval95_K)).toBe(true);
    });
    const csv = delayResultsToCsv(convertDelayBatch(batchOf([0, 60]), { distance_m: D_M }));
    expect(csv).toContain(',settled,');
  });

  it('the streaming chooser says which rows a later reading settles, with the continuation on its branch', () => {
    const next = seriesChooser({ kind: 'range', min_K: 0, max_K: 2.2 });
    const convs = temps.map((T) => convertDelay({ distance_m: D_M, delay_s: D_M / secondSound(T), distanceSd_m: SD_D_M, delaySd_s: SD_T_S, offset_s: 0, offsetSd_s: 0 }));
    const pending: number[] = [];
    convs.forEach((c, i) => {
      const own = i === 0 || i === 60 ? { kind: 'pressure' as const, pressure_Pa: vapourPressure(temps[i] as number).pressure_Pa } : null;
      const choice = next(c.candidates, own);
      if (choice.ambiguous) pending.push(i);
      if (i === 60) {
        expect(choice.settles.map((s) => s.row)).toEqual(pending);
        for (const s of choice.settles) expect(convs[s.row]?.candidates[s.index]?.branch).toBe('middle');
      }
    });
    expect(pending.length).toBeGreaterThan(10);
  });
});
