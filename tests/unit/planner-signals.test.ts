/**
 * Planner arrivals, echoes and predicted pulses against hand-worked cases and independent
 * integrals. Property values quoted are those of the Donnelly & Barenghi (1998) curves at 1.8 K:
 * u2 = 19.9028 m/s, u1 = 231.29 m/s, ρ = 145.354 kg/m³, c_p = 2950.5 J/(kg·K).
 */
import { describe, expect, it } from 'vitest';
import {
  coldLength,
  computePlan,
  heliumProperties,
  imageSources,
  type Medium,
  pulseProfile,
  receivedPulse,
  ringAngleInsideDisk,
  type SampledSignal,
} from '../../src/physics';
import { basePlan, withHeater, withSensor } from '../support/plans';
import { bruteRayleigh } from '../support/rayleigh-brute';

const props18 = heliumProperties(1.8);
const U2 = props18.secondSound_m_s as number;
const medium: Medium = { density_kg_m3: props18.density_kg_m3, specificHeat_J_kgK: props18.specificHeat_J_kgK, secondSound_m_s: U2 };

function valueAt(signal: SampledSignal, t: number): number {
  const i = Math.round((t - signal.start_s) / signal.step_s);
  return signal.values[i] ?? 0;
}

describe('arrivals (hand-worked from the reference property values at 1.8 K)', () => {
  it('second sound over 50 mm takes d/u2 = 2.5122 ms; first sound d/u1 = 0.2162 ms', () => {
    const s = computePlan(basePlan()).sensors[0];
    // 0.05 m / 19.9028 m/s and 0.05 m / 231.29 m/s (D&B 1998 curves at 1.8 K).
    expect(s?.secondSoundArrival_s).toBeCloseTo(0.05 / 19.9028, 8);
    expect(s?.firstSoundArrival_s).toBeCloseTo(0.05 / 231.29, 7);
  });

  it('sensor lag adds to the second-sound arrival (t = t0 + d/u2, PHYSICS notes §3)', () => {
    const s = computePlan(withSensor(basePlan(), { lag_s: 20e-6 })).sensors[0];
    expect(s?.secondSoundArrival_s).toBeCloseTo(0.05 / U2 + 20e-6, 10);
  });

  it('parallel heater and sensor plates give echoes at (2k+1)d/u2 (PHYSICS notes §3)', () => {
    const d = 0.02;
    const R = 0.4;
    const plan = withSensor(
      basePlan({
        reflectors: [
          { label: 'heater plate', axis: 'z', position_m: 0, reflection: R },
          { label: 'sensor plate', axis: 'z', position_m: d, reflection: R },
        ],
        echoOrder: 6,
      }),
      { position_m: [0, 0, d] },
    );
    const s = computePlan(plan).sensors[0];
    expect(s?.secondSoundArrival_s).toBeCloseTo(d / U2, 10);
    const times = s?.echoes.map((e) => e.arrival_s) ?? [];
    expect(times.length).toBe(3);
    times.forEach((t, k) => {
      expect(t).toBeCloseTo(((2 * (k + 1) + 1) * d) / U2, 10);
    });
    // Each round trip multiplies by R_sensor·R_heater; the sensor's own plate adds (1 + R) to each.
    const direct = s?.amplitude_K as number;
    const face = plan.heater.power_W / plan.heater.area_m2 / (medium.density_kg_m3 * medium.specificHeat_J_kgK * U2);
    expect(direct).toBeCloseTo(face * (1 + R), 12);
    s?.echoes.forEach((e, k) => {
      expect(e.amplitude_K).toBeCloseTo(face * (1 + R) * (R * R) ** (k + 1), 12);
    });
  });

  it('image sources: a point between two planes has the classic image positions (method of images)', () => {
    const images = imageSources(
      [0, 0, 0.01],
      [
        { label: 'a', axis: 'z', position_m: 0, reflection: 0.5 },
        { label: 'b', axis: 'z', position_m: 0.05, reflection: 0.5 },
      ],
      2,
    );
    const zs = images.map((i) => Number(i.position[2].toFixed(6))).sort((x, y) => x - y);
    // Order 0: 0.01; order 1: −0.01, 0.09; order 2: 0.11 (a then b), −0.09 (b then a).
    expect(zs).toEqual([-0.09, -0.01, 0.01, 0.09, 0.11]);
    expect(images.filter((i) => i.order === 2).every((i) => i.factor === 0.25)).toBe(true);
  });
});

describe('amplitude of a planar pulse, δT = q/(ρ c_p u2) (PHYSICS notes §4)', () => {
  it('1 W/cm² at 1.8 K gives about 1.17 mK (from the reference data)', () => {
    const s = computePlan(withHeater(basePlan(), { power_W: 1, area_m2: 1e-4 })).sensors[0];
    expect(s?.amplitude_K).toBeCloseTo(1.17e-3, 5);
    // 1e4 W/m² / (145.354 kg/m³ · 2950.5 J/(kg·K) · 19.9028 m/s) = 1.1716 mK; the quoted
    // property values carry 5–6 digits, so agreement to 2e-5 relative.
    expect(Math.abs((s?.amplitude_K as number) / (1e4 / (145.354 * 2950.5 * 19.9028)) - 1)).toBeLessThan(2e-5);
  });

  it('signal in volts and SNR follow responsivity, noise and √N averaging', () => {
    const plan = withSensor(withHeater(basePlan(), { averages: 16 }), { responsivity_V_K: 2, noise_V: 1e-6 });
    const s = computePlan(plan).sensors[0];
    const dT = s?.amplitude_K as number;
    expect(s?.signal_V).toBeCloseTo(2 * dT, 12);
    expect(s?.snrSingle).toBeCloseTo((2 * dT) / 1e-6, 6);
    expect(s?.snrAveraged).toBeCloseTo(((2 * dT) / 1e-6) * 4, 6);
  });

  it('pulses needed for a target SNR: N = ⌈(target/SNR₁)²⌉', () => {
    const plan = withSensor(basePlan({ targets: { snr: 100, temperatureSd_K: 1e-3, temperatureKind: 'absolute' } }), { noise_V: 1e-4 });
    const s = computePlan(plan).sensors[0];
    const snr1 = s?.snrSingle as number;
    expect(s?.pulsesForTargetSnr).toBe(Math.ceil((100 / snr1) ** 2));
  });
});

describe('flat disk heater (Rayleigh integral of a baffled piston, PHYSICS notes §4)', () => {
  const a = 5e-3;
  const q0 = 1e3;
  const width = 60e-6;
  const rise = 2e-6;
  const profile = pulseProfile({ kind: 'rectangle' }, width, rise);
  const step = 0.25e-6;
  const rhoC = medium.density_kg_m3 * medium.specificHeat_J_kgK;

  /** Brute-force Rayleigh integral (tests/support/rayleigh-brute.ts), q̇ averaged over one step. */
  const disk = {
    radius_m: a,
    flux_W_m2: q0,
    rate: (tau: number) => (profile.value(tau + step / 2) - profile.value(tau - step / 2)) / step,
    secondSound_m_s: U2,
    rhoC,
    rings: 400,
    perRing: 360,
  };
  const bruteForce = (sensor: [number, number, number], t: number): number => bruteRayleigh(disk, sensor, t);

  const source = { geometry: 'disk' as const, peakFlux_W_m2: q0, peakPower_W: 0, face: { kind: 'disk' as const, radius_m: a }, mount: 'wall' as const, profile, centre: [0, 0, 0] as const, amplitudeFactor: 1 };

  it('on the axis: the plane-wave pulse minus a copy delayed by (√(z²+a²) − z)/u2', () => {
    const z = 0.01;
    const closed = receivedPulse(source, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const edgeDelay = (Math.hypot(z, a) - z) / U2;
    for (const t of [z / U2 + 10e-6, z / U2 + edgeDelay + 10e-6, z / U2 + width + 5e-6]) {
      const expected = (q0 / (rhoC * U2)) * (profile.value(t - z / U2) - profile.value(t - z / U2 - edgeDelay));
      expect(valueAt(closed, t)).toBeCloseTo(expected, 12);
    }
  });

  it('the on-axis formula agrees with a numerical Rayleigh integral (within 1 % of the peak)', () => {
    const z = 0.01;
    const closed = receivedPulse(source, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const peak = Math.max(...closed.values.map(Math.abs));
    for (const dt of [5e-6, 20e-6, 40e-6, 70e-6, 90e-6]) {
      const t = Math.round((z / U2 + dt) / step) * step;
      expect(Math.abs(valueAt(closed, t) - bruteForce([0, 0, z], t))).toBeLessThan(0.01 * peak);
    }
  });

  it('after the pulse has passed the face adds nothing: a lagged pulse is the unlagged one, padded with zeros, through the lag (both the corner and the convolution sums; common practice, no source)', () => {
    // Shorter than the rise, so both tabulate the face alike (on the scale of the rise).
    const lag = 1.5e-6;
    const k = 1 - Math.exp(-step / lag);
    // A smooth bump of 1000 points has more corners than delay bins (the face's delays span about
    // 71 µs here, 285 steps): the convolution sum. The rectangle takes the corner sum.
    const bump = pulseProfile({ kind: 'custom', points: Array.from({ length: 1000 }, (_, i): [number, number] => [(i / 999) * width, Math.sin((Math.PI * i) / 999) ** 2]) }, 0, 0);
    for (const shape of [profile, bump]) {
      const face = { ...source, profile: shape };
      const sensor: [number, number, number] = [1e-3, 0, 0.012];
      const lagged = receivedPulse(face, { position: sensor, radius_m: 0, lag_s: lag }, medium, step).signal;
      const bare = receivedPulse(face, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step).signal;
      expect(lagged.start_s).toBe(bare.start_s);
      expect(lagged.values.length).toBeGreaterThan(bare.values.length + 30);
      const peak = Math.max(...lagged.values.map(Math.abs));
      let y = 0;
      lagged.values.forEach((v, i) => {
        y += k * ((bare.values[i] ?? 0) - y);
        expect(Math.abs(v - y)).toBeLessThan(1e-12 * peak);
      });
    }
  });

  it('a custom pulse of many points (the convolution sum) agrees with the brute-force integral, its steep end included (within 1 % of the peak)', () => {
    // A slow rise over 1000 points, then a fall within one step: more corners than delay bins.
    const points: [number, number][] = Array.from({ length: 1000 }, (_, i): [number, number] => [(i / 999) * width, i / 999]);
    points.push([width + step, 0]);
    const ramp = pulseProfile({ kind: 'custom', points }, 0, 0);
    const sensor: [number, number, number] = [1e-3, 0, 0.012];
    const numeric = receivedPulse({ ...source, profile: ramp }, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step).signal;
    const brute = bruteRayleigh({ ...disk, rate: (tau: number) => (ramp.value(tau + step / 2) - ramp.value(tau - step / 2)) / step, rings: 200, perRing: 180 }, sensor, 0);
    expect(brute).toBe(0);
    const peak = Math.max(...numeric.values.map(Math.abs));
    for (let k = 10; k < numeric.values.length; k += Math.floor(numeric.values.length / 12)) {
      const t = numeric.start_s + k * step;
      const expected = bruteRayleigh({ ...disk, rate: (tau: number) => (ramp.value(tau + step / 2) - ramp.value(tau - step / 2)) / step, rings: 400, perRing: 360 }, sensor, t);
      expect(Math.abs(valueAt(numeric, t) - expected)).toBeLessThan(0.01 * peak);
    }
  });

  it("off the axis, the kernel's ring integral agrees with the brute-force integral (within 1 % of the peak)", () => {
    const sensor: [number, number, number] = [3e-3, 1e-3, 0.008];
    const numeric = receivedPulse(source, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step).signal;
    const peak = Math.max(...numeric.values.map(Math.abs));
    expect(peak).toBeGreaterThan(0);
    const t0 = numeric.start_s;
    for (const k of [20, 80, 160, 240, 320]) {
      const t = t0 + k * step;
      expect(Math.abs(valueAt(numeric, t) - bruteForce(sensor, t))).toBeLessThan(0.01 * peak);
    }
  });

  it('far away, a small disk looks like a point heater of the same power (δT = Ṗ/(2πρ c_p u2² r))', () => {
    const small = { ...source, face: { kind: 'disk' as const, radius_m: 0.5e-3 } };
    const point = { ...source, geometry: 'point' as const, face: null, peakPower_W: q0 * Math.PI * small.face.radius_m ** 2 };
    const z = 0.05;
    const disk = receivedPulse(small, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const far = receivedPulse(point, { position: [0, 0, z], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const peakDisk = Math.max(...disk.values);
    const peakPoint = Math.max(...far.values);
    expect(Math.abs(peakDisk / peakPoint - 1)).toBeLessThan(0.02);
  });

  it('a finite sensor on the axis averages the field over its face (7-point rule ≈ dense average)', () => {
    const z = 0.006;
    const rs = 2e-3;
    const finite = receivedPulse(source, { position: [0, 0, z], radius_m: rs, lag_s: 0 }, medium, step).signal;
    const t = Math.round((z / U2 + 8e-6) / step) * step;
    // Dense area average of the brute-force field: 3 rings × 6 angles + centre, area-weighted.
    let sum = 0;
    let weight = 0;
    for (const [r, w] of [[0, 1], [rs / 3, 6], [(2 * rs) / 3, 12], [rs * 0.95, 18]] as const) {
      const n = r === 0 ? 1 : 6;
      for (let j = 0; j < n; j++) {
        const phi = (j * 2 * Math.PI) / n;
        sum += (w / n) * bruteForce([r * Math.cos(phi), r * Math.sin(phi), z], t);
      }
      weight += w;
    }
    const peak = Math.max(...finite.values.map(Math.abs));
    expect(Math.abs(valueAt(finite, t) - sum / weight)).toBeLessThan(0.05 * peak);
  });

  it('ring angle inside a disk: whole, none and partial rings', () => {
    expect(ringAngleInsideDisk(1, 0, 2)).toBeCloseTo(2 * Math.PI, 12);
    expect(ringAngleInsideDisk(5, 1, 2)).toBe(0);
    // A ring through the disk centre's far side: s = d = a → angle 2·acos(1/2) = 2π/3.
    expect(ringAngleInsideDisk(1, 1, 1)).toBeCloseTo((2 * Math.PI) / 3, 12);
  });
});

describe('sensor lag (first-order response)', () => {
  it('keeps the pulse area and delays its centroid by the time constant', () => {
    const tau = 10e-6;
    const src = { geometry: 'plane-wave' as const, peakFlux_W_m2: 1e3, peakPower_W: 0, face: null, mount: 'wall' as const, profile: pulseProfile({ kind: 'rectangle' }, 50e-6, 1e-6), centre: [0, 0, 0] as const, amplitudeFactor: 1 };
    const step = 0.1e-6;
    const plain = receivedPulse(src, { position: [0, 0, 0.01], radius_m: 0, lag_s: 0 }, medium, step).signal;
    const lagged = receivedPulse(src, { position: [0, 0, 0.01], radius_m: 0, lag_s: tau }, medium, step).signal;
    const moments = (s: SampledSignal) => {
      let m0 = 0;
      let m1 = 0;
      s.values.forEach((v, i) => {
        m0 += v;
        m1 += v * (s.start_s + i * s.step_s);
      });
      return { area: m0 * s.step_s, centroid: m1 / m0 };
    };
    const a = moments(plain);
    const b = moments(lagged);
    expect(b.area / a.area).toBeCloseTo(1, 2);
    expect((b.centroid - a.centroid) / tau).toBeCloseTo(1, 1);
  });
});

describe('cold path length (spacer contraction, PHYSICS notes §3)', () => {
  it('100 mm of 304 stainless measured warm is 99.70 mm cold (ε = 0.30 %, from memory)', () => {
    expect(coldLength(0.1, 'stainless-304').length_m).toBeCloseTo(0.0997, 10);
  });

  it('PTFE shrinks 2.1 % and Invar 0.04 % (from memory)', () => {
    expect(coldLength(0.1, 'ptfe').length_m).toBeCloseTo(0.0979, 10);
    expect(coldLength(0.1, 'invar').length_m).toBeCloseTo(0.09996, 10);
  });

  it('the planner applies contraction to distances measured warm, not to cold ones', () => {
    const warm = computePlan(basePlan({ spacer: { materialId: 'copper', measuredWarm: true } })).sensors[0];
    const cold = computePlan(basePlan({ spacer: { materialId: 'copper', measuredWarm: false } })).sensors[0];
    expect(warm?.pathLength_m).toBeCloseTo(0.05 * (1 - 0.0032), 12);
    expect(cold?.pathLength_m).toBe(0.05);
  });

  it('an unknown material is refused with the list of known ones', () => {
    expect(() => coldLength(0.1, 'unobtainium')).toThrow(/known: stainless-304/);
  });
});

describe('pulse shapes', () => {
  it('rectangle: area equals the width; half-sine: 2τ/π; custom: trapezoid rule', () => {
    expect(pulseProfile({ kind: 'rectangle' }, 100e-6, 5e-6).area_s).toBeCloseTo(100e-6, 15);
    expect(pulseProfile({ kind: 'half-sine' }, 100e-6, 0).area_s).toBeCloseTo((2 * 100e-6) / Math.PI, 15);
    const custom = pulseProfile({ kind: 'custom', points: [[0, 0], [10e-6, 2], [30e-6, 2], [40e-6, 0]] }, 0, 0);
    expect(custom.area_s).toBeCloseTo(30e-6, 15);
    expect(custom.value(20e-6)).toBe(1);
    expect(custom.effectiveRise_s).toBeCloseTo(10e-6, 15);
  });

  it('half-sine effective rise is τ/π (the sinusoid 1/ω sets the shock distance)', () => {
    expect(pulseProfile({ kind: 'half-sine' }, 1e-3, 0).effectiveRise_s).toBeCloseTo(1e-3 / Math.PI, 15);
  });

  it('refuses bad custom points with a field message', () => {
    expect(() => pulseProfile({ kind: 'custom', points: [[0, 1]] }, 0, 0)).toThrow(/pulse points/);
    expect(() => pulseProfile({ kind: 'custom', points: [[0, 1], [0, 2]] }, 0, 0)).toThrow(/increase/);
    expect(() => pulseProfile({ kind: 'custom', points: [[0, 0], [1e-6, 0]] }, 0, 0)).toThrow(/above 0/);
    expect(() => pulseProfile({ kind: 'rectangle' }, 100e-6, 200e-6)).toThrow(/rise time/);
  });
});

describe('coarse time steps keep the pulse (each sample is the signal averaged over its step)', () => {
  it('a 1 s sensor lag on a 100 µs pulse: the sensor sees the pulse area spread over its time constant', () => {
    const plan = withSensor(basePlan(), { lag_s: 1 });
    const s = computePlan(plan).sensors[0];
    const face = plan.heater.power_W / plan.heater.area_m2 / (medium.density_kg_m3 * medium.specificHeat_J_kgK * U2);
    // A first-order sensor much slower than the pulse peaks at (pulse area)/τ times the height.
    expect(s?.amplitude_K).toBeGreaterThan(0);
    expect(Math.abs((s?.amplitude_K as number) / ((face * 100e-6) / 1) - 1)).toBeLessThan(0.01);
    expect(s?.timingSd_s).toBeGreaterThan(0);
  });

  it('a 10 ns custom pulse on a much coarser step keeps its area', () => {
    const profile = pulseProfile({ kind: 'custom', points: [[0, 0], [5e-9, 1], [10e-9, 0]] }, 0, 0);
    const source = { geometry: 'plane-wave' as const, peakFlux_W_m2: 1e6, peakPower_W: 0, face: null, mount: 'wall' as const, profile, centre: [0, 0, 0] as const, amplitudeFactor: 1 };
    const step = 1e-6;
    const r = receivedPulse(source, { position: [0, 0, 0.01], radius_m: 0, lag_s: 0 }, medium, step);
    const area = r.signal.values.reduce((a, v) => a + v, 0) * step;
    const expected = (1e6 * profile.area_s) / (medium.density_kg_m3 * medium.specificHeat_J_kgK * U2);
    expect(area / expected).toBeCloseTo(1, 9);
  });

  it('the pulse integral matches its samples: trapezoid, half-sine and custom', () => {
    for (const profile of [
      pulseProfile({ kind: 'rectangle' }, 100e-6, 7e-6),
      pulseProfile({ kind: 'half-sine' }, 80e-6, 0),
      pulseProfile({ kind: 'custom', points: [[0, 0], [10e-6, 2], [30e-6, 1], [45e-6, 0]] }, 0, 0),
    ]) {
      const n = 20000;
      const h = (profile.duration_s * 1.2) / n;
      let sum = 0;
      for (let i = 0; i < n; i++) {
        sum += profile.value((i + 0.5) * h) * h;
        if (i % 997 === 0) expect(profile.integral((i + 1) * h)).toBeCloseTo(sum, 9);
      }
      expect(profile.integral(profile.duration_s * 2)).toBeCloseTo(profile.area_s, 15);
    }
  });
});
