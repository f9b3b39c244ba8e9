/**
 * The heap a followed run holds: the series of `files` files (default 10 000) built as the page
 * builds it (every row kept) and as `sekundo watch` builds it (only rows still open), measured with
 * the garbage collector run before each reading of the heap. Prints the heap held in all and per
 * file. Run: node --expose-gc --import tsx tests/bench/watch-memory.ts [files]
 * Inputs: tests/support/watch-run.ts (invented).
 */
import { WatchSeries } from '../../src/io/watch-series';
import { longRun } from '../support/watch-run';

const files = Number(process.argv[2] ?? 10_000);
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with node --expose-gc');
const collect = gc;
const readings = longRun(files);
const settings = { distance_m: 0.05, distanceSd_m: 1e-5, offset_s: 0, offsetSd_s: 0, start: { kind: 'near' as const, temperature_K: 1.825 } };
// The kernel's tables are built on first use: build them before the first reading of the heap.
new WatchSeries(settings).add(readings[0] as (typeof readings)[number]);

function held(history: boolean): { series: WatchSeries; bytes: number } {
  collect();
  collect();
  const before = process.memoryUsage().heapUsed;
  const series = new WatchSeries(settings, history);
  for (const r of readings) series.add(r);
  collect();
  collect();
  return { series, bytes: process.memoryUsage().heapUsed - before };
}

for (const [what, history] of [
  ['page (every row kept)', true],
  ['command line (rows still open only)', false],
] as const) {
  const { series, bytes } = held(history);
  console.log(`${files} files, ${what}: ${(bytes / 1048576).toFixed(2)} MiB of heap, ${(bytes / files).toFixed(0)} bytes a file (${series.length} files added)`);
}
