/**
 * Plans and sensor files at the documented limits, for the keystroke benchmark and the browser
 * test of the worst case: a custom pulse of the most points, the most sensors with the most
 * reflecting planes at the highest echo order, both together, and the most located sensors.
 * Invented geometry (a frame of sensors in front of the heater, plates around it).
 */
import { CUSTOM_PULSE_MAX_POINTS, MAX_ECHO_ORDER, PLAN_LIMITS } from '../../src/physics';
import { MAX_REFLECTORS } from '../../src/io/plan-file';
import { LOCATE_MAX_SENSORS } from '../../src/io/locate-csv';

type Json = Record<string, unknown>;

/** The demo's heater with a custom pulse of `points` points (a half sine over 100 µs). */
function customPulse(demo: Json, points: number): Json {
  const heater = { ...(demo.heater as Json) };
  delete heater.width_s;
  heater.shape = { custom: Array.from({ length: points }, (_, i) => [(i * 1e-4) / (points - 1), Math.round(1000 * Math.sin((Math.PI * i) / (points - 1))) / 1000 || (i === 0 ? 0 : 0.001)]) };
  return heater;
}

/**
 * `count` sensors on a frame 10–42 mm in front of the heater, and `planes` plates beside, above and
 * behind it, several stacked on one side (some sensors sit at the heights where paths off the back
 * of a stacked plate once put heater images: tests/unit/grazing-image.test.ts).
 */
function crowded(demo: Json, count: number, planes: number, echoOrder: number): Json {
  const base = (demo.sensors as Json[])[0] as Json;
  const sensors = Array.from({ length: count }, (_, i) => {
    const s: Json = { ...base, id: `s${i + 1}`, label: `Sensor ${i + 1}`, position_m: [0.002 * ((i % 8) - 3.5), 0.002 * (Math.floor(i / 8) - 3.5), 0.01 + 0.0005 * i] };
    delete s.distance_m;
    return s;
  });
  const axes = ['x', 'y', 'z'] as const;
  const reflectors = Array.from({ length: planes }, (_, i) => {
    const axis = axes[i % 3] as string;
    const side = Math.floor(i / 3) % 2 === 0 ? 1 : -1;
    return { label: `Plate ${i + 1}`, axis, position_m: axis === 'z' ? (side > 0 ? 0.05 + 0.002 * i : -0.005 - 0.001 * i) : side * (0.02 + 0.001 * i), reflection: 0.4 };
  });
  return { ...demo, sensors, reflectors, echoOrder };
}

export interface LimitCase {
  name: string;
  plan: Json;
  planText: string;
}

/** The documented limits, one case each, and all of them together. */
export function limitCases(demo: Json): LimitCase[] {
  const maxSensors = PLAN_LIMITS.sensorCount[1];
  const cases: [string, Json][] = [
    ['demo plan', demo],
    [`custom pulse, ${CUSTOM_PULSE_MAX_POINTS} points`, { ...demo, heater: customPulse(demo, CUSTOM_PULSE_MAX_POINTS) }],
    [`${maxSensors} sensors, no planes`, crowded(demo, maxSensors, 0, 0)],
    [`1 sensor, ${MAX_REFLECTORS} planes, echo order ${MAX_ECHO_ORDER}`, crowded(demo, 1, MAX_REFLECTORS, MAX_ECHO_ORDER)],
    [`${maxSensors} sensors × ${MAX_REFLECTORS} planes × echo order ${MAX_ECHO_ORDER}`, crowded(demo, maxSensors, MAX_REFLECTORS, MAX_ECHO_ORDER)],
    [`all of them with a ${CUSTOM_PULSE_MAX_POINTS}-point pulse`, { ...crowded(demo, maxSensors, MAX_REFLECTORS, MAX_ECHO_ORDER), heater: customPulse(demo, CUSTOM_PULSE_MAX_POINTS) }],
  ];
  return cases.map(([name, plan]) => ({ name, plan, planText: JSON.stringify(plan) }));
}

/** A sensor CSV of `count` sensors on a sphere of 150 mm around a source near the centre, at 1.8 K (u₂ = 19.90 m/s). */
export function locateCsv(count = LOCATE_MAX_SENSORS): string {
  const rows = ['label,x_m,y_m,z_m,arrival_s,arrival_sd_s'];
  const source = [0.01, -0.02, 0.005];
  for (let i = 0; i < count; i++) {
    const z = 1 - (2 * (i + 0.5)) / count;
    const r = Math.sqrt(1 - z * z);
    const phi = i * Math.PI * (3 - Math.sqrt(5));
    const p = [0.15 * r * Math.cos(phi), 0.15 * r * Math.sin(phi), 0.15 * z];
    const d = Math.hypot((p[0] ?? 0) - (source[0] ?? 0), (p[1] ?? 0) - (source[1] ?? 0), (p[2] ?? 0) - (source[2] ?? 0));
    rows.push(`S${i + 1},${p.map((v) => v.toFixed(5)).join(',')},${(d / 19.9).toFixed(7)},0.00005`);
  }
  return `${rows.join('\n')}\n`;
}
