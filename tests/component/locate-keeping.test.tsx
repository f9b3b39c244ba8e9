/**
 * The source-location view keeps what the person loaded: a sensor CSV (and edits, and fit options)
 * survives a reload, like the plan's autosave; a damaged record is refused with a message and the
 * view starts afresh. The view also offers the speed prior, the bath temperature's sd and a region
 * for added sensors. Sensors here are invented.
 */
import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { LOCATE_STORAGE_KEY } from '../../src/io/locate-storage';
import { memoryStore } from '../../src/io/workspace-storage';
import { checkedLocateOptions, startLocatePersistence } from '../../src/ui/locate/persist-locate';
import { resetSekundoStore } from '../../src/ui/store';
import { DEMO_SENSORS, openLocate, store } from './locate-helpers';

const MINE = DEMO_SENSORS.map((s, i) => ({ ...s, label: `Mine${i + 1}` }));

describe('keeping the sensors between visits', () => {
  it('a sensor CSV the user loaded, and the options, are there again after a reload', () => {
    const kv = memoryStore();
    const stop = startLocatePersistence(kv);
    store().loadLocateSensors(MINE, { kind: 'file', name: 'bay3-sensors.csv', note: null }, { dropOutliers: true, temperatureSd_K: 0.002 });
    stop();
    // A reload: a fresh store, the same browser storage.
    resetSekundoStore();
    const stop2 = startLocatePersistence(kv);
    expect(store().locateStatus).toBe('ready');
    expect(store().locateRows.map((r) => r.label)).toEqual(MINE.map((s) => s.label));
    expect(store().locateRows[0]?.position_m).toEqual(MINE[0]?.position_m);
    expect(store().locateOrigin).toMatchObject({ kind: 'file', name: 'bay3-sensors.csv' });
    expect(store().locateOptions.dropOutliers).toBe(true);
    expect(store().locateOptions.temperatureSd_K).toBe(0.002);
    stop2();
  });

  it('a damaged record is refused with a message and nothing is restored', () => {
    const kv = memoryStore();
    kv.setItem(LOCATE_STORAGE_KEY, '{"format":"sekundo-locate-inputs","version":1,"sensorsCsv":"x_m,y_m\\n1,2"}');
    const stop = startLocatePersistence(kv);
    expect(store().locateStatus).toBe('idle');
    expect(store().locateErrors.rows).toMatch(/could not be read/);
    stop();
  });

  it('kept options are checked field by field: out of range takes the default', () => {
    const o = checkedLocateOptions({ temperature_K: 5, arrivalSd_s: -1, surface: 'torus', speedPrior: false, sensorRegion: { on: true, min_m: [1, 1, 1], max_m: [0, 0, 0] } });
    expect(o.temperature_K).toBe(1.8);
    expect(o.arrivalSd_s).toBe(5e-6);
    expect(o.surface).toBe('none');
    expect(o.speedPrior).toBe(false);
    expect(o.sensorRegion.on).toBe(false);
  });
});

describe('the speed prior and the sensor region in the view', () => {
  it('by default the speed is fitted within u₂’s own uncertainty, and the summary says so', async () => {
    await openLocate();
    expect(screen.getByRole('checkbox', { name: /Fit the speed within u₂’s own uncertainty/ })).toBeChecked();
    expect(screen.getByLabelText('Bath temperature sd')).toBeInTheDocument();
    expect(screen.getByTestId('locate-speed-how').textContent).toMatch(/prior u₂ at 1\.800 K = 19\.90 ± 0\.050 m\/s/);
  });

  it('turning the prior off holds u₂ fixed', async () => {
    const { user } = await openLocate();
    await user.click(screen.getByRole('checkbox', { name: /Fit the speed within u₂’s own uncertainty/ }));
    expect(screen.getByTestId('locate-speed-how').textContent).toMatch(/^fixed/);
  });

  it('a region for added sensors can be given, and an inside-out box is refused with a message', async () => {
    const { user } = await openLocate();
    await user.click(screen.getByRole('checkbox', { name: /Suggest an added sensor only inside a box/ }));
    const lowest = screen.getByLabelText(/lowest x/);
    await user.clear(lowest);
    await user.type(lowest, '500{Tab}');
    expect(screen.getByText(/the lowest x must lie below the highest x/)).toBeInTheDocument();
    // The last good value stays in effect (typing applies each good prefix: 5, 50 mm).
    const r = store().locateOptions.sensorRegion;
    expect(r.min_m[0]).toBeLessThan(r.max_m[0]);
  });
});
