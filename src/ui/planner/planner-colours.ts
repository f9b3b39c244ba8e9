/**
 * Colours of the planner's charts and tables, in the house palette (app/styles.css,
 * src/ui/charts/chart-theme.ts): one colour per sensor, the heater in muted ink, the record window
 * in a faint teal, the planned point in the amber that marks "you are here" elsewhere.
 */

/** Sensor colours in plan order, repeating after ten; distinct in hue and in lightness. */
export const SENSOR_COLOURS = [
  '#0b7a76', // teal
  '#4a5c9c', // indigo
  '#b5542a', // rust
  '#8a4f8f', // plum
  '#5b7b1f', // olive
  '#2b6fa8', // steel blue
  '#a3405f', // raspberry
  '#8c6a14', // ochre
  '#3d4d5c', // slate
  '#2f9a8e', // light teal
] as const;

export function sensorColour(index: number): string {
  return SENSOR_COLOURS[index % SENSOR_COLOURS.length] as string;
}

export const PLANNER_COLOURS = {
  heater: '#5a6e8a',
  heaterFill: 'rgba(90, 110, 138, 0.22)',
  recordFill: 'rgba(11, 122, 118, 0.07)',
  recordEdge: 'rgba(11, 109, 105, 0.55)',
  planned: '#d9772b',
  target: '#10223a',
  insensitiveFill: 'rgba(255, 255, 255, 0.62)',
  insensitiveEdge: '#5a6e8a',
} as const;

/**
 * The resolution map's colour ramp, from fine (deep teal) through pale sand to coarse (rust):
 * sequential in lightness towards the middle so neighbouring bands stay apart.
 */
const RAMP = ['#0b4f4c', '#0b6d69', '#1f8f86', '#55b3a6', '#9fd3c8', '#e4ecd9', '#f3dcb8', '#eab27e', '#d9772b', '#b5542a', '#8a3718'] as const;

/** `count` colours spread evenly along the ramp (fine to coarse). */
export function bandColours(count: number): string[] {
  if (count <= 1) return [RAMP[0]];
  return Array.from({ length: count }, (_, i) => {
    const x = (i / (count - 1)) * (RAMP.length - 1);
    return mix(RAMP[Math.floor(x)] as string, RAMP[Math.min(RAMP.length - 1, Math.floor(x) + 1)] as string, x - Math.floor(x));
  });
}

function mix(a: string, b: string, f: number): string {
  const pa = parse(a);
  const pb = parse(b);
  const c = pa.map((v, i) => Math.round(v + ((pb[i] as number) - v) * f));
  return `#${c.map((v) => v.toString(16).padStart(2, '0')).join('')}`;
}

function parse(hex: string): [number, number, number] {
  return [Number.parseInt(hex.slice(1, 3), 16), Number.parseInt(hex.slice(3, 5), 16), Number.parseInt(hex.slice(5, 7), 16)];
}
