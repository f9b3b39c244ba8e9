export { useHeliumProperties } from './derived';
export type { LocateOrigin, LocateSlice } from '../locate/locate-slice';
export type { PlannerSlice, PlannerSource, TimelineView } from '../planner/planner-slice';
export { type PreferencesSlice, THEME_CHOICES, type ThemeChoice } from '../preferences/preferences-slice';
export { resetSekundoStore, useSekundoStore } from './sekundo-store';
export type { SekundoState } from './state';
export { DEFAULT_TEMPERATURE_K, type TemperatureSlice } from '../temperature/temperature-slice';
export type { ViewSlice } from '../layout/view-slice';
