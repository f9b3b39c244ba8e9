/**
 * Synthetic trace files for the folder-following tests: the invented traces of the trace lab
 * (src/ui/converter/trace/trace-example.ts: sensor 50 mm from the heater, arrival 50 mm / u₂(T)
 * from the kernel's own u₂), with an optional bath vapour pressure header line. Invented data.
 */
import { exampleTraceText } from '../../src/ui/converter/trace/trace-example';

/** One trace file's text for a bath at `temperature_K`, recorded at `timestamp` (ISO 8601, or null for none). */
export function watchTraceText(temperature_K: number, timestamp: string | null, seed: number, pressure?: string): string {
  let text = exampleTraceText(temperature_K, timestamp ?? '2026-11-03T15:00:00Z', seed);
  if (timestamp === null) text = text.replace(/^# Timestamp: .*\n/m, '');
  if (pressure !== undefined) text = text.replace('time_s,', `# Bath vapour pressure: ${pressure}\ntime_s,`);
  return text;
}

/** Garbage that no trace reader accepts. */
export const BAD_TRACE_TEXT = 'this is not a trace\nat all;;;\n';

/** Waits `ms` milliseconds. */
export function pause(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}
