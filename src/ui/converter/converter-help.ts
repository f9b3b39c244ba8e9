/**
 * Help for every input of the converter: what it is, the units it takes, typical values and the
 * valid range, and where its starting value comes from. Shown by the fields' "?" buttons (or a
 * table column's) and read out with each field (src/ui/help/FieldHelp.tsx).
 *
 * Valid ranges and starting values are never typed here: they come from FIELD_SPECS (the same
 * fieldRangeText the fields' messages use) and from the table cells' specs, so help and validation
 * cannot disagree.
 */
import type { Unit } from '../../io/quantity';
import { SECOND_SOUND_EXTREMA, T_LAMBDA_K, vapourPressure } from '../../physics';
import type { HelpTopic } from '../help/FieldHelp';
import { fieldRangeText, fieldValueText, unitLabel } from '../fields/field-spec';
import { type ConverterFieldKey, type ConverterFieldSpec, FIELD_SPECS } from './converter-fields';
import { type CellSpec, cellRangeText, DELAY_CELL, DISTANCE_CELL, SD_CELL, SWEEP_DELAY_CELL } from './table-input';

const RULE = 'common practice, no source';

/** A field's help, less the parts its spec gives (units, valid range, starting value). */
interface FieldTopic {
  what: string;
  /** Typical values; the valid range from the spec follows. */
  typical: string;
  /** Why the field starts as it does, after the starting value. */
  why: string;
}

/** Saturated vapour pressure at a temperature, kPa, for typical-value text (from the kernel's ITS-90 curve). */
const kPaAt = (T_K: number) => (vapourPressure(T_K).pressure_Pa / 1000).toPrecision(2);
const { maximum: MAXIMUM, minimum: MINIMUM } = SECOND_SOUND_EXTREMA;

export const CONVERTER_FIELD_HELP: Readonly<Record<ConverterFieldKey, FieldTopic>> = {
  distance: {
    what: 'Heater–sensor distance along the path the pulse travels, cold (at the bath temperature): a distance measured warm shrinks by the spacer’s contraction, a few tenths of a per cent for metals.',
    typical: 'a few mm to about 100 mm',
    why: 'an example path, no source; “Use as the distance” in the sweep calibration fills it from a measurement',
  },
  distanceSd: {
    what: 'One standard deviation of the distance: machining and assembly tolerance, plus the contraction’s uncertainty if it was measured warm.',
    typical: `10–100 µm (${RULE})`,
    why: `a machining tolerance (${RULE})`,
  },
  delay: {
    what: 'Time of flight read off the trace: from the heater pulse (time zero) to the arrival at the sensor.',
    typical: `about 0.25–5 ms for 5–100 mm at about 20 m/s (u₂ peaks at ${MAXIMUM.speed_m_s.toFixed(1)} m/s near ${MAXIMUM.temperature_K.toFixed(2)} K)`,
    why: 'an example reading, no source',
  },
  delaySd: {
    what: 'One standard deviation of the delay reading: the jitter of the pick and the sampling of the trace.',
    typical: `1–10 µs (${RULE})`,
    why: `a few samples of a fast digitiser (${RULE})`,
  },
  offset: {
    what: 'Fixed lag t₀ of the heater, its drive and the electronics (and the sensor’s response), subtracted from every delay: u = d/(t − t₀).',
    typical: 'zero to tens of µs; measure it with delays at several distances (the fit gives t₀)',
    why: 'no lag is assumed until you measure one',
  },
  offsetSd: {
    what: 'One standard deviation of the offset t₀.',
    typical: 'a few µs, or the sd the distance fit gives',
    why: 'no lag assumed, so no uncertainty in it',
  },
  pressure: {
    what: `Vapour pressure read over the bath. The candidate nearest the temperature of this pressure on the ITS-90 helium-4 vapour-pressure scale is chosen.`,
    typical: `about ${kPaAt(1.3)}–${kPaAt(2.1)} kPa between 1.3 and 2.1 K`,
    why: 'no reading until you type one',
  },
  expected: {
    what: 'The bath temperature you expect (from a thermometer, or the last reading). The candidate nearest it is chosen.',
    typical: '1.3–2.1 K in He II',
    why: 'a common He II working point',
  },
  rangeMin: {
    what: 'Lower end of a temperature window. The one candidate inside the window is chosen; with several inside, none is.',
    typical: 'a window around where the bath is, 0.1–0.5 K wide',
    why: 'an example window',
  },
  rangeMax: {
    what: 'Upper end of the temperature window.',
    typical: `below Tλ = ${T_LAMBDA_K} K (no second sound above it)`,
    why: 'an example window',
  },
  threshold: {
    what: 'Threshold picker: the arrival is the first crossing of the baseline plus k times the noise sd after the start of the search window. Baseline and noise come from the samples before time zero.',
    typical: `3–10 noise sd: low picks noise, high picks late on the edge (${RULE})`,
    why: `high enough that noise alone rarely crosses it (${RULE})`,
  },
  fraction: {
    what: 'Fraction picker: the arrival is where the leading edge crosses the baseline plus this fraction of the peak height.',
    typical: `0.2–0.5 (${RULE})`,
    why: `half the peak (${RULE})`,
  },
  searchFrom: {
    what: 'Start of the window in which the picker looks for the arrival, counted from time zero. Start it past the heater’s electrical pickup.',
    typical: 'a little before the earliest arrival you expect',
    why: 'empty: from time zero',
  },
  searchTo: {
    what: 'End of the search window, counted from time zero. End it before the first echo.',
    typical: 'a little after the latest arrival you expect',
    why: 'empty: to the end of the record',
  },
};

/** The units a field takes: its menu, or a unit typed after the number. */
export function converterUnitsText(spec: ConverterFieldSpec): string {
  const units = spec.units ?? [];
  if (spec.kind === null || units.length === 0) return 'a plain number, no unit';
  const other = units[1] ?? units[0] ?? 's';
  const example = `${spec.initial === null ? '1' : fieldValueText(spec.initial, other)} ${other}`;
  return `${units.join(', ')}: a bare number is in the unit shown beside the field; or type a unit after it (e.g. “${example}”)`;
}

/** The whole help of a field, its range and starting value shown in `unit` (the field's unit in use). */
export function converterFieldHelp(key: ConverterFieldKey, unit: Unit | null): HelpTopic {
  const spec = FIELD_SPECS[key];
  const topic = CONVERTER_FIELD_HELP[key];
  const start = spec.initial === null ? 'empty' : `${fieldValueText(spec.initial, unit)}${unit ? ` ${unitLabel(spec, unit)}` : ''}`;
  return {
    what: topic.what,
    units: converterUnitsText(spec),
    range: `typically ${topic.typical}; valid ${fieldRangeText(spec)}`,
    origin: spec.initial === null ? topic.why : `${start}: ${topic.why}`,
  };
}

/** A table column's help: its cell spec's range in the column's unit. */
function columnHelp(what: string, cell: CellSpec, typical: string, unit: Unit, extra = ''): HelpTopic {
  return {
    what,
    units: `the unit in the column’s heading for a bare number; or type a unit after it${extra}`,
    range: `typically ${typical}; valid ${cellRangeText(cell, unit)}`,
    origin: 'an invented example of three sensors (demo data, not a measurement); paste rows from a spreadsheet into any cell',
  };
}

/** Help for the columns of the distance table, in the columns' units. */
export function distanceColumnHelp(units: { distance: Unit; delay: Unit; sd: Unit }) {
  return {
    distance: columnHelp('Heater–sensor distance of this row, cold. Rows need two or more different distances.', DISTANCE_CELL, 'a few mm to about 100 mm', units.distance),
    delay: columnHelp('Delay read at that distance, from the same time zero for every row; the fit gives the common offset t₀.', DELAY_CELL, 'about 0.25–5 ms', units.delay),
    sd: columnHelp('One standard deviation of the row’s delay; optional, but give it on every row or on none (then the scatter sets the uncertainties).', SD_CELL, `1–10 µs (${RULE})`, units.sd, '; empty: no sd'),
  };
}

/** Help for the sweep's paste area and its unit. */
export function sweepHelp(unit: Unit) {
  return {
    text: {
      what: `Readings logged while the bath drifts through the u₂ maximum near ${MAXIMUM.temperature_K.toFixed(2)} K, one “x, delay” per line: x is the time of the reading or its number, the delay as read. At least five readings, with the shortest delay inside the sweep, not at an end.`,
      units: 'x: any plain number; delay: the unit chosen below for a bare number, or type a unit after it',
      range: `delays ${cellRangeText(SWEEP_DELAY_CELL, unit)}`,
      origin: 'empty; “Load an invented example” fills in a made-up sweep computed from the kernel’s u₂',
    },
    unit: {
      what: 'Unit of the delays typed without one in the sweep.',
      origin: 'ms, the unit a scope usually shows for these delays',
    },
  } satisfies Record<string, HelpTopic>;
}

/** The converter's choices: how to pick a candidate, the trace channels and picker. */
export const CONVERTER_CHOICE_HELP = {
  none: {
    what: `Show every candidate temperature and choose none. One delay can mean up to three temperatures, because u₂ is not monotonic in T: it has a maximum near ${MAXIMUM.temperature_K.toFixed(2)} K and a minimum near ${MINIMUM.temperature_K.toFixed(2)} K.`,
    origin: 'chosen until you give something to choose by',
  },
  range: {
    what: 'Choose the one candidate inside a temperature window (none if several are). Give the window’s ends below.',
    origin: 'off; the window starts at an example',
  },
  heater: {
    what: 'The channel that records the heater drive or its trigger: its rising edge is time zero, and the cross-correlation picker uses it as the template. None: time zero is the file’s t = 0.',
    origin: 'none',
  },
  sensor: {
    what: 'The channel with the sensor’s signal, in which the arrival is picked.',
    origin: 'the first channel that is not the heater',
  },
  picker: {
    what: 'How the arrival is found: a threshold of k noise sd, a fraction of the peak on the leading edge, the peak itself (a parabola through its top), or cross-correlation with the heater drive (or a rectangle when there is none).',
    origin: 'fraction of the peak, the usual constant-fraction pick',
  },
  polarity: {
    what: 'Which way the pulse goes on the sensor channel. Automatic follows the larger excursion from the baseline; fix it when the heater pickup or an echo is larger.',
    origin: 'automatic',
  },
} as const satisfies Record<string, HelpTopic>;
