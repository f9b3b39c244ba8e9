/**
 * The header values of a trace file that Sekundo uses, read the same way by the page and the
 * command line. Only these documented keys are read (case, spaces, "_" and "-" do not matter);
 * any other header line is kept as text and never used:
 *
 *  - `bath_vapour_pressure` (also `bath vapor pressure`, `vapour_pressure`, `vapor_pressure`):
 *    the vapour pressure over the bath, which chooses among the temperature candidates. The unit
 *    is written with the value ("16.38 mbar") or in the key ("bath_vapour_pressure_Pa",
 *    "bath vapour pressure (mbar)"): Pa, kPa, mbar, bar, torr or atm. A bare number with no unit
 *    anywhere is refused, as is a unit in the key that disagrees with one in the value.
 *  - `acquired` (also `timestamp`, `date`, `datetime`, `acquisition_time`, `start_time`,
 *    `trigger_time`, `recorded`): when the trace was recorded, which orders a series of files. ISO
 *    8601 only: 2026-11-03, 2026-11-03T14:02:11, 2026-11-03 14:02:11.250, with an optional zone
 *    (Z, +01:00, +0100). Other forms ("3.4.2026", "04/03/2026", "Nov 3 2026") are refused: they
 *    read differently in different countries. A time without a zone is compared as written.
 *  - `acquired_s` (also `timestamp_s`): the same moment as seconds since 1970-01-01 00:00 UTC.
 *
 * Each value read says which header line it came from, so the page and the CLI show it before it
 * is used.
 */
import { parseQuantity, QuantityParseError } from './quantity';

/** A documented header key: its name, the other spellings read, and what it means. */
export interface TraceHeaderKey {
  name: string;
  aliases: readonly string[];
  meaning: string;
  format: string;
}

export const TRACE_HEADER_KEYS: readonly TraceHeaderKey[] = [
  {
    name: 'bath_vapour_pressure',
    aliases: ['bath_vapor_pressure', 'vapour_pressure', 'vapor_pressure'],
    meaning: 'vapour pressure over the bath; chooses among the temperature candidates',
    format: 'a number with its unit, in the value ("16.38 mbar") or in the key ("bath_vapour_pressure_Pa: 1638"): Pa, kPa, mbar, bar, torr, atm',
  },
  {
    name: 'acquired',
    aliases: ['timestamp', 'date', 'datetime', 'acquisition_time', 'start_time', 'trigger_time', 'recorded'],
    meaning: 'when the trace was recorded; orders a series of files',
    format: 'ISO 8601: 2026-11-03, 2026-11-03T14:02:11 or 2026-11-03 14:02:11.25, optional zone Z or +01:00',
  },
  {
    name: 'acquired_s',
    aliases: ['timestamp_s'],
    meaning: 'when the trace was recorded, as seconds since 1970-01-01 00:00 UTC',
    format: 'a plain number of seconds',
  },
];

/** A header value as read: the key and text it came from, and the value. */
export interface HeaderValue<T> {
  /** The key as written in the file. */
  key: string;
  /** The value as written in the file. */
  text: string;
  value: T;
}

export interface TraceHeaderValues {
  /** Vapour pressure over the bath, Pa. */
  vapourPressure_Pa: HeaderValue<number> | null;
  /** When the trace was recorded: ms since the epoch (a time without zone is read as UTC, for ordering). */
  acquired_ms: HeaderValue<number> | null;
  /** Documented keys whose value could not be read, one line each. */
  problems: string[];
}

const PRESSURE_UNITS: Readonly<Record<string, string>> = { pa: 'Pa', kpa: 'kPa', mbar: 'mbar', bar: 'bar', torr: 'torr', atm: 'atm' };

function normal(key: string): string {
  return key
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, '_');
}

/** The key without a unit suffix, and that unit: "bath vapour pressure (mbar)" → ["bath_vapour_pressure", "mbar"]. */
function splitUnit(key: string): [string, string | null] {
  const k = normal(key);
  const bracket = /^(.*?)_?[([]([a-z]+)[)\]]_?$/.exec(k);
  if (bracket?.[1] && bracket[2]) return [bracket[1], bracket[2]];
  const suffix = /^(.*)_([a-z]+)$/.exec(k);
  if (suffix?.[1] && suffix[2] && suffix[2] in PRESSURE_UNITS) return [suffix[1], suffix[2]];
  return [k, null];
}

function which(name: string): TraceHeaderKey | undefined {
  return TRACE_HEADER_KEYS.find((k) => k.name === name || k.aliases.includes(name));
}

const PLAIN = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const ISO_8601 = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,9}))?)?(Z|[+-]\d{2}:?\d{2})?)?$/;

/**
 * An ISO 8601 date or date-time as ms since the epoch (without a zone: as if UTC), or null when
 * the text is not one (or names a day or time that does not exist).
 */
export function parseIsoDateTime(text: string): number | null {
  const m = ISO_8601.exec(text.trim());
  if (!m) return null;
  const [, y, mo, d, h = '0', mi = '0', s = '0', frac = '', zone = 'Z'] = m;
  const year = Number(y);
  const month = Number(mo);
  const day = Number(d);
  const hour = Number(h);
  const minute = Number(mi);
  const second = Number(s);
  if (month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || second > 59) return null;
  const utc = Date.UTC(year, month - 1, day, hour, minute, second, Number(`0.${frac || '0'}`) * 1000);
  if (new Date(Date.UTC(year, month - 1, day)).getUTCDate() !== day) return null;
  if (zone === 'Z') return utc;
  const zm = /^([+-])(\d{2}):?(\d{2})$/.exec(zone);
  if (!zm) return null;
  const offset = (Number(zm[2]) * 60 + Number(zm[3])) * 60_000 * (zm[1] === '-' ? -1 : 1);
  return utc - offset;
}

/** Reads the documented header keys of a trace file (its "key: value" fields). */
export function readTraceHeader(fields: Readonly<Record<string, string>>): TraceHeaderValues {
  const out: TraceHeaderValues = { vapourPressure_Pa: null, acquired_ms: null, problems: [] };
  for (const [key, raw] of Object.entries(fields)) {
    const [base, keyUnit] = splitUnit(key);
    const known = which(base);
    if (!known) continue;
    const text = raw.trim();
    const shown = `header "${key}: ${text.length > 40 ? `${text.slice(0, 40)}…` : text}"`;
    if (known.name === 'bath_vapour_pressure') {
      if (out.vapourPressure_Pa) continue;
      const unit = keyUnit === null ? null : PRESSURE_UNITS[keyUnit];
      if (keyUnit !== null && unit === undefined) {
        out.problems.push(`${shown}: "${keyUnit}" is not a pressure unit (Pa, kPa, mbar, bar, torr, atm); not used`);
        continue;
      }
      if (PLAIN.test(text) && !unit) {
        out.problems.push(`${shown}: the number has no unit; write it with the value ("${text} Pa") or in the key ("${base}_Pa"); not used`);
        continue;
      }
      try {
        const value = parseQuantity(PLAIN.test(text) ? `${text} ${unit}` : text, 'pressure');
        const valueUnit = /[a-zA-Z]+$/.exec(text)?.[0]?.toLowerCase();
        if (unit && valueUnit !== undefined && PRESSURE_UNITS[valueUnit] !== unit) {
          out.problems.push(`${shown}: the key says ${unit} but the value has another unit; not used`);
          continue;
        }
        if (!(value > 0)) {
          out.problems.push(`${shown}: a vapour pressure must be above 0; not used`);
          continue;
        }
        out.vapourPressure_Pa = { key, text, value };
      } catch (error) {
        if (!(error instanceof QuantityParseError)) throw error;
        out.problems.push(`${shown}: not a pressure (${known.format}); not used`);
      }
    } else if (known.name === 'acquired') {
      if (out.acquired_ms) continue;
      const ms = parseIsoDateTime(text);
      if (ms === null) out.problems.push(`${shown}: not an ISO 8601 date (e.g. 2026-11-03T14:02:11); forms such as 3.4.2026 or 04/03/2026 read differently in different countries and are not used`);
      else out.acquired_ms = { key, text, value: ms };
    } else if (known.name === 'acquired_s') {
      if (out.acquired_ms) continue;
      if (PLAIN.test(text) && Number.isFinite(Number(text))) out.acquired_ms = { key, text, value: Number(text) * 1000 };
      else out.problems.push(`${shown}: not a number of seconds since 1970-01-01 UTC; not used`);
    }
  }
  return out;
}

/** What the header gave, in one line for people ("bath vapour pressure 1638 Pa (header "…"), recorded …"); null when nothing. */
export function describeTraceHeader(values: TraceHeaderValues): string | null {
  const parts: string[] = [];
  if (values.vapourPressure_Pa) parts.push(`bath vapour pressure ${Number(values.vapourPressure_Pa.value.toPrecision(6))} Pa (from "${values.vapourPressure_Pa.key}: ${values.vapourPressure_Pa.text}")`);
  if (values.acquired_ms) parts.push(`recorded ${new Date(values.acquired_ms.value).toISOString().replace('.000Z', 'Z')} (from "${values.acquired_ms.key}: ${values.acquired_ms.text}")`);
  return parts.length > 0 ? parts.join('; ') : null;
}
