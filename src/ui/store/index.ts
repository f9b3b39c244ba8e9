export { useHeliumProperties } from './derived';
export type { LocateOrigin, LocateSlice } from './locate-slice';
export type { PlannerSlice, PlannerSource, TimelineView } from './planner-slice';
export { type PreferencesSlice, THEME_CHOICES, type ThemeChoice } from './preferences-slice';
export { resetSekundoStore, useSekundoStore } from './sekundo-store';
export type { SekundoState } from './state';
export { DEFAULT_TEMPERATURE_K, type TemperatureSlice } from './temperature-slice';
export type { ViewSlice } from './view-slice';
