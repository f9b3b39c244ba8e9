import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../app/App';
import { heliumProperties, T_LAMBDA_K } from '../../src/physics';
import { CHOSEN_TEMPERATURE_SHAPE } from '../../src/ui/charts/chart-theme';
import { PlotlyChart } from '../../src/ui/plot/PlotlyChart';
import { fakePlotly, lastDraw, lastShape } from './fake-plotly';

const CHART_IDS = ['speeds', 'fractions', 'thermometry'] as const;

async function renderDrawn() {
  const user = userEvent.setup();
  const view = render(<App />);
  await waitFor(() => {
    for (const id of CHART_IDS) expect(lastDraw(id)).toBeDefined();
  });
  return { user, view };
}

async function typeTemperature(user: ReturnType<typeof userEvent.setup>, text: string) {
  const field = screen.getByRole('textbox', { name: /temperature/i });
  await user.clear(field);
  await user.type(field, `${text}{Enter}`);
}

function chosenPointY(chartId: string, traceName: string): readonly (number | null)[] | undefined {
  return lastDraw(chartId)?.data.find((trace) => trace.name === traceName && trace.mode === 'markers')?.y;
}

describe('charts', () => {
  it('draws each chart with no logo, responsive, and no math typesetting', async () => {
    await renderDrawn();
    for (const id of CHART_IDS) {
      const config = lastDraw(id)?.config;
      expect(config).toMatchObject({ displaylogo: false, responsive: true, typesetMath: false, showSendToCloud: false });
    }
  });

  it('marks the chosen temperature on every chart and moves the marker when it changes', async () => {
    const { user } = await renderDrawn();
    for (const id of CHART_IDS) expect(lastShape(id, CHOSEN_TEMPERATURE_SHAPE)?.x0).toBe(1.8);

    await typeTemperature(user, '1200 mK');
    await waitFor(() => {
      for (const id of CHART_IDS) expect(lastShape(id, CHOSEN_TEMPERATURE_SHAPE)?.x0).toBeCloseTo(1.2, 12);
    });
    expect(chosenPointY('speeds', 'u₂')).toEqual([heliumProperties(1.2).secondSound_m_s]);
    expect(chosenPointY('fractions', 'ρs/ρ')).toEqual([heliumProperties(1.2).superfluidFraction]);
  });

  it('computes the curves once: the same arrays are drawn after the temperature changes', async () => {
    const { user } = await renderDrawn();
    const before = lastDraw('speeds')?.data[0]?.x;
    await typeTemperature(user, '2.0 K');
    await waitFor(() => expect(lastShape('speeds', CHOSEN_TEMPERATURE_SHAPE)?.x0).toBe(2));
    expect(lastDraw('speeds')?.data[0]?.x).toBe(before);
  });

  it('shades the insensitive regions around the u₂ minimum (≈1.12 K) and maximum (≈1.65 K)', async () => {
    await renderDrawn();
    const bands = lastDraw('thermometry')?.layout.shapes?.filter((shape) => shape.name?.startsWith('insensitive-')) ?? [];
    expect(bands).toHaveLength(2);
    const [low, high] = bands;
    expect(low?.x0).toBeLessThan(1.12);
    expect(low?.x1).toBeGreaterThan(1.12);
    expect(high?.x0).toBeLessThan(1.65);
    expect(high?.x1).toBeGreaterThan(1.65);
    const figure = screen.getByRole('figure', { name: /where a time of flight pins the temperature/i });
    expect(within(figure).getByText(/\|du₂\/dT\| < 2 m\/s\/K/)).toBeInTheDocument();
  });

  it('has no u₂ marker in He I and says so on the thermometry chart', async () => {
    const { user } = await renderDrawn();
    await typeTemperature(user, '3 K');
    await waitFor(() => expect(lastShape('thermometry', CHOSEN_TEMPERATURE_SHAPE)?.x0).toBe(3));
    expect(chosenPointY('speeds', 'u₂')).toEqual([]);
    const notes = lastDraw('thermometry')?.layout.annotations?.map((a) => a.text) ?? [];
    expect(notes.some((text) => text.includes('He I, no second sound'))).toBe(true);
  });

  it('draws u₂ only below Tλ', async () => {
    await renderDrawn();
    const u2 = lastDraw('speeds')?.data.find((trace) => trace.name === 'u₂ second sound');
    const x = u2?.x ?? [];
    const y = u2?.y ?? [];
    x.forEach((T, i) => {
      if (T >= T_LAMBDA_K) expect(y[i]).toBeNull();
      else expect(y[i]).toBeGreaterThanOrEqual(0);
    });
  });

  it('purges every chart on unmount', async () => {
    const { view } = await renderDrawn();
    const elements = CHART_IDS.map((id) => lastDraw(id)?.element);
    view.unmount();
    for (const element of elements) expect(fakePlotly.purged).toContain(element);
  });

  it('keeps the page usable when one chart fails, and can retry it', async () => {
    fakePlotly.failFor = 'fractions';
    // React and the boundary report the failure on the console; expected here.
    const consoleError = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const user = userEvent.setup();
    render(<App />);
    const figure = screen.getByRole('figure', { name: /superfluid and normal fractions/i });
    const alert = await within(figure).findByRole('alert');
    expect(alert).toHaveTextContent(/could not be shown.*Fake drawing failure/);
    await waitFor(() => expect(lastDraw('speeds')).toBeDefined());
    expect(screen.getByRole('table')).toBeInTheDocument();
    await typeTemperature(user, '1.5 K');
    expect(screen.getByRole('status', { name: 'Temperature in effect' })).toHaveTextContent('1.5000 K');

    fakePlotly.failFor = null;
    await user.click(within(figure).getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(lastShape('fractions', CHOSEN_TEMPERATURE_SHAPE)?.x0).toBe(1.5));
    expect(consoleError).toHaveBeenCalledWith(expect.stringContaining('chart failed'), expect.any(Error), expect.anything());
    consoleError.mockRestore();
  });

  it('gives the plot an accessible name and shows a placeholder until drawn', async () => {
    render(<PlotlyChart chartId="demo" label="Demo chart" data={[]} layout={{}} />);
    expect(screen.getByText('Drawing chart…')).toBeInTheDocument();
    expect(screen.getByRole('img', { name: 'Demo chart' })).toBeInTheDocument();
    await waitFor(() => expect(screen.queryByText('Drawing chart…')).not.toBeInTheDocument());
  });
});
