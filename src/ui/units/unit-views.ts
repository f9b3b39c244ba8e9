/**
 * The converter's results in the header's display units (temperature, length, time, pressure):
 * the store and the kernel stay in SI; tables, cards, chart axes and CSV exports convert here. A
 * measured value and its sd are rounded together (src/ui/format/format-measured.ts). CSV columns
 * name their unit ("T_mK", "delay_us") so a file says what it holds, as the explorer's and the
 * locate view's exports do.
 */
import { columnWithUnit } from '../../io/csv-common';
import { fromBaseUnit, type Unit } from '../../io/quantity';
import { formatFixed } from './format-number';
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';
import { plain } from './format-number';
import { useSekundoStore } from '../store';
import type { DisplayUnits } from './unit-choices';
import { type DisplayUnitView, displayUnitView, useDisplayUnit } from './use-display-unit';

/** The display units the converter shows: one view per kind. */
export interface UnitViews {
  temperature: DisplayUnitView<'temperature'>;
  length: DisplayUnitView<'length'>;
  time: DisplayUnitView<'time'>;
  pressure: DisplayUnitView<'pressure'>;
}

/** The views of a set of display units (exports read the store at click time). */
export function unitViewsOf(units: Pick<DisplayUnits, keyof UnitViews>): UnitViews {
  return {
    temperature: displayUnitView(units.temperature),
    length: displayUnitView(units.length),
    time: displayUnitView(units.time),
    pressure: displayUnitView(units.pressure),
  };
}

/** The display units now, outside React (exports built at click time). */
export function currentUnitViews(): UnitViews {
  return unitViewsOf(useSekundoStore.getState().displayUnits);
}

/** The header's display units for the converter's results. */
export function useUnitViews(): UnitViews {
  const temperature = useDisplayUnit('temperature');
  const length = useDisplayUnit('length');
  const time = useDisplayUnit('time');
  const pressure = useDisplayUnit('pressure');
  return { temperature, length, time, pressure };
}

/** A CSV column name ending in the view's unit: ("T", mK) → "T_mK", ("delay_sd", µs) → "delay_sd_us". */
export function csvColumn(base: string, view: { unit: Unit }): string {
  return columnWithUnit(base, view.unit);
}

/** An SI value (or none) in a display unit, for a CSV cell. */
export function inViewUnit<V extends number | null | undefined>(value: V, view: { fromSi: (v: number) => number }): number | Exclude<V, number> {
  return (typeof value === 'number' ? view.fromSi(value) : value) as number | Exclude<V, number>;
}

/**
 * A temperature that is no measurement (the one a rule points at, a range end, a difference), to
 * 0.1 mK as the kernel's own reasons give it: "1.8000 K", "1800.0 mK".
 */
export function fixedTemperatureText(T_K: number, unit: 'K' | 'mK'): string {
  return unit === 'mK' ? `${formatFixed(T_K * 1e3, 1)} mK` : `${formatFixed(T_K, 4)} K`;
}

/** A set limit of the kind (no measurement) in plain digits with its unit: "0.3 K", "300 mK". */
export function limitText(value_si: number, view: { fromSi: (v: number) => number; shown: string }): string {
  return `${plain(view.fromSi(value_si))} ${view.shown}`;
}

/** Decimals of a time on chart hovers and labels: 0.1 µs in any unit (as the locate view's predicted arrivals). */
export const TIME_DECIMALS: Readonly<Record<'ms' | 'µs' | 's', number>> = { ms: 4, 'µs': 1, s: 7 };

/**
 * A figure written with temperature in kelvin on the y axis, shown in `unit` instead: y values,
 * the axis title's "(K)" and hover text "%{y:.4f} K" follow (0.1 mK either way).
 */
export function temperatureOnY(figure: { data: PlotTrace[]; layout: PlotLayout }, unit: 'K' | 'mK'): { data: PlotTrace[]; layout: PlotLayout } {
  if (unit === 'K') return figure;
  const { data, layout } = figure;
  const factor = fromBaseUnit(1, unit);
  return {
    data: data.map((t) =>
      t.yaxis === undefined || t.yaxis === 'y' ? { ...t, y: t.y.map((v) => (v === null ? null : v * factor)), hovertemplate: t.hovertemplate?.replace(/%\{y:\.\d+f\} K/g, '%{y:.1f} mK') } : t,
    ),
    layout: {
      ...layout,
      yaxis: layout.yaxis && { ...layout.yaxis, title: layout.yaxis.title && { ...layout.yaxis.title, text: layout.yaxis.title.text.replace('(K)', '(mK)') } },
    },
  };
}
