/**
 * The heap a followed run holds: the series of `files` files (default 10 000) built as the page
 * builds it, measured with the garbage collector run before each reading of the heap. Prints the
 * heap held per file and in all. Run: node --expose-gc --import tsx tests/bench/watch-memory.ts [files]
 * Inputs: tests/support/watch-run.ts (invented).
 */
import { WatchSeries } from '../../src/io/watch-series';
import { longRun } from '../support/watch-run';

const files = Number(process.argv[2] ?? 10_000);
const gc = (globalThis as { gc?: () => void }).gc;
if (!gc) throw new Error('run with node --expose-gc');
const readings = longRun(files);
// The kernel's tables are built on first use: build them before the first reading of the heap.
new WatchSeries({ distance_m: 0.05, distanceSd_m: 1e-5, offset_s: 0, offsetSd_s: 0, start: null }).add(readings[0] as (typeof readings)[number]);
gc();
gc();
const before = process.memoryUsage().heapUsed;
const series = new WatchSeries({ distance_m: 0.05, distanceSd_m: 1e-5, offset_s: 0, offsetSd_s: 0, start: { kind: 'near', temperature_K: 1.825 } });
for (const r of readings) series.add(r);
gc();
gc();
const after = process.memoryUsage().heapUsed;
const held = after - before;
console.log(`${files} files: series holds ${(held / 1048576).toFixed(2)} MiB of heap, ${(held / files).toFixed(0)} bytes a file (${series.length} rows; the readings' own header text is in the input, not the series)`);
