/**
 * The help of the planner's and the converter's inputs: every field has a topic, and the valid
 * range the help names is the one validation names (both come from the same specs and limits).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { type PlanFile, parsePlanFile } from '../../src/io/plan-file';
import type { Unit } from '../../src/io/quantity';
import { type ConverterFieldKey, FIELD_SPECS } from '../../src/ui/converter/converter-fields';
import { CONVERTER_CHOICE_HELP, CONVERTER_FIELD_HELP, converterFieldHelp, distanceColumnHelp, sweepHelp } from '../../src/ui/converter/converter-help';
import { readDistanceRows, readSweepText } from '../../src/ui/converter/table-input';
import { BUILT_IN_PLAN } from '../../src/ui/planner/default-plan';
import {
  BATH_FIELDS,
  DIGITISER_FIELDS,
  ECHO_ORDER_FIELD,
  fieldRangeText,
  HEATER_FIELDS,
  type NumberField,
  planFieldSpec,
  pulsePointField,
  reflectorFields,
  sensorFields,
  TARGET_FIELDS,
} from '../../src/ui/planner/plan-fields';
import { fieldRangeText as specRangeText, fieldValueText, readFieldText, shownFieldUnit, unitLabel } from '../../src/ui/fields/field-spec';
import { DEFAULT_DISPLAY_UNITS } from '../../src/ui/units/unit-choices';
import { PLAN_NUMBER_HELP, PLAN_OTHER_HELP, planHelpKey, planNumberHelp, planUnitsText } from '../../src/ui/planner/planner-help';

function demoPlan(): PlanFile {
  const parsed = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed.plan;
}

const DEMO = demoPlan();
/** The demo with a custom pulse, so the pulse-point fields have values. */
const CUSTOM: PlanFile = {
  ...DEMO,
  heater: { ...DEMO.heater, shape: { custom: [[0, 0], [2e-6, 1], [9.8e-5, 1], [1e-4, 0]] } },
};
/** Plans whose dependent ranges (rise time, record length, pre-trigger) differ. */
const PLANS: readonly [string, PlanFile][] = [
  ['demo', DEMO],
  ['built-in', BUILT_IN_PLAN],
  ['custom pulse', CUSTOM],
  ['short record', { ...DEMO, heater: { ...DEMO.heater, width_s: 2e-5 }, digitiser: { ...DEMO.digitiser, recordLength_s: 5e-3, preTrigger_s: 2e-3 } }],
];

/** Every number field of the planner, with the rows its tables make. */
const PLAN_FIELDS: readonly NumberField[] = [
  ...Object.values(BATH_FIELDS),
  ...Object.values(HEATER_FIELDS),
  ...Object.values(sensorFields(0, 'k0')),
  ...Object.values(sensorFields(2, 'k7')),
  ...Object.values(reflectorFields(1, 'p1')),
  pulsePointField(0, 0),
  pulsePointField(2, 1),
  ECHO_ORDER_FIELD,
  ...Object.values(DIGITISER_FIELDS),
  ...Object.values(TARGET_FIELDS),
];

/** The valid range a help topic names: the text after "valid " up to the end or a ";". */
function validPart(range: string | undefined): string {
  const match = /valid (.+?)(?:;|$)/.exec(range ?? '');
  if (!match?.[1]) throw new Error(`no valid range in “${range}”`);
  return match[1];
}

/** A bare SI number clearly outside [min, max] on each side that has room. */
function outside(min: number, max: number): number[] {
  return [max + Math.max(1, Math.abs(max)), ...(min !== 0 || max < 0 ? [min - Math.max(1, Math.abs(min))] : [-1])];
}

describe('planner help', () => {
  it.each(PLAN_FIELDS.map((f) => [f.key, f] as const))('%s has a topic: what, units, typical values and where it comes from', (_key, field) => {
    const topic = PLAN_NUMBER_HELP[planHelpKey(field.key)];
    expect(topic?.what.length).toBeGreaterThan(20);
    expect(topic?.typical.length).toBeGreaterThan(0);
    const help = planNumberHelp(field, fieldRangeText(field, DEMO));
    expect(help.units?.length).toBeGreaterThan(5);
    expect(help.origin).toMatch(/demo plan, an invented/);
  });

  it.each(PLAN_FIELDS.map((f) => [f.key, f] as const))('%s: the help names the range its messages name, for each plan', (_key, field) => {
    for (const [, plan] of PLANS) {
      const named = validPart(planNumberHelp(field, fieldRangeText(field, plan)).range);
      const range = typeof field.range === 'function' ? field.range(plan) : field.range;
      for (const value of outside(range[0], range[1])) {
        const read = readFieldText(planFieldSpec(field, plan), String(value), null);
        expect(read.ok, `${field.key} = ${value}`).toBe(false);
        if (!read.ok) expect(read.message).toContain(named);
      }
    }
  });

  it.each(PLAN_FIELDS.filter((f) => f.kind).map((f) => [f.key, f] as const))('%s: a bare number is read in the unit shown, as the help says', (_key, field) => {
    expect(planUnitsText(field)).toMatch(/a bare number is in the unit shown beside the box$/);
    // A value inside the range, set in the demo (fields such as the disk radius are not in every plan).
    const [min, max] = typeof field.range === 'function' ? field.range(DEMO) : field.range;
    const value = min > 0 ? Math.sqrt(min * max) : max / 2;
    const plan = field.set(DEMO, value);
    const spec = planFieldSpec(field, plan);
    const unit = shownFieldUnit(spec, value, DEFAULT_DISPLAY_UNITS);
    const read = readFieldText(spec, fieldValueText(value, unit), unit);
    expect(read.ok).toBe(true);
    // Six significant digits are shown, so the value reads back to within 5 parts in 10⁶.
    if (read.ok) expect(Math.abs((read.value ?? 0) - value)).toBeLessThanOrEqual(5e-6 * Math.abs(value));
  });

  it('plain-number fields say they take no unit', () => {
    expect(planUnitsText(ECHO_ORDER_FIELD)).toBe('a whole number, no unit');
    expect(planUnitsText(TARGET_FIELDS.snr)).toBe('a plain number, no unit');
  });

  it('finds the topic of a table row by leaving out the row', () => {
    expect(planHelpKey('sensor.k12.distanceSd')).toBe('sensor.distanceSd');
    expect(planHelpKey('plane.p3.reflection')).toBe('plane.reflection');
    expect(planHelpKey('pulse.4.time')).toBe('pulse.time');
    expect(planHelpKey('bath.temperature')).toBe('bath.temperature');
    expect(planHelpKey('echoOrder')).toBe('echoOrder');
  });

  it('has no topic for a field that does not exist', () => {
    expect(() => planNumberHelp({ ...ECHO_ORDER_FIELD, key: 'nothing.here' }, '0–1')).toThrow(/No help for the planner field “nothing\.here”/);
  });

  it.each(Object.entries(PLAN_OTHER_HELP))('%s (not a number field) has a topic', (_key, topic) => {
    expect(topic.what.length).toBeGreaterThan(20);
    expect(topic.origin.length).toBeGreaterThan(0);
  });

  it.each([
    ['plan.name', (text: string): PlanFile => ({ ...DEMO, name: text })],
    ['sensor.id', (text: string): PlanFile => ({ ...DEMO, sensors: DEMO.sensors.map((s, i) => (i === 0 ? { ...s, id: text } : s)) })],
    ['sensor.label', (text: string): PlanFile => ({ ...DEMO, sensors: DEMO.sensors.map((s, i) => (i === 0 ? { ...s, label: text } : s)) })],
    ['plane.label', (text: string): PlanFile => ({ ...DEMO, reflectors: DEMO.reflectors.map((r, i) => (i === 0 ? { ...r, label: text } : r)) })],
  ] as const)('%s: the plan file takes as many characters as the help says, and no more', (key, withText) => {
    const most = Number(/^1–(\d+) characters/.exec(PLAN_OTHER_HELP[key].range)?.[1]);
    expect(most).toBeGreaterThan(10);
    expect(parsePlanFile(JSON.stringify(withText('x'.repeat(most)))).ok).toBe(true);
    expect(parsePlanFile(JSON.stringify(withText('x'.repeat(most + 1)))).ok).toBe(false);
  });
});

const CONVERTER_KEYS = Object.keys(FIELD_SPECS) as ConverterFieldKey[];
/** Each field with each unit it offers (null for a plain number). */
const FIELD_UNITS: readonly [ConverterFieldKey, Unit | null][] = CONVERTER_KEYS.flatMap((key) => {
  const units: readonly (Unit | null)[] = FIELD_SPECS[key].units ?? [null];
  return units.map((unit) => [key, unit] as [ConverterFieldKey, Unit | null]);
});

describe('converter help', () => {
  it.each(CONVERTER_KEYS)('%s has a topic: what, units, typical values and where it comes from', (key) => {
    const topic = CONVERTER_FIELD_HELP[key];
    expect(topic.what.length).toBeGreaterThan(20);
    expect(topic.typical.length).toBeGreaterThan(0);
    const help = converterFieldHelp(key, FIELD_SPECS[key].units?.[0] ?? null);
    expect(help.units?.length).toBeGreaterThan(5);
    expect(help.range).toMatch(/^typically .+; valid /);
    expect(help.origin?.length).toBeGreaterThan(5);
  });

  it.each(FIELD_UNITS)('%s in %s: the help names the range its messages name', (key, unit) => {
    const spec = FIELD_SPECS[key];
    const named = validPart(converterFieldHelp(key, unit).range);
    expect(named).toBe(specRangeText(spec).split(';')[0]);
    const [min, max] = spec.range;
    for (const value of outside(min, max)) {
      const text = fieldValueText(value, unit);
      const read = readFieldText(spec, text, unit);
      expect(read.ok, `${key} = ${text} ${unit}`).toBe(false);
      if (!read.ok) expect(read.message).toContain(named);
    }
  });

  it.each(FIELD_UNITS)('%s in %s: the starting value the help gives is the field’s own', (key, unit) => {
    const spec = FIELD_SPECS[key];
    const origin = converterFieldHelp(key, unit).origin ?? '';
    if (spec.initial === null) {
      expect(spec.blank).toBeDefined();
      expect(origin).toMatch(/^(empty|no reading)/);
      return;
    }
    const shown = fieldValueText(spec.initial, unit);
    expect(origin.startsWith(`${shown}${unit ? ` ${unitLabel(spec, unit)}` : ''}:`)).toBe(true);
    expect(readFieldText(spec, shown, unit)).toEqual({ ok: true, value: spec.initial });
  });

  it.each(CONVERTER_KEYS.filter((k) => (FIELD_SPECS[k].units ?? []).length > 0))('%s: the typed example in its help is a good value of its kind', (key) => {
    const spec = FIELD_SPECS[key];
    const unit = spec.units?.[0] ?? null;
    const example = /e\.g\. “(.+)”/.exec(converterFieldHelp(key, unit).units ?? '')?.[1] ?? '';
    expect(readFieldText(spec, example, unit)).toMatchObject({ ok: true });
  });

  it('fields that may be empty say what an empty field means', () => {
    for (const key of CONVERTER_KEYS.filter((k) => FIELD_SPECS[k].blank !== undefined)) {
      expect(converterFieldHelp(key, FIELD_SPECS[key].units?.[0] ?? null).range).toContain(`empty for ${FIELD_SPECS[key].blank}`);
    }
  });

  it.each([
    ['distance', { distance: '200000', delay: '1', sd: '' }],
    ['delay', { distance: '20', delay: '20000000', sd: '' }],
    ['sd', { distance: '20', delay: '1', sd: '2000000000' }],
  ] as const)('the %s column’s help names the range the table’s messages name', (column, row) => {
    const units = { distance: 'mm', delay: 'ms', sd: 'µs' } as const;
    const named = validPart(distanceColumnHelp(units)[column].range);
    const read = readDistanceRows([row], units);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.message).toContain(named);
  });

  it('the sweep’s help names the delay range its messages name', () => {
    for (const unit of ['ms', 'µs', 's'] as const) {
      const named = /^delays (.+)$/.exec(sweepHelp(unit).text.range)?.[1] ?? '';
      const read = readSweepText('0, 1\n1, 1e30', unit);
      expect(read.ok).toBe(false);
      if (!read.ok) expect(read.message).toContain(named);
    }
  });

  it.each(Object.entries(CONVERTER_CHOICE_HELP))('the choice %s has a topic', (_key, topic) => {
    expect(topic.what.length).toBeGreaterThan(20);
    expect(topic.origin.length).toBeGreaterThan(0);
  });
});
