import type { ConverterSlice } from '../converter/converter-slice';
import type { FieldsSlice } from '../fields/fields-slice';
import type { RehearseSlice } from '../planner/rehearse/rehearse-slice';
import type { LocateSlice } from './locate-slice';
import type { PlannerSlice } from './planner-slice';
import type { PreferencesSlice } from './preferences-slice';
import type { ResonatorSlice } from '../resonator/resonator-slice';
import type { TemperatureSlice } from './temperature-slice';
import type { ViewSlice } from './view-slice';
import type { WatchSlice } from '../converter/watch/watch-slice';

/** The whole store: inputs only. Results are derived from them with kernel calls. */
export type SekundoState = TemperatureSlice & ViewSlice & PlannerSlice & ConverterSlice & LocateSlice & ResonatorSlice & PreferencesSlice & FieldsSlice & WatchSlice & RehearseSlice;
