import { screen, within } from '@testing-library/react';
import { planFileToInput } from '../../src/io/plan-file';
import { computePlan } from '../../src/physics';
import { formatSignificant } from '../../src/ui/units/format-number';
import { inUnit, LADDERS, unitForColumn } from '../../src/ui/units/ladders';
import { demoPlan, openPlanner, store } from './planner-helpers';

describe('planner results for the demo plan', () => {
  it('opens the demo plan by default', async () => {
    const { fetchMock } = await openPlanner();
    expect(fetchMock).toHaveBeenCalledWith('./demo-plan.json');
    expect(store().plannerPlan).toEqual(demoPlan());
    expect(screen.getByText('Demo plan (invented setup)')).toBeInTheDocument();
    expect(screen.getByRole('textbox', { name: 'Plan name' })).toHaveValue(demoPlan().name);
  });

  it('shows, for every sensor, the values computePlan gives', async () => {
    await openPlanner();
    const expected = computePlan(planFileToInput(demoPlan()));
    const table = screen.getByRole('table', { name: /predicted arrivals, signals and temperature resolution/i });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(expected.sensors.length);
    const ms = unitForColumn(expected.sensors.map((s) => s.secondSoundArrival_s), LADDERS.time);
    const tsd = unitForColumn(expected.sensors.map((s) => s.temperatureSd_K), LADDERS.temperatureDifference);
    expected.sensors.forEach((sensor, i) => {
      const row = rows[i] as HTMLElement;
      expect(within(row).getByRole('rowheader')).toHaveTextContent(`${sensor.label} (${sensor.id})`);
      const cell = (key: string) => row.querySelector(`[data-column="${key}"]`)?.textContent;
      expect(cell('second')).toBe(formatSignificant(inUnit(sensor.secondSoundArrival_s as number, ms), 4));
      expect(cell('tsd')).toBe(formatSignificant(inUnit(sensor.temperatureSd_K as number, tsd), 2));
      expect(cell('snrN')).toBe(formatSignificant(sensor.snrAveraged as number, 3));
      expect(cell('pulses')).toBe((sensor.pulsesForTargetSnr as number).toLocaleString('en-GB'));
      expect(cell('path')).toBe(formatSignificant(inUnit(sensor.pathLength_m, unitForColumn(expected.sensors.map((s) => s.pathLength_m), LADDERS.length)), 4));
    });
    // Units in the headers: the arrivals of the demo are in milliseconds, the temperature sd in millikelvin.
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((h) => h.textContent);
    expect(headers).toContain('Second sound (ms)');
    expect(headers).toContain('T sd (mK)');
  });

  it('summarises the heater as computePlan does', async () => {
    await openPlanner();
    const expected = computePlan(planFileToInput(demoPlan())).heater;
    const summary = screen.getByRole('region', { name: 'Heater and bath' });
    const value = (term: string) => within(summary).getByText(term).nextElementSibling?.querySelector('.summary-list__value')?.textContent;
    expect(value('Peak heat flux')).toBe(`${formatSignificant(expected.flux_W_m2 / 1e4, 3)} W/cm²`);
    expect(value('Average power into the bath')).toBe(`${formatSignificant(expected.averagePower_W * 1e6, 3)} µW`);
    expect(value('Energy per pulse')).toBe(`${formatSignificant(expected.energyPerPulse_J * 1e6, 3)} µJ`);
    expect(value('δT at the heater face')).toBe(`${formatSignificant((expected.faceDeltaT_K as number) * 1e6, 3)} µK`);
    expect(value('Counterflow velocity')).toBe(`${formatSignificant((expected.counterflowVelocity_m_s as number) * 100, 3)} cm/s`);
    expect(value('Shock distance')).toBe(`${formatSignificant((expected.shockDistance_m as number) * 1e3, 3)} mm`);
  });

  it('lists the kernel’s warnings with severity in words, the number and its limit', async () => {
    await openPlanner();
    const expected = computePlan(planFileToInput(demoPlan())).warnings;
    const list = screen.getByRole('list', { name: 'Plan warnings' });
    const items = within(list).getAllByRole('listitem');
    expect(items).toHaveLength(expected.length);
    for (const w of expected) expect(within(list).getByText(w.message)).toBeInTheDocument();
    const heating = items.find((item) => item.getAttribute('data-code') === 'bath-heating') as HTMLElement;
    expect(within(heating).getByText('Note')).toBeInTheDocument();
    expect(heating).toHaveTextContent('average power 50.0 µW');
  });

  it('stores the plan and no results', async () => {
    await openPlanner();
    const keys = Object.keys(store());
    for (const derived of ['plannerResult', 'result', 'warnings', 'sensors']) expect(keys).not.toContain(derived);
  });
});

describe('planner results as CSV', () => {
  it('writes one row per sensor in SI units, unrounded, with empty cells in He I', async () => {
    const { resultsCsv } = await import('../../src/ui/planner/results-csv');
    const { tableCsv } = await import('../../src/ui/export/csv-export');
    const result = computePlan(planFileToInput(demoPlan()));
    const text = tableCsv(resultsCsv(result));
    const { default: Papa } = await import('papaparse');
    const parse = (csv: string) => Papa.parse<string[]>(csv.trim()).data;
    const lines = text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'sensor_id,label,pathLength_m,pathLengthSd_m,firstSoundArrival_s,secondSoundArrival_s,amplitude_K,signal_V,snrSingle,snrAveraged,pulsesForTargetSnr,timingSd_s,timingSdThreshold_s,timingSdFraction_s,timingSdPeak_s,timingSdXcorr_s,timingLowerLimit,temperatureSd_K,temperatureChangeSd_K,temperatureSdWithModel_K,targetKind,meetsTarget,shortestDistanceForTarget_m,shortestDistanceNote,insensitive',
    );
    expect(lines).toHaveLength(result.sensors.length + 1);
    const first = result.sensors[0];
    const rows = parse(text);
    expect(rows[1]?.[1]).toBe(first?.label);
    expect(rows[1]?.[5]).toBe(String(first?.secondSoundArrival_s));
    const heI = computePlan({ ...planFileToInput(demoPlan()), temperature_K: 2.5 });
    const heILine = parse(tableCsv(resultsCsv(heI)))[1] ?? [];
    expect(heILine[5]).toBe('');
    expect(heILine[24]).toBe('');
    // The headline timing sd is the fraction picker's (picker-timing.ts).
    expect(rows[1]?.[11]).toBe(String(first?.timingSd_s));
    expect(rows[1]?.[13]).toBe(String(first?.timingSdByPicker_s?.fraction));
  });

  it('the timing cell’s tooltip gives every picker’s figure from the plan result, and marks small-noise lower limits', async () => {
    const { pickerTimingText } = await import('../../src/ui/planner/ResultsTable');
    const sensor = computePlan(planFileToInput(demoPlan())).sensors[0];
    if (!sensor?.timingSdByPicker_s) throw new Error('the demo sensor has a timing');
    const text = pickerTimingText(sensor, null) ?? '';
    const { formatSignificant } = await import('../../src/ui/units/format-number');
    for (const v of Object.values(sensor.timingSdByPicker_s)) expect(text).toContain(`${formatSignificant(v as number, 2)} s`);
    expect(text).toMatch(/^By picker: fraction 0\.5 .* \(shown\), threshold 5σ .*, peak .*, cross-correlation with the drive .*\.$/);
    expect(text).not.toMatch(/lower limits/);
    expect(pickerTimingText({ ...sensor, timingLowerLimit: true }, null)).toMatch(/SNR below 10 these are lower limits/);
  });

  it('offers the table as a download beside it', async () => {
    await openPlanner();
    expect(screen.getByRole('button', { name: 'Download the results per sensor as CSV' })).toBeInTheDocument();
  });
});
