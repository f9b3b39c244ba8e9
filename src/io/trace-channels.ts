/**
 * Helpers on a parsed trace (trace-csv.ts): its channels by name, one channel as a kernel trace,
 * and the time axis shifted to the heater pulse onset.
 */
import { heaterOnset, type Trace } from '../physics';
import { CsvInputError, indexOfName } from './csv-common';
import type { TraceChannel, TraceCsv } from './trace-csv';

/** Names of the channels, in file order. */
export function channelNames(trace: TraceCsv): string[] {
  return trace.channels.map((c) => c.name);
}

/**
 * The channel called `name` (exact, else ignoring case and surrounding spaces).
 * Throws a 'missing-column' {@link CsvInputError} listing the channels.
 */
export function channelByName(trace: TraceCsv, name: string): TraceChannel {
  const i = indexOfName(channelNames(trace), name);
  const channel = trace.channels[i];
  if (!channel) {
    const time = trace.metadata.timeColumn;
    const why = indexOfName([time], name) === 0 ? ` ("${time}" is the time column)` : '';
    throw new CsvInputError('missing-column', `no channel "${name}"${why}; channels: ${channelNames(trace).join(', ')}`);
  }
  return channel;
}

/** A kernel {@link Trace} of one channel, on the file's time axis or on `time_s` if given. */
export function traceOf(trace: TraceCsv, name: string, time_s: Float64Array = trace.time_s): Trace {
  return { time_s, values: channelByName(trace, name).values };
}

/** A time axis shifted so that the heater pulse starts at t = 0, and the onset it was shifted by. */
export interface HeaterAlignment {
  /** time − onset, s: a new array. */
  time_s: Float64Array;
  /** The heater onset on the file's time axis (50 % of its first rise, kernel `heaterOnset`), s. */
  onset_s: number;
  onsetSd_s: number;
}

/**
 * Shifts time zero to the heater pulse onset found in channel `heaterName` (the kernel's
 * `heaterOnset`: the 50 % crossing of the drive's first rise, baseline from its first 8 samples).
 * Throws CsvInputError for an unknown channel and the kernel's InvalidInputError for a drive
 * without a rise.
 */
export function alignToHeaterOnset(trace: TraceCsv, heaterName: string): HeaterAlignment {
  const heater = traceOf(trace, heaterName);
  const { onset_s, onsetSd_s } = heaterOnset(heater);
  const time_s = new Float64Array(trace.time_s.length);
  for (let i = 0; i < time_s.length; i++) time_s[i] = (trace.time_s[i] as number) - onset_s;
  return { time_s, onset_s, onsetSd_s };
}
