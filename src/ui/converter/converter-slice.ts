import type { StateCreator } from 'zustand';
import type { DelayBatch } from '../../io/delay-batch';
import type { Unit } from '../../io/quantity';
import type { PickerKind } from '../../physics';
import type { FieldsSlice } from '../fields/fields-slice';
import type { PreferencesSlice } from '../preferences/preferences-slice';
import { type ChoiceKind, crossFieldProblem, type FieldValues } from './converter-checks';
import { fieldValueText, shownFieldUnit } from '../fields/field-spec';
import { type ConverterFieldKey, converterFieldKey, FIELD_SPECS, initialConverterValues } from './converter-fields';
import { type DistancePoints, readDistanceRows } from './table-input';
import type { TraceInfo } from './trace/trace-protocol';

/*
 * The converter's inputs: the typed fields' last good values in SI (their drafts, messages and
 * picked units live in the fields slice under "converter.", src/ui/fields), the way of choosing among candidates, the distance table and
 * sweep as typed with their last good points, the batch file read, and the trace files loaded
 * with the picking options. Results (speeds, candidates, fits, picks, series) are derived from
 * these with the kernel in memos, never stored.
 */

export type ConverterMode = 'reading' | 'batch' | 'trace' | 'watch';
export type ReadingMethod = 'single' | 'distances' | 'sweep';

export type DistanceColumn = 'distance' | 'delay' | 'sd';

export interface DistanceRow {
  key: string;
  distance: string;
  delay: string;
  sd: string;
}

export type { DistancePoints } from './table-input';

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

export type { Polarity } from './trace/trace-protocol';
import type { Polarity } from './trace/trace-protocol';

export interface ConverterSlice {
  converterMode: ConverterMode;
  converterMethod: ReadingMethod;
  /** Last good value of each typed field, SI; a refused entry never replaces it. null: empty (fields that allow it). */
  converterValues: Readonly<Record<ConverterFieldKey, number | null>>;
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
  /** A good value typed into a field (SI): set when it agrees with the other fields; returns the refusal, or null. */
  setConverterValue: (key: ConverterFieldKey, value: number | null) => string | null;
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

/** SI values of the fields (the converter's checks and results read them). */
export function valuesOf(values: Readonly<Record<ConverterFieldKey, number | null>>): FieldValues {
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

/** What the converter's slice reads besides its own state: the fields' drafts and units, the header's units. */
type ConverterStore = ConverterSlice & FieldsSlice & Pick<PreferencesSlice, 'displayUnits'>;

export const createConverterSlice: StateCreator<ConverterStore, [], [], ConverterSlice> = (set, get) => {
  /** Checks a new value of `key` with the others; sets it, or gives the message. */
  const setValue = (key: ConverterFieldKey, value: number | null): string | null => {
    const { converterValues, converterMode, converterMethod, converterBatch, converterChoice } = get();
    const problem = crossFieldProblem(key, { ...converterValues, [key]: value }, {
      reading: converterMode === 'reading' && converterMethod === 'single',
      batch: converterMode === 'batch' ? (converterBatch?.batch ?? null) : null,
      choice: converterChoice,
    });
    if (problem !== null) return problem;
    if (converterValues[key] !== value) set({ converterValues: { ...converterValues, [key]: value } });
    return null;
  };

  return {
    converterMode: 'reading',
    converterMethod: 'single',
    converterValues: initialConverterValues(),
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

    setConverterValue: setValue,

    applyConverterValues: (values) => {
      for (const [key, value] of Object.entries(values) as [ConverterFieldKey, number][]) {
        const problem = setValue(key, value);
        if (problem === null) get().dropFieldDraft(converterFieldKey(key));
        else {
          // Refused: the value stays in the field as a draft, in the unit it shows, with the message.
          const fieldKey = converterFieldKey(key);
          const { displayUnits, fieldUnits, setFieldDraft } = get();
          const unit = shownFieldUnit(FIELD_SPECS[key], value, displayUnits, fieldUnits[fieldKey]);
          setFieldDraft(fieldKey, { text: fieldValueText(value, unit), unit, message: problem });
        }
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
