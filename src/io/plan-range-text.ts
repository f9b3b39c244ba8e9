/* Values and ranges as plan-file messages quote them: "10 ns–10 s", "(got …)". */

/** Units that read well with an SI prefix in messages (10 ns, 1 µm, 10 kW). */
const PREFIXED_UNITS: ReadonlySet<string> = new Set(['s', 'm', 'Hz', 'W', 'V']);
const PREFIXES: readonly (readonly [number, string])[] = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'µ'],
  [1e-9, 'n'],
  [1e-12, 'p'],
  [1e-15, 'f'],
];

export function plain(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

/** A value in SI for a message: "10 ns", "1 µm", "0.3 K", "1e-12 m²". */
export function formatValue(x: number, unit: string): string {
  const space = unit === '' ? '' : ' ';
  if (x !== 0 && PREFIXED_UNITS.has(unit)) {
    const magnitude = Math.abs(x) * (1 + 1e-12);
    const prefix = PREFIXES.find(([size]) => magnitude >= size);
    if (prefix && magnitude < 1e12) return `${plain(x / prefix[0])} ${prefix[1]}${unit}`;
  }
  return `${plain(x)}${space}${unit}`;
}

/** "10 ns–10 s", "0.3–4.24 K", "from -1 to 1": a closed range for a message. */
export function formatPlanRange(min: number, max: number, unit: string): string {
  const a = formatValue(min, unit);
  const b = formatValue(max, unit);
  if (min < 0) return `from ${a} to ${b}`;
  const unitOfA = a.slice(a.indexOf(' ') + 1);
  const sameUnit = a.includes(' ') && b.includes(' ') && unitOfA === b.slice(b.indexOf(' ') + 1);
  return sameUnit ? `${a.slice(0, a.indexOf(' '))}–${b}` : `${a}–${b}`;
}

/** The value found, for "(got …)". */
export function show(x: unknown): string {
  if (x === undefined) return 'nothing';
  if (x === null) return 'null';
  if (Array.isArray(x)) return `a list of ${x.length}`;
  if (typeof x === 'object') return 'an object';
  if (typeof x === 'string') return JSON.stringify(x.length > 40 ? `${x.slice(0, 40)}…` : x);
  return String(x);
}
