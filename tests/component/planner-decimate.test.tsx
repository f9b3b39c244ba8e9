import fc from 'fast-check';
import type { SampledSignal } from '../../src/physics';
import { decimateSegments } from '../../src/ui/planner/decimate';

const signal = (start_s: number, step_s: number, values: number[]): SampledSignal => ({ start_s, step_s, values: Float64Array.from(values) });

describe('decimateSegments (min/max per pixel column)', () => {
  it('keeps at most two points per column, plus the baseline ends', () => {
    const values = Array.from({ length: 100_000 }, (_, i) => Math.sin(i / 50));
    const line = decimateSegments([signal(0, 1e-6, values)], 0, 0.1, 800);
    expect(line.t.length).toBeLessThanOrEqual(2 * 800 + 2);
    expect(line.t.length).toBe(line.v.length);
  });

  it('never loses a peak: a one-sample spike survives', () => {
    const values = new Array(50_000).fill(0);
    values[31_337] = 5;
    values[12_345] = -3;
    const line = decimateSegments([signal(0, 1e-6, values)], 0, 0.05, 300);
    expect(Math.max(...line.v)).toBe(5);
    expect(Math.min(...line.v)).toBe(-3);
    expect(line.t[line.v.indexOf(5)]).toBeCloseTo(0.031337, 12);
  });

  it('keeps the points in time order, min and max in the order they occur', () => {
    const line = decimateSegments([signal(0, 1, [0, 3, -2, 1, 0, 0])], 0, 5, 1);
    expect(line.t).toEqual([1, 2]);
    expect(line.v).toEqual([3, -2]);
    const falling = decimateSegments([signal(0, 1, [0, -2, 3, 0])], 0, 3, 1);
    expect(falling.v).toEqual([-2, 3]);
  });

  it('leaves short signals untouched when there are more columns than samples', () => {
    const values = [0, 0.5, 1, 0.5, 0];
    const line = decimateSegments([signal(1, 0.5, values)], 1, 3, 1000);
    expect(line.v).toEqual(values);
    expect(line.t).toEqual([1, 1.5, 2, 2.5, 3]);
  });

  it('draws the zero baseline across the view outside the segments', () => {
    const line = decimateSegments([signal(2, 1, [0, 1, 0])], 0, 10, 100);
    expect(line.t[0]).toBe(0);
    expect(line.v[0]).toBe(0);
    expect(line.t.at(-1)).toBe(10);
    expect(line.v.at(-1)).toBe(0);
    expect(decimateSegments([], -1, 1, 10)).toEqual({ t: [-1, 1], v: [0, 0] });
  });

  it('skips samples and segments outside the view', () => {
    const line = decimateSegments([signal(0, 1, [9, 9, 9]), signal(10, 1, [1, 2, 3, 4, 5]), signal(30, 1, [9])], 11, 13, 100);
    expect(line.v).toEqual([2, 3, 4]);
    expect(line.t).toEqual([11, 12, 13]);
  });

  it('handles segments given in any order and an empty view', () => {
    const line = decimateSegments([signal(5, 1, [0, 2, 0]), signal(0, 1, [0, 1, 0])], 0, 7, 50);
    expect(line.t).toEqual([...line.t].sort((a, b) => a - b));
    expect(decimateSegments([signal(0, 1, [1])], 1, 1, 10)).toEqual({ t: [], v: [] });
  });

  it('for any signal: bounded size, the extremes kept, times sorted and inside the view', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e3, max: 1e3, noNaN: true }), { minLength: 2, maxLength: 3000 }),
        fc.integer({ min: 1, max: 400 }),
        (values, columns) => {
          const line = decimateSegments([signal(0, 1, values)], 0, values.length - 1, columns);
          expect(line.t.length).toBeLessThanOrEqual(2 * columns + 2);
          expect(Math.max(...line.v)).toBe(Math.max(...values));
          expect(Math.min(...line.v)).toBe(Math.min(...values));
          for (let i = 1; i < line.t.length; i++) expect(line.t[i] as number).toBeGreaterThanOrEqual(line.t[i - 1] as number);
        },
      ),
      { numRuns: 150 },
    );
  });
});
