import {
  DB1998,
  type HeliumProperties,
  ITS90,
  LANDAU,
  NO_VAPOUR_PRESSURE_REASON,
  type PropertyInfo,
  type PropertyKey,
} from '../../physics';
import { DISPLAY_SIGNIFICANT_DIGITS, formatSignificant, UNCERTAINTY_SIGNIFICANT_DIGITS } from '../format/format-number';

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

/** Row content for a property at the properties' temperature. Never shows "NaN". */
export function displayProperty(info: PropertyInfo, properties: HeliumProperties): PropertyDisplay {
  const value = properties[info.key];
  if (value === null || !Number.isFinite(value)) return { kind: 'absent', reason: absentReason(info.key, properties) };
  const sd = info.key === 'secondSound_m_s' ? properties.secondSoundSd_m_s : null;
  const digits = UNCERTAINTY_KEYS.has(info.key) ? UNCERTAINTY_SIGNIFICANT_DIGITS : DISPLAY_SIGNIFICANT_DIGITS;
  return {
    kind: 'value',
    value: formatSignificant(value, digits),
    uncertainty: sd === null ? null : `± ${formatSignificant(sd, UNCERTAINTY_SIGNIFICANT_DIGITS)}`,
  };
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
