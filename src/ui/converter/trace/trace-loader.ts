/**
 * Loading trace files: refuses oversize files (and too many or too much at once) before reading,
 * with the limit named; reads the rest one after another in the worker, with progress in the
 * store and a cancel that stops the file being read and drops the ones waiting. When the first
 * file of a session is read, its channel names set the heater and sensor defaults.
 */
import { overLimitText } from '../../../io/byte-size';
import { useSekundoStore } from '../../store';
import type { TraceFileEntry } from '../converter-slice';
import { TraceReadError, traceEngine } from './trace-engine';
import { TRACE_FILE_COUNT_LIMIT, TRACE_FILE_LIMIT_BYTES, TRACE_TOTAL_LIMIT_BYTES, type TraceInfo } from './trace-protocol';


/** Files waiting to be read, in order, with their File objects (never in the store). */
const waiting: { id: string; file: Blob }[] = [];
let reading: string | null = null;
let batchCount = 0;
let batchIndex = 0;
let idCounter = 0;

/** Adds files: refused ones get a notice naming the limit; the others are queued and read in the worker. */
export function loadTraceFiles(files: readonly (Blob & { name: string })[]): void {
  const state = useSekundoStore.getState();
  const held = state.converterTraceFiles.filter((f) => f.status !== 'failed' && f.status !== 'cancelled');
  let total = held.reduce((sum, f) => sum + f.size, 0);
  let count = held.length;
  const refused: string[] = [];
  const accepted: TraceFileEntry[] = [];
  for (const file of files) {
    if (file.size > TRACE_FILE_LIMIT_BYTES) {
      refused.push(`${file.name} is ${overLimitText(file.size, TRACE_FILE_LIMIT_BYTES)} for one trace file`);
      continue;
    }
    if (count >= TRACE_FILE_COUNT_LIMIT) {
      refused.push(`${file.name} would be file ${count + 1}; at most ${TRACE_FILE_COUNT_LIMIT} trace files are held at once`);
      continue;
    }
    if (total + file.size > TRACE_TOTAL_LIMIT_BYTES) {
      refused.push(`${file.name} would bring the files held to ${overLimitText(total + file.size, TRACE_TOTAL_LIMIT_BYTES)} for all trace files together`);
      continue;
    }
    idCounter += 1;
    const id = `trace-${idCounter}`;
    total += file.size;
    count += 1;
    accepted.push({ id, name: file.name, size: file.size, status: 'queued', message: null, info: null });
    waiting.push({ id, file });
  }
  state.setConverterTraceNotice(refused.length === 0 ? null : `Not read: ${refused.join('; ')}.`);
  if (accepted.length === 0) return;
  state.addConverterTraceFiles(accepted);
  if (reading === null) {
    batchCount = accepted.length;
    batchIndex = 0;
  } else batchCount += accepted.length;
  if (reading === null) void readNext();
}

async function readNext(): Promise<void> {
  const next = waiting.shift();
  if (!next) {
    reading = null;
    useSekundoStore.getState().setConverterTraceProgress(null);
    return;
  }
  reading = next.id;
  batchIndex += 1;
  const store = useSekundoStore.getState();
  const entry = store.converterTraceFiles.find((f) => f.id === next.id);
  if (!entry) return readNext();
  store.updateConverterTraceFile(next.id, { status: 'reading' });
  const progress = { id: next.id, name: entry.name, index: batchIndex, count: batchCount, bytes: 0, totalBytes: entry.size, rows: 0 };
  store.setConverterTraceProgress(progress);
  try {
    const info = await traceEngine().parse(next.id, next.file, (p) => useSekundoStore.getState().setConverterTraceProgress({ ...progress, ...p }));
    const now = useSekundoStore.getState();
    if (!now.converterTraceFiles.some((f) => f.id === next.id)) traceEngine().forget(next.id);
    else {
      const firstReady = !now.converterTraceFiles.some((f) => f.status === 'ready');
      now.updateConverterTraceFile(next.id, { status: 'ready', info });
      if (firstReady) setDefaultChannels(info);
    }
  } catch (error) {
    const cancelled = error instanceof TraceReadError && error.cancelled;
    const message = error instanceof Error ? error.message : String(error);
    useSekundoStore.getState().updateConverterTraceFile(next.id, { status: cancelled ? 'cancelled' : 'failed', message: cancelled ? 'Cancelled before it was read.' : message });
  }
  return readNext();
}

/** Heater: a channel named like a heater drive or trigger; sensor: the first other channel. */
export function defaultChannels(channels: readonly string[]): { heater: string | null; sensor: string | null } {
  const heater = channels.find((c) => /heat|drive|pulse|trig|gen/i.test(c)) ?? null;
  const sensor = channels.find((c) => c !== heater && /sens|bolo|therm|signal|det|resp/i.test(c)) ?? channels.find((c) => c !== heater) ?? null;
  return { heater, sensor };
}

function setDefaultChannels(info: TraceInfo): void {
  useSekundoStore.getState().setConverterTraceChannels(defaultChannels(info.channels));
}

/** Stops the file being read and drops the ones waiting (their rows say "cancelled"). */
export function cancelTraceLoading(): void {
  const store = useSekundoStore.getState();
  for (const w of waiting.splice(0)) store.updateConverterTraceFile(w.id, { status: 'cancelled', message: 'Cancelled before it was read.' });
  if (reading !== null) traceEngine().cancel(reading);
}

/** Removes one file (stops it if it is being read). */
export function removeTraceFile(id: string): void {
  const i = waiting.findIndex((w) => w.id === id);
  if (i >= 0) waiting.splice(i, 1);
  if (reading === id) traceEngine().cancel(id);
  else traceEngine().forget(id);
  useSekundoStore.getState().removeConverterTraceFile(id);
}

/** Removes every file. */
export function clearTraceFiles(): void {
  const store = useSekundoStore.getState();
  cancelTraceLoading();
  for (const f of store.converterTraceFiles) if (f.id !== reading) traceEngine().forget(f.id);
  store.clearConverterTraceFiles();
}
