/**
 * Number and table formatting for the command line's human-readable output.
 */

/** Significant digits for most printed values: the reference curves are good to ~0.1 %. */
export const DEFAULT_SIGNIFICANT_DIGITS = 5;
/** Digits used when quoting a range or an input back to the user (as the kernel's messages do). */
const PLAIN_DIGITS = 6;
/** Below this magnitude a value prints in exponent form, e.g. 3.1407e-6. */
const SMALL_MAGNITUDE = 1e-3;

/** Placeholder printed where a property does not exist (u₂ above Tλ, p_sat below 0.5 K). */
export const ABSENT = '—';

/** `x` to `digits` significant digits, plain notation where readable, exponent form for tiny values. */
export function formatSignificant(x: number, digits = DEFAULT_SIGNIFICANT_DIGITS): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const magnitude = Math.abs(x);
  if (magnitude < SMALL_MAGNITUDE) return x.toExponential(digits - 1);
  if (magnitude >= 10 ** digits) return x.toFixed(0);
  return x.toPrecision(digits);
}

/** `x` with at most six significant digits and no trailing zeros, as the kernel quotes numbers. */
export function formatPlain(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  return Number(x.toPrecision(PLAIN_DIGITS)).toString();
}

/** A closed range as users read it: "0.3–4.24 K". */
export function formatRange(range: readonly [number, number], unit: string): string {
  return `${formatPlain(range[0])}–${formatPlain(range[1])} ${unit}`;
}

/** How each column of {@link alignTable} is padded. */
export type Alignment = 'left' | 'right';

/**
 * Lays rows of cells out in columns separated by two spaces, trailing spaces trimmed.
 * Every row must have one cell per entry of `alignments`.
 */
export function alignTable(rows: readonly (readonly string[])[], alignments: readonly Alignment[]): string[] {
  const widths = alignments.map((_, column) => Math.max(0, ...rows.map((row) => [...(row[column] ?? '')].length)));
  return rows.map((row) =>
    alignments
      .map((alignment, column) => pad(row[column] ?? '', widths[column] ?? 0, alignment))
      .join('  ')
      .trimEnd(),
  );
}

function pad(cell: string, width: number, alignment: Alignment): string {
  const fill = ' '.repeat(Math.max(0, width - [...cell].length));
  return alignment === 'left' ? cell + fill : fill + cell;
}
