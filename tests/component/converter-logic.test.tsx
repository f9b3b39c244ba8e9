// @vitest-environment node
/*
 * The converter's logic outside React, in node: the trace worker's service (streamed parse with
 * progress, cancel, pick, samples as transferable typed arrays), min/max decimation, typed fields
 * and pasted tables, and the series (timestamps, order, choice along the series).
 */
import { secondSound, vapourPressure } from '../../src/physics';
import { FIELD_SPECS } from '../../src/ui/converter/converter-fields';
import { readFieldText } from '../../src/ui/fields/field-spec';
import { decimateMinMax, lowerBound } from '../../src/ui/converter/decimate';
import { buildSeries, orderFiles, pressureOf, timestampOf } from '../../src/ui/converter/series';
import { readDistanceRows, readSweepText, splitPasted } from '../../src/ui/converter/table-input';
import type { TraceRequest, TraceResponse } from '../../src/ui/converter/trace/trace-protocol';
import { TraceService } from '../../src/ui/converter/trace/trace-service';
import { defaultChannels } from '../../src/ui/converter/trace/trace-loader';

/** A two-channel trace: time in µs, a heater step at 0 and a sensor step at `arrival_us` (no noise but a fixed ripple before it). */
function stepTrace(rows: number, arrival_us: number): string {
  const lines = ['# Timestamp: 2026-11-03T15:00:00Z', 'time_us,heater,sensor'];
  for (let i = 0; i < rows; i++) {
    const t = i - 100;
    lines.push(`${t},${t >= 0 && t < 10 ? 5 : 0},${t >= arrival_us ? 1 : i % 2 === 0 ? 0.001 : -0.001}`);
  }
  return `${lines.join('\n')}\n`;
}

function serviceWithInbox() {
  const inbox: { message: TraceResponse; transfer: Transferable[] }[] = [];
  const service = new TraceService((message, transfer = []) => inbox.push({ message, transfer }));
  return { service, inbox };
}

describe('trace worker service', () => {
  it('streams a file through the parser, reports progress and keeps the numbers by id', async () => {
    const { service, inbox } = serviceWithInbox();
    const blob = new Blob([stepTrace(3000, 1500)]);
    await service.handle({ type: 'parse', id: 'a', file: blob, sizeLimitBytes: 1 << 20 });
    const parsed = inbox.find((m) => m.message.type === 'parsed')?.message;
    expect(parsed).toMatchObject({ type: 'parsed', id: 'a', info: { rows: 3000, channels: ['heater', 'sensor'], timeColumn: 'time_us', timeUnit: 'us', fields: { Timestamp: '2026-11-03T15:00:00Z' } } });
    if (parsed?.type !== 'parsed') throw new Error('no parse');
    expect(parsed.info.firstTime_s).toBeCloseTo(-100e-6, 15);
    expect(inbox.some((m) => m.message.type === 'progress' && m.message.totalBytes === blob.size)).toBe(true);
    expect(service.held()).toEqual(['a']);
  });

  it('answers a pick and sends samples as transferable typed arrays', async () => {
    const { service, inbox } = serviceWithInbox();
    await service.handle({ type: 'parse', id: 'a', file: new Blob([stepTrace(3000, 1500)]), sizeLimitBytes: 1 << 20 });
    service.handle({ type: 'pick', request: 1, id: 'a', options: { picker: 'threshold', heater: 'heater', sensor: 'sensor' } });
    const picked = inbox.find((m) => m.message.type === 'picked')?.message;
    if (picked?.type !== 'picked') throw new Error('no pick');
    // The heater rises between −1 and 0 µs (onset −0.5 µs); the sensor steps between 1499 and 1500 µs.
    expect(picked.pick.timeZero_s).toBeCloseTo(-0.5e-6, 12);
    expect(picked.pick.arrival_s).toBeGreaterThan(1499e-6);
    expect(picked.pick.arrival_s).toBeLessThanOrEqual(1500e-6);
    service.handle({ type: 'samples', request: 2, id: 'a' });
    const sent = inbox.find((m) => m.message.type === 'samples');
    if (sent?.message.type !== 'samples') throw new Error('no samples');
    expect(sent.message.samples.time_s).toBeInstanceOf(Float64Array);
    expect(sent.message.samples.channels.map((c) => [c.name, c.values.constructor.name, c.values.length])).toEqual([
      ['heater', 'Float32Array', 3000],
      ['sensor', 'Float32Array', 3000],
    ]);
    // Every buffer goes in the transfer list (moved, not copied, across the worker boundary).
    expect(sent.transfer).toHaveLength(3);
    expect(sent.transfer[0]).toBe(sent.message.samples.time_s.buffer);
  });

  it('stops a parse on cancel and reports it as cancelled', async () => {
    const { service, inbox } = serviceWithInbox();
    const text = stepTrace(400_000, 1500);
    // A stream that yields 64 KiB at a time, so the cancel arrives between chunks.
    const bytes = new TextEncoder().encode(text);
    let at = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (at >= bytes.length) return controller.close();
        controller.enqueue(bytes.subarray(at, at + 65536));
        at += 65536;
        if (at === 65536 * 4) service.handle({ type: 'cancel', id: 'big' });
      },
    });
    const blob = { size: bytes.length, stream: () => stream } as unknown as Blob;
    await service.handle({ type: 'parse', id: 'big', file: blob, sizeLimitBytes: 1 << 30 });
    expect(inbox.at(-1)?.message).toEqual({ type: 'parse-failed', id: 'big', message: 'cancelled before it was read', cancelled: true });
    expect(at).toBeLessThan(bytes.length);
    expect(service.held()).toEqual([]);
  });

  it('refuses a file over the limit and a malformed one, naming the limit and the line', async () => {
    const { service, inbox } = serviceWithInbox();
    await service.handle({ type: 'parse', id: 'big', file: new Blob(['x'.repeat(2000)]), sizeLimitBytes: 1000 });
    expect(inbox.at(-1)?.message).toMatchObject({ type: 'parse-failed', cancelled: false, message: expect.stringMatching(/over the .* limit/) });
    await service.handle({ type: 'parse', id: 'bad', file: new Blob(['t,v\n0,1\n1,2\n2,3\n3,x\n']), sizeLimitBytes: 1000 });
    expect(inbox.at(-1)?.message).toMatchObject({ type: 'parse-failed', message: expect.stringMatching(/^line 5: /) });
  });

  it('says when a file is no longer held', () => {
    const { service, inbox } = serviceWithInbox();
    const request: TraceRequest = { type: 'pick', request: 9, id: 'gone', options: { picker: 'peak' } };
    service.handle(request);
    expect(inbox[0]?.message).toEqual({ type: 'request-failed', request: 9, message: 'this file is no longer loaded; drop it again' });
  });
});

describe('min/max decimation', () => {
  const n = 100_000;
  const x = Float64Array.from({ length: n }, (_, i) => i * 1e-6);
  const y = Float64Array.from({ length: n }, (_, i) => Math.sin(i / 500) + (i === 54_321 ? 7 : 0) - (i === 12_345 ? 9 : 0));

  it('keeps at most two points per column and every extreme', () => {
    const line = decimateMinMax(x, y, 0, (n - 1) * 1e-6, 500);
    expect(line.x.length).toBeLessThanOrEqual(2 * 500 + 2);
    expect(Math.max(...line.y)).toBe(Math.max(...y));
    expect(Math.min(...line.y)).toBe(Math.min(...y));
    for (let i = 1; i < line.x.length; i++) expect(line.x[i]).toBeGreaterThanOrEqual(line.x[i - 1] as number);
  });

  it('returns every sample of a short view, with one neighbour each side, shifted and scaled', () => {
    const t = Array.from({ length: 100 }, (_, i) => i);
    const line = decimateMinMax(t, t, 10, 20, 500, 1e3, 10);
    expect(line.x).toEqual(Array.from({ length: 13 }, (_, i) => (i - 1) * 1e3));
    expect(line.y).toEqual(Array.from({ length: 13 }, (_, i) => 9 + i));
  });

  it('handles empty input and an empty view', () => {
    expect(decimateMinMax([], [], 0, 1, 10)).toEqual({ x: [], y: [] });
    expect(decimateMinMax(x, y, 1, 1, 10)).toEqual({ x: [], y: [] });
  });

  it('finds the first index at or after a value', () => {
    expect(lowerBound([1, 2, 2, 3], 2)).toBe(1);
    expect(lowerBound([1, 2, 2, 3], 4)).toBe(4);
    expect(lowerBound([1, 2, 2, 3], 0)).toBe(0);
  });
});

describe('typed fields and pasted tables', () => {
  it('reads a bare number in the chosen unit and a typed unit as written', () => {
    expect(readFieldText(FIELD_SPECS.delay, '2.5', 'ms')).toEqual({ ok: true, value: 2.5e-3 });
    expect(readFieldText(FIELD_SPECS.delay, '2500 us', 'ms')).toEqual({ ok: true, value: 2.5e-3 });
    expect(readFieldText(FIELD_SPECS.delay, '−1', 'ms')).toEqual({ ok: false, message: 'Delay must be 1 ns–10000 s; “−1” is outside.' });
    expect(readFieldText(FIELD_SPECS.delay, '', 'ms')).toEqual({ ok: false, message: 'Delay is empty: type a value, 1 ns–10000 s.' });
    expect(readFieldText(FIELD_SPECS.delay, '2.5 K', 'ms')).toMatchObject({ ok: false, message: expect.stringMatching(/^Delay: “2\.5 K” has a unit that is not a time\. Type e\.g\. 100 us \(units s, ms, us, µs, ns\); valid 1 ns–10000 s\.$/) });
    expect(readFieldText(FIELD_SPECS.pressure, '', 'Pa')).toEqual({ ok: true, value: null });
    expect(readFieldText(FIELD_SPECS.fraction, '0.99', null)).toEqual({ ok: false, message: 'Fraction of the peak must be 0.05–0.95; “0.99” is outside.' });
  });

  it('reads the distance table and names the row, the column and the range of a bad cell', () => {
    const units = { distance: 'mm', delay: 'ms', sd: 'µs' } as const;
    expect(readDistanceRows([{ distance: '20', delay: '1.07', sd: '' }, { distance: '', delay: '', sd: '' }, { distance: '35', delay: '1.87', sd: '' }], units)).toEqual({
      ok: true,
      value: { points: [{ distance_m: 0.02, delay_s: 1.07e-3 }, { distance_m: 0.035, delay_s: 1.87e-3 }], rows: [1, 3] },
    });
    expect(readDistanceRows([{ distance: '0', delay: '1', sd: '' }], units)).toEqual({ ok: false, message: 'Row 1, distance 0 mm is outside the valid range 0.001 mm – 100000 mm.' });
    expect(readDistanceRows([{ distance: '5', delay: '1', sd: '-2' }], units)).toMatchObject({ ok: false, message: expect.stringMatching(/^Row 1, delay sd −2 µs is outside the valid range/) });
  });

  it('reads a pasted sweep, skipping comments and a header line, and names a bad line', () => {
    expect(readSweepText('# sweep\nminute, delay\n0, 2.39\n1\t2.38\n2 2.37\n', 'ms')).toEqual({
      ok: true,
      value: [
        { x: 0, delay_s: 2.39e-3 },
        { x: 1, delay_s: 2.38e-3 },
        { x: 2, delay_s: 2.37e-3 },
      ],
    });
    expect(readSweepText('0, 2.39\n1, 2.38, 7\n', 'ms')).toEqual({ ok: false, message: 'Line 2: “1, 2.38, 7” needs two numbers, x and delay, got 3 cells.' });
    expect(readSweepText('', 'ms')).toEqual({ ok: false, message: 'The sweep is empty: paste lines of “x, delay”.' });
    expect(splitPasted('20\t1.07\n35;1.87;2\n\n')).toEqual([
      ['20', '1.07'],
      ['35', '1.87', '2'],
    ]);
  });
});

describe('series of trace files', () => {
  it('reads timestamps and pressures from header fields', () => {
    expect(timestampOf({ Timestamp: '2026-11-03T15:00:00Z' })?.ms).toBe(Date.UTC(2026, 10, 3, 15));
    expect(timestampOf({ timestamp_s: '1700000000' })?.ms).toBe(1.7e12);
    expect(timestampOf({ operator: 'A. N. Other' })).toBeNull();
    expect(pressureOf({ 'bath vapour pressure (mbar)': '16.382' })).toBeCloseTo(1638.2, 9);
    expect(pressureOf({ bath_vapour_pressure_Pa: '1638.2' })).toBeCloseTo(1638.2, 9);
    expect(pressureOf({ vapour_pressure: '12 kPa' })).toBe(12000);
    // Only the documented keys: an insulation-vacuum reading is not the bath's vapour pressure.
    expect(pressureOf({ 'insulation vacuum pressure': '2e-5 mbar' })).toBeNull();
  });

  it('orders by timestamp when every file has one, else by name in natural order', () => {
    const f = (name: string, stamp?: string) => ({ id: name, name, fields: (stamp ? { Timestamp: stamp } : {}) as Record<string, string> });
    expect(orderFiles([f('b', '2026-01-01T00:02:00Z'), f('a', '2026-01-01T00:03:00Z'), f('c', '2026-01-01T00:01:00Z')]).files.map((x) => x.name)).toEqual(['c', 'b', 'a']);
    const byName = orderFiles([f('shot-10.csv'), f('shot-2.csv', '2026-01-01T00:00:00Z'), f('shot-1.csv')]);
    expect(byName.by).toBe('name');
    expect(byName.files.map((x) => x.name)).toEqual(['shot-1.csv', 'shot-2.csv', 'shot-10.csv']);
  });

  it('chooses along the series: the start rule, then continuity, and a file with its own pressure starts afresh', () => {
    // Model: 50 mm at 1.86, 1.84, 1.62 (own vapour pressure), 1.60 K; the pick is the exact transit time.
    const model = [1.86, 1.84, 1.62, 1.6];
    const files = model.map((T, i) => ({ id: `f${i}`, name: `f${i}`, fields: (i === 2 ? { bath_vapour_pressure_Pa: String(vapourPressure(T).pressure_Pa) } : {}) as Record<string, string> }));
    const picks = new Map(
      model.map((T, i) => [
        `f${i}`,
        { arrival_s: 0.05 / secondSound(T), arrivalSd_s: 1e-6, delay_s: 0.05 / secondSound(T), delaySd_s: 1e-6, timeZero_s: 0, timeZeroSd_s: 0, timeZero: 'file t = 0' as const, reference: "from the file's t = 0" as const, referenceTime_s: 0, picker: 'fraction' as const, sensor: 's', heater: null, template: null, baseline: { level: 0, noise: 1, samples: 10 }, peak: 10, snr: 10 },
      ]),
    );
    const rows = buildSeries(files, picks, new Map(), { distance_m: 0.05, distanceSd_m: 0, offset_s: 0, offsetSd_s: 0 }, { kind: 'near', temperature_K: 1.9 });
    expect(rows.map((r) => r.chosenBy)).toEqual(['expected', 'continuity', 'vapour pressure in the file', 'continuity']);
    rows.forEach((r, i) => {
      const c = r.chosen === null ? undefined : r.conversion?.candidates[r.chosen];
      expect(c?.temperature_K).toBeCloseTo(model[i] as number, 9);
    });
    expect(rows[1]?.rule).toEqual({ kind: 'near', temperature_K: rows[0]?.conversion?.candidates[rows[0]?.chosen ?? 0]?.temperature_K });
  });

  it('past the u₂ maximum the files stay undecided with both continuations, until a file with its own pressure settles them back to the turn', () => {
    // Model: 50 mm, cooling from 1.76 K to 1.46 K in 20 mK steps through the maximum (1.651 K); the
    // first file and the last carry their vapour pressure. Picks are the exact transit with 1 µs sd.
    const model = Array.from({ length: 16 }, (_, i) => 1.76 - i * 0.02);
    const last = model.length - 1;
    const files = model.map((T, i) => ({ id: `f${i}`, name: `f${i}`, fields: (i === 0 || i === last ? { bath_vapour_pressure_Pa: String(vapourPressure(T).pressure_Pa) } : {}) as Record<string, string> }));
    const pick = (T: number) => ({ arrival_s: 0.05 / secondSound(T), arrivalSd_s: 1e-6, delay_s: 0.05 / secondSound(T), delaySd_s: 1e-6, timeZero_s: 0, timeZeroSd_s: 0, timeZero: 'file t = 0' as const, reference: "from the file's t = 0" as const, referenceTime_s: 0, picker: 'fraction' as const, sensor: 's', heater: null, template: null, baseline: { level: 0, noise: 1, samples: 10 }, peak: 10, snr: 10 });
    const picks = new Map(model.map((T, i) => [`f${i}`, pick(T)]));
    const settings = { distance_m: 0.05, distanceSd_m: 2e-5, offset_s: 0, offsetSd_s: 0 };
    // Without the last pressure: undecided rows past the turn, both continuations, one of them the truth.
    const open = buildSeries(files.map((f, i) => (i === last ? { ...f, fields: {} } : f)), picks, new Map(), settings, null);
    const undecided = open.filter((r) => r.ambiguous);
    expect(undecided.length).toBeGreaterThan(3);
    for (const r of undecided) {
      expect(r.chosen).toBeNull();
      const T = model[open.indexOf(r)] as number;
      const alternatives = r.ambiguous?.alternatives.map((k) => r.conversion?.candidates[k]?.temperature_K ?? 0) ?? [];
      expect(Math.min(...alternatives.map((x) => Math.abs(x - T)))).toBeLessThan(1e-6);
    }
    // With it: every file is decided; its 95 % interval holds the truth (next to the turn the
    // interval spans both branches), and away from the turn the value is the truth itself.
    const settled = buildSeries(files, picks, new Map(), settings, null);
    expect(settled.some((r) => r.chosenBy === 'settled by a later pressure')).toBe(true);
    settled.forEach((r, i) => {
      const c = r.chosen === null ? undefined : r.conversion?.candidates[r.chosen];
      const T = model[i] as number;
      expect(c).toBeDefined();
      expect(T).toBeGreaterThanOrEqual((c?.interval95_K[0] ?? Number.NaN) - 1e-9);
      expect(T).toBeLessThanOrEqual((c?.interval95_K[1] ?? Number.NaN) + 1e-9);
      if (!c?.reaches95.includes('maximum')) expect(c?.temperature_K).toBeCloseTo(T, 6);
    });
  });

  it('names heater and sensor channels from their names', () => {
    expect(defaultChannels(['CH1 heater drive', 'CH2 bolometer'])).toEqual({ heater: 'CH1 heater drive', sensor: 'CH2 bolometer' });
    expect(defaultChannels(['col2', 'col3'])).toEqual({ heater: null, sensor: 'col2' });
  });
});
