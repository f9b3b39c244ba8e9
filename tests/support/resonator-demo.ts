/**
 * Invented data for the resonator demo: "Kestrel-2", a fictional plane-parallel second-sound
 * resonator of an invented lab (two 25 mm plates, a 10.00 mm stainless-steel spacer measured
 * warm), in a 1.85 K bath, driven on its mode n = 8. Demo data, not a measurement.
 *
 *  - public/demo-resonator-reference.csv: a sweep without vortices (Δ₀ = 2.4 Hz, A₀ = 2 mV);
 *  - public/demo-resonator-sweep.csv: the same mode with an isotropic tangle of 3e8 m⁻² (the width
 *    grows by B κ L/(6π), the peak falls as A Δ stays constant) and the bath 0.05 mK warmer;
 *  - public/demo-resonator-lockin.csv: 120 s at the reference's centre frequency, a counterflow
 *    heater switched on at 20 s (L rises to 2.5e8 m⁻² with a 3 s time constant) and off at 70 s
 *    (L decays as 1/(1 + t/5 s)), while the bath warms slowly (f₀ drifts by −0.3 Hz over 120 s).
 * Each with 10 µV of white noise on x and y from a fixed seed. The model: tests/support/resonator-synth.ts.
 *
 * Write the files again with: npx tsx tests/support/resonator-demo.ts
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { coldGap, modeFrequency, mutualFrictionB, QUANTUM_OF_CIRCULATION_M2_S, secondSound } from '../../src/physics';
import { type ResonanceTruth, synthLockin, synthSweep } from './resonator-synth';

export const DEMO_RESONATOR = {
  name: 'Kestrel-2',
  gapWarm_m: 0.01,
  spacerId: 'stainless-304',
  plateDiameter_m: 0.025,
  temperature_K: 1.85,
  mode: 8,
} as const;
export const DEMO_REFERENCE_PATH = 'public/demo-resonator-reference.csv';
export const DEMO_SWEEP_PATH = 'public/demo-resonator-sweep.csv';
export const DEMO_LOCKIN_PATH = 'public/demo-resonator-lockin.csv';

const WIDTH0_HZ = 2.4;
const AMPLITUDE0_V = 2e-3;
const PHASE_RAD = 0.6;
const NOISE_V = 1e-5;
const SWEEP_LINE_DENSITY_M2 = 3e8;
const SWEEP_WARMER_K = 5e-5;
const LOCKIN_LINE_DENSITY_M2 = 2.5e8;
const SEED = 1717;

/** The demo's true reference resonance (what the fit should find). */
export function demoTruth(): ResonanceTruth {
  const gap = coldGap(DEMO_RESONATOR.gapWarm_m, 0, DEMO_RESONATOR.spacerId).gap_m;
  const f0 = modeFrequency(DEMO_RESONATOR.mode, secondSound(DEMO_RESONATOR.temperature_K), gap);
  return { f0_Hz: f0, width_Hz: WIDTH0_HZ, amplitude: AMPLITUDE0_V, phase_rad: PHASE_RAD, background: { re: 5e-5, im: -3e-5, slopeRe: 2e-7, slopeIm: 1e-7 } };
}

/** Extra full width of an isotropic tangle L at the demo's temperature, Hz: B κ L/(6π). */
export function demoExtraWidth_Hz(L_m2: number): number {
  return (mutualFrictionB(DEMO_RESONATOR.temperature_K) * QUANTUM_OF_CIRCULATION_M2_S * L_m2) / (6 * Math.PI);
}

function csv(comment: string[], header: string, rows: string[]): string {
  return `${[...comment.map((c) => `# ${c}`), header, ...rows].join('\n')}\n`;
}

const num = (v: number) => Number(v.toPrecision(9)).toString();

export function demoReferenceCsv(): string {
  const t = demoTruth();
  const s = synthSweep(t, { from_Hz: t.f0_Hz - 15, to_Hz: t.f0_Hz + 15, points: 401, noise: NOISE_V, seed: SEED });
  const rows = Array.from(s.frequency_Hz, (f, i) => `${num(f)},${num((s.x[i] as number) * 1e3)},${num((s.y[i] as number) * 1e3)}`);
  return csv(
    ['Sekundo demo: "Kestrel-2", an invented resonator (not a measurement). Vortex-free reference sweep of mode 8 at 1.85 K.', 'Made by tests/support/resonator-demo.ts.'],
    'frequency_Hz,x_mV,y_mV',
    rows,
  );
}

export function demoSweepCsv(): string {
  const ref = demoTruth();
  const gap = coldGap(DEMO_RESONATOR.gapWarm_m, 0, DEMO_RESONATOR.spacerId).gap_m;
  const f0 = modeFrequency(DEMO_RESONATOR.mode, secondSound(DEMO_RESONATOR.temperature_K + SWEEP_WARMER_K), gap);
  const width = WIDTH0_HZ + demoExtraWidth_Hz(SWEEP_LINE_DENSITY_M2);
  const t: ResonanceTruth = { ...ref, f0_Hz: f0, width_Hz: width, amplitude: (AMPLITUDE0_V * WIDTH0_HZ) / width };
  const s = synthSweep(t, { from_Hz: ref.f0_Hz - 15, to_Hz: ref.f0_Hz + 15, points: 401, noise: NOISE_V, seed: SEED + 1 });
  const rows = Array.from(s.frequency_Hz, (f, i) => `${num(f)},${num((s.x[i] as number) * 1e3)},${num((s.y[i] as number) * 1e3)}`);
  return csv(
    ['Sekundo demo: "Kestrel-2", an invented resonator (not a measurement). Mode 8 with a vortex tangle (3e8 per m² made up), bath 0.05 mK warmer.', 'Made by tests/support/resonator-demo.ts.'],
    'frequency_Hz,x_mV,y_mV',
    rows,
  );
}

/** The demo record's true L(t), m⁻². */
export function demoLineDensity(t: number): number {
  if (t < 20) return 0;
  const on = LOCKIN_LINE_DENSITY_M2 * (1 - Math.exp(-(Math.min(t, 70) - 20) / 3));
  return t <= 70 ? on : on / (1 + (t - 70) / 5);
}

export function demoLockinCsv(): string {
  const ref = demoTruth();
  const times = Float64Array.from({ length: 2400 }, (_, i) => i * 0.05);
  const r = synthLockin(ref, {
    drive_Hz: ref.f0_Hz,
    times_s: times,
    width: (t) => WIDTH0_HZ + demoExtraWidth_Hz(demoLineDensity(t)),
    centre: (t) => ref.f0_Hz - (0.3 * t) / 120,
    noise: NOISE_V,
    seed: SEED + 2,
  });
  const rows = Array.from(times, (t, i) => `${t.toFixed(2)},${num((r.x[i] as number) * 1e3)},${num((r.y[i] as number) * 1e3)}`);
  return csv(
    [
      'Sekundo demo: "Kestrel-2", an invented resonator (not a measurement). Lock-in record at the reference centre frequency, mode 8, 1.85 K.',
      'A counterflow heater (invented) on from 20 s to 70 s; the bath warms slowly. Made by tests/support/resonator-demo.ts.',
    ],
    'time_s,x_mV,y_mV',
    rows,
  );
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  writeFileSync(join(process.cwd(), DEMO_REFERENCE_PATH), demoReferenceCsv());
  writeFileSync(join(process.cwd(), DEMO_SWEEP_PATH), demoSweepCsv());
  writeFileSync(join(process.cwd(), DEMO_LOCKIN_PATH), demoLockinCsv());
  console.log(`wrote ${DEMO_REFERENCE_PATH}, ${DEMO_SWEEP_PATH}, ${DEMO_LOCKIN_PATH}`);
}
