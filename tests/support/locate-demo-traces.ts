/**
 * Invented digitiser traces for the source-location demo ("Linnet-1", public/demo-locate.csv):
 * one channel per sensor, named after it, on the clock of the demo's arrival times (t = 0 is the
 * cavity-trip trigger). Demo data, not a measurement.
 *
 * Model: the quench spot is a small (point) heater at the source the demo's arrivals give
 * (located with the kernel), whose power rises in 250 µs and dies away over 3 ms; each sensor
 * sees the kernel's received pulse for it (src/physics/received-pulse.ts: Ṗ(t − r/u₂)/r, through a
 * 60 µs first-order sensor lag) at 1.8 K, turned into millivolts by an invented 10 V/K
 * responsivity, over 0.1 mV of white noise from a fixed seed. Each pulse is then moved along the
 * time axis (the demo's arrivals scatter around the model's, and L225's is late) so that the
 * fraction-of-peak picker at 0.5 — the panel’s default — finds the demo’s arrival to within
 * 1 µs (less than the pick’s own sd). The threshold picker finds the leading edge about 35 µs
 * earlier and the peak picker the top about 135 µs later on every sensor alike: the fit’s emission
 * time takes up such a common shift, and the source comes out the same.
 *
 * Write the file again with: npx tsx tests/support/locate-demo-traces.ts
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { type LocateSensor, parseLocateCsv } from '../../src/io/locate-csv';
import { heliumProperties, locateSource, type PulseProfile, pickArrival, pulseProfile, receivedPulse, type Vec3 } from '../../src/physics';
import { gaussian, seededRandom } from './synthetic-trace';

/** Where the demo's files sit, relative to the repository root. */
export const DEMO_SENSORS_PATH = 'public/demo-locate.csv';
export const DEMO_TRACES_PATH = 'public/demo-locate-traces.csv';

const BATH_K = 1.8;
const STEP_S = 4e-6;
const START_S = -1e-3;
const END_S = 16e-3;
/** Quench power: up in 250 µs, down to nothing over 3 ms (invented). */
const QUENCH_RISE_S = 250e-6;
const QUENCH_FALL_S = 3e-3;
const QUENCH_POWER_W = 20;
const SENSOR_LAG_S = 60e-6;
const RESPONSIVITY_MV_PER_K = 1e4;
const NOISE_MV = 0.1;
const SEED = 2026;
/** The picker the demo is aligned to: the panel's default. */
const ALIGN_FRACTION = 0.5;
const ALIGN_TOLERANCE_S = 1e-6;
const ALIGN_ROUNDS = 12;
const ALIGN_SEEDS = 20;
/** Decimals of a written value, mV (0.1 µV: far below the noise). */
const DECIMALS = 4;

/** The demo sensors, as the page reads them. */
export function demoSensors(root = process.cwd()): LocateSensor[] {
  return parseLocateCsv(readFileSync(join(root, DEMO_SENSORS_PATH))).sensors;
}

/** A profile moved later by `delay_s` (the kernel takes time zero as the onset). */
function delayed(profile: PulseProfile, delay_s: number): PulseProfile {
  return {
    corners: null,
    duration_s: profile.duration_s + delay_s,
    area_s: profile.area_s,
    effectiveRise_s: profile.effectiveRise_s,
    value: (t) => profile.value(t - delay_s),
    integral: (t) => profile.integral(t - delay_s),
  };
}

const round = (x: number) => Number(x.toFixed(DECIMALS));

/** The demo traces as CSV text: a commented header, then time_s and one column per sensor (mV). */
export function locateDemoTracesCsv(sensors: readonly LocateSensor[]): string {
  const props = heliumProperties(BATH_K);
  const u2 = props.secondSound_m_s as number;
  const medium = { density_kg_m3: props.density_kg_m3, specificHeat_J_kgK: props.specificHeat_J_kgK, secondSound_m_s: u2 };
  const read = sensors.filter((s): s is LocateSensor & { arrival_s: number } => s.arrival_s !== null);
  const fit = locateSource(
    read.map((s) => ({ position_m: s.position_m, arrival_s: s.arrival_s, arrivalSd_s: s.arrivalSd_s ?? undefined })),
    { speed_m_s: u2, fitSpeed: false, arrivalSd_s: 5e-5, constraint: { kind: 'none' }, dropOutliers: true },
  );
  const source: Vec3 = fit.source_m;
  const profile = pulseProfile({ kind: 'custom', points: [[0, 0], [QUENCH_RISE_S, 1], [QUENCH_RISE_S + QUENCH_FALL_S, 0]] }, 0, 0);
  const rows = Math.round((END_S - START_S) / STEP_S) + 1;
  const time_s = Float64Array.from({ length: rows }, (_, i) => START_S + i * STEP_S);
  const distance = (p: Vec3) => Math.hypot(p[0] - source[0], p[1] - source[1], p[2] - source[2]);
  // The quench starts on a sample (so the kernel's grid falls on the file's), before every pulse.
  const earliest = Math.min(...read.map((s) => s.arrival_s - distance(s.position_m) / u2));
  const quench_s = Math.floor((earliest - 100e-6) / STEP_S) * STEP_S;

  const channel = (s: LocateSensor & { arrival_s: number }, seed: number, onset_s: number): Float64Array => {
    const normal = gaussian(seededRandom(seed));
    const values = Float64Array.from({ length: rows }, () => NOISE_MV * normal());
    const received = receivedPulse(
      { geometry: 'point', peakFlux_W_m2: 0, peakPower_W: QUENCH_POWER_W, face: null, mount: 'wall', profile: delayed(profile, onset_s - quench_s - distance(s.position_m) / u2), centre: source, amplitudeFactor: 1 },
      { position: s.position_m, radius_m: 0, lag_s: SENSOR_LAG_S },
      medium,
      STEP_S,
    );
    const first = Math.round((quench_s + received.signal.start_s - START_S) / STEP_S);
    received.signal.values.forEach((v, k) => {
      const i = first + k;
      if (i >= 0 && i < rows) values[i] = (values[i] as number) + RESPONSIVITY_MV_PER_K * v;
    });
    return values.map(round);
  };

  /** The pulse placed so the pick meets the demo's arrival, over one noise sequence; null if it cannot. */
  const aligned = (s: LocateSensor & { arrival_s: number }, seed: number): Float64Array | null => {
    const missOf = (onset_s: number) => {
      const values = channel(s, seed, onset_s);
      const pick = pickArrival({ time_s, values }, { kind: 'fraction', fraction: ALIGN_FRACTION, polarity: 'auto' });
      return { values, onset_s, miss: s.arrival_s - pick.arrival_s };
    };
    // Start with the onset at the demo's arrival, then move it by what the pick misses.
    let best = missOf(s.arrival_s);
    for (let round = 0; round < ALIGN_ROUNDS && Math.abs(best.miss) >= ALIGN_TOLERANCE_S; round++) best = missOf(best.onset_s + best.miss);
    return Math.abs(best.miss) < ALIGN_TOLERANCE_S ? best.values : null;
  };

  const columns = read.map((s, index) => {
    // Which sample is the peak can change as the pulse moves over the noise, and the pick jumps
    // with it; when it jumps over the demo's arrival, the next noise sequence is taken.
    for (let attempt = 0; attempt < ALIGN_SEEDS; attempt++) {
      const values = aligned(s, SEED + 100 * attempt + index);
      if (values) return { label: s.label, values };
    }
    throw new Error(`${s.label}: no noise sequence lets the pick meet the demo arrival`);
  });

  const lines = [
    '# Sekundo demo traces for "Linnet-1", the invented cavity of public/demo-locate.csv. Invented numbers, not a measurement.',
    '# Made by tests/support/locate-demo-traces.ts (npx tsx tests/support/locate-demo-traces.ts): the kernel\'s pulse from a point',
    `# quench spot at the demo's source, ${BATH_K} K bath, ${RESPONSIVITY_MV_PER_K / 1e3} V/K sensors with a ${SENSOR_LAG_S * 1e6} µs lag, ${NOISE_MV} mV noise;`,
    "# each pulse placed so the fraction-of-peak picker at 0.5 finds the demo's arrival time.",
    '# t = 0 is the cavity-trip trigger, the clock of the demo arrival times. Channels in mV, named after the sensors.',
    `time_s,${columns.map((c) => c.label).join(',')}`,
  ];
  for (let i = 0; i < rows; i++) {
    lines.push(`${(time_s[i] as number).toFixed(6)},${columns.map((c) => (c.values[i] as number).toFixed(DECIMALS)).join(',')}`);
  }
  return `${lines.join('\n')}\n`;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  writeFileSync(join(process.cwd(), DEMO_TRACES_PATH), locateDemoTracesCsv(demoSensors()));
  console.log(`wrote ${DEMO_TRACES_PATH}`);
}
