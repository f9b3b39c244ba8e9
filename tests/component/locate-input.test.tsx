import { fireEvent, screen, waitFor } from '@testing-library/react';
import { DEMO_SENSORS, openLocate, shownSource, store } from './locate-helpers';

describe('locate view: bad input names the field and its range and keeps the last good state', () => {
  it('an arrival that is not a time', async () => {
    await openLocate();
    const before = shownSource();
    const arrival = screen.getByLabelText('Arrival at U90 (ms)');
    fireEvent.change(arrival, { target: { value: 'soon' } });
    expect(screen.getByRole('alert')).toHaveTextContent(
      'arrival at sensor U90: “soon” does not start with a number. Type e.g. 100 us (units s, ms, us, µs, ns); valid from −1000 s to 1000 s (empty for no reading).',
    );
    expect(arrival).toHaveAttribute('aria-invalid', 'true');
    expect(arrival).toHaveValue('soon');
    expect(store().locateRows[1]?.arrival_s).toBe(DEMO_SENSORS[1]?.arrival_s);
    expect(shownSource()).toEqual(before);
    // Escape gives the field back its value in effect.
    fireEvent.keyDown(arrival, { key: 'Escape' });
    expect(arrival).toHaveValue('4.997');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('a position out of range, and one in an unknown unit', async () => {
    await openLocate();
    const x = screen.getByLabelText('x of U0 (mm)');
    fireEvent.change(x, { target: { value: '200 m' } });
    expect(screen.getByRole('alert')).toHaveTextContent('x of sensor U0 must be from −100 m to 100 m; “200 m” is outside.');
    fireEvent.change(x, { target: { value: '2 ft' } });
    expect(screen.getByRole('alert')).toHaveTextContent('x of sensor U0: “2 ft” has a unit that is not a length. Type e.g. 50 mm (units m, cm, mm, um, µm); valid from −100 m to 100 m.');
    expect(store().locateRows[0]?.position_m[0]).toBe(0.15);
    // A good value typed with a unit applies and clears the message.
    fireEvent.change(x, { target: { value: '0.16 m' } });
    expect(store().locateRows[0]?.position_m[0]).toBe(0.16);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('a timing sd of zero, a temperature above Tλ, a repeated label', async () => {
    await openLocate();
    const alerts = () => screen.getAllByRole('alert').map((a) => a.textContent ?? '');
    fireEvent.change(screen.getByLabelText('Timing sd of U0'), { target: { value: '0' } });
    expect(alerts()).toContain('timing sd of sensor U0 must be above 0 µs, up to 10 s (empty for the default); “0” is outside.');
    expect(store().locateRows[0]?.arrivalSd_s).toBe(5e-5);
    fireEvent.change(screen.getByLabelText('Bath temperature T90'), { target: { value: '2.5 K' } });
    expect(alerts()).toContain('Bath temperature must be 0.3–2.1768 K (He II); “2.5 K” is outside.');
    expect(store().locateOptions.temperature_K).toBe(1.8);
    fireEvent.change(screen.getByLabelText('Label of sensor U90'), { target: { value: 'U0' } });
    expect(alerts()).toContain('Label "U0" is already used by another sensor; give each sensor its own label.');
    expect(store().locateRows[1]?.label).toBe('U90');
  });

  it('a sensor CSV with a malformed line: the file and line are named, the sensors stay', async () => {
    const { user } = await openLocate();
    const bad = new File(['label,x_m,y_m,z_m,arrival_s\nA,0.1,0,0,0.01\nB,0.1,zero,0,0.01\n'], 'run-7.csv', { type: 'text/csv' });
    await user.upload(screen.getByLabelText('Open sensor CSV'), bad);
    await waitFor(() => expect(screen.getByRole('alert')).toHaveTextContent('run-7.csv, line 3: column "y_m": "zero" is not a number. The sensors on screen are unchanged.'));
    expect(store().locateRows).toHaveLength(DEMO_SENSORS.length);
    expect(store().locateOrigin.kind).toBe('demo');
  });

  it('a good sensor CSV replaces the sensors and names the file', async () => {
    const { user } = await openLocate();
    const text = 'label,x_mm,y_mm,z_mm,arrival_ms\nA,100,0,0,5\nB,0,100,0,6\nC,0,0,100,\n';
    await user.upload(screen.getByLabelText('Open sensor CSV'), new File([text], 'bench.csv', { type: 'text/csv' }));
    await waitFor(() => expect(store().locateOrigin).toMatchObject({ kind: 'file', name: 'bench.csv' }));
    expect(store().locateRows.map((r) => r.label)).toEqual(['A', 'B', 'C']);
    expect(store().locateRows[2]?.arrival_s).toBeNull();
    expect(screen.getAllByText(/2 sensors have an arrival time \(1 without\)/).length).toBeGreaterThan(0);
  });
});
