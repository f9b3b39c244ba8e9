/**
 * Reading plan files of older versions: one step per version, each saying what it changed, so a
 * file from before opens with a note instead of an error.
 */
import { CURRENT_PLAN_VERSION, type PlanMigrationNote } from './plan-file-types';
import { isNumber, isRecord } from './plan-file-schema';

/**
 * A step that turns a plan of one version (its key in the table) into the next version; it tells
 * `note` each change a user should know about.
 */
export type PlanMigration = (plan: Record<string, unknown>, note: (change: string) => void) => Record<string, unknown>;

/** R that version 1 offered by default for every new plane ("glass, measured about 0.4"). */
const V1_DEFAULT_REFLECTION = 0.4;

function sig(x: number, digits = 6): number {
  return Number(x.toPrecision(digits));
}

/**
 * Version 1 → 2: sized heaters, walls that reflect as walls, and a target that says what it is for.
 *  - A "planar" heater (a plane wave at every distance) of area A becomes a √A × √A rectangle,
 *    computed with its size: the plane-wave value now holds only on short paths.
 *  - A "point" heater was a small source on a wall (2π): it keeps that, as `mount: "wall"`.
 *  - A plane with R = 0.4, version 1's default, becomes a solid wall, R = (Z − h)/(Z + h) ≈ 1;
 *    any other R is kept as a measured value.
 *  - The temperature target becomes an absolute-reading target (what "meets target" meant).
 */
export function planV1toV2(plan: Record<string, unknown>, note: (change: string) => void): Record<string, unknown> {
  const out: Record<string, unknown> = { ...plan };
  if (isRecord(plan.heater)) {
    const heater: Record<string, unknown> = { ...plan.heater };
    if (heater.geometry === 'planar' && isNumber(heater.area_m2)) {
      const side = sig(Math.sqrt(heater.area_m2));
      delete heater.area_m2;
      heater.geometry = 'rectangle';
      heater.width_m = side;
      heater.height_m = side;
      note(
        `heater: the planar film of ${sig(plan.heater.area_m2 as number * 1e4, 4)} cm² is now a ${sig(side * 1e3, 4)} mm × ${sig(side * 1e3, 4)} mm rectangle computed with its size (it was a plane wave at every distance; now the plane-wave value holds only on short paths and the pulse shrinks beyond)`,
      );
    } else if (heater.geometry === 'point') {
      heater.mount = 'wall';
      note('heater: the point source stays on a wall (radiating into 2π), as before; choose "free" if it stands in the liquid (4π)');
    }
    out.heater = heater;
  }
  if (Array.isArray(plan.reflectors)) {
    out.reflectors = plan.reflectors.map((r, i) => {
      if (!isRecord(r) || !isNumber(r.reflection)) return r;
      const name = typeof r.label === 'string' ? `"${r.label}"` : `plane ${i + 1}`;
      if (r.reflection === V1_DEFAULT_REFLECTION) {
        const { reflection: _dropped, ...wall } = r;
        note(`reflectors: ${name} had R = 0.4, the old default; it is now a solid wall, R = (Z − h)/(Z + h) ≈ 1 — type a measured R to use another`);
        return wall;
      }
      note(`reflectors: ${name} keeps its typed R = ${r.reflection} as a measured value (a solid wall would give R ≈ 1)`);
      return r;
    });
  }
  if (isRecord(plan.targets) && plan.targets.temperatureKind === undefined) {
    out.targets = { ...plan.targets, temperatureKind: 'absolute' };
    note('targets: the temperature sd target is read as one absolute reading (judged with the u₂ curve\'s own sd); choose "change" to judge changes between readings');
  }
  return out;
}

/** Steps from older versions, keyed by the version they start from. */
export const PLAN_MIGRATIONS: Readonly<Record<number, PlanMigration>> = { 1: planV1toV2 };

/**
 * Brings a plan from `fromVersion` up to `toVersion` through the migration table, one version at a
 * time (each step's result gets the next version number), with what each step changed. Returns
 * the messages if a step is missing.
 */
export function migratePlan(
  plan: Record<string, unknown>,
  fromVersion: number,
  migrations: Readonly<Record<number, PlanMigration>> = PLAN_MIGRATIONS,
  toVersion: number = CURRENT_PLAN_VERSION,
): { ok: true; plan: Record<string, unknown>; notes: PlanMigrationNote[] } | { ok: false; errors: string[] } {
  let current = plan;
  const notes: PlanMigrationNote[] = [];
  for (let version = fromVersion; version < toVersion; version++) {
    const step = Object.hasOwn(migrations, version) ? migrations[version] : undefined;
    if (!step) return { ok: false, errors: [`version: no way to read version ${version} files (this Sekundo reads version ${toVersion})`] };
    const changes: string[] = [];
    current = { ...step(current, (c) => changes.push(c)), version: version + 1 };
    notes.push({ fromVersion: version, changes });
  }
  return { ok: true, plan: current, notes };
}
