/**
 * Help for every input of the source-location view: what it is, its units, typical values and the
 * valid range, and where its starting value comes from. Shown by the fields' "?" buttons and read
 * out with each field (src/ui/help/FieldHelp.tsx).
 */
import { LOCATE_ARRIVAL_RANGE_S, LOCATE_ARRIVAL_SD_RANGE_S, LOCATE_LABEL_MAX, LOCATE_MAX_SENSORS, LOCATE_POSITION_RANGE_M } from '../../io/locate-csv';
import { MIN_BASELINE_SAMPLES, MODEL_MIN_K, SECOND_SOUND_EXTREMA, secondSound, T_LAMBDA_K } from '../../physics';
import { plain } from '../units/format-number';
import { PICKER_FIELD_SPECS } from '../fields/picker-specs';
import { TRACE_FILE_LIMIT_BYTES } from '../converter/trace/trace-protocol';
import type { HelpTopic } from '../help/FieldHelp';
import { fieldRangeText } from '../fields/field-spec';
import { SPEED_SPEC } from './locate-fields';
import { LOCATE_DEFAULT_ARRIVAL_SD_S, LOCATE_DEFAULT_TEMPERATURE_K } from './locate-inputs';

const DEMO = 'the demo file public/demo-locate.csv (an invented cavity test), or a sensor CSV you open';
const DEFAULT_SD_US = LOCATE_DEFAULT_ARRIVAL_SD_S * 1e6;

/** u₂ between 1.2 K and 2.1 K from the kernel: up to its maximum near 1.65 K, then down towards Tλ. */
const U2_SPAN = (() => {
  const at = (T: number) => secondSound(T).toFixed(1);
  const { maximum } = SECOND_SOUND_EXTREMA;
  return `${at(1.2)} m/s at 1.2 K, ${maximum.speed_m_s.toFixed(1)} m/s at its maximum near ${maximum.temperature_K.toFixed(2)} K, ${at(2.1)} m/s at 2.1 K, and zero at Tλ`;
})();

/** Typed quantities: a bare number is in the shown unit; any unit of the kind may be typed. */
const typed = (unit: string, examples: string) => `${unit} (a bare number); or type a unit: ${examples}`;

export const LOCATE_HELP = {
  label: {
    what: 'A name for the sensor, used in the tables, on the charts and in saved CSV files.',
    range: `1–${LOCATE_LABEL_MAX} characters, different for each sensor`,
    origin: `${DEMO}; new rows are named S1, S2, …`,
  },
  position: (unit: string): HelpTopic => ({
    what: 'Where the sensor sits: x, y and z in one frame of your choice (the source comes out in the same frame). Use the sensing face, as measured warm or cold, consistently.',
    units: typed(unit, '0.12 m, 15 cm, 150 mm'),
    range: `typically a few mm to a few hundred mm apart; valid ${LOCATE_POSITION_RANGE_M[0]} to ${LOCATE_POSITION_RANGE_M[1]} m`,
    origin: `${DEMO}; a new row copies the last sensor's position`,
  }),
  arrival: (unit: string): HelpTopic => ({
    what: 'When the second-sound front reached this sensor, on any clock common to all sensors (e.g. from the trigger). Blank: no reading; the sensor still counts for the layout map.',
    units: typed(unit, '11.563 ms, 11563 us, 0.011563 s'),
    range: `a few to tens of ms at 20 m/s over 0.1–0.5 m; valid ${LOCATE_ARRIVAL_RANGE_S[0]} to ${LOCATE_ARRIVAL_RANGE_S[1]} s, or blank`,
    origin: `${DEMO}; blank for a new row`,
  }),
  sensorSd: {
    what: 'One standard deviation of this sensor’s arrival time: how well its pick is known. Blank: the default timing sd below.',
    units: typed('µs', '0.05 ms, 50 us'),
    range: `typically 1–100 µs (a few samples of the digitiser, plus the pick’s spread); valid above 0, up to ${LOCATE_ARRIVAL_SD_RANGE_S[1]} s`,
    origin: `${DEMO}; blank for a new row`,
  },
  speedMode: {
    what: 'How fast the heat front travelled: u₂ at the bath temperature from the kernel (Donnelly & Barenghi 1998 curve), or a speed you give (e.g. measured on a known path).',
    origin: 'u₂ at the bath temperature',
  },
  temperature: (unit: string): HelpTopic => ({
    what: 'Temperature of the He II bath on ITS-90, to take u₂ from.',
    units: typed(unit, '1.8 K, 1800 mK'),
    range: `typically 1.4–2.1 K; valid ${MODEL_MIN_K}–${T_LAMBDA_K} K (He II only: no second sound above Tλ)`,
    origin: `${LOCATE_DEFAULT_TEMPERATURE_K} K, a common He II working point`,
  }),
  speed: {
    what: 'The speed of the front, used instead of u₂ (strong pulses can travel faster than small-signal second sound).',
    units: typed('m/s', '20 m/s, 2000 cm/s'),
    range: `small-signal u₂ is ${U2_SPAN}; valid ${fieldRangeText(SPEED_SPEC)}`,
    origin: '20 m/s, about u₂ in the usual working range',
  },
  speedPrior: {
    what: "Fit the speed too, held near u₂ at the bath temperature within u₂'s own uncertainty (0.25 % near 1.8 K, Donnelly & Barenghi 1998) and the temperature sd below. The real helium's speed differs from the table by about that much; with the speed held fixed, the stated regions would be too small. Turn it off to hold u₂ fixed.",
    origin: 'on',
  },
  temperatureSd: {
    what: 'One-sigma uncertainty of the bath temperature: it widens the speed prior by |du₂/dT| times this.',
    units: typed('mK', '2 mK, 0.002 K'),
    range: 'typically 0.1–5 mK; valid 0–1000 mK',
    origin: '0 mK: the thermometer taken as exact, only the u₂ curve uncertain',
  },
  sensorRegion: {
    what: 'Where the map may suggest one more sensor: never inside a sphere or cylinder body (the cavity, the beam axis), and, when this is on, only inside the box given by its lowest and highest corner.',
    units: 'lengths in the shown unit',
    range: 'each corner within ±100 m; lowest below highest on every axis',
    origin: 'off: anywhere outside the body, in a box around the sensors',
  },
  fitSpeed: {
    what: 'Fit an effective speed together with the position and emission time, starting from the speed above. Needs one more sensor with a reading than a fixed speed.',
    origin: 'off',
  },
  defaultSd: {
    what: 'Timing sd for every sensor whose own sd is blank; it weights the fit and sets the scale of the uncertainties.',
    units: typed('µs', '0.005 ms, 5 us'),
    range: `typically 1–100 µs; valid above 0, up to ${LOCATE_ARRIVAL_SD_RANGE_S[1]} s`,
    origin: `${DEFAULT_SD_US} µs: a few samples of a fast digitiser (common practice, no source)`,
  },
  surface: {
    what: 'Hold the source on a surface (a cavity cell, a beam tube, a wall) when it can only be there: fewer unknowns, so fewer sensors are needed and the position is tighter along the surface.',
    units: 'lengths in the shown unit; direction components are plain numbers (any length)',
    range: 'centre or point within ±100 m; radius above 0, up to 100 m',
    origin: 'none: anywhere in 3-D. A surface starts centred on the origin, radius 100 mm, axis or normal along z',
  },
  dropOutliers: {
    what: 'Refit without the sensor with the largest residual while that residual exceeds 3σ, one sensor at a time; those left out are named in the residuals.',
    origin: 'off: outliers are flagged and kept',
  },
  projection: {
    what: 'Which two coordinates this chart shows: x–y looks down the z axis (top view), x–z and y–z look from the side.',
    origin: 'x–y on the left, x–z on the right',
  },
  zoom: {
    what: 'Whole layout shows every sensor; close-up shows the source and its 1σ and 2σ regions (once a source is located).',
    origin: 'whole layout',
  },
  mapPlane: {
    what: 'The plane the layout-quality map is drawn in, through the located source (or the sensors’ centroid before there is one).',
    origin: 'x–y',
  },
  rows: {
    what: `Sensors with their positions, arrival times and timing sds; at most ${LOCATE_MAX_SENSORS}. Four readings fix a source with a known speed, fewer on a surface.`,
  },
  traceFile: {
    what: 'One digitiser CSV recorded on one clock: a time column and one channel per sensor. Its t = 0 is taken as the common clock of every sensor, so the arrivals written are times on it (the trigger, as a rule). The samples before t = 0 give each channel its baseline and noise.',
    units: 'time in s, or as the column name says (“Time (ms)”, “t_us”); channels in any unit',
    range: `at least ${MIN_BASELINE_SAMPLES} samples before t = 0; up to ${TRACE_FILE_LIMIT_BYTES / 1048576} MiB`,
    origin: 'none; “Load the demo traces” opens public/demo-locate-traces.csv, invented traces of the demo cavity',
  },
  traceChannel: {
    what: 'The sensor whose arrival this channel gives. A channel named like a sensor label (any case) is matched to it; choose another sensor, or “not used” for a trigger or a spare channel. Sensors without a channel keep what they have.',
    origin: 'the sensor whose label is the channel’s name, else not used',
  },
  tracePicker: {
    what: 'How the arrival is found in each channel: threshold (first crossing of the baseline + k noise sd), fraction of the peak (crossing of a fraction of the pulse height on its leading edge), peak (top of a parabola through the pulse), or cross-correlation (best match to a rectangle as wide as the pulse at half height). Each gives its own sd: the noise over the slope at the pick for the edges, the fit’s for the peak.',
    origin: 'fraction of the peak at 0.5: the same point of the pulse on near and far sensors, whatever their heights',
  },
  tracePolarity: {
    what: 'Whether the pulses go up or down from the baseline; automatic follows the larger excursion in the search window.',
    origin: 'automatic',
  },
  traceThreshold: {
    what: 'The threshold picker’s level, in noise sd above the baseline: higher is safer from noise, lower is closer to the foot of the pulse.',
    units: 'noise sd (a plain number)',
    range: `typically 3–10; valid ${PICKER_FIELD_SPECS.threshold.range[0]}–${PICKER_FIELD_SPECS.threshold.range[1]}`,
    origin: `${PICKER_FIELD_SPECS.threshold.initial}, as in the converter`,
  },
  traceFraction: {
    what: 'The fraction picker’s level, as a fraction of the pulse height above the baseline.',
    units: 'a plain number',
    range: `typically 0.2–0.5; valid ${PICKER_FIELD_SPECS.fraction.range[0]}–${PICKER_FIELD_SPECS.fraction.range[1]}`,
    origin: `${PICKER_FIELD_SPECS.fraction.initial}, half height`,
  },
  traceSearch: (unit: string): HelpTopic => ({
    what: 'Where on the file’s clock the picker looks for the pulse, in every channel alike: start past a pickup at the trigger, stop before an echo.',
    units: typed(unit, '1.5 ms, 1500 us'),
    range: `${plain(PICKER_FIELD_SPECS.searchFrom.range[0])} to ${plain(PICKER_FIELD_SPECS.searchFrom.range[1])} s; the end after the start; blank: from t = 0 to the end of the record`,
    origin: 'blank',
  }),
} as const satisfies Record<string, HelpTopic | ((unit: string) => HelpTopic)>;
