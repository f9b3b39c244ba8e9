/**
 * A long invented cooldown as the folder follower sees it: `files` readings, one every 6 s, of a
 * bath drifting slowly between 1.70 and 1.95 K (picks made from the kernel's own u₂ over 50 mm,
 * 0.3 µs timing sd), every 500th file with its bath vapour pressure in the header. Invented data
 * for the benchmark and the heap figure.
 */
import type { WatchReading } from '../../src/io/watch-series';
import { secondSound, vapourPressure } from '../../src/physics';

export function longRun(files: number): WatchReading[] {
  const start = Date.UTC(2026, 10, 3, 12, 0, 0);
  return Array.from({ length: files }, (_, i) => {
    const T = 1.825 + 0.12 * Math.sin(i / 1500) + 0.0005 * Math.sin(i * 1.7);
    const fields: Record<string, string> = { Timestamp: new Date(start + i * 6000).toISOString() };
    if (i % 500 === 0) fields['Bath vapour pressure'] = `${vapourPressure(T).pressure_Pa.toFixed(1)} Pa`;
    return {
      file: `shot-${String(i + 1).padStart(5, '0')}.csv`,
      fields,
      modified_ms: start + i * 6000,
      pick: { delay_s: 0.05 / secondSound(T), delaySd_s: 3e-7, snr: 30, sensor: 'sensor_V', picker: 'fraction' },
      problem: null,
    };
  });
}
