/**
 * The demo of "Follow a folder": the trace lab's invented traces (trace-example.ts: an imaginary
 * rig, sensor 50 mm from the heater) replayed as if a digitiser were writing them now, one file
 * every REPLAY_STEP_MS, with header timestamps a minute apart. The invented run cools from 1.83 K
 * into a band around 1.79 K, holds there, drifts out warm for a few minutes and comes back; every
 * twelfth file notes the bath vapour pressure in its header (which decides its candidate, and the
 * first file's starts the series); one file in the middle is an oscilloscope's settings dump. Demo data, not a measurement.
 */
import type { FolderEntry } from '../../../io/folder-poll';
import { vapourPressure } from '../../../physics';
import { exampleTraceText } from '../trace/trace-example';
import type { WatchSource } from './watch-sources';

/** Time between two demo files appearing, ms. */
export const REPLAY_STEP_MS = 900;
/** How often the demo looks for them, ms. */
export const REPLAY_LOOK_MS = 400;

/**
 * The invented bath temperature of demo shot i (0-based), K. The fraction picker takes the pulse at
 * half height on its rising edge, about 10 µs after its onset (the invented sensor's rise), which
 * reads about 9 mK warm at 50 mm unless the offset t₀ takes it out: the bath holds at 1.791 K so
 * that the readings hold in the example alarm band around 1.800 K.
 */
export function demoTemperature(i: number): number {
  if (i < 14) return 1.831 - (0.04 * i) / 14;
  if (i < 26) return 1.791 + 0.0006 * Math.sin(i);
  if (i < 31) return 1.791 + 0.003 * (i - 25);
  return Math.max(1.791, 1.806 - 0.004 * (i - 30));
}

/** Shots in the demo. */
export const DEMO_SHOTS = 40;
/** Every this many shots the file's header carries the bath vapour pressure. */
const PRESSURE_EVERY = 12;
/** The shot that is no trace. */
const NOT_A_TRACE = 18;

function demoName(i: number): string {
  return i === NOT_A_TRACE ? 'scope-settings.csv' : `invented-cooldown-${String(i + 1).padStart(3, '0')}.csv`;
}

function demoText(i: number): string {
  if (i === NOT_A_TRACE) return '# Invented oscilloscope settings dump (not a trace)\nchannel;volts_per_div;coupling\nCH1;0.005;AC\nCH2;2;DC\n';
  const stamp = new Date(Date.UTC(2026, 10, 3, 15, i, 0)).toISOString().replace('.000Z', 'Z');
  const text = exampleTraceText(demoTemperature(i), stamp, 2000 + i);
  if (i % PRESSURE_EVERY !== 0) return text;
  // The invented logger notes the bath's vapour pressure now and then (the kernel's ITS-90 value, rounded as a gauge shows it).
  const p = vapourPressure(demoTemperature(i)).pressure_Pa;
  return text.replace('time_s,', `# Bath vapour pressure: ${p.toFixed(0)} Pa\ntime_s,`);
}

/** The demo as a folder that fills while it is followed; `now` is the clock (tests pass their own). */
export function demoSource(now: () => number = Date.now): WatchSource {
  const start = now();
  // Texts wait here from the look that finds them until they are opened; sizes stay.
  const texts = new Map<number, string>();
  const sizes = new Map<number, number>();
  const arrived = () => Math.min(DEMO_SHOTS, Math.floor((now() - start) / REPLAY_STEP_MS) + 1);
  return {
    kind: 'demo',
    name: 'invented demo run',
    interval_ms: REPLAY_LOOK_MS,
    async list() {
      const out: FolderEntry[] = [];
      for (let i = 0; i < arrived(); i++) {
        let size = sizes.get(i);
        if (size === undefined) {
          const text = demoText(i);
          texts.set(i, text);
          size = text.length;
          sizes.set(i, size);
        }
        out.push({ name: demoName(i), size_bytes: size, modified_ms: start + i * REPLAY_STEP_MS });
      }
      return out;
    },
    async open(name) {
      for (let i = 0; i < DEMO_SHOTS; i++) {
        if (demoName(i) !== name) continue;
        const text = texts.get(i) ?? demoText(i);
        texts.delete(i);
        return new File([text], name, { type: 'text/csv', lastModified: start + i * REPLAY_STEP_MS });
      }
      throw new Error(`${name} is not in the demo`);
    },
  };
}
