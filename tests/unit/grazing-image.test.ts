/**
 * A heater image in a sensor's own plane (height 0: a grazing path). The kernel computes its pulse
 * as the z → 0 limit of the Rayleigh
 * integral (PHYSICS notes §4), which is continuous down to the face's plane. Checked against
 * independent computations: the small-source formula δT = Ṗ(t − r/u2)/(2π ρ c_p u2² r) written
 * out here, a brute-force polar-grid Rayleigh integral at z = 0, and the plane-wave value
 * q f(t)/(ρ c_p u2) on the face itself before its edge wave arrives. Stacked parallel planes once
 * put images there through paths off the back of a plane; those are no longer images (last test).
 * Property values are the Donnelly & Barenghi (1998) curves at 1.8 K through the kernel's
 * heliumProperties.
 */
import { describe, expect, it } from 'vitest';
import { computePlan, heliumProperties, imageSources, type Medium, type PulseSource, pulseProfile, receivedPulse, type SampledSignal } from '../../src/physics';
import { basePlan, withHeater } from '../support/plans';
import { bruteRayleigh } from '../support/rayleigh-brute';

const props = heliumProperties(1.8);
const U2 = props.secondSound_m_s as number;
const medium: Medium = { density_kg_m3: props.density_kg_m3, specificHeat_J_kgK: props.specificHeat_J_kgK, secondSound_m_s: U2 };
const rhoC = medium.density_kg_m3 * medium.specificHeat_J_kgK;
const step = 0.25e-6;
const width = 60e-6;
const profile = pulseProfile({ kind: 'rectangle' }, width, 2e-6);

function valueAt(signal: SampledSignal, t: number): number {
  const i = Math.round((t - signal.start_s) / signal.step_s);
  return signal.values[i] ?? 0;
}

/** The pulse's rate of change averaged over one step centred on t, 1/s. */
function rate(t: number): number {
  return (profile.value(t + step / 2) - profile.value(t - step / 2)) / step;
}

describe('a heater image in the sensor’s plane (grazing path)', () => {
  it('small source: the pulse is Ṗ(t − r/u2)/(2π ρ c_p u2² r) times the reflection product, as at any height', () => {
    const power = 0.01;
    const factor = 0.16;
    const source: PulseSource = { geometry: 'point', peakFlux_W_m2: 0, peakPower_W: power, face: null, mount: 'wall', profile, centre: [0.004, -0.002, 0.02], amplitudeFactor: factor };
    const sensor: [number, number, number] = [0.016, 0.003, 0.02];
    const r = Math.hypot(0.012, 0.005);
    const pulse = receivedPulse(source, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step);
    expect(pulse.arrival_s).toBeCloseTo(r / U2, 12);
    const peak = (factor * power) / (2 * Math.PI * rhoC * U2 * U2 * r) / 2e-6;
    for (const dt of [0.5e-6, 1.25e-6, 30e-6, width + 0.75e-6]) {
      const t = Math.round((r / U2 + dt) / step) * step;
      const expected = (factor * power * rate(t - r / U2)) / (2 * Math.PI * rhoC * U2 * U2 * r);
      expect(Math.abs(valueAt(pulse.signal, t) - expected)).toBeLessThan(1e-9 * peak);
    }
  });

  it('disk face beside the sensor in its plane: the ring integral agrees with a brute-force Rayleigh integral at z = 0 (1 % of the peak)', () => {
    const a = 5e-3;
    const q0 = 1e3;
    const source: PulseSource = { geometry: 'disk', peakFlux_W_m2: q0, peakPower_W: 0, face: { kind: 'disk', radius_m: a }, mount: 'wall', profile, centre: [0, 0, 0.03], amplitudeFactor: 1 };
    const sensor: [number, number, number] = [8e-3, 3e-3, 0.03];
    const pulse = receivedPulse(source, { position: sensor, radius_m: 0, lag_s: 0 }, medium, step).signal;
    // Independent: the brute-force Rayleigh integral with the sensor in the disk's own plane.
    const disk = { radius_m: a, flux_W_m2: q0, rate, secondSound_m_s: U2, rhoC, rings: 1000, perRing: 1500 };
    const brute = (t: number) => bruteRayleigh(disk, [sensor[0], sensor[1], 0], t);
    const peak = Math.max(...pulse.values.map(Math.abs));
    expect(peak).toBeGreaterThan(0);
    const nearest = Math.hypot(8e-3, 3e-3) - a;
    expect(pulse.start_s).toBeLessThanOrEqual(nearest / U2);
    for (const k of [30, 120, 240, 400, 520]) {
      const t = pulse.start_s + k * step;
      expect(Math.abs(valueAt(pulse, t) - brute(t))).toBeLessThan(0.01 * peak);
    }
  });

  it('sensor on the image’s face itself: the plane-wave value q f(t)/(ρ c_p u2) until the nearest edge’s wave arrives, the z → 0 limit', () => {
    const q0 = 500;
    const factor = -0.4;
    const face = { kind: 'rectangle' as const, width_m: 0.01, height_m: 0.008 };
    const source: PulseSource = { geometry: 'rectangle', peakFlux_W_m2: q0, peakPower_W: 0, face, mount: 'wall', profile, centre: [0.002, 0, 0.024], amplitudeFactor: factor };
    const at = (z: number) => receivedPulse(source, { position: [0.002, 0.001, z], radius_m: 0, lag_s: 0 }, medium, step);
    const flat = at(0.024);
    expect(flat.arrival_s).toBe(0);
    // The nearest edge is 3 mm away (y = 0.004 from y = 0.001): 151 µs, after the 62 µs pulse.
    for (const t of [1e-6, 10e-6, 30e-6, 55e-6]) {
      const tt = Math.round(t / step) * step;
      expect(valueAt(flat.signal, tt)).toBeCloseTo((factor * q0 * profile.value(tt)) / (rhoC * U2), 9);
    }
    // And the limit is continuous: 1 µm above the face gives the same pulse, 0.05 µs later.
    const above = at(0.024 + 1e-6).signal;
    const peak = Math.max(...flat.signal.values.map(Math.abs));
    for (const t of [5e-6, 40e-6, 150e-6, 160e-6]) expect(Math.abs(valueAt(flat.signal, t) - valueAt(above, t + 1e-6 / U2))).toBeLessThan(0.01 * peak);
  });

  it('a small source seen from its own point is still refused, naming the sensor position', () => {
    const source: PulseSource = { geometry: 'point', peakFlux_W_m2: 0, peakPower_W: 0.01, face: null, mount: 'wall', profile, centre: [0, 0, 0.02], amplitudeFactor: 0.4 };
    expect(() => receivedPulse(source, { position: [0, 0, 0.02], radius_m: 0, lag_s: 0 }, medium, step)).toThrow(/sensor position: must not coincide/);
  });

  it('stacked planes: no path off the back of a plane, so no image in the sensor’s plane and no echo before the direct wave (Borish 1984 validity, from memory)', () => {
    // Two plates above the heater. Mirrored in the lower one and then in the upper one the heater
    // would sit at z = 2·60 − 2·50 mm, the sensor's plane: a wave that left the lower plate downwards
    // cannot meet the upper one. The sensor sits exactly there, as the plan that found this had it.
    const zInvalid = 2 * 0.06 - 2 * 0.05;
    const reflectors = [
      { label: 'lower plate', axis: 'z' as const, position_m: 0.05, reflection: 0.4 },
      { label: 'upper plate', axis: 'z' as const, position_m: 0.06, reflection: 0.4 },
    ];
    const images = imageSources([0, 0, 0], reflectors, 3);
    expect(images.map((im) => Number(im.position[2].toFixed(6))).sort((x, y) => x - y)).toEqual([0, 0.1, 0.12]);
    const plan = withHeater(
      basePlan({ reflectors, echoOrder: 2, sensors: [{ id: 's1', label: 'S1', position_m: [0.012, 0, zInvalid], distanceSd_m: 0, area_m2: 0, responsivity_V_K: 1, noise_V: 1e-7, lag_s: 0 }] }),
      { geometry: 'rectangle', width_m: 0.01, height_m: 0.01, area_m2: 1e-4 },
    );
    const sensor = computePlan(plan).sensors[0];
    const direct = sensor?.secondSoundArrival_s as number;
    // The direct path: from the face's nearest point (7 mm aside) up 20 mm.
    expect(direct).toBeCloseTo(Math.hypot(0.007, zInvalid) / U2, 9);
    // Echoes off the lower plate (z = 100 mm image) and the upper plate (120 mm), each once, later.
    expect(sensor?.echoes.map((e) => e.path.join(' → '))).toEqual(['lower plate', 'upper plate', 'lower plate → heater plate', 'upper plate → heater plate']);
    expect(sensor?.echoes[0]?.arrival_s).toBeCloseTo(Math.hypot(0.007, 0.1 - zInvalid) / U2, 9);
    for (const e of sensor?.echoes ?? []) expect(e.arrival_s).toBeGreaterThan(direct);
    // Nothing arrives before the direct wave.
    for (const segment of sensor?.waveform ?? []) {
      segment.values.forEach((v, i) => {
        if (segment.start_s + (i + 1) * segment.step_s < direct) expect(v).toBe(0);
      });
    }
  });
});
