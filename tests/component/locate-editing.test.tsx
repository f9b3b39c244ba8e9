import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { secondSound } from '../../src/physics';
import { lastDraw } from './fake-plotly';
import { DEMO_SENSORS, drawnSource, openLocate, shownSource, store } from './locate-helpers';

const residualRow = (label: string) => within(screen.getByRole('table', { name: 'Residual of each sensor' })).queryByRole('row', { name: new RegExp(`^${label} `) });

describe('locate view: editing moves the result', () => {
  it('opens on the demo: the source near the equator of the invented cell, with 1σ and 2σ ellipses in both projections', async () => {
    await openLocate();
    const [x, y, z] = shownSource().map((t) => Number(t.replace('\u2212', '-')));
    // The demo was written from a source at (−48.4, 90.9, 4.0) mm with 50 µs timing noise and one late sensor.
    expect(Math.abs((x ?? 0) + 48.4)).toBeLessThan(5);
    expect(Math.abs((y ?? 0) - 90.9)).toBeLessThan(5);
    expect(Math.abs((z ?? 0) - 4)).toBeLessThan(8);
    for (const id of ['locate-projection-1', 'locate-projection-2']) {
      const names = lastDraw(id)?.data.map((t) => t.name) ?? [];
      expect(names).toEqual(expect.arrayContaining(['located source', '1σ region (68.3 %)', '2σ region (95.4 %)', 'sensors', 'outliers']));
    }
    expect(screen.getByText(/OUTLIER, kept in the fit/)).toBeInTheDocument();
    // The page says what the ellipses are.
    expect(screen.getByText(/drawn at Δχ² = 2\.30 and 6\.18, so it holds the true position/)).toBeInTheDocument();
    expect(residualRow('L225')).toHaveTextContent('OUTLIER');
  });

  it('typing a new arrival time at one sensor moves the located source and its drawing', async () => {
    const { user } = await openLocate();
    const before = shownSource();
    const drawnBefore = drawnSource();
    const arrival = screen.getByLabelText('Arrival at U90 (ms)');
    await user.clear(arrival);
    await user.type(arrival, '5.3');
    expect(store().locateRows.find((r) => r.label === 'U90')?.arrival_s).toBeCloseTo(5.3e-3, 12);
    expect(shownSource()).not.toEqual(before);
    await waitFor(() => expect(drawnSource()).not.toEqual(drawnBefore));
    // A later arrival at U90 (at +y) pushes the source away from it, to smaller y.
    expect((drawnSource()?.[1] ?? 0) < (drawnBefore?.[1] ?? 0)).toBe(true);
  });

  it('moving a sensor moves the result; its label follows in the projections', async () => {
    const { user } = await openLocate();
    const before = shownSource();
    const x = screen.getByLabelText('x of U0 (mm)');
    await user.clear(x);
    await user.type(x, '170');
    expect(store().locateRows[0]?.position_m[0]).toBeCloseTo(0.17, 12);
    expect(shownSource()).not.toEqual(before);
    await waitFor(() => expect(lastDraw('locate-projection-1')?.layout.annotations?.some((a) => a.x === 170 && a.text.includes('U0'))).toBe(true));
  });

  it('the robust refit leaves the late sensor out and says so in words', async () => {
    const { user } = await openLocate();
    await user.click(screen.getByLabelText(/Robust refit/));
    expect(screen.getByText('OUTLIER, left out of the fit')).toBeInTheDocument();
    expect(screen.getByText(/left out: L225/)).toBeInTheDocument();
    await waitFor(() => expect(lastDraw('locate-projection-1')?.data.some((t) => t.name === 'left out of the fit')).toBe(true));
  });

  it('a fitted speed reports its sd; a given speed replaces u₂', async () => {
    const { user } = await openLocate();
    // By default the speed is fitted within u₂'s own uncertainty (a prior).
    expect(screen.getByText(/fitted within u₂’s own uncertainty: prior u₂ at 1\.800 K/)).toBeInTheDocument();
    expect(screen.getByText(/u₂ = 19\.90 m\/s/)).toBeInTheDocument();
    await user.click(screen.getByLabelText(/Fit an effective speed/));
    expect(screen.getByText(/fitted freely, starting from u₂ at 1\.800 K/)).toBeInTheDocument();
    await user.click(screen.getByLabelText('A speed I give'));
    const speed = screen.getByLabelText('Speed');
    fireEvent.change(speed, { target: { value: '21 m/s' } });
    expect(store().locateOptions.speed_m_s).toBe(21);
    expect(store().locateOptions.speedMode).toBe('speed');
    expect(secondSound(1.8)).not.toBe(21);
  });

  it('adds and removes sensors; a sensor without a reading is drawn open and not fitted', async () => {
    const { user } = await openLocate();
    await user.click(screen.getByRole('button', { name: 'Add a sensor' }));
    expect(store().locateRows).toHaveLength(DEMO_SENSORS.length + 1);
    expect(store().locateRows.at(-1)).toMatchObject({ label: 'S9', arrival_s: null });
    await waitFor(() => expect(lastDraw('locate-projection-1')?.data.some((t) => t.name === 'no arrival time')).toBe(true));
    expect(screen.getByText('no reading, not fitted')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Remove sensor S9' }));
    await user.click(screen.getByRole('button', { name: 'Remove sensor U0' }));
    expect(store().locateRows.map((r) => r.label)).not.toContain('U0');
    expect(residualRow('U0')).toBeNull();
  });

  it('the surface constraint holds the source on a sphere of the radius typed', async () => {
    const { user } = await openLocate();
    await user.selectOptions(screen.getByLabelText('Source on a surface'), 'sphere');
    const radius = screen.getByLabelText('radius');
    fireEvent.change(radius, { target: { value: '103' } });
    expect(store().locateOptions.sphere.radius_m).toBeCloseTo(0.103, 12);
    const [x, y, z] = shownSource().map((t) => Number(t.replace('\u2212', '-')));
    expect(Math.hypot(x ?? 0, y ?? 0, z ?? 0)).toBeCloseTo(103, 0);
    await waitFor(() => expect(lastDraw('locate-projection-1')?.data.some((t) => t.name === 'surface')).toBe(true));
  });
});
