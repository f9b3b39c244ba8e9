import { useMemo } from 'react';
import { formatSignificant } from './format-number';
import { formatMeasured, type MeasuredText } from './format-measured';
import { useSekundoStore } from '../store';
import { type DisplayUnitOf, fromSi, shownUnit, toSi, type UnitKind } from './unit-choices';

/** A kind's chosen display unit and how to show SI values in it. */
export interface DisplayUnitView<K extends UnitKind> {
  unit: DisplayUnitOf<K>;
  /** The unit as printed ("W/cm²", "µs"). */
  shown: string;
  /** An SI value as a number in the unit (tables, chart axes, CSV). */
  fromSi: (value_si: number) => number;
  /** A number in the unit back in SI (typed values). */
  toSi: (value: number) => number;
  /** An SI value as text in the unit, `digits` significant digits (4 by default), without the unit. */
  format: (value_si: number, digits?: number) => string;
  /** An SI value and its SI sd, rounded together ("19.90 ± 0.05"), without the unit. */
  measured: (value_si: number, sd_si: number | null, digits?: number) => MeasuredText;
}

/** A display-unit view of a unit (tests, or code outside React). */
export function displayUnitView<K extends UnitKind>(unit: DisplayUnitOf<K>): DisplayUnitView<K> {
  const scale = (v: number) => fromSi(v, unit);
  return {
    unit,
    shown: shownUnit(unit),
    fromSi: scale,
    toSi: (v) => toSi(v, unit),
    format: (v, digits) => formatSignificant(scale(v), digits),
    measured: (v, sd, digits) => formatMeasured(scale(v), sd === null ? null : scale(sd), digits),
  };
}

/**
 * The chosen display unit of `kind` (temperature, length, time, pressure, heat flux), from the
 * store. Every view that shows such a quantity reads it here, so one choice changes them all.
 */
export function useDisplayUnit<K extends UnitKind>(kind: K): DisplayUnitView<K> {
  const unit = useSekundoStore((s) => s.displayUnits[kind]) as DisplayUnitOf<K>;
  return useMemo(() => displayUnitView<K>(unit), [unit]);
}
