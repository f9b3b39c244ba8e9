/**
 * Plan files of format version 1 (written before heaters had sizes and walls reflected as walls)
 * still open: read as version 2 with a note of each change. The fixture is the old demo plan, an
 * invented setup, with its lid's R changed to 0.9 to stand for a measured value.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CURRENT_PLAN_VERSION, parsePlanFile, planFileToInput, planV1toV2, serializePlanFile } from '../../src/io/plan-file';
import { computePlan } from '../../src/physics';

const V1_TEXT = readFileSync('tests/fixtures/plan-version-1.json', 'utf8');

function readV1() {
  const parsed = parsePlanFile(V1_TEXT);
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed;
}

describe('reading a version-1 plan file', () => {
  it('opens, as the current version, with one note per change', () => {
    const { plan, migrated } = readV1();
    expect(plan.version).toBe(CURRENT_PLAN_VERSION);
    expect(migrated).toHaveLength(1);
    expect(migrated[0]?.fromVersion).toBe(1);
    expect(migrated[0]?.changes).toHaveLength(4);
  });

  it('a planar film of 1 cm² becomes a 10 mm × 10 mm rectangle computed with its size, and says so', () => {
    const { plan, migrated } = readV1();
    expect(plan.heater).toMatchObject({ geometry: 'rectangle', width_m: 0.01, height_m: 0.01 });
    expect(plan.heater.area_m2).toBeUndefined();
    expect(migrated[0]?.changes[0]).toMatch(/planar film of 1 cm² is now a 10 mm × 10 mm rectangle/);
  });

  it('R = 0.4 (the old default) becomes a solid wall; another R is kept as measured', () => {
    const { plan, migrated } = readV1();
    expect(plan.reflectors[0]?.reflection).toBeUndefined();
    expect(plan.reflectors[1]?.reflection).toBe(0.9);
    expect(migrated[0]?.changes.join(' ')).toMatch(/"bottom plate" had R = 0.4, the old default; it is now a solid wall/);
    expect(migrated[0]?.changes.join(' ')).toMatch(/"glass lid" keeps its typed R = 0.9 as a measured value/);
    const planes = computePlan(planFileToInput(plan)).planes;
    expect(planes.map((p) => p.source)).toEqual(['solid-wall', 'measured']);
  });

  it('the temperature target is read as an absolute reading', () => {
    const { plan, migrated } = readV1();
    expect(plan.targets.temperatureKind).toBe('absolute');
    expect(migrated[0]?.changes[3]).toMatch(/absolute reading/);
  });

  it('a point heater keeps its wall (2π) mount', () => {
    const raw = JSON.parse(V1_TEXT);
    raw.heater.geometry = 'point';
    const changes: string[] = [];
    const out = planV1toV2(raw, (c) => changes.push(c)) as { heater: { mount: string } };
    expect(out.heater.mount).toBe('wall');
    expect(changes[0]).toMatch(/stays on a wall/);
  });

  it('saved again, the plan is a version-2 file that reads back without notes', () => {
    const { plan } = readV1();
    const again = parsePlanFile(serializePlanFile(plan));
    expect(again.ok && again.migrated).toEqual([]);
    expect(again.ok && again.plan).toEqual(plan);
  });
});
