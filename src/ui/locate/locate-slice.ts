import type { StateCreator } from 'zustand';
import { LOCATE_MAX_SENSORS, type LocateSensor } from '../../io/locate-csv';
import {
  DEFAULT_LOCATE_DISPLAY,
  DEFAULT_LOCATE_OPTIONS,
  type LocateDisplay,
  type LocateEdit,
  type LocateInputs,
  type LocateOptionsInput,
  type LocateRowInput,
} from './locate-inputs';
import type { TraceInfo } from '../converter/trace/trace-protocol';
import { type ArrivalUpdate, type ChannelChoice, DEFAULT_TRACE_PICKER, type TracePickerSettings, withArrivals } from './trace-arrivals';
import { readFieldText } from '../fields/field-spec';
import { LOCATE_FIELD_PREFIX, locateFieldKey } from './locate-fields';
import { editTraceSetting, TRACE_SETTING_KEYS, type TraceSettingKey, traceSettingKey, traceSettingSpec } from './trace-fields';
import type { FieldsSlice } from '../fields/fields-slice';

/** Store keys of the trace picker's typed settings. */
const SETTING_FIELDS: ReadonlySet<string> = new Set(TRACE_SETTING_KEYS.map(traceSettingKey));

/** Where the sensors on screen came from. */
export interface LocateOrigin {
  kind: 'demo' | 'built-in' | 'file';
  /** File name, or the demo's name. */
  name: string;
  /** What to tell the user about it (e.g. why the demo did not load); null for nothing. */
  note: string | null;
}

/** The trace file read for the "from traces" panel (its numbers stay in the trace worker). */
export interface LocateTraceFile {
  /** The worker's id of the file. */
  id: string;
  name: string;
  size: number;
  info: TraceInfo;
}

/** A trace file being read: its progress. */
export interface LocateTraceReading {
  id: string;
  name: string;
  bytes: number;
  totalBytes: number;
  rows: number;
}

/**
 * The source-location view's inputs: sensor rows and fit options (always values the fields
 * accepted) and how results are shown; typed fields keep their drafts and messages in the fields
 * slice under "locate." (src/ui/fields). Results are
 * derived from these with the kernel (src/ui/locate/derive-locate.ts), never stored.
 */
export interface LocateSlice {
  locateRows: readonly LocateRowInput[];
  locateOptions: LocateOptionsInput;
  locateDisplay: LocateDisplay;
  /** 'idle' until the view first opens, 'loading' while the demo is fetched, then 'ready'. */
  locateStatus: 'idle' | 'loading' | 'ready';
  locateOrigin: LocateOrigin;
  /** Why a control's change (or a file, or an action) was refused, by key; the inputs keep their last good value. */
  locateErrors: Readonly<Record<string, string>>;
  beginLocateLoad: () => void;
  /** Replaces every sensor (demo, file); clears drafts and messages. Options are kept unless given. */
  loadLocateSensors: (sensors: readonly LocateSensor[], origin: LocateOrigin, options?: Partial<LocateOptionsInput>) => void;
  /** A change from a typed field: made when the inputs take it; returns the refusal, or null. */
  applyLocateEdit: (change: (inputs: LocateInputs) => LocateEdit | LocateInputs) => string | null;
  /** A change from a control (checkbox, select, button); a refusal is shown under `key`. */
  changeLocate: (key: string, change: (inputs: LocateInputs) => LocateEdit | LocateInputs) => void;
  addLocateSensor: () => void;
  removeLocateSensor: (key: string) => void;
  /** A message under `key` that no edit caused (a file that could not be read). */
  refuseLocate: (key: string, message: string) => void;
  clearLocateMessage: (key: string) => void;
  setLocateDisplay: (change: Partial<LocateDisplay>) => void;

  /** The trace file whose channels give arrivals ("from traces" panel); null before one is read. */
  locateTraceFile: LocateTraceFile | null;
  /** The file being read, or null. */
  locateTraceReading: LocateTraceReading | null;
  /** Channel → sensor choices that differ from matching by name. */
  locateTraceChoice: ChannelChoice;
  locateTracePicker: TracePickerSettings;
  /** Progress of a file being read (a new reading replaces the one shown). */
  setLocateTraceReading: (reading: LocateTraceReading | null) => void;
  /** A file read: it replaces the one before, channels match by name again, file messages go. */
  setLocateTraceFile: (file: LocateTraceFile) => void;
  /** A channel's sensor (a row key), or null for "not used". */
  chooseLocateTraceSensor: (channel: string, key: string | null) => void;
  /** A change from a picker control (select). */
  setLocateTracePicker: (change: Partial<TracePickerSettings>) => void;
  /** A good value typed into a picker setting: set when the window still runs forwards; returns the refusal, or null. */
  setLocateTraceSetting: (key: TraceSettingKey, value: number | null) => string | null;
  /**
   * Writes arrival times and timing sds into the given sensors, in one change; every other sensor
   * and field stays as it was. Drafts and messages of the written fields go.
   */
  setLocateArrivals: (updates: readonly ArrivalUpdate[]) => void;
}

/** Store key of messages about adding and removing rows. */
export const LOCATE_ROWS_KEY = 'rows';

let keyCounter = 0;
function newKey(): string {
  keyCounter += 1;
  return `s${keyCounter}`;
}

function without(record: Readonly<Record<string, string>>, key: string): Record<string, string> {
  if (!(key in record)) return record as Record<string, string>;
  const copy = { ...record };
  delete copy[key];
  return copy;
}

function withoutPrefix(record: Readonly<Record<string, string>>, prefix: string): Record<string, string> {
  return Object.fromEntries(Object.entries(record).filter(([key]) => !key.startsWith(prefix)));
}

/** A label not yet used: S1, S2, … */
function freeLabel(rows: readonly LocateRowInput[]): string {
  const used = new Set(rows.map((r) => r.label));
  for (let n = rows.length + 1; ; n++) if (!used.has(`S${n}`)) return `S${n}`;
}

/** What the locate slice reads besides its own state: the fields' drafts. */
type LocateStore = LocateSlice & FieldsSlice;

export const createLocateSlice: StateCreator<LocateStore, [], [], LocateSlice> = (set, get) => {
  const inputs = (): LocateInputs => ({ rows: get().locateRows, options: get().locateOptions });
  const refuse = (key: string, message: string): void => set({ locateErrors: { ...get().locateErrors, [key]: message } });

  return {
    locateRows: [],
    locateOptions: DEFAULT_LOCATE_OPTIONS,
    locateDisplay: DEFAULT_LOCATE_DISPLAY,
    locateStatus: 'idle',
    locateOrigin: { kind: 'built-in', name: 'built-in layout', note: null },
    locateErrors: {},

    beginLocateLoad: () => set({ locateStatus: 'loading' }),

    loadLocateSensors: (sensors, origin, options) => {
      get().dropFieldDrafts(LOCATE_FIELD_PREFIX);
      set({
        locateRows: sensors.map((s) => ({ ...s, key: newKey() })),
        locateOrigin: origin,
        locateOptions: options ? { ...get().locateOptions, ...options } : get().locateOptions,
        locateStatus: 'ready',
        locateErrors: {},
      });
    },

    applyLocateEdit: (change) => {
      const result = change(inputs());
      const edit: LocateEdit = 'ok' in result ? result : { ok: true, inputs: result };
      if (!edit.ok) return edit.message;
      set({ locateRows: edit.inputs.rows, locateOptions: edit.inputs.options });
      return null;
    },

    changeLocate: (key, change) => {
      const result = change(inputs());
      const edit: LocateEdit = 'ok' in result ? result : { ok: true, inputs: result };
      if (edit.ok) set({ locateRows: edit.inputs.rows, locateOptions: edit.inputs.options, locateErrors: without(get().locateErrors, key) });
      else refuse(key, edit.message);
    },

    addLocateSensor: () => {
      const rows = get().locateRows;
      if (rows.length >= LOCATE_MAX_SENSORS) return refuse(LOCATE_ROWS_KEY, `At most ${LOCATE_MAX_SENSORS} sensors.`);
      const last = rows.at(-1);
      const row: LocateRowInput = {
        key: newKey(),
        label: freeLabel(rows),
        position_m: last ? [last.position_m[0], last.position_m[1], last.position_m[2]] : [0, 0, 0],
        arrival_s: null,
        arrivalSd_s: null,
      };
      set({ locateRows: [...rows, row], locateErrors: without(get().locateErrors, LOCATE_ROWS_KEY) });
    },

    removeLocateSensor: (key) => {
      const { locateRows, locateErrors } = get();
      get().dropFieldDrafts(locateFieldKey(`row.${key}.`));
      set({
        locateRows: locateRows.filter((r) => r.key !== key),
        locateErrors: withoutPrefix(without(locateErrors, LOCATE_ROWS_KEY), `row.${key}.`),
      });
    },

    refuseLocate: refuse,
    clearLocateMessage: (key) => set({ locateErrors: without(get().locateErrors, key) }),
    setLocateDisplay: (change) => set({ locateDisplay: { ...get().locateDisplay, ...change } }),

    locateTraceFile: null,
    locateTraceReading: null,
    locateTraceChoice: {},
    locateTracePicker: DEFAULT_TRACE_PICKER,
    setLocateTraceReading: (reading) => set({ locateTraceReading: reading }),
    // A new file: its messages (file, apply) go; the picker settings and any refused text typed into them stay with their messages.
    setLocateTraceFile: (file) =>
      set({
        locateTraceFile: file,
        locateTraceReading: null,
        locateTraceChoice: {},
        locateErrors: Object.fromEntries(Object.entries(get().locateErrors).filter(([key]) => !key.startsWith('traces.') || SETTING_FIELDS.has(key))),
      }),
    chooseLocateTraceSensor: (channel, key) => set({ locateTraceChoice: { ...get().locateTraceChoice, [channel]: key } }),
    setLocateTracePicker: (change) => set({ locateTracePicker: { ...get().locateTracePicker, ...change } }),
    setLocateTraceSetting: (key, value) => {
      const result = editTraceSetting(get().locateTracePicker, key, value);
      if (!result.ok) return result.message;
      set({ locateTracePicker: result.settings });
      // The window's other end may have been refused only because of this one: read its text again.
      const other = key === 'from' ? 'to' : key === 'to' ? 'from' : null;
      const otherKey = other && locateFieldKey(traceSettingKey(other));
      const draft = otherKey ? get().fieldDrafts[otherKey] : undefined;
      if (other && otherKey && draft && draft.message !== null) {
        const read = readFieldText(traceSettingSpec(other), draft.text, draft.unit);
        const again = read.ok ? editTraceSetting(get().locateTracePicker, other, read.value) : null;
        if (again?.ok) {
          set({ locateTracePicker: again.settings });
          get().dropFieldDraft(otherKey);
        }
      }
      return null;
    },
    setLocateArrivals: (updates) => {
      const { locateRows, locateErrors } = get();
      const fields = new Set(updates.flatMap((u) => [`row.${u.key}.arrival`, `row.${u.key}.sd`]));
      for (const field of fields) get().dropFieldDraft(locateFieldKey(field));
      const keep = (record: Readonly<Record<string, string>>) => Object.fromEntries(Object.entries(record).filter(([key]) => !fields.has(key)));
      set({ locateRows: withArrivals(locateRows, updates), locateErrors: keep(locateErrors) });
    },
  };
};
