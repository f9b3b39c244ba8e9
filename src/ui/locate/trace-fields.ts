/**
 * The typed picker settings of the "from traces" panel: the picker's shared specs
 * (src/ui/fields/picker-specs.ts, as in the converter), and how a good value changes the settings
 * (the search window must run forwards).
 */
import type { FieldSpec } from '../fields/field-spec';
import { PICKER_FIELD_SPECS } from '../fields/picker-specs';
import { KINDS, messageText } from '../units/ladders';
import type { TracePickerSettings } from './trace-arrivals';

export const TRACE_SETTING_KEYS = ['threshold', 'fraction', 'from', 'to'] as const;
export type TraceSettingKey = (typeof TRACE_SETTING_KEYS)[number];

/** Key of a setting's draft and message ("traces.from"; in the fields slice under "locate."). */
export const traceSettingKey = (key: TraceSettingKey) => `traces.${key}`;

const SPECS: Readonly<Record<TraceSettingKey, FieldSpec>> = {
  threshold: { ...PICKER_FIELD_SPECS.threshold, label: 'Threshold k' },
  fraction: PICKER_FIELD_SPECS.fraction,
  from: PICKER_FIELD_SPECS.searchFrom,
  to: PICKER_FIELD_SPECS.searchTo,
};

/** A setting's spec; times follow the header's unit of time. */
export function traceSettingSpec(key: TraceSettingKey): FieldSpec {
  return SPECS[key];
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

/** The settings with one good value set, or why they refuse it (the window must run forwards). */
export function editTraceSetting(settings: TracePickerSettings, key: TraceSettingKey, value: number | null): { ok: true; settings: TracePickerSettings } | { ok: false; message: string } {
  const next: TracePickerSettings =
    key === 'threshold'
      ? { ...settings, threshold: value ?? settings.threshold }
      : key === 'fraction'
        ? { ...settings, fraction: value ?? settings.fraction }
        : key === 'from'
          ? { ...settings, from_s: value }
          : { ...settings, to_s: value };
  if (next.from_s !== null && next.to_s !== null && !(next.to_s > next.from_s)) {
    const shown = (x: number) => messageText(x, KINDS.time.ladder, KINDS.time.zero);
    return { ok: false, message: `${SPECS[key].label}: the search window must end after it starts (from ${shown(next.from_s)} to ${shown(next.to_s)}).` };
  }
  return { ok: true, settings: next };
}
