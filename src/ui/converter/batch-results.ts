/**
 * The batch mode's pieces outside React: reading a dropped file (size limit, the io parser, a
 * trial conversion so a file that cannot be converted is refused whole), the results derived from
 * the inputs, the chart's figure, and an invented example file.
 */
import { overLimitText } from '../../io/byte-size';
import { CsvInputError } from '../../io/csv-common';
import { convertDelayBatch, type DelayBatch, type DelayBatchResults, parseDelayCsv } from '../../io/delay-batch';
import { PhysicsError, secondSound, vapourPressure } from '../../physics';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';
import { batchSettingsOf, type ChoiceKind, type FieldValues, sentence } from './converter-checks';
import { decimateMinMax } from './decimate';

/** Largest batch file the page reads, bytes (2 MiB, about 70 000 rows: converted in well under a second). */
export const BATCH_FILE_LIMIT_BYTES = 2 * 1024 * 1024;

export type BatchRead = { ok: true; batch: DelayBatch } | { ok: false; message: string };


/** Reads a batch file's bytes; refuses an oversize, malformed or unconvertible file with a message naming it and the line. */
export function readBatch(name: string, bytes: Uint8Array, values: FieldValues, choice: ChoiceKind): BatchRead {
  if (bytes.byteLength > BATCH_FILE_LIMIT_BYTES) {
    return { ok: false, message: `${name} is ${overLimitText(bytes.byteLength, BATCH_FILE_LIMIT_BYTES)} for batch files; split it into smaller files.` };
  }
  try {
    const batch = parseDelayCsv(bytes);
    convertDelayBatch(batch, batchSettingsOf(values, choice));
    return { ok: true, batch };
  } catch (error) {
    if (error instanceof CsvInputError || error instanceof PhysicsError) return { ok: false, message: `${name}: ${sentence(error.message)}` };
    throw error;
  }
}

export type BatchOutcome = { ok: true; results: DelayBatchResults } | { ok: false; message: string };

/** The batch converted with the current settings. */
export function batchResults(batch: DelayBatch, values: FieldValues, choice: ChoiceKind): BatchOutcome {
  try {
    return { ok: true, results: convertDelayBatch(batch, batchSettingsOf(values, choice)) };
  } catch (error) {
    if (error instanceof CsvInputError || error instanceof PhysicsError) return { ok: false, message: sentence(error.message) };
    throw error;
  }
}

/** Time of each row in minutes since the first, when every row has a timestamp that reads as a date or a number of seconds; else null. */
export function batchMinutes(batch: DelayBatch): Float64Array | null {
  if (!batch.hasTimestamp || batch.rows.length === 0) return null;
  const out = new Float64Array(batch.rows.length);
  let first = Number.NaN;
  for (const [i, row] of batch.rows.entries()) {
    const text = (row.timestamp ?? '').trim();
    const ms = /^[+-]?\d+(?:\.\d+)?(?:[eE][+-]?\d+)?$/.test(text) ? Number(text) * 1000 : Date.parse(text);
    if (!Number.isFinite(ms)) return null;
    if (i === 0) first = ms;
    out[i] = (ms - first) / 60000;
  }
  return out;
}

/** Above this many rows the chart draws a decimated line only (no markers, no band). */
const MARKER_LIMIT = 1500;
const CHART_COLUMNS = 1200;

/** Names of the two traces of readings past a turn of u₂ (tests find them). */
export const ALONG_TRACE = 'Undecided: back along the branch';
export const ACROSS_TRACE = 'Undecided: on across the turn (trend guess)';

/**
 * Temperature against reading (or time): the chosen T with its 95 % interval as a band, both
 * continuations of readings past a turn of u₂ (dashed, undecided), and every candidate faintly.
 */
export function batchFigure(results: DelayBatchResults, minutes: Float64Array | null): { data: PlotTrace[]; layout: PlotLayout } {
  const n = results.count;
  const x = minutes ?? Float64Array.from({ length: n }, (_, i) => i + 1);
  const chosenX: number[] = [];
  const chosenT: number[] = [];
  const lower: number[] = [];
  const upper: number[] = [];
  const otherX: number[] = [];
  const otherT: number[] = [];
  const alongX: number[] = [];
  const alongT: number[] = [];
  const acrossT: number[] = [];
  for (let i = 0; i < n; i++) {
    const c = results.chosen[i] as number;
    const along = c < 0 ? (results.along[i] as number) : -1;
    const across = c < 0 ? (results.across[i] as number) : -1;
    if (along >= 0 && across >= 0) {
      alongX.push(x[i] as number);
      alongT.push(results.temperature_K[i * 3 + along] as number);
      acrossT.push(results.temperature_K[i * 3 + across] as number);
    }
    for (let k = 0; k < (results.candidateCount[i] as number); k++) {
      const j = i * 3 + k;
      if (k === c) {
        chosenX.push(x[i] as number);
        chosenT.push(results.temperature_K[j] as number);
        lower.push(results.low95_K[j] as number);
        upper.push(results.high95_K[j] as number);
      } else if (k === along || k === across) {
        // Drawn as a continuation below.
      } else if (n <= MARKER_LIMIT) {
        otherX.push(x[i] as number);
        otherT.push(results.temperature_K[j] as number);
      }
    }
  }
  const data: PlotTrace[] = [];
  if (n <= MARKER_LIMIT) {
    data.push(
      { type: 'scatter', name: 'lower', x: chosenX, y: lower, mode: 'lines', line: { width: 0 }, hoverinfo: 'skip', showlegend: false },
      { type: 'scatter', name: '95 % interval', x: chosenX, y: upper, mode: 'lines', line: { width: 0 }, fill: 'tonexty', fillcolor: 'rgba(217, 119, 43, 0.22)', hoverinfo: 'skip' },
      { type: 'scatter', name: 'Other candidates', x: otherX, y: otherT, mode: 'markers', marker: { color: CHART_COLOURS.inkMuted, size: 5, opacity: 0.55 }, hovertemplate: '%{y:.4f} K<extra>other candidate</extra>' },
      { type: 'scatter', name: 'Chosen temperature', x: chosenX, y: chosenT, mode: 'lines+markers', line: { color: CHART_COLOURS.chosen, width: 1.5 }, marker: { color: CHART_COLOURS.chosen, size: 5 }, hovertemplate: '%{y:.4f} K<extra>chosen</extra>' },
    );
  } else {
    const from = chosenX[0] ?? 0;
    const to = chosenX[chosenX.length - 1] ?? 1;
    const line = decimateMinMax(chosenX, chosenT, from, to, CHART_COLUMNS);
    data.push({ type: 'scatter', name: 'Chosen temperature', x: line.x, y: line.y, mode: 'lines', line: { color: CHART_COLOURS.chosen, width: 1.2 }, hovertemplate: '%{y:.4f} K<extra>chosen</extra>' });
  }
  // Both continuations of every reading past a turn, even in a long batch (they are what the reader must see).
  if (alongX.length > 0) {
    data.push(
      { type: 'scatter', name: ALONG_TRACE, x: alongX, y: alongT, mode: 'lines+markers', line: { color: CHART_COLOURS.inkMuted, width: 1.2, dash: 'dash' }, marker: { color: CHART_COLOURS.inkMuted, size: 4, symbol: 'circle-open' }, hovertemplate: '%{y:.4f} K<extra>one continuation (undecided)</extra>' },
      { type: 'scatter', name: ACROSS_TRACE, x: alongX, y: acrossT, mode: 'lines+markers', line: { color: CHART_COLOURS.chosen, width: 1.2, dash: 'dash' }, marker: { color: CHART_COLOURS.chosen, size: 4, symbol: 'circle-open' }, hovertemplate: '%{y:.4f} K<extra>other continuation; the trend guess (undecided)</extra>' },
    );
  }
  return { data, layout: temperatureSeriesLayout(minutes ? 'Minutes since the first reading' : 'Reading') };
}

/** Layout of a temperature series (a batch, trace files): temperature in K against `xTitle`, the key above. */
export function temperatureSeriesLayout(xTitle: string): PlotLayout {
  return {
    ...baseLayout(),
    margin: { l: 64, r: 16, t: 30, b: 46 },
    legend: { orientation: 'h', x: 1, y: 1.01, xanchor: 'right', yanchor: 'bottom' },
    xaxis: axis(xTitle),
    yaxis: axis('Temperature T (K)'),
  };
}

/**
 * An invented cooldown log: 48 readings, one every 30 s, of a bath drifting from 1.95 K down to
 * 1.55 K over a 50 mm path, with ±1.5 µs of scatter, and the bath vapour pressure noted on the
 * first row and again on row 41 (1.61 K, after the bath has passed the u₂ maximum, where
 * continuity alone cannot tell the middle branch from the high one). Demo data from the kernel's own u₂ and ITS-90, not a measurement.
 */
export function exampleBatchText(): string {
  const scatter_us = [0.4, -1.1, 1.3, -0.2, 0.8, -1.5, 0.1, 1.0, -0.7, 0.5, -1.2, 1.4, -0.3, 0.6, -0.9, 1.1];
  const lines = ['timestamp,delay_ms,pressure_Pa'];
  for (let i = 0; i < 48; i++) {
    const T = 1.95 - (0.4 * i) / 47;
    const delay_ms = (0.05 / secondSound(T) + (scatter_us[i % scatter_us.length] as number) * 1e-6) * 1e3;
    const time = new Date(Date.UTC(2026, 10, 3, 14, 0, 0) + i * 30_000).toISOString().replace('.000Z', 'Z');
    const pressure = i === 0 || i === 40 ? vapourPressure(T).pressure_Pa.toFixed(1) : '';
    lines.push(`${time},${delay_ms.toFixed(5)},${pressure}`);
  }
  return `${lines.join('\n')}\n`;
}
