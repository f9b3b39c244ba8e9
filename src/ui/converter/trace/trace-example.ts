/**
 * Invented digitiser traces for trying the trace lab: an imaginary rig with the sensor 50.00 mm
 * from the heater, 1 MS/s, a 40 µs, 5 V heater pulse at t = 0, and a sensor pulse that rises in
 * about 15 µs and decays in 200 µs, 20 mV high over 0.5 mV of noise (a fixed pseudo-random
 * sequence). The arrival is 50 mm / u₂(T) from the kernel's own u₂. Demo data, not a measurement.
 */
import { secondSound } from '../../../physics';

const PATH_M = 0.05;
const STEP_S = 1e-6;
const START_S = -0.5e-3;
const END_S = 4.5e-3;
const HEATER_WIDTH_S = 40e-6;
const HEATER_V = 5;
const PULSE_V = 0.02;
const RISE_S = 15e-6;
const DECAY_S = 200e-6;
const NOISE_V = 0.5e-3;

/** A fixed pseudo-random normal sequence (Park–Miller generator, Box–Muller), the same on every run. */
function normals(seed: number): () => number {
  let state = seed % 2147483647 || 1;
  const uniform = () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
  return () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** One trace as CSV text, for a bath at `temperature_K`, with a timestamp header line. */
export function exampleTraceText(temperature_K: number, timestamp: string, seed: number): string {
  const arrival = PATH_M / secondSound(temperature_K);
  const noise = normals(seed);
  const lines = [`# Invented trace for Sekundo's trace lab (not a measurement)`, `# Timestamp: ${timestamp}`, 'time_s,heater_V,sensor_V'];
  const n = Math.round((END_S - START_S) / STEP_S);
  for (let i = 0; i <= n; i++) {
    const t = START_S + i * STEP_S;
    const heater = t >= 0 && t < HEATER_WIDTH_S ? HEATER_V : 0;
    const dt = t - arrival;
    const pulse = dt > 0 ? PULSE_V * (1 - Math.exp(-dt / RISE_S)) * Math.exp(-dt / DECAY_S) : 0;
    lines.push(`${t.toExponential(6)},${heater},${(pulse + NOISE_V * noise()).toExponential(5)}`);
  }
  return `${lines.join('\n')}\n`;
}

/** Six invented shots, two minutes apart, while the bath cools from 1.86 K to 1.81 K. */
export function exampleTraceFiles(): File[] {
  return Array.from({ length: 6 }, (_, i) => {
    const T = 1.86 - 0.01 * i;
    const timestamp = new Date(Date.UTC(2026, 10, 3, 15, 2 * i, 0)).toISOString().replace('.000Z', 'Z');
    return new File([exampleTraceText(T, timestamp, 1000 + i)], `invented-shot-${i + 1}.csv`, { type: 'text/csv' });
  });
}
