/**
 * The series built while a folder is followed (src/io/watch-series.ts): it must choose exactly as
 * the trace lab's series does for dropped files (src/ui/converter/series.ts, buildSeries), one file
 * at a time, including the extremum rules (past a turn of u₂ files stay undecided until a file with
 * its own vapour pressure settles them). The picks are made from the kernel's own u₂(T), so the true
 * temperature is known; the vapour pressures from the kernel's ITS-90 curve (Preston-Thomas 1990).
 * Invariants, no published numbers.
 */
import { describe, expect, it } from 'vitest';
import type { TracePick } from '../../src/io/trace-pick';
import { chosenTemperature, WATCH_ROW_LIMIT, type WatchReading, WatchSeries } from '../../src/io/watch-series';
import { secondSound, vapourPressure } from '../../src/physics';
import { buildSeries, chosenOf, type SeriesFile } from '../../src/ui/converter/series';

const D = 0.05;
const settings = { distance_m: D, distanceSd_m: 1e-5, offset_s: 0, offsetSd_s: 0 };

function reading(i: number, T: number, options: { pressure?: boolean; stamp?: boolean; delay_s?: number } = {}): WatchReading {
  const fields: Record<string, string> = {};
  if (options.stamp !== false) fields.Timestamp = new Date(Date.UTC(2026, 10, 3, 15, i)).toISOString();
  if (options.pressure) fields['Bath vapour pressure'] = `${vapourPressure(T).pressure_Pa} Pa`;
  return {
    file: `shot-${i + 1}.csv`,
    fields,
    modified_ms: Date.UTC(2026, 10, 3, 16, i),
    pick: { delay_s: options.delay_s ?? D / secondSound(T), delaySd_s: 2e-7, snr: 40, sensor: 'sensor_V', picker: 'fraction' },
    problem: null,
  };
}

describe('WatchSeries', () => {
  it('chooses as the trace lab does for the same files, through a turn of u₂ and its settlement', () => {
    // Cooling through the u₂ maximum (1.65 K) from 1.72 K to 1.58 K; the last file has its own pressure.
    const temps = Array.from({ length: 15 }, (_, i) => 1.72 - 0.01 * i);
    const readings = temps.map((T, i) => reading(i, T, { pressure: i === temps.length - 1 }));
    const start = { kind: 'near' as const, temperature_K: 1.72 };
    const series = new WatchSeries({ ...settings, start });
    const settledRows = new Set<number>();
    for (const r of readings) for (const s of series.add(r).settled) settledRows.add(s.seq);

    const files: SeriesFile[] = readings.map((r) => ({ id: r.file, name: r.file, fields: r.fields }));
    const picks = new Map(readings.map((r) => [r.file, r.pick as unknown as TracePick]));
    const lab = buildSeries(files, picks, new Map(), settings, start);

    expect(series.rows.some((r) => r.chosenBy === 'settled by a later pressure')).toBe(true);
    expect(settledRows.size).toBeGreaterThan(0);
    series.rows.forEach((row, i) => {
      const other = lab[i];
      expect(row.chosenBy).toBe(other?.chosenBy ?? null);
      expect(chosenTemperature(row).temperature_K).toBe(other ? (chosenOf(other)?.temperature_K ?? null) : null);
    });
    // Every decided file's 95 % interval holds the temperature it was made for (a settled file near
    // the turn may sit on the other branch: its interval then runs across the turn and still holds it).
    series.rows.forEach((row, i) => {
      const c = row.chosen === null ? undefined : row.candidates[row.chosen];
      if (!c) return;
      const T = temps[i] as number;
      expect(T).toBeGreaterThanOrEqual(c.interval95_K[0] - 1e-9);
      expect(T).toBeLessThanOrEqual(c.interval95_K[1] + 1e-9);
      if (row.chosenBy !== 'settled by a later pressure') expect(Math.abs(c.temperature_K - T)).toBeLessThan(1e-6);
    });
  });

  it('without history (the command line) it chooses and settles exactly as with it, holding only the rows still open', () => {
    const temps = Array.from({ length: 15 }, (_, i) => 1.72 - 0.01 * i);
    const readings = temps.map((T, i) => reading(i, T, { pressure: i === temps.length - 1 }));
    const start = { kind: 'near' as const, temperature_K: 1.72 };
    const full = new WatchSeries({ ...settings, start });
    const light = new WatchSeries({ ...settings, start }, false);
    for (const r of readings) {
      const a = full.add(r);
      const b = light.add(r);
      expect(b.row).toEqual(a.row);
      expect(b.settled).toEqual(a.settled);
    }
    expect(light.length).toBe(15);
    expect(light.rows).toEqual([]);
    expect(() => light.configure({ ...settings, start })).toThrow(/without history/);
  });

  it('leaves files past the turn undecided (both continuations kept) until a file with its own pressure comes', () => {
    const temps = Array.from({ length: 10 }, (_, i) => 1.7 - 0.01 * i);
    const series = new WatchSeries({ ...settings, start: { kind: 'near', temperature_K: 1.7 } });
    for (const [i, T] of temps.entries()) series.add(reading(i, T));
    const ambiguous = series.rows.filter((r) => r.ambiguous !== null);
    expect(ambiguous.length).toBeGreaterThan(0);
    for (const r of ambiguous) {
      expect(chosenTemperature(r).temperature_K).toBeNull();
      expect(r.warnings.join(' ')).toMatch(/both continuations fit/);
    }
  });

  it('takes time from the header timestamp when there is one, else from the file, and says which', () => {
    const series = new WatchSeries({ ...settings, start: null });
    const a = series.add(reading(0, 1.9)).row;
    const b = series.add(reading(1, 1.9, { stamp: false })).row;
    expect(a).toMatchObject({ timeFrom: 'header', time_ms: Date.UTC(2026, 10, 3, 15, 0), timeSource: 'Timestamp: 2026-11-03T15:00:00.000Z' });
    expect(b).toMatchObject({ timeFrom: 'file modified', time_ms: Date.UTC(2026, 10, 3, 16, 1), timeSource: null });
  });

  it('builds every row again when the distance changes, and keeps a file that could not be read as a row with its message', () => {
    const series = new WatchSeries({ ...settings, start: { kind: 'range', min_K: 1.93, max_K: 2.1 } });
    series.add(reading(0, 2.0));
    series.add({ file: 'bad.csv', fields: {}, modified_ms: 0, pick: null, problem: 'line 1: no time column' });
    series.add(reading(2, 2.01));
    expect(series.rows[1]).toMatchObject({ problem: 'line 1: no time column', chosen: null, delay_s: null });
    const before = chosenTemperature(series.rows[2] as never).temperature_K as number;
    series.configure({ ...settings, distance_m: D * 1.001, start: { kind: 'range', min_K: 1.93, max_K: 2.1 } });
    const after = chosenTemperature(series.rows[2] as never).temperature_K as number;
    expect(series.length).toBe(3);
    // A longer path over the same delay is a faster speed: above the u₂ maximum (1.65 K) u₂ falls as T rises, so a colder bath.
    expect(after).toBeLessThan(before);
  });

  it('a delay too long for any second sound (a unit slip) is that file’s problem, and the series goes on', () => {
    const series = new WatchSeries({ ...settings, start: null });
    const row = series.add(reading(0, 1.9, { delay_s: 10 })).row;
    expect(row.problem).toMatch(/far slower than any second sound/);
    expect(series.add(reading(1, 2.1)).row.chosenBy).toBe('only candidate');
  });

  it('renames a file’s row, replaces the row of a file read again, and refuses past its limit', () => {
    const series = new WatchSeries({ ...settings, start: null });
    series.add(reading(0, 2.1));
    series.rename('shot-1.csv', 'shot-1-kept.csv');
    expect(series.rows[0]?.file).toBe('shot-1-kept.csv');
    expect(series.replace({ ...reading(0, 2.05), file: 'shot-1-kept.csv' })).toBe(true);
    expect(series.length).toBe(1);
    expect(chosenTemperature(series.rows[0] as never).temperature_K).toBeCloseTo(2.05, 6);
    expect(series.replace(reading(5, 2))).toBe(false);
    expect(WATCH_ROW_LIMIT).toBe(50_000);
  });
});
