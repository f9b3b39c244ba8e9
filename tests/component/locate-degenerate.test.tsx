import { screen, waitFor, within } from '@testing-library/react';
import { secondSound, type Vec3 } from '../../src/physics';
import { lastDraw } from './fake-plotly';
import { arrivalsFrom, openLocate } from './locate-helpers';

const U2 = secondSound(1.8);
const LINE: Vec3[] = [0, 1, 2, 3, 4, 5].map((i) => [0.04 * i - 0.1, 0, 0]);

describe('locate view: a layout that cannot fix the source says so', () => {
  it('sensors on a line: a plain message, no uncertainties, no ellipses', async () => {
    await openLocate(arrivalsFrom([0.02, 0.05, 0.03], LINE, U2));
    const message = screen.getByText('This layout cannot fix the source.').closest('[role="status"]') as HTMLElement;
    expect(message).toBeInTheDocument();
    expect(within(message).getByText(/on a line/)).toBeInTheDocument();
    expect(screen.getByRole('table', { name: 'Where the fit stopped (not determined)' })).toHaveTextContent(/1σ\s*—\s*—\s*—/);
    expect(screen.getByText('fit stopped at')).toBeInTheDocument();
    const names = lastDraw('locate-projection-1')?.data.map((t) => t.name) ?? [];
    expect(names).toContain('located source');
    expect(names).not.toContain('1σ region (68.3 %)');
    expect(names).not.toContain('2σ region (95.4 %)');
    expect(screen.getByText(/Star: where the fit stopped; no ellipses, because the layout cannot fix the source/)).toBeInTheDocument();
  });

  it('sensors on a line: the quality map is grey everywhere and one sensor off the line is suggested', async () => {
    await openLocate(arrivalsFrom([0.02, 0.05, 0.03], LINE, U2));
    await waitFor(() => expect(lastDraw('locate-quality-map')).toBeDefined());
    const map = lastDraw('locate-quality-map');
    expect(map?.data.find((t) => t.name === 'expected position sd')?.x).toHaveLength(0);
    expect(map?.data.find((t) => t.name === 'cannot fix a source here')?.x.length).toBe(31 * 31);
    expect(map?.data.find((t) => t.name === 'best added sensor')?.x).toHaveLength(1);
    const advice = screen.getByText(/One more sensor at/).parentElement as HTMLElement;
    expect(advice).toHaveTextContent(/falls from undetermined \(the layout cannot fix every point\) to [\d.]+ mm/);
    // The suggested place is off the line of sensors (the x axis).
    const [, y = '', z = ''] = /One more sensor at \(([^)]*)\) mm/.exec(advice.textContent ?? '')?.[1]?.split(', ') ?? [];
    expect(Math.hypot(Number(y.replace('\u2212', '-')), Number(z.replace('\u2212', '-')))).toBeGreaterThan(10);
  });

  it('too few readings: no source, and the count needed', async () => {
    const few = arrivalsFrom([0.02, 0.05, 0.03], [[0.1, 0, 0], [0, 0.1, 0], [0, 0, 0.1], [-0.1, 0, 0]], U2);
    await openLocate(few);
    expect(screen.getByText(/No source located\./).parentElement).toHaveTextContent(
      '4 sensors have an arrival time; fitting 4 unknowns (x, y, z, the emission time) with a check needs at least 5.',
    );
    expect(lastDraw('locate-projection-1')?.data.map((t) => t.name)).toEqual(['sensors']);
  });
});
