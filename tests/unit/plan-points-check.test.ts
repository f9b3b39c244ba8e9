/**
 * The fast check of a custom pulse's points (src/io/plan-points-check.ts) agrees with the plan-file
 * schema on every rule, and a plan file written with it is the file the schema path wrote: the
 * page checks plans on each keystroke and writes its autosave after each pause in typing with it.
 * The rules are the plan-file format's own (no source).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { type PlanFile, parsePlanFile, serializePlanFile } from '../../src/io/plan-file';
import { PLAN_FILE_SCHEMA } from '../../src/io/plan-file-schema';
import { pointsPass, withCheckedPointsShort } from '../../src/io/plan-points-check';
import { CUSTOM_PULSE_MAX_POINTS } from '../../src/physics';
import { saveAutosave } from '../../src/io/workspace-storage';

const demoText = readFileSync('public/demo-plan.json', 'utf8');

function demo(): PlanFile {
  const parsed = parsePlanFile(demoText);
  if (!parsed.ok) throw new Error(parsed.errors.join('; '));
  return parsed.plan;
}

function withPoints(points: unknown): PlanFile {
  const plan = demo();
  const { width_s: _width, ...heater } = plan.heater as PlanFile['heater'] & { width_s?: number };
  return { ...plan, heater: { ...heater, shape: { custom: points as [number, number][] } } } as PlanFile;
}

const halfSine = (n: number): [number, number][] => Array.from({ length: n }, (_, i) => [(i * 1e-4) / (n - 1), Math.round(1000 * Math.sin((Math.PI * i) / (n - 1))) / 1000 || (i === 0 ? 0 : 0.001)]);

describe('custom pulse points: the fast check agrees with the schema', () => {
  const cases: [string, unknown][] = [
    ['a half sine of the most points', halfSine(CUSTOM_PULSE_MAX_POINTS)],
    ['one point too many', halfSine(CUSTOM_PULSE_MAX_POINTS + 1)],
    ['one point', [[0, 1]]],
    ['times not increasing', [[0, 0], [2e-5, 1], [2e-5, 0.5], [4e-5, 0]]],
    ['a negative amplitude', [[0, 0], [2e-5, -1], [4e-5, 0]]],
    ['all amplitudes zero', [[0, 0], [2e-5, 0], [4e-5, 0]]],
    ['a NaN time', [[0, 0], [Number.NaN, 1], [4e-5, 0]]],
    ['a point of three numbers', [[0, 0, 1], [2e-5, 1], [4e-5, 0]]],
    ['a text amplitude', [[0, 0], [2e-5, '1'], [4e-5, 0]]],
  ];
  for (const [name, points] of cases) {
    it(name, () => {
      const schema = PLAN_FILE_SCHEMA.safeParse(withPoints(points)).success;
      expect(pointsPass(points)).toBe(schema);
    });
  }

  it('the stand-in keeps the duration and height, and hands back the points taken out', () => {
    const plan = withPoints(halfSine(200));
    const short = withCheckedPointsShort(plan);
    expect(short.plan.heater.shape).toEqual({ custom: [[0, 1], [1e-4, 1]] });
    expect(short.points).toBe(plan.heater.shape);
    const named = demo();
    expect(withCheckedPointsShort(named)).toEqual({ plan: named, points: null });
  });

  it('a plan file with 10 000 points is written as the schema path wrote it, and read back unchanged', () => {
    const plan = withPoints(halfSine(CUSTOM_PULSE_MAX_POINTS));
    const checked = PLAN_FILE_SCHEMA.parse(plan);
    const text = serializePlanFile(plan);
    expect(text).toContain('[0.0001, 0.001]');
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(checked)));
    const back = parsePlanFile(text);
    expect(back.ok && back.plan).toEqual(plan);
  });

  it('a plan whose points fail is refused by the writer as before', () => {
    expect(() => serializePlanFile(withPoints([[0, 0], [2e-5, -1], [4e-5, 0]]))).toThrow(TypeError);
  });
});

describe('autosave slots are pruned at a slot’s first save only', () => {
  it('later saves of the same slot read no other slot', () => {
    const items = new Map<string, string>();
    let reads = 0;
    const store = {
      get length() {
        return items.size;
      },
      key: (i: number) => [...items.keys()][i] ?? null,
      getItem: (k: string) => {
        reads += 1;
        return items.get(k) ?? null;
      },
      setItem: (k: string, v: string) => void items.set(k, v),
      removeItem: (k: string) => void items.delete(k),
    };
    saveAutosave(store, demo(), 'tab-a');
    saveAutosave(store, demo(), 'tab-b');
    const first = reads;
    expect(first).toBeGreaterThan(0);
    saveAutosave(store, demo(), 'tab-b');
    saveAutosave(store, demo(), 'tab-b');
    expect(reads).toBe(first);
  });
});
