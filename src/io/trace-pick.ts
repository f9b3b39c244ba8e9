/**
 * Picking the arrival in a parsed trace file: chooses the sensor channel, puts time zero at the
 * heater onset when a heater channel is named (else keeps the file's t = 0), builds the
 * cross-correlation template, and calls the kernel's pickers. Shared by the CLI and the page's
 * worker: no node-only imports.
 *
 * Cross-correlation template (the kernel's xcorr needs one):
 *  - with a heater channel: the heater drive itself, baseline removed, from the last sample at or
 *    below 2 % of its peak before the onset to the first one at or below 2 % after it. The arrival
 *    is where the sensor's copy of the drive onset falls, so the delay is measured from the same
 *    point of the pulse as with the other pickers (the drive's 50 % onset);
 *  - without one: a rectangle as wide as the sensor pulse at half height (measured on the trace).
 *    The arrival is the leading half-height point of the best-matching window (its centre less
 *    half the measured width): the feature the fraction picker finds at 0.5, found with the noise
 *    averaging of a correlation.
 *
 * Like with like: with a heater channel the delay is measured between the same features of the
 * drive and of the received pulse. The edge pickers and the correlation measure onset to onset
 * (from the drive's 50 % onset); the peak picker measures peak to peak (from the drive's centre at
 * half height — for a flat-topped pulse, where its peak lies), so a 100 µs pulse is not read as
 * 50 µs slower. Without a heater channel the delay counts from the file's t = 0 and `reference`
 * says so. The baseline and noise use only samples before time zero, before the file's t = 0 and
 * before the drive starts to rise (so no heater pickup at the switching instant enters the noise).
 */
import {
  baselineOf,
  heaterCentre,
  heaterStart,
  InvalidInputError,
  MIN_BASELINE_SAMPLES,
  type Pick,
  type PickerKind,
  pickArrival,
  requireInsideWindow,
  TEMPLATE_EDGE_FRACTION,
  type Trace,
  uniformStep,
} from '../physics';
import { CsvInputError } from './csv-common';
import { alignToHeaterOnset, channelByName } from './trace-channels';
import type { TraceCsv } from './trace-csv';

/** The default template spans the sensor pulse above this fraction of its peak. */
const DEFAULT_TEMPLATE_LEVEL = 0.5;

/** Ends of the search window the page and the command line accept, s from time zero (the pickers take any). */
export const TRACE_SEARCH_RANGE_S = [-1e4, 1e4] as const;

export type TemplateSource = 'heater drive' | 'half-height rectangle';

/** Which features the delay runs between. */
export type DelayReference = 'onset to onset' | 'peak to peak' | "from the file's t = 0";

export interface TracePickOptions {
  picker: PickerKind;
  /**
   * Sensor channel; default the first channel that is not the heater and not named like a drive
   * or trigger ("heater", "drive", "trig…", "pulse"), else the first that is not the heater.
   */
  sensor?: string;
  /** Heater drive channel: time zero moves to its onset. */
  heater?: string;
  /** Search window relative to time zero, s (default: from 0 to the end). */
  from_s?: number;
  to_s?: number;
  /** Threshold picker: noise sd (default 5). Fraction picker: fraction of the peak (default 0.5). */
  thresholdSigma?: number;
  fraction?: number;
  polarity?: 'positive' | 'negative' | 'auto';
}

export interface TracePick {
  /** Arrival on the file's own time axis, s. */
  arrival_s: number;
  arrivalSd_s: number;
  /** Arrival − the heater's matching feature (its onset, or its centre for the peak picker), s: the delay a conversion to speed uses. */
  delay_s: number;
  /** What the delay runs between: onset to onset, peak to peak, or from the file's t = 0. */
  reference: DelayReference;
  /** The heater feature the delay counts from, on the file's axis, s (the onset, the centre, or 0). */
  referenceTime_s: number;
  /** √(arrival sd² + time-zero sd²), s. */
  delaySd_s: number;
  /** The heater onset on the file's axis, or 0. */
  timeZero_s: number;
  timeZeroSd_s: number;
  timeZero: 'heater onset' | 'file t = 0';
  picker: PickerKind;
  sensor: string;
  heater: string | null;
  template: TemplateSource | null;
  /** Pre-trigger baseline of the sensor, its peak excursion and peak/noise. */
  baseline: Pick['baseline'];
  peak: number;
  snr: number;
}

/**
 * Picks the arrival in `trace` with the options' picker. Throws CsvInputError for an unknown
 * channel and the kernel's InvalidInputError / OutOfRangeError (baseline too short, no crossing, …).
 */
export function pickTraceArrival(trace: TraceCsv, options: TracePickOptions): TracePick {
  const heaterName = options.heater === undefined ? null : channelByName(trace, options.heater).name;
  const sensorName = options.sensor === undefined ? defaultSensor(trace, heaterName) : channelByName(trace, options.sensor).name;
  if (sensorName === heaterName) throw new CsvInputError('missing-column', `the sensor and heater channels are both "${sensorName}"`);
  const aligned = heaterName === null ? null : alignToHeaterOnset(trace, heaterName);
  const time_s = aligned ? aligned.time_s : trace.time_s;
  const sensor: Trace = { time_s, values: channelByName(trace, sensorName).values };
  const drive: Trace | null = aligned && heaterName !== null ? { time_s, values: channelByName(trace, heaterName).values } : null;
  // Noise only from samples before time zero, the file's t = 0 and the start of the drive.
  const baselineEnd_s = aligned && drive ? Math.min(0, -aligned.onset_s, heaterStart(drive)) : 0;
  let pick: Pick;
  let delay_s: number;
  let template: TemplateSource | null = null;
  if (options.picker === 'xcorr') {
    const made = aligned && heaterName !== null ? heaterTemplate(time_s, channelByName(trace, heaterName).values) : null;
    if (made) {
      template = 'heater drive';
      pick = pickArrival(sensor, { kind: 'xcorr', template: made.template, from_s: (options.from_s ?? 0) - made.lead_s, to_s: options.to_s, polarity: options.polarity, baselineEnd_s });
      delay_s = pick.arrival_s + made.lead_s;
    } else {
      template = 'half-height rectangle';
      const rect = rectangleTemplate(sensor, options.from_s ?? 0, options.to_s, options.polarity, baselineEnd_s);
      pick = pickArrival(sensor, { kind: 'xcorr', template: rect.template, from_s: options.from_s, to_s: options.to_s, polarity: options.polarity, baselineEnd_s });
      delay_s = pick.arrival_s + ((rect.template.length - 1) * rect.step_s) / 2 - rect.width_s / 2;
      requireInsideWindow(delay_s, { from_s: options.from_s ?? 0, to_s: options.to_s ?? (time_s[time_s.length - 1] as number) }, 'xcorr');
    }
  } else {
    pick = pickArrival(sensor, {
      kind: options.picker,
      thresholdSigma: options.thresholdSigma,
      fraction: options.fraction,
      from_s: options.from_s,
      to_s: options.to_s,
      polarity: options.polarity,
      baselineEnd_s,
    });
    delay_s = pick.arrival_s;
  }
  if (trace.metadata.timeCountsSamples) {
    const t = trace.time_s;
    throw new CsvInputError(
      'sample-numbers',
      `the time column "${trace.metadata.timeColumn}" counts whole numbers (${t[0]}, ${t[1]}, ${t[2]}, …): these look like sample numbers, not seconds; ` +
        'write the time in the file, or name its unit in the column name, e.g. "Time (us)"',
    );
  }
  const timeZero_s = aligned ? aligned.onset_s : 0;
  const timeZeroSd_s = aligned ? aligned.onsetSd_s : 0;
  // Peak to peak: from the drive's centre, not its onset.
  let referenceTime_s = timeZero_s;
  let referenceSd_s = timeZeroSd_s;
  let reference: DelayReference = aligned ? 'onset to onset' : "from the file's t = 0";
  const arrival_s = delay_s + timeZero_s;
  if (options.picker === 'peak' && drive) {
    const centre = heaterCentre(drive);
    referenceTime_s = timeZero_s + centre.centre_s;
    referenceSd_s = Math.hypot(timeZeroSd_s, centre.centreSd_s);
    reference = 'peak to peak';
    delay_s = arrival_s - referenceTime_s;
  }
  return {
    arrival_s,
    arrivalSd_s: pick.arrivalSd_s,
    delay_s,
    reference,
    referenceTime_s,
    delaySd_s: Math.hypot(pick.arrivalSd_s, referenceSd_s),
    timeZero_s,
    timeZeroSd_s,
    timeZero: aligned ? 'heater onset' : 'file t = 0',
    picker: options.picker,
    sensor: sensorName,
    heater: heaterName,
    template,
    baseline: pick.baseline,
    peak: pick.peak,
    snr: pick.snr,
  };
}

/** Channel names skipped when choosing the sensor by default: drive and trigger channels. */
const NOT_A_SENSOR = /heater|drive|trig|pulse/i;

function defaultSensor(trace: TraceCsv, heater: string | null): string {
  const others = trace.channels.filter((c) => c.name !== heater);
  const channel = others.find((c) => !NOT_A_SENSOR.test(c.name)) ?? others[0];
  if (!channel) throw new CsvInputError('missing-column', `no sensor channel: the file's only channel is the heater "${heater}"`);
  return channel.name;
}

/**
 * The heater drive as a template, on a time axis whose zero is its onset: baseline (first 8
 * samples) removed, sign made positive, cut where the drive is within 2 % of its peak of the
 * baseline. `lead_s` is how long before the onset the template starts.
 */
export function heaterTemplate(time_s: Float64Array, drive: Float64Array): { template: Float64Array; lead_s: number } {
  let sum = 0;
  for (let i = 0; i < MIN_BASELINE_SAMPLES; i++) sum += drive[i] as number;
  const level = sum / MIN_BASELINE_SAMPLES;
  let peak = 0;
  for (let i = 0; i < drive.length; i++) {
    const x = (drive[i] as number) - level;
    if (Math.abs(x) > Math.abs(peak)) peak = x;
  }
  const sign = peak >= 0 ? 1 : -1;
  const y = (k: number) => sign * ((drive[k] as number) - level);
  const edge = TEMPLATE_EDGE_FRACTION * Math.abs(peak);
  let onset = 0;
  while (onset < time_s.length && (time_s[onset] as number) < 0) onset++;
  let k0 = onset;
  while (k0 > 0 && y(k0 - 1) > edge) k0--;
  k0 = Math.max(0, k0 - 1);
  let k1 = onset;
  while (k1 < drive.length - 1 && y(k1) > edge) k1++;
  const template = new Float64Array(k1 - k0 + 1);
  for (let k = k0; k <= k1; k++) template[k - k0] = y(k);
  return { template, lead_s: -(time_s[k0] as number) };
}

/**
 * A rectangle as long as the sensor pulse's full width at half maximum, with that width measured
 * by linear interpolation of the two half-height crossings around the largest excursion in the
 * search window. Throws InvalidInputError when the pulse has no clear half-height width.
 */
export function rectangleTemplate(
  sensor: Trace,
  from_s: number,
  to_s: number | undefined,
  polarity: TracePickOptions['polarity'],
  baselineEnd_s = 0,
): { template: Float64Array; width_s: number; step_s: number } {
  const step_s = uniformStep(sensor);
  const base = baselineOf(sensor, baselineEnd_s);
  const t = sensor.time_s;
  const v = sensor.values;
  let i0 = 0;
  while (i0 < t.length && (t[i0] as number) < from_s) i0++;
  let i1 = t.length - 1;
  if (to_s !== undefined) while (i1 > i0 && (t[i1] as number) > to_s) i1--;
  let iMax = i0;
  let iMin = i0;
  for (let i = i0; i <= i1; i++) {
    if ((v[i] as number) > (v[iMax] as number)) iMax = i;
    if ((v[i] as number) < (v[iMin] as number)) iMin = i;
  }
  const up = (v[iMax] as number) - base.level;
  const down = base.level - (v[iMin] as number);
  const sign = polarity === 'positive' ? 1 : polarity === 'negative' ? -1 : up >= down ? 1 : -1;
  const iPeak = sign > 0 ? iMax : iMin;
  const y = (k: number) => sign * ((v[k] as number) - base.level);
  const half = DEFAULT_TEMPLATE_LEVEL * y(iPeak);
  let left = iPeak;
  while (left > i0 && y(left - 1) >= half) left--;
  let right = iPeak;
  while (right < i1 && y(right + 1) >= half) right++;
  if (left <= i0 || right >= i1) {
    throw new InvalidInputError('template', 'the sensor pulse has no clear width at half height inside the search window; give a heater column for the drive-shaped template');
  }
  const crossing = (a: number, b: number) => (t[a] as number) + ((half - y(a)) / (y(b) - y(a))) * ((t[b] as number) - (t[a] as number));
  const width_s = crossing(right + 1, right) - crossing(left - 1, left);
  const samples = Math.max(3, right - left + 1);
  return { template: new Float64Array(samples).fill(1), width_s, step_s };
}
