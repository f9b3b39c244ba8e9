import type { ConverterSlice } from '../converter/converter-slice';
import type { FieldsSlice } from '../fields/fields-slice';
import type { LocateSlice } from '../locate/locate-slice';
import type { PlannerSlice } from '../planner/planner-slice';
import type { RehearseSlice } from '../planner/rehearse/rehearse-slice';
import type { PreferencesSlice } from '../preferences/preferences-slice';
import type { ResonatorSlice } from '../resonator/resonator-slice';
import type { TemperatureSlice } from '../temperature/temperature-slice';
import type { ViewSlice } from '../layout/view-slice';
import type { WatchSlice } from '../converter/watch/watch-slice';

/** The whole store: inputs only. Results are derived from them with kernel calls. */
export type SekundoState = TemperatureSlice & ViewSlice & PlannerSlice & ConverterSlice & LocateSlice & ResonatorSlice & PreferencesSlice & FieldsSlice & WatchSlice & RehearseSlice;
