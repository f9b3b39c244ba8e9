#!/usr/bin/env node
/**
 * Sekundo's command line against the scripts a practitioner would otherwise write (numpy/scipy,
 * pandas), whole process against whole process, side by side in one run:
 *   - delay: `sekundo delay --input` on 200 000 delays at 50 mm vs delay_peer.py (numpy/scipy);
 *   - trace: `sekundo trace` on a 3-million-row, ~123 MB digitiser CSV (fraction picker, heater
 *     onset) vs trace_peer.py (pandas.read_csv, C engine, plus a numpy onset pick).
 * The inputs are generated into a temporary directory (invented numbers) and deleted after. Each
 * pair runs --runs times (default 5), alternating Sekundo and its peer; the medians and their
 * ratio (Sekundo / peer: below 1 means Sekundo is faster) are printed, for wall time and for CPU
 * time (user + system, from /proc on Linux; steadier than wall time on a busy machine).
 *
 * Needs a python3 with numpy, scipy and pandas: $PYTHON, else python3 on PATH, else
 * /usr/bin/python3. Without one it prints why and exits 0 (skipped).
 *
 * It also times the cold start first (no Python needed): `sekundo --version` and `sekundo props
 * --temperature 1.8K` against `node -e 0`, 4 × --runs alternations, medians.
 *
 * Usage: node tests/bench/peers/run-peers.mjs [--runs N] [--only cold|delay|trace] [--sekundo BIN]
 *   --sekundo BIN: the program to time (default bin/sekundo.mjs of this checkout), e.g. another
 *   checkout's bin/sekundo.mjs to compare before and after.
 * Also `npm run bench:peers`. A benchmark, not a test: nothing here fails on time.
 */
import { spawnSync } from 'node:child_process';
import { closeSync, mkdtempSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';

const here = dirname(fileURLToPath(import.meta.url));
const root = resolve(here, '../../..');
const { values: opts } = parseArgs({
  options: {
    runs: { type: 'string', default: '5' },
    only: { type: 'string' },
    sekundo: { type: 'string', default: join(root, 'bin/sekundo.mjs') },
  },
});
const RUNS = Math.max(1, Number.parseInt(opts.runs, 10) || 5);
const SEKUNDO = resolve(opts.sekundo);

const DELAYS = 200_000;
const DISTANCE_M = 0.05;
const DELAY_SD_S = 1e-6;
const TRACE_ROWS = 3_000_000;

function findPython() {
  const tried = [process.env.PYTHON, 'python3', '/usr/bin/python3'].filter(Boolean);
  for (const python of tried) {
    const probe = spawnSync(python, ['-c', 'import numpy, scipy, pandas'], { stdio: 'ignore' });
    if (probe.status === 0) return { python, tried };
  }
  return { python: null, tried };
}

/** 200 000 delays, 2.3–2.7 ms, as a scope would log them (9 significant digits). */
function writeDelays(path) {
  const fd = openSync(path, 'w');
  let text = 'delay_s\n';
  for (let i = 0; i < DELAYS; i++) {
    const t = 2.3e-3 + (0.4e-3 * ((i * 7919) % DELAYS)) / DELAYS;
    text += `${t.toPrecision(9)}\n`;
    if (text.length > 1 << 16) {
      writeSync(fd, text);
      text = '';
    }
  }
  writeSync(fd, text);
  closeSync(fd);
}

/**
 * A digitiser export: two "#" lines, a header, 3 000 000 rows of time (s), heater drive (V) and
 * sensor (V) at 2 ns per sample from −1 ms; a 100 µs drive pulse at t = 0 and a second-sound pulse
 * arriving 2.5 ms later, with noise from a fixed-seed generator. About 123 MB.
 */
function writeTrace(path) {
  const fd = openSync(path, 'w');
  let text = '# invented digitiser export, channel 1 heater, channel 2 sensor\n# sample interval: 2e-9 s\ntime_s,heater,sensor\n';
  let seed = 12345;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648 - 0.5;
  };
  for (let i = 0; i < TRACE_ROWS; i++) {
    const t = -1e-3 + i * 2e-9;
    const heater = (t >= 0 && t < 1e-4 ? 1.5 : 0) + 2e-3 * noise();
    const x = (t - 2.5e-3) / 4e-5;
    const sensor = 2.0e-2 + (x > 0 ? 1e-3 * x * x * Math.exp(2 - 2 * x) : 0) + 5e-5 * noise();
    text += `${t.toExponential(10)},${heater.toExponential(6)},${sensor.toExponential(6)}\n`;
    if (text.length > 1 << 20) {
      writeSync(fd, text);
      text = '';
    }
  }
  writeSync(fd, text);
  closeSync(fd);
}

/** CPU seconds (user + system) used so far by this process's finished children (Linux), or NaN. */
function childrenCpuSeconds() {
  try {
    const stat = readFileSync('/proc/self/stat', 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // Fields 16 and 17 of stat(5) (cutime, cstime), counted from field 3 here; clock ticks of 1/100 s.
    return (Number(fields[13]) + Number(fields[14])) / 100;
  } catch {
    return Number.NaN;
  }
}

/** Wall time and CPU time of one whole process, ms; its stdout goes to `outPath`. Throws if it fails. */
function timeOne(command, args, outPath) {
  const out = openSync(outPath, 'w');
  const cpuBefore = childrenCpuSeconds();
  const start = performance.now();
  const result = spawnSync(command, args, { stdio: ['ignore', out, 'pipe'], maxBuffer: 1 << 20 });
  const wall = performance.now() - start;
  const cpu = (childrenCpuSeconds() - cpuBefore) * 1000;
  closeSync(out);
  if (result.status !== 0) throw new Error(`${command} ${args.join(' ')} failed (${result.status}): ${result.stderr}`);
  return { wall, cpu };
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
};

function compare(name, sekundo, peer, dir) {
  const times = { sekundo: [], peer: [] };
  // One untimed run each first: disk cache and Python's byte-code cache warm for both.
  timeOne(...sekundo, join(dir, `${name}-sekundo.out`));
  timeOne(...peer, join(dir, `${name}-peer.out`));
  for (let r = 0; r < RUNS; r++) {
    const order = r % 2 === 0 ? ['sekundo', 'peer'] : ['peer', 'sekundo'];
    for (const who of order) {
      const [command, args] = who === 'sekundo' ? sekundo : peer;
      times[who].push(timeOne(command, args, join(dir, `${name}-${who}.out`)));
    }
  }
  const line = (what) => {
    const s = median(times.sekundo.map((t) => t[what]));
    const p = median(times.peer.map((t) => t[what]));
    const runs = (who) => times[who].map((t) => t[what].toFixed(0)).join(' ');
    console.log(
      `${name.padEnd(6)} ${what.padEnd(4)} sekundo ${s.toFixed(0).padStart(6)} ms   peer ${p.toFixed(0).padStart(6)} ms   ratio ${(s / p).toFixed(2)}×   (runs: ${runs('sekundo')} | ${runs('peer')})`,
    );
  };
  line('wall');
  line('cpu');
}

/** Cold start: `sekundo --version` and `sekundo props` against `node -e 0`, alternating, medians. */
function coldStart(dir) {
  const node = process.execPath;
  const cases = [
    ['node -e 0', [node, ['-e', '0']]],
    ['sekundo --version', [node, [SEKUNDO, '--version']]],
    ['sekundo props --temperature 1.8K', [node, [SEKUNDO, 'props', '--temperature', '1.8K']]],
  ];
  const times = cases.map(() => []);
  for (const [, run] of cases) timeOne(...run, join(dir, 'cold.out'));
  for (let r = 0; r < RUNS * 4; r++) {
    for (const [k, [, run]] of cases.entries()) times[k].push(timeOne(...run, join(dir, 'cold.out')));
  }
  const base = { wall: median(times[0].map((t) => t.wall)), cpu: median(times[0].map((t) => t.cpu)) };
  cases.forEach(([name], k) => {
    const wall = median(times[k].map((t) => t.wall));
    const cpu = median(times[k].map((t) => t.cpu));
    console.log(`cold   ${name.padEnd(33)} wall ${wall.toFixed(0).padStart(5)} ms (${(wall / base.wall).toFixed(2)}× node -e 0)   cpu ${cpu.toFixed(0).padStart(5)} ms (${(cpu / base.cpu).toFixed(2)}×)`);
  });
}

if (opts.only === undefined || opts.only === 'cold') {
  const dir = mkdtempSync(join(tmpdir(), 'sekundo-cold-'));
  try {
    coldStart(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
if (opts.only === 'cold') process.exit(0);

const { python, tried } = findPython();
if (!python) {
  console.log(`peer benchmarks skipped: no python3 with numpy, scipy and pandas (tried ${tried.join(', ')}); set PYTHON to one.`);
  process.exit(0);
}

const dir = mkdtempSync(join(tmpdir(), 'sekundo-peers-'));
try {
  console.log(`Sekundo: node ${SEKUNDO}; peers: ${python}; ${RUNS} alternating runs each; medians of whole-process wall and CPU time.`);
  const node = process.execPath;
  if (opts.only === undefined || opts.only === 'delay') {
    const delays = join(dir, 'delays.csv');
    writeDelays(delays);
    compare(
      'delay',
      [node, [SEKUNDO, 'delay', '--input', delays, '--distance', `${DISTANCE_M}m`, '--delay-sd', `${DELAY_SD_S}s`]],
      [python, [join(here, 'delay_peer.py'), join(root, 'tests/reference/he4-svp.json'), delays, String(DISTANCE_M), String(DELAY_SD_S)]],
      dir,
    );
  }
  if (opts.only === undefined || opts.only === 'trace') {
    const trace = join(dir, 'trace.csv');
    writeTrace(trace);
    compare(
      'trace',
      [node, [SEKUNDO, 'trace', trace, '--distance', `${DISTANCE_M}m`, '--heater-column', 'heater', '--sensor-column', 'sensor', '--picker', 'fraction']],
      [python, [join(here, 'trace_peer.py'), trace]],
      dir,
    );
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
