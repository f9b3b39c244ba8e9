/**
 * Display units a person can choose, one per kind of quantity, for every view: the kernel and the
 * store stay in SI; values are converted only where they are shown or typed (src/io/quantity.ts
 * does the arithmetic). The choice lives in the store (preferences slice) and in the browser's
 * preferences, under "unit.<kind>".
 */
import { type Dimension, fromBaseUnit, toBaseUnit, type Unit } from '../../io/quantity';

/** One unit a person may choose: the symbol the parser knows and the symbol as shown. */
export interface UnitChoice<U extends string = string> {
  unit: U;
  /** As printed (µ, ²). */
  shown: string;
}

const choice = <const U extends Unit>(unit: U, shown: string = unit): UnitChoice<U> => ({ unit, shown });

/** The kinds of quantity with a chosen display unit, their dimension and choices (default first). */
export const UNIT_KINDS = {
  temperature: {
    label: 'Temperature',
    dimension: 'temperature',
    choices: [choice('K'), choice('mK')],
  },
  length: {
    label: 'Length',
    dimension: 'length',
    choices: [choice('mm'), choice('cm'), choice('m')],
  },
  time: {
    label: 'Time',
    dimension: 'time',
    choices: [choice('ms'), choice('µs'), choice('s')],
  },
  pressure: {
    label: 'Pressure',
    dimension: 'pressure',
    choices: [choice('Pa'), choice('mbar'), choice('torr')],
  },
  heatFlux: {
    label: 'Heat flux',
    dimension: 'heat flux',
    choices: [choice('W/cm2', 'W/cm²'), choice('W/m2', 'W/m²')],
  },
} as const satisfies Record<string, { label: string; dimension: Dimension; choices: readonly UnitChoice[] }>;

export type UnitKind = keyof typeof UNIT_KINDS;

/** The unit symbols a kind may be shown in, e.g. `'mm' | 'cm' | 'm'` for length. */
export type DisplayUnitOf<K extends UnitKind> = (typeof UNIT_KINDS)[K]['choices'][number]['unit'];

/** The chosen unit of every kind. */
export type DisplayUnits = { [K in UnitKind]: DisplayUnitOf<K> };

export const UNIT_KIND_LIST = Object.keys(UNIT_KINDS) as UnitKind[];

/** Units before anyone chooses: what the views showed before there was a choice. */
export const DEFAULT_DISPLAY_UNITS: DisplayUnits = {
  temperature: 'K',
  length: 'mm',
  time: 'ms',
  pressure: 'Pa',
  heatFlux: 'W/cm2',
};

/** `text` as a unit of `kind`, or null when it is not one of its choices (a stale or foreign preference). */
export function asDisplayUnit<K extends UnitKind>(kind: K, text: string | undefined): DisplayUnitOf<K> | null {
  const found = (UNIT_KINDS[kind].choices as readonly UnitChoice[]).find((c) => c.unit === text);
  return found ? (found.unit as DisplayUnitOf<K>) : null;
}

/** The unit as printed: "W/cm²", "µs". */
export function shownUnit(unit: string): string {
  for (const kind of UNIT_KIND_LIST) {
    const found = (UNIT_KINDS[kind].choices as readonly UnitChoice[]).find((c) => c.unit === unit);
    if (found) return found.shown;
  }
  return unit;
}

/** An SI value in a chosen display unit. */
export function fromSi(value_si: number, unit: DisplayUnitOf<UnitKind>): number {
  return fromBaseUnit(value_si, unit);
}

/** A value in a display unit, back in SI. */
export function toSi(value: number, unit: DisplayUnitOf<UnitKind>): number {
  return toBaseUnit(value, unit);
}
