/**
 * Small refusals that must say the true thing: sizes over a limit never read as the limit, values
 * too large to compute with are refused (not an sd of NaN), an over-long line is "too long" however
 * the file arrives, an oversize custom pulse names the limit, UTF-16 plan files are read like
 * UTF-16 traces, and sensor ids that look the same are refused. Common practice, no source.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { formatFileSize, overLimitText } from '../../src/io/byte-size';
import { parsePlanFile } from '../../src/io/plan-file';
import { planTextFromBytes } from '../../src/io/plan-text';
import { TRACE_CSV_SIZE_LIMIT_BYTES, TraceCsvParser } from '../../src/io/trace-csv';
import { readBatch } from '../../src/ui/converter/batch-results';
import { readPlanFile } from '../../src/ui/planner/plan-file-actions';

const MIB = 1024 * 1024;
const DEMO = readFileSync('public/demo-plan.json', 'utf8');

function parseTrace(text: string, chunk: number): () => unknown {
  const bytes = new TextEncoder().encode(text);
  return () => {
    const parser = new TraceCsvParser({ totalBytes: bytes.length });
    for (let i = 0; i < bytes.length; i += chunk) parser.feed(bytes.subarray(i, i + chunk));
    return parser.finish();
  };
}

function utf16(text: string): Uint8Array {
  const bytes = new Uint8Array(2 + text.length * 2);
  bytes.set([0xff, 0xfe]);
  for (let i = 0; i < text.length; i++) {
    bytes[2 + 2 * i] = text.charCodeAt(i) & 0xff;
    bytes[3 + 2 * i] = text.charCodeAt(i) >> 8;
  }
  return bytes;
}

describe('sizes over a limit', () => {
  it('256 MiB + 1 byte is not reported as "256 MiB"', () => {
    expect(formatFileSize(256 * MIB + 1, 256 * MIB)).toBe('268435457 bytes');
    expect(overLimitText(256 * MIB + 1, 256 * MIB)).toBe('268435457 bytes, over the 256 MiB limit');
    expect(overLimitText(300 * MIB, 256 * MIB)).toBe('300 MiB, over the 256 MiB limit');
  });

  it('the trace parser and the page batch reader say the excess', () => {
    expect(() => new TraceCsvParser({ totalBytes: TRACE_CSV_SIZE_LIMIT_BYTES + 1 })).toThrow(`${TRACE_CSV_SIZE_LIMIT_BYTES + 1} bytes, over the 512 MiB limit`);
    const read = readBatch('big.csv', new Uint8Array(2 * MIB + 1), {} as never, 'none' as never);
    expect(read.ok ? '' : read.message).toContain(`${2 * MIB + 1} bytes, over the 2 MiB limit`);
  });
});

describe('trace values and lines', () => {
  const rows = (v: string) => ['time_s,sensor', ...Array.from({ length: 20 }, (_, i) => `${(i - 5) * 1e-6},${i === 12 ? v : '0.001'}`)].join('\n');

  it('1e308 in a trace is refused as too large to compute with, naming line and column', () => {
    expect(parseTrace(rows('1e308'), 1 << 20)).toThrow(/line 14: column "sensor": 1e\+308 is too large to compute with/);
    expect(parseTrace(rows('1e99'), 1 << 20)).not.toThrow();
  });

  it.each([
    ['in one chunk (as the command line reads)', 4 * MIB],
    ['in 64 KiB chunks (as the page reads)', 64 * 1024],
  ])('a 2 MB line is "longer than … without a line break" %s', (_how, chunk) => {
    expect(parseTrace(`${'x'.repeat(2_000_000)}\n0,1\n1,2\n2,3\n`, chunk)).toThrow(/line 1: longer than 1048576 bytes without a line break/);
  });
});

describe('plan files', () => {
  it('a 190 000-point custom pulse is refused naming the point limit', () => {
    const plan = JSON.parse(DEMO) as { heater: Record<string, unknown> };
    plan.heater.shape = { custom: Array.from({ length: 190_000 }, (_, i) => [i * 1e-9, 1]) };
    const parsed = parsePlanFile(JSON.stringify(plan));
    expect(parsed.ok).toBe(false);
    const message = parsed.ok ? '' : parsed.errors.join('; ');
    expect(message).toContain('heater.shape: custom: must be a list of 2–10000 points');
    expect(message).toContain('a list of 190000');
    expect(message).not.toContain('an object');
  });

  it('UTF-16 plan files with a byte-order mark open, in the page as on the command line', async () => {
    const text = planTextFromBytes(utf16(DEMO));
    expect(text.ok && parsePlanFile(text.text).ok).toBe(true);
    const read = await readPlanFile(new Blob([utf16(DEMO) as Uint8Array<ArrayBuffer>]));
    expect(read.ok).toBe(true);
  });

  it('a PNG is refused as not a plan file, in one line', async () => {
    const read = await readPlanFile(new Blob([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d])]));
    expect(read.ok ? [] : read.errors).toEqual(['plan: the file is binary (it holds NUL bytes), not a plan file; a plan file is JSON text']);
  });

  it('sensor ids differing only by a zero-width character (or a look-alike form) are refused', () => {
    const plan = JSON.parse(DEMO) as { sensors: { id: string }[] };
    (plan.sensors[0] as { id: string }).id = 'b10';
    (plan.sensors[1] as { id: string }).id = 'b\u200b10';
    const zeroWidth = parsePlanFile(JSON.stringify(plan));
    expect(zeroWidth.ok ? '' : zeroWidth.errors.join('; ')).toMatch(/sensors\[1\]\.id: .*looks the same as the id of sensors\[0\]/);
    (plan.sensors[1] as { id: string }).id = 'ｂ10';
    expect(parsePlanFile(JSON.stringify(plan)).ok).toBe(false);
  });
});
