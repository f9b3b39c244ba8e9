/**
 * The invented demo run of "Follow a folder" (src/ui/converter/watch/watch-demo.ts): files appear
 * one at a time on the demo's clock, the first carries the bath vapour pressure (the kernel's
 * ITS-90 value, so it decides its candidate), one file is no trace, and a demo file read as the
 * page reads it gives the temperature it was made for, plus the half-height pick's known lag.
 */
import { describe, expect, it } from 'vitest';
import { TraceCsvParser } from '../../src/io/trace-csv';
import { pickTraceArrival } from '../../src/io/trace-pick';
import { chosenTemperature, WatchSeries } from '../../src/io/watch-series';
import { DEMO_SHOTS, demoSource, demoTemperature, REPLAY_STEP_MS } from '../../src/ui/converter/watch/watch-demo';

async function read(blob: Blob) {
  const parser = new TraceCsvParser({ totalBytes: blob.size });
  parser.feed(new Uint8Array(await blob.arrayBuffer()));
  return parser.finish();
}

describe('the demo replay', () => {
  it('files arrive one per step on the demo’s clock, up to the last', async () => {
    let now = 1_000_000;
    const source = demoSource(() => now);
    expect((await source.list()).map((f) => f.name)).toEqual(['invented-cooldown-001.csv']);
    now += 2.5 * REPLAY_STEP_MS;
    expect((await source.list()).map((f) => f.name)).toEqual(['invented-cooldown-001.csv', 'invented-cooldown-002.csv', 'invented-cooldown-003.csv']);
    now += 1000 * REPLAY_STEP_MS;
    const all = await source.list();
    expect(all).toHaveLength(DEMO_SHOTS);
    expect(all.map((f) => f.name)).toContain('scope-settings.csv');
    // Sizes stay the same from look to look: each file settles on its second look.
    expect((await source.list()).map((f) => f.size_bytes)).toEqual(all.map((f) => f.size_bytes));
  });

  it('read as the page reads them, the first file is decided by its own vapour pressure and the next by continuity', async () => {
    const source = demoSource(() => 0);
    const series = new WatchSeries({ distance_m: 0.05, distanceSd_m: 1e-4, offset_s: 0, offsetSd_s: 0, start: null });
    for (const name of ['invented-cooldown-001.csv', 'invented-cooldown-002.csv']) {
      const trace = await read(await source.open(name));
      const pick = pickTraceArrival(trace, { picker: 'fraction', heater: 'heater_V', sensor: 'sensor_V' });
      series.add({ file: name, fields: trace.metadata.fields, modified_ms: 0, pick: { ...pick, picker: pick.picker }, problem: null });
    }
    expect(series.rows.map((r) => r.chosenBy)).toEqual(['vapour pressure in the file', 'continuity']);
    series.rows.forEach((r, i) => {
      // The half-height pick lies about 10 µs after the invented pulse's onset: 5–12 mK warm at 50 mm.
      const warm = (chosenTemperature(r).temperature_K as number) - demoTemperature(i);
      expect(warm).toBeGreaterThan(0.005);
      expect(warm).toBeLessThan(0.012);
    });
  });

  it('the settings dump in the middle is no trace', async () => {
    const source = demoSource(() => 0);
    await expect(read(await source.open('scope-settings.csv'))).rejects.toThrow();
  });
});
