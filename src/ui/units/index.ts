/**
 * Shown units, one place for every view: tables, cards, charts, CSV exports, messages and fields.
 * The store and the kernel stay in SI; values are converted only where they are shown or typed
 * (src/io/quantity.ts does the arithmetic).
 *
 * - unit-choices.ts: the header's chosen unit per kind (temperature, length, time, pressure, heat
 *   flux), `DisplayUnits`, kept in the preferences slice as `displayUnits`.
 * - use-display-unit.ts: `useDisplayUnit(kind)`, a kind's chosen unit with fromSi/format/measured.
 * - unit-views.ts: the four kinds results use at once (`useUnitViews`, `currentUnitViews` for
 *   exports built at click time), CSV column names with their unit, temperatures on chart axes.
 * - ladders.ts: ladders of units for quantities shown at the size that suits them (sds, lags,
 *   temperature differences, frequencies…), `KINDS` (what a field of each kind parses and shows),
 *   and `chosenLadders`/`useShownLadders` (the ladders with the header's units swapped in).
 * - format-number.ts, format-measured.ts: significant digits, a true minus sign, and a value with
 *   its sd rounded to the digits the sd supports ("19.90 ± 0.05").
 * - temperature-text.ts: temperatures as text in K or mK, and checks of a temperature's range.
 *
 * Store slices import the single files (never this index, which reaches React and the store).
 */
export * from './format-measured';
export * from './format-number';
export * from './ladders';
export * from './temperature-text';
export * from './unit-choices';
export * from './unit-views';
export * from './use-display-unit';
export * from './use-shown-ladders';
