/**
 * "Follow a folder" with a long run: 10 000 files (hours of a cooldown). What the page does per
 * run and per redraw: the series built file by file (conversion and choice of each file, all its
 * candidates), the same series built again after a change of distance, the alarms evaluated
 * along it, and the live chart's figure decimated to a 1200-pixel chart. The heap the series
 * holds is measured by tests/bench/watch-memory.ts. Inputs: tests/support/watch-run.ts (invented).
 */
import { bench, describe } from 'vitest';
import { WatchSeries } from '../../src/io/watch-series';
import { evaluateAlarms } from '../../src/ui/converter/watch/watch-alarms';
import { watchFigure } from '../../src/ui/converter/watch/watch-figure';
import { longRun } from '../support/watch-run';

const FILES = 10_000;
const readings = longRun(FILES);
const settings = { distance_m: 0.05, distanceSd_m: 1e-5, offset_s: 0, offsetSd_s: 0, start: { kind: 'near' as const, temperature_K: 1.825 } };
const series = new WatchSeries(settings);
for (const r of readings) series.add(r);
const alarmSettings = { band: { low_K: 1.8, high_K: 1.85 }, rate: { limit_K_s: 1e-3 / 60, window_s: 300 } };
const alarms = evaluateAlarms(series.rows, alarmSettings);

describe(`follow a folder: ${FILES} files`, () => {
  bench('series: add every file (convert + choose)', () => {
    const s = new WatchSeries(settings);
    for (const r of readings) s.add(r);
  }, { iterations: 3, warmupIterations: 1 });

  // A run of its own: the series the other benches read stays at 10 000 files.
  const growing = new WatchSeries(settings);
  for (const r of readings) growing.add(r);
  let next = 0;
  bench('series: add one more file to a run of 10 000', () => {
    growing.add(readings[next++ % FILES] as (typeof readings)[number]);
  }, { time: 200, iterations: 200 });

  bench('series: built again after a change of distance', () => {
    series.configure({ ...settings, distance_m: 0.0501 });
  }, { iterations: 3, warmupIterations: 1 });

  bench('alarms: band and rate along the run', () => {
    evaluateAlarms(series.rows, alarmSettings);
  });

  bench('chart: figure decimated to 1200 columns (one redraw)', () => {
    watchFigure({ rows: series.rows, alarms, band: alarmSettings.band, columns: 1200 });
  });
});
