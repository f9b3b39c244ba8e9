import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parsePlanFile } from '../../src/io/plan-file';
import { computePlan, type PlanWarning } from '../../src/physics';
import { planFileToInput } from '../../src/io/plan-file';
import { tableCsv } from '../../src/ui/export/csv-export';
import { chosenLadders, KINDS, LADDERS, readText, shownLadder, temperatureText, unitFor } from '../../src/ui/units/ladders';
import { fieldValueText, readFieldText, shownFieldUnit } from '../../src/ui/fields/field-spec';
import { DIGITISER_FIELDS, HEATER_FIELDS, type NumberField, planFieldSpec, sensorFields } from '../../src/ui/planner/plan-fields';
import { warningFigures, warningsCsv, warningUnit } from '../../src/ui/planner/warning-figures';
import { DEFAULT_DISPLAY_UNITS, type DisplayUnits } from '../../src/ui/units/unit-choices';

// Unit factors: SI prefixes; 1 torr = 101325/760 Pa and 1 mbar = 100 Pa (their definitions).

const demo = (() => {
  const parsed = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed.plan;
})();

const units = (chosen: Partial<DisplayUnits>): DisplayUnits => ({ ...DEFAULT_DISPLAY_UNITS, ...chosen });

describe('planner display units', () => {
  it('swaps the ladders that follow the header for the one chosen unit, and keeps the others', () => {
    const ladders = chosenLadders(units({ time: 'µs', length: 'cm', temperature: 'mK', pressure: 'torr', heatFlux: 'W/m2' }));
    expect(ladders.time.map((u) => u.unit)).toEqual(['µs']);
    expect(ladders.length.map((u) => u.shown)).toEqual(['cm']);
    expect(ladders.temperature.map((u) => u.unit)).toEqual(['mK']);
    expect(ladders.pressure.map((u) => u.unit)).toEqual(['torr']);
    expect(ladders.heatFlux.map((u) => u.shown)).toEqual(['W/m²']);
    expect(ladders.temperatureDifference).toBe(LADDERS.temperatureDifference);
    expect(ladders.voltage).toBe(LADDERS.voltage);
    expect(readText(2.5e-3, ladders.time)).toBe('2500 µs');
    expect(readText(133.322, ladders.pressure, 4)).toBe('1.000 torr');
  });

  it('gives each kind of field its shown ladder: chosen where it follows, the ladder for sds and time constants', () => {
    const chosen = units({ time: 's', length: 'm' });
    expect(shownLadder(KINDS.time, chosen).ladder.map((u) => u.unit)).toEqual(['s']);
    expect(shownLadder(KINDS.length, chosen).ladder.map((u) => u.unit)).toEqual(['m']);
    expect(shownLadder(KINDS.lengthSd, chosen).ladder).toBe(LADDERS.length);
    expect(shownLadder(KINDS.timeConstant, chosen).ladder).toBe(LADDERS.time);
    expect(shownLadder(KINDS.time, undefined).ladder).toBe(LADDERS.time);
  });

  it('writes field texts in the chosen unit that read back to the same value', () => {
    const chosen = units({ time: 'µs', length: 'cm', heatFlux: 'W/m2' });
    const sensor = sensorFields(0, 'k0');
    const cases = [HEATER_FIELDS.width, DIGITISER_FIELDS.recordLength, DIGITISER_FIELDS.preTrigger, sensor.distance, HEATER_FIELDS.flux] as const;
    const shown = (field: NumberField, inUnits = chosen) => {
      const value = field.get(demo) as number;
      const unit = shownFieldUnit(planFieldSpec(field, demo), value, inUnits);
      return { value, unit, text: fieldValueText(value, unit) };
    };
    for (const field of cases) {
      const { value, unit, text } = shown(field);
      const read = readFieldText(planFieldSpec(field, demo), text, unit);
      expect(read.ok && read.value).toBeCloseTo(value, 12);
    }
    expect(shown(HEATER_FIELDS.width)).toMatchObject({ unit: 'µs', text: `${Number(((demo.heater.width_s as number) * 1e6).toPrecision(6))}` });
    expect(shown(sensor.distance).unit).toBe('cm');
    // An instrument constant stays on its ladder whatever the header says.
    expect(shown(sensor.lag).unit).toBe(unitFor(sensor.lag.get(demo) as number, LADDERS.time, KINDS.timeConstant.zero).unit);
  });

  it('shows an absolute temperature to 0.1 mK in either unit', () => {
    expect(temperatureText(1.8, LADDERS.temperature)).toBe('1.8000 K');
    expect(temperatureText(1.8, chosenLadders(units({ temperature: 'mK' })).temperature)).toBe('1800.0 mK');
    expect(temperatureText(2.1768, chosenLadders(units({ temperature: 'mK' })).temperature, 1e-3)).toBe('2177 mK');
  });
});

describe('planner warnings in figures and as CSV', () => {
  const shock: PlanWarning = { code: 'shock', severity: 'caution', message: 'The front may steepen.', value: 0.0121, limit: 0.00997, sensorId: 'b10' };
  const lambda: PlanWarning = { code: 'near-lambda', severity: 'caution', message: 'Close to Tλ.', value: 2.1762, limit: 2.1758, sensorId: null };
  const heating: PlanWarning = { code: 'bath-heating', severity: 'info', message: 'Mean power into the bath.', value: 5e-5, limit: 0, sensorId: null };

  it('shows the numbers in the chosen units', () => {
    expect(warningFigures(shock)).toBe('shock distance 12.1 mm · path 9.97 mm');
    expect(warningFigures(shock, chosenLadders(units({ length: 'cm' })))).toBe('shock distance 1.21 cm · path 0.997 cm');
    expect(warningFigures(lambda, chosenLadders(units({ temperature: 'mK' })))).toBe('bath 2176.2 mK · Tλ − 1 mK 2175.8 mK');
    expect(warningFigures(heating)).toBe('average power 50.0 µW');
  });

  it('writes every warning of the demo plan with its SI value, limit and unit', () => {
    const result = computePlan(planFileToInput({ ...demo, digitiser: { ...demo.digitiser, recordLength_s: 2e-3 } }));
    expect(result.warnings.length).toBeGreaterThan(0);
    const labels = new Map(result.sensors.map((s) => [s.id, s.label]));
    const table = warningsCsv(result.warnings, labels);
    expect(table.header).toEqual(['severity', 'code', 'sensor_id', 'sensor_label', 'message', 'what', 'value', 'limit_what', 'limit', 'unit']);
    expect(table.rows).toHaveLength(result.warnings.length);
    result.warnings.forEach((w, i) => {
      const row = table.rows[i] as readonly unknown[];
      expect(row[0]).toBe(w.severity);
      expect(row[1]).toBe(w.code);
      expect(row[3]).toBe(w.sensorId === null ? '' : labels.get(w.sensorId));
      expect(row[6]).toBe(w.value);
      expect(row[9]).toBe(warningUnit(w.code));
    });
    const short = table.rows.find((r) => r[1] === 'record-too-short');
    expect(short?.[9]).toBe('s');
    // "record ends": the record length after the pre-trigger.
    expect(short?.[6]).toBeCloseTo(2e-3 - demo.digitiser.preTrigger_s, 12);
    expect(tableCsv(table).split('\r\n')[0]).toBe('severity,code,sensor_id,sensor_label,message,what,value,limit_what,limit,unit');
  });

  it('quotes a message or label that holds a comma or a quote (RFC 4180)', () => {
    const labels = new Map([['b10', 'Bolometer A, 10 mm']]);
    const lines = tableCsv(warningsCsv([{ ...shock, message: 'The front may steepen, "soon".' }], labels)).split('\r\n');
    expect(lines[1]).toBe('caution,shock,b10,"Bolometer A, 10 mm","The front may steepen, ""soon"".",shock distance,0.0121,path,0.00997,m');
  });

  it('leaves the limit empty where a warning has none', () => {
    const [row] = warningsCsv([heating], new Map()).rows;
    expect(row?.[7]).toBe('');
    expect(row?.[8]).toBeNull();
    expect(row?.[9]).toBe('W');
  });
});
