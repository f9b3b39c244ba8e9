/**
 * The typed picker settings of the "from traces" panel: the converter's picker fields (their
 * names and ranges, src/ui/converter/converter-fields.ts) read the locate view's way (a bare
 * number in the shown unit, a message naming the field and its range, the last good value kept).
 */
import { FIELD_SPECS } from '../converter/converter-fields';
import { type FieldRead, fieldText, type QuantityFieldSpec, readField, type TimeUnit } from './locate-fields';
import type { TracePickerSettings } from './trace-arrivals';

export const TRACE_SETTING_KEYS = ['threshold', 'fraction', 'from', 'to'] as const;
export type TraceSettingKey = (typeof TRACE_SETTING_KEYS)[number];

/** Store key of a setting's draft and message. */
export const traceSettingKey = (key: TraceSettingKey) => `traces.${key}`;

const plain = (x: number) => String(x).replace('-', '\u2212');
const seconds = (range: readonly [number, number]) => `${plain(range[0])} to ${plain(range[1])} s`;

const THRESHOLD_SPEC: QuantityFieldSpec = {
  name: 'Threshold k',
  dimension: null,
  unit: null,
  range: FIELD_SPECS.threshold.range,
  rangeText: `${FIELD_SPECS.threshold.range[0]}–${FIELD_SPECS.threshold.range[1]} noise sd`,
};

const FRACTION_SPEC: QuantityFieldSpec = {
  name: 'Fraction of the peak',
  dimension: null,
  unit: null,
  range: FIELD_SPECS.fraction.range,
  rangeText: `${FIELD_SPECS.fraction.range[0]}–${FIELD_SPECS.fraction.range[1]}`,
};

/** A setting's spec; times are shown, and read when bare, in the view's time unit. */
export function traceSettingSpec(key: TraceSettingKey, unit: TimeUnit = 'ms'): QuantityFieldSpec {
  switch (key) {
    case 'threshold':
      return THRESHOLD_SPEC;
    case 'fraction':
      return FRACTION_SPEC;
    case 'from':
      return { name: 'Search from', dimension: 'time', unit, range: FIELD_SPECS.searchFrom.range, rangeText: `${seconds(FIELD_SPECS.searchFrom.range)}, or blank for t = 0`, blankAllowed: true };
    case 'to':
      return { name: 'Search to', dimension: 'time', unit, range: FIELD_SPECS.searchTo.range, rangeText: `${seconds(FIELD_SPECS.searchTo.range)}, or blank for the end of the record`, blankAllowed: true };
  }
}

/** The setting's value in the settings. */
export function traceSettingValue(settings: TracePickerSettings, key: TraceSettingKey): number | null {
  switch (key) {
    case 'threshold':
      return settings.threshold;
    case 'fraction':
      return settings.fraction;
    case 'from':
      return settings.from_s;
    case 'to':
      return settings.to_s;
  }
}

/** The settings with one field's text applied, or why the text is refused (the window must run forwards). */
export function editTraceSetting(settings: TracePickerSettings, key: TraceSettingKey, text: string, unit: TimeUnit = 'ms'): { ok: true; settings: TracePickerSettings } | { ok: false; message: string } {
  const spec = traceSettingSpec(key, unit);
  const read: FieldRead = readField(spec, text);
  if (!read.ok) return read;
  const value = read.value;
  const next: TracePickerSettings =
    key === 'threshold'
      ? { ...settings, threshold: value ?? settings.threshold }
      : key === 'fraction'
        ? { ...settings, fraction: value ?? settings.fraction }
        : key === 'from'
          ? { ...settings, from_s: value }
          : { ...settings, to_s: value };
  if (next.from_s !== null && next.to_s !== null && !(next.to_s > next.from_s)) {
    const shown = (x: number) => `${fieldText(traceSettingSpec('from', unit), x)} ${unit}`;
    return { ok: false, message: `${spec.name} ${text.trim()}: the search window must end after it starts (from ${shown(next.from_s)} to ${shown(next.to_s)} as typed).` };
  }
  return { ok: true, settings: next };
}
