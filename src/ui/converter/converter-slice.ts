import type { StateCreator } from 'zustand';
import type { DelayBatch } from '../../io/delay-batch';
import type { Unit } from '../../io/quantity';
import type { PickerKind } from '../../physics';
import type { SekundoState } from '../store/state';
import { DEFAULT_DISPLAY_UNITS, type DisplayUnits } from '../units/unit-choices';
import { type ChoiceKind, crossFieldProblem, type FieldValues } from './converter-checks';
import { type ConverterFieldKey, FIELD_SPECS, fieldText, followedUnit, readField } from './converter-fields';
import { readDistanceRows } from './table-input';
import type { TraceInfo } from './trace/trace-protocol';

/*
 * The converter's inputs: typed fields (last good value in SI, the text as typed, its unit, and
 * the message for a refused entry), the way of choosing among candidates, the distance table and
 * sweep as typed with their last good points, the batch file read, and the trace files loaded
 * with the picking options. Results (speeds, candidates, fits, picks, series) are derived from
 * these with the kernel in memos, never stored.
 */

export type ConverterMode = 'reading' | 'batch' | 'trace' | 'watch';
export type ReadingMethod = 'single' | 'distances' | 'sweep';

export interface FieldState {
  /** The text in the field (as typed, or the value in `unit`). */
  text: string;
  /** The unit of the text and of the field's menu. */
  unit: Unit | '';
  /** Last good value, SI; a refused entry never replaces it. null: empty (optional fields). */
  value: number | null;
  /**
   * Whether the unit was picked in the field's own menu. Until then the field follows the header's
   * display units (see followedUnit in converter-fields.ts); after that it keeps its own choice.
   */
  ownUnit: boolean;
}

export type DistanceColumn = 'distance' | 'delay' | 'sd';

export interface DistanceRow {
  key: string;
  distance: string;
  delay: string;
  sd: string;
}

/** Last good points of the distance table (SI), with their 1-based table rows. */
export interface DistancePoints {
  points: { distance_m: number; delay_s: number; delaySd_s?: number }[];
  rows: number[];
}

export interface BatchInput {
  fileName: string;
  batch: DelayBatch;
}

export type TraceFileStatus = 'queued' | 'reading' | 'ready' | 'failed' | 'cancelled';

export interface TraceFileEntry {
  id: string;
  name: string;
  size: number;
  status: TraceFileStatus;
  /** Why it failed or was refused; null otherwise. */
  message: string | null;
  info: TraceInfo | null;
}

export interface TraceProgress {
  id: string;
  name: string;
  /** 1-based position of the file in the files being read now, and how many they are. */
  index: number;
  count: number;
  bytes: number;
  totalBytes: number;
  rows: number;
}

export type Polarity = 'auto' | 'positive' | 'negative';

export interface ConverterSlice {
  converterMode: ConverterMode;
  converterMethod: ReadingMethod;
  converterFields: Readonly<Record<ConverterFieldKey, FieldState>>;
  converterErrors: Readonly<Partial<Record<ConverterFieldKey, string>>>;
  converterChoice: ChoiceKind;
  converterDistanceRows: readonly DistanceRow[];
  converterDistanceUnits: { distance: Unit; delay: Unit; sd: Unit };
  converterDistancePoints: DistancePoints | null;
  converterDistanceError: string | null;
  converterSweepText: string;
  converterSweepUnit: Unit;
  converterSweepPoints: { x: number; delay_s: number }[] | null;
  converterSweepError: string | null;
  converterBatch: BatchInput | null;
  converterBatchError: string | null;
  converterTraceFiles: readonly TraceFileEntry[];
  converterTraceProgress: TraceProgress | null;
  /** Message about files refused before reading (too large, too many); null for none. */
  converterTraceNotice: string | null;
  converterTraceSelected: string | null;
  /** Heater drive channel (time zero at its onset); null: none, time zero is the file's t = 0. */
  converterTraceHeater: string | null;
  /** Sensor channel; null: the first channel that is not the heater. */
  converterTraceSensor: string | null;
  converterTracePicker: PickerKind;
  converterTracePolarity: Polarity;
  converterTraceView: 'record' | 'arrival';

  setConverterMode: (mode: ConverterMode) => void;
  setConverterMethod: (method: ReadingMethod) => void;
  /** Text typed into a field; applied on commit. */
  editConverterField: (key: ConverterFieldKey, text: string) => void;
  /** Applies the field's text if it is valid alone and with the other fields; otherwise keeps the value and sets the message. */
  commitConverterField: (key: ConverterFieldKey) => void;
  /** Drops a refused or unfinished entry (Escape): the field shows its good value again. */
  discardConverterDraft: (key: ConverterFieldKey) => void;
  /** Changes the unit of a field: the value stays, the text is shown in the new unit. The field keeps this unit from now on. */
  setConverterFieldUnit: (key: ConverterFieldKey, unit: Unit) => void;
  /**
   * Shows the fields that follow the header's display units in those units (called when they
   * change): values stay as they are; a field with a draft or a refused entry keeps its text, unit
   * and message, and follows once the draft is applied or dropped.
   */
  followConverterDisplayUnits: () => void;
  /** Sets field values from a result ("use this path length"); each is checked like a typed one. */
  applyConverterValues: (values: Partial<Record<ConverterFieldKey, number>>) => void;
  setConverterChoice: (choice: ChoiceKind) => void;
  editConverterDistanceCell: (key: string, column: DistanceColumn, text: string) => void;
  addConverterDistanceRow: () => void;
  removeConverterDistanceRow: (key: string) => void;
  /** Replaces the table's rows from pasted lines (already split into cells). */
  setConverterDistanceRows: (rows: readonly { distance: string; delay: string; sd: string }[]) => void;
  setConverterDistanceUnit: (column: DistanceColumn, unit: Unit) => void;
  /** Sets the table's last good points, or refuses with a message (points unchanged). */
  commitConverterDistances: (result: { ok: true; points: DistancePoints } | { ok: false; message: string }) => void;
  editConverterSweep: (text: string) => void;
  setConverterSweepUnit: (unit: Unit) => void;
  commitConverterSweep: (result: { ok: true; points: { x: number; delay_s: number }[] } | { ok: false; message: string }) => void;
  loadConverterBatch: (input: BatchInput) => void;
  refuseConverterBatch: (message: string) => void;
  clearConverterBatch: () => void;
  addConverterTraceFiles: (files: readonly TraceFileEntry[]) => void;
  updateConverterTraceFile: (id: string, change: Partial<Omit<TraceFileEntry, 'id'>>) => void;
  removeConverterTraceFile: (id: string) => void;
  clearConverterTraceFiles: () => void;
  setConverterTraceProgress: (progress: TraceProgress | null) => void;
  setConverterTraceNotice: (notice: string | null) => void;
  selectConverterTrace: (id: string) => void;
  setConverterTraceChannels: (channels: { heater?: string | null; sensor?: string | null }) => void;
  setConverterTracePicker: (picker: PickerKind) => void;
  setConverterTracePolarity: (polarity: Polarity) => void;
  setConverterTraceView: (view: 'record' | 'arrival') => void;
}

const FIELD_KEYS = Object.keys(FIELD_SPECS) as ConverterFieldKey[];

function initialFields(units: DisplayUnits): Record<ConverterFieldKey, FieldState> {
  const fields = {} as Record<ConverterFieldKey, FieldState>;
  for (const key of FIELD_KEYS) {
    const spec = FIELD_SPECS[key];
    const unit = followedUnit(spec, units);
    fields[key] = { text: fieldText(spec, spec.initial, unit), unit, value: spec.initial, ownUnit: false };
  }
  return fields;
}

/** The unit a field shows once it has no draft: its own choice, or the header's. */
function shownUnitOf(key: ConverterFieldKey, field: FieldState, units: DisplayUnits): Unit | '' {
  return field.ownUnit ? field.unit : followedUnit(FIELD_SPECS[key], units);
}

/** SI values of the fields. */
export function valuesOf(fields: Readonly<Record<ConverterFieldKey, FieldState>>): FieldValues {
  const values = {} as Record<ConverterFieldKey, number | null>;
  for (const key of FIELD_KEYS) values[key] = fields[key].value;
  return values;
}

let rowCounter = 0;
function rowKey(): string {
  rowCounter += 1;
  return `row-${rowCounter}`;
}

/**
 * An invented example: three sensors 20, 35 and 50 mm from the heater in a bath near 1.90 K
 * (u₂ = 18.83 m/s) with a 12 µs lag, read to about ±1 µs. Demo data, not a measurement.
 */
const EXAMPLE_DISTANCE_ROWS = [
  { distance: '20', delay: '1.07507', sd: '' },
  { distance: '35', delay: '1.86960', sd: '' },
  { distance: '50', delay: '2.66783', sd: '' },
];

const EXAMPLE_DISTANCE_READ = readDistanceRows(EXAMPLE_DISTANCE_ROWS, { distance: 'mm', delay: 'ms', sd: 'µs' });
const EXAMPLE_DISTANCE_POINTS: DistancePoints | null = EXAMPLE_DISTANCE_READ.ok ? EXAMPLE_DISTANCE_READ.value : null;

function without<K extends string>(record: Readonly<Partial<Record<K, string>>>, key: K): Partial<Record<K, string>> {
  if (!(key in record)) return record;
  const copy = { ...record };
  delete copy[key];
  return copy;
}

export const createConverterSlice: StateCreator<SekundoState, [], [], ConverterSlice> = (set, get) => {
  /** Checks a new value of `key` with the others; applies it or records the message. */
  const apply = (key: ConverterFieldKey, text: string, unit: Unit | ''): void => {
    const spec = FIELD_SPECS[key];
    const read = readField(spec, text, unit);
    const { converterFields, converterErrors, converterMode, converterMethod, converterBatch, converterChoice, displayUnits } = get();
    if (!read.ok) {
      set({ converterErrors: { ...converterErrors, [key]: read.message } });
      return;
    }
    const next = { ...valuesOf(converterFields), [key]: read.value };
    const problem = crossFieldProblem(key, next, {
      reading: converterMode === 'reading' && converterMethod === 'single',
      batch: converterMode === 'batch' ? (converterBatch?.batch ?? null) : null,
      choice: converterChoice,
    });
    if (problem !== null) {
      set({ converterErrors: { ...converterErrors, [key]: problem } });
      return;
    }
    // The text was read in `unit`; the good value is shown in the unit the field shows now.
    const field = converterFields[key];
    const shown = field.ownUnit ? unit : followedUnit(spec, displayUnits);
    set({
      converterFields: { ...converterFields, [key]: { ...field, text: fieldText(spec, read.value, shown), unit: shown, value: read.value } },
      converterErrors: without(converterErrors, key),
    });
  };

  return {
    converterMode: 'reading',
    converterMethod: 'single',
    converterFields: initialFields(DEFAULT_DISPLAY_UNITS),
    converterErrors: {},
    converterChoice: 'none',
    converterDistanceRows: EXAMPLE_DISTANCE_ROWS.map((r) => ({ key: rowKey(), ...r })),
    converterDistanceUnits: { distance: 'mm', delay: 'ms', sd: 'µs' },
    converterDistancePoints: EXAMPLE_DISTANCE_POINTS,
    converterDistanceError: null,
    converterSweepText: '',
    converterSweepUnit: 'ms',
    converterSweepPoints: null,
    converterSweepError: null,
    converterBatch: null,
    converterBatchError: null,
    converterTraceFiles: [],
    converterTraceProgress: null,
    converterTraceNotice: null,
    converterTraceSelected: null,
    converterTraceHeater: null,
    converterTraceSensor: null,
    converterTracePicker: 'fraction',
    converterTracePolarity: 'auto',
    converterTraceView: 'record',

    setConverterMode: (mode) => set({ converterMode: mode }),
    setConverterMethod: (method) => set({ converterMethod: method }),

    editConverterField: (key, text) => {
      const { converterFields } = get();
      set({ converterFields: { ...converterFields, [key]: { ...converterFields[key], text } } });
    },

    commitConverterField: (key) => {
      const field = get().converterFields[key];
      apply(key, field.text, field.unit);
    },

    discardConverterDraft: (key) => {
      const { converterFields, converterErrors, displayUnits } = get();
      const field = converterFields[key];
      const unit = shownUnitOf(key, field, displayUnits);
      set({
        converterFields: { ...converterFields, [key]: { ...field, unit, text: fieldText(FIELD_SPECS[key], field.value, unit) } },
        converterErrors: without(converterErrors, key),
      });
    },

    setConverterFieldUnit: (key, unit) => {
      const { converterFields, converterErrors } = get();
      const field = converterFields[key];
      const spec = FIELD_SPECS[key];
      if (key in converterErrors) {
        // A refused text is re-read in the new unit.
        set({ converterFields: { ...converterFields, [key]: { ...field, unit, ownUnit: true } } });
        apply(key, field.text, unit);
        return;
      }
      set({ converterFields: { ...converterFields, [key]: { ...field, unit, ownUnit: true, text: fieldText(spec, field.value, unit) } } });
    },

    followConverterDisplayUnits: () => {
      const { converterFields, converterErrors, displayUnits } = get();
      let fields: Record<ConverterFieldKey, FieldState> | null = null;
      for (const key of FIELD_KEYS) {
        const field = converterFields[key];
        const spec = FIELD_SPECS[key];
        const unit = shownUnitOf(key, field, displayUnits);
        const draft = key in converterErrors || field.text !== fieldText(spec, field.value, field.unit);
        if (unit === field.unit || draft) continue;
        fields ??= { ...converterFields };
        fields[key] = { ...field, unit, text: fieldText(spec, field.value, unit) };
      }
      if (fields) set({ converterFields: fields });
    },

    applyConverterValues: (values) => {
      for (const [key, value] of Object.entries(values) as [ConverterFieldKey, number][]) {
        const field = get().converterFields[key];
        apply(key, fieldText(FIELD_SPECS[key], value, field.unit), field.unit);
      }
    },

    setConverterChoice: (choice) => set({ converterChoice: choice }),

    editConverterDistanceCell: (key, column, text) =>
      set({ converterDistanceRows: get().converterDistanceRows.map((r) => (r.key === key ? { ...r, [column]: text } : r)) }),
    addConverterDistanceRow: () => set({ converterDistanceRows: [...get().converterDistanceRows, { key: rowKey(), distance: '', delay: '', sd: '' }] }),
    removeConverterDistanceRow: (key) => set({ converterDistanceRows: get().converterDistanceRows.filter((r) => r.key !== key) }),
    setConverterDistanceRows: (rows) => set({ converterDistanceRows: rows.map((r) => ({ key: rowKey(), ...r })) }),
    setConverterDistanceUnit: (column, unit) => set({ converterDistanceUnits: { ...get().converterDistanceUnits, [column]: unit } }),
    commitConverterDistances: (result) =>
      set(result.ok ? { converterDistancePoints: result.points, converterDistanceError: null } : { converterDistanceError: result.message }),

    editConverterSweep: (text) => set({ converterSweepText: text }),
    setConverterSweepUnit: (unit) => set({ converterSweepUnit: unit }),
    commitConverterSweep: (result) =>
      set(result.ok ? { converterSweepPoints: result.points, converterSweepError: null } : { converterSweepError: result.message }),

    loadConverterBatch: (input) => set({ converterBatch: input, converterBatchError: null }),
    refuseConverterBatch: (message) => set({ converterBatchError: message }),
    clearConverterBatch: () => set({ converterBatch: null, converterBatchError: null }),

    addConverterTraceFiles: (files) => {
      const { converterTraceFiles, converterTraceSelected } = get();
      set({ converterTraceFiles: [...converterTraceFiles, ...files], converterTraceSelected: converterTraceSelected ?? files[0]?.id ?? null });
    },
    updateConverterTraceFile: (id, change) =>
      set({ converterTraceFiles: get().converterTraceFiles.map((f) => (f.id === id ? { ...f, ...change } : f)) }),
    removeConverterTraceFile: (id) => {
      const { converterTraceFiles, converterTraceSelected } = get();
      const rest = converterTraceFiles.filter((f) => f.id !== id);
      set({ converterTraceFiles: rest, converterTraceSelected: converterTraceSelected === id ? (rest[0]?.id ?? null) : converterTraceSelected });
    },
    clearConverterTraceFiles: () => set({ converterTraceFiles: [], converterTraceSelected: null, converterTraceNotice: null, converterTraceProgress: null }),
    setConverterTraceProgress: (progress) => set({ converterTraceProgress: progress }),
    setConverterTraceNotice: (notice) => set({ converterTraceNotice: notice }),
    selectConverterTrace: (id) => set({ converterTraceSelected: id }),
    setConverterTraceChannels: ({ heater, sensor }) =>
      set({
        ...(heater === undefined ? {} : { converterTraceHeater: heater }),
        ...(sensor === undefined ? {} : { converterTraceSensor: sensor }),
      }),
    setConverterTracePicker: (picker) => set({ converterTracePicker: picker }),
    setConverterTracePolarity: (polarity) => set({ converterTracePolarity: polarity }),
    setConverterTraceView: (view) => set({ converterTraceView: view }),
  };
};
