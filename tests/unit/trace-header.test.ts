/**
 * Trace header values: only the documented keys are used (src/io/trace-header.ts), each with its
 * unit, dates only in ISO 8601; the page's series and the command line read one file the same way.
 * Vapour pressure 1638.2 Pa ≈ 1.800 K on ITS-90 (the kernel's own curve, as in plan-file tests).
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { TraceCsvParser } from '../../src/io/trace-csv';
import { parseIsoDateTime, readTraceHeader, TRACE_HEADER_KEYS } from '../../src/io/trace-header';
import { pickTraceArrival } from '../../src/io/trace-pick';
import { buildSeries } from '../../src/ui/converter/series';
import { exampleTraceText } from '../../src/ui/converter/trace/trace-example';
import { run, runJson } from '../support/cli-harness';

const dir = mkdtempSync(join(tmpdir(), 'sekundo-header-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('documented keys only, with their units', () => {
  it('an insulation-vacuum "pressure" line is not the bath vapour pressure', () => {
    const h = readTraceHeader({ 'Insulation vacuum pressure': '2e-5 mbar', 'pressure': '12 kPa', 'He gas pressure (bar)': '1.2' });
    expect(h.vapourPressure_Pa).toBeNull();
    expect(h.problems).toEqual([]);
  });

  it('a unit in the key is read: bath vapour pressure (bar) 0.016382 is 1638.2 Pa, not 0.016 Pa', () => {
    expect(readTraceHeader({ 'Bath vapour pressure (bar)': '0.016382' }).vapourPressure_Pa?.value).toBeCloseTo(1638.2, 9);
    expect(readTraceHeader({ bath_vapour_pressure_mbar: '16.382' }).vapourPressure_Pa?.value).toBeCloseTo(1638.2, 9);
    expect(readTraceHeader({ 'vapor pressure': '12.288 torr' }).vapourPressure_Pa?.value).toBeCloseTo((12.288 * 101325) / 760, 9);
  });

  it('a number with no unit anywhere, or two units that disagree, is refused with a message', () => {
    const bare = readTraceHeader({ bath_vapour_pressure: '1638' });
    expect(bare.vapourPressure_Pa).toBeNull();
    expect(bare.problems[0]).toMatch(/the number has no unit; write it with the value \("1638 Pa"\)/);
    const clash = readTraceHeader({ 'bath vapour pressure (Pa)': '16 mbar' });
    expect(clash.vapourPressure_Pa).toBeNull();
    expect(clash.problems[0]).toMatch(/the key says Pa but the value has another unit/);
  });

  it('dates: ISO 8601 only; 3.4.2026 and 04/03/2026 are refused, not guessed', () => {
    expect(parseIsoDateTime('2026-04-03')).toBe(Date.UTC(2026, 3, 3));
    expect(parseIsoDateTime('2026-04-03T14:02:11.25')).toBe(Date.UTC(2026, 3, 3, 14, 2, 11, 250));
    expect(parseIsoDateTime('2026-04-03 14:02:11+02:00')).toBe(Date.UTC(2026, 3, 3, 12, 2, 11));
    for (const text of ['3.4.2026', '04/03/2026', 'Apr 3 2026', '2026-02-30', '2026-13-01', '2026-04-03T25:00']) expect(parseIsoDateTime(text)).toBeNull();
    const h = readTraceHeader({ Date: '3.4.2026' });
    expect(h.acquired_ms).toBeNull();
    expect(h.problems[0]).toMatch(/not an ISO 8601 date .* 3\.4\.2026 or 04\/03\/2026 read differently/);
    expect(readTraceHeader({ timestamp_s: '1700000000' }).acquired_ms?.value).toBe(1.7e12);
  });

  it('every documented key has a meaning and a format for the help', () => {
    for (const k of TRACE_HEADER_KEYS) expect(k.meaning.length * k.format.length).toBeGreaterThan(0);
  });
});

describe('the page and the command line read one file the same way', () => {
  const text = exampleTraceText(1.8, '2026-11-03T15:00:00Z', 1001).replace('time_s,', '# bath vapour pressure (mbar): 16.382\n# Insulation vacuum pressure: 2e-5 mbar\ntime_s,');
  const path = join(dir, 'shot.csv');
  writeFileSync(path, text);

  it('both choose by the header vapour pressure, and the CLI shows the value it used', async () => {
    const json = await runJson<{ chosen: number; choice: string; candidates: { temperature_K: number }[]; header: { vapourPressure_Pa: { value: number } } }>(
      'trace',
      path,
      '--distance',
      '50mm',
      '--heater-column',
      'heater_V',
    );
    expect(json.header.vapourPressure_Pa.value).toBeCloseTo(1638.2, 9);
    expect(json.choice).toMatch(/header \("bath vapour pressure \(mbar\): 16.382"\)/);
    // The candidate near 1.8 K (the half-height pick sits a little after the onset, hence 1.81 K).
    expect(json.candidates[json.chosen]?.temperature_K).toBeCloseTo(1.8, 1);

    const parser = new TraceCsvParser();
    parser.feed(new TextEncoder().encode(text));
    const trace = parser.finish();
    const pick = pickTraceArrival(trace, { picker: 'fraction', heater: 'heater_V' });
    const [row] = buildSeries([{ id: 'a', name: 'shot.csv', fields: trace.metadata.fields }], new Map([['a', pick]]), new Map(), { distance_m: 0.05, distanceSd_m: 0, offset_s: 0, offsetSd_s: 0 }, null);
    expect(row?.pressure_Pa).toBeCloseTo(1638.2, 9);
    expect(row?.chosen).toBe(json.chosen);

    const shown = await run('trace', path, '--distance', '50mm', '--heater-column', 'heater_V');
    expect(shown.stdout).toMatch(/Header +bath vapour pressure 1638\.2 Pa \(from "bath vapour pressure \(mbar\): 16\.382"\); recorded 2026-11-03T15:00:00\.000Z/);
  });
});
