import {
  DB1998,
  type HeliumProperties,
  ITS90,
  LANDAU,
  NO_VAPOUR_PRESSURE_REASON,
  type PropertyInfo,
  type PropertyKey,
} from '../../physics';
import { formatMeasured, formatSd } from '../units/format-measured';
import { DISPLAY_SIGNIFICANT_DIGITS, formatSignificant, UNCERTAINTY_SIGNIFICANT_DIGITS } from '../units/format-number';
import { fromSi, shownUnit } from '../units/unit-choices';

/** Display units the table uses: properties in these kinds are shown in the chosen unit. */
export interface PropertyUnits {
  pressure: 'Pa' | 'mbar' | 'torr';
}

/** The table's units before anyone chooses. */
export const SI_PROPERTY_UNITS: PropertyUnits = { pressure: 'Pa' };

/** What one table row shows: a number with its uncertainty, or why there is none. */
export type PropertyDisplay =
  | { kind: 'value'; value: string; uncertainty: string | null }
  | { kind: 'absent'; reason: string };

/** Keys that exist only in He II (they all follow from second sound). */
const SECOND_SOUND_KEYS: ReadonlySet<PropertyKey> = new Set([
  'secondSound_m_s',
  'secondSoundSlope_m_s_K',
  'secondSoundSd_m_s',
  'twoFluidSecondSound_m_s',
  'nonlinearity_per_K',
]);

/** Keys whose value is itself an uncertainty (shown to fewer digits). */
const UNCERTAINTY_KEYS: ReadonlySet<PropertyKey> = new Set(['secondSoundSd_m_s']);

/** A property's value in the table's unit (SI unless a display unit applies), null when absent. */
export function propertyValue(info: PropertyInfo, properties: HeliumProperties, units: PropertyUnits = SI_PROPERTY_UNITS): { value: number; sd: number | null } | null {
  const value = properties[info.key];
  if (value === null || !Number.isFinite(value)) return null;
  const sd = info.key === 'secondSound_m_s' ? properties.secondSoundSd_m_s : null;
  if (info.key === 'vapourPressure_Pa') return { value: fromSi(value, units.pressure), sd: null };
  return { value, sd };
}

/** The unit a property is shown in: its SI unit, or the chosen display unit. */
export function propertyUnit(info: PropertyInfo, units: PropertyUnits = SI_PROPERTY_UNITS): string {
  return info.key === 'vapourPressure_Pa' ? shownUnit(units.pressure) : info.unit;
}

/**
 * Row content for a property at the properties' temperature. A value with an sd is rounded to the
 * digit the sd supports (sd to one or two digits); others show four significant digits. Never "NaN".
 */
export function displayProperty(info: PropertyInfo, properties: HeliumProperties, units: PropertyUnits = SI_PROPERTY_UNITS): PropertyDisplay {
  const shown = propertyValue(info, properties, units);
  if (shown === null) return { kind: 'absent', reason: absentReason(info.key, properties) };
  const digits = UNCERTAINTY_KEYS.has(info.key) ? UNCERTAINTY_SIGNIFICANT_DIGITS : DISPLAY_SIGNIFICANT_DIGITS;
  if (UNCERTAINTY_KEYS.has(info.key)) return { kind: 'value', value: formatSd(shown.value), uncertainty: null };
  if (shown.sd === null) return { kind: 'value', value: formatSignificant(shown.value, digits), uncertainty: null };
  const measured = formatMeasured(shown.value, shown.sd, digits);
  return { kind: 'value', value: measured.value, uncertainty: measured.sd === null ? null : `± ${measured.sd}` };
}

/** Why a property has no value at the properties' temperature (the table and its CSV say so). */
export function absentReasonOf(key: PropertyKey, properties: HeliumProperties): string {
  return absentReason(key, properties);
}

function absentReason(key: PropertyKey, properties: HeliumProperties): string {
  if (key === 'secondSound_m_s' && properties.secondSoundAbsentReason) return properties.secondSoundAbsentReason;
  if (SECOND_SOUND_KEYS.has(key) && properties.phase === 'He I') return 'Not defined in He I: there is no second sound.';
  if (key === 'vapourPressure_Pa') return NO_VAPOUR_PRESSURE_REASON;
  return 'Not available at this temperature.';
}

/** A few words naming the source, for the table; the full reference is one click away. */
export function shortSource(info: PropertyInfo): string {
  const tags: string[] = [];
  if (info.source.includes(ITS90)) tags.push('ITS-90');
  if (info.source.includes(DB1998)) tags.push('Donnelly & Barenghi 1998');
  if (info.source.includes(LANDAU)) tags.push('Landau model');
  if (tags.length > 0) return tags.join(' · ');
  return leadingWords(info.source);
}

/** The source's opening words, up to the first formula or colon. */
function leadingWords(source: string): string {
  const head = source.split(/[:=;]/)[0] ?? source;
  const words = head.trim().split(/\s+/);
  while (words.length > 1 && !/^[A-Za-z-]+$/.test(words[words.length - 1] ?? '')) words.pop();
  return words.join(' ');
}
