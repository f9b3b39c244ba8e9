/**
 * The trace picker's typed settings, shared by the views that pick arrivals in traces (the
 * converter's trace mode and the locate view's "from traces" panel): one spec each, so both read
 * and name them alike. Ranges are the kernel's (PICKER_LIMITS) and the trace reader's.
 */
import { TRACE_SEARCH_RANGE_S } from '../../io/trace-pick';
import { PICKER_LIMITS } from '../../physics';
import { KINDS } from '../units/ladders';
import type { FieldSpec } from './field-spec';

/** A picker setting's spec and the value it starts with (SI; null: empty). */
export interface PickerFieldSpec extends FieldSpec {
  initial: number | null;
}

export const PICKER_FIELD_SPECS = {
  threshold: { label: 'Threshold', kind: null, range: PICKER_LIMITS.thresholdSigma, rangeNote: 'noise sd', initial: 5 },
  fraction: { label: 'Fraction of the peak', kind: null, range: PICKER_LIMITS.fraction, initial: 0.5 },
  searchFrom: { label: 'Search from', kind: KINDS.time, units: ['ms', 'µs', 's', 'ns'], range: TRACE_SEARCH_RANGE_S, initial: null, blank: 'time zero' },
  searchTo: { label: 'Search to', kind: KINDS.time, units: ['ms', 'µs', 's', 'ns'], range: TRACE_SEARCH_RANGE_S, initial: null, blank: 'the end of the record' },
} as const satisfies Record<string, PickerFieldSpec>;
