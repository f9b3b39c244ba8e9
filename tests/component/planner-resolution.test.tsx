import { screen, waitFor } from '@testing-library/react';
import { planFileToInput } from '../../src/io/plan-file';
import { computePlan, SECOND_SOUND_EXTREMA, SPACER_MATERIALS, shortestDistanceForResolution } from '../../src/physics';
import { isoDistance, type MapSensor, mapFigure, mapGrid, mapLevels, spreadAt } from '../../src/ui/planner/resolution-map';
import { lastDraw } from './fake-plotly';
import { demoPlan, openPlanner } from './planner-helpers';

const plain: MapSensor = { timingSd_s: 50e-9, distanceSd_m: 20e-6, contractionSd: 0, lag_s: 0 };

function nearestColumn(temperatures: readonly number[], T: number): number {
  let best = 0;
  temperatures.forEach((t, i) => {
    if (Math.abs(t - T) < Math.abs((temperatures[best] as number) - T)) best = i;
  });
  return best;
}

describe('resolution map', () => {
  it('gives, at each planned sensor, the temperature sd the planner gives (same sums, same kernel)', () => {
    const input = planFileToInput(demoPlan());
    const result = computePlan(input);
    const material = SPACER_MATERIALS.find((m) => m.id === input.spacer.materialId);
    const scale = 1 - (material?.contraction ?? 0);
    result.sensors.forEach((s, i) => {
      const planSensor = input.sensors[i];
      if (!planSensor || s.timingSd_s === null || s.temperatureSd_K === null) throw new Error('expected He II results');
      const sensor: MapSensor = {
        timingSd_s: s.timingSd_s,
        distanceSd_m: planSensor.distanceSd_m * scale,
        contractionSd: (material?.contractionSd ?? 0) / scale,
        lag_s: planSensor.lag_s,
      };
      const mapped = spreadAt(result.temperature_K, s.pathLength_m, sensor).sd_K;
      // On the axis the map and the planner add the same terms. Off the axis (b25x) the planner
      // takes the contraction over the straight distance and the map over the path (the planar
      // heater's z): 4 mm off at 25 mm changes σT by under 0.1 %.
      const offAxis = input.sensors[i]?.position_m[0] !== 0;
      expect(Math.abs(mapped / s.temperatureSd_K - 1)).toBeLessThan(offAxis ? 1e-3 : 1e-12);
    });
  });

  it('puts the target iso-line where the kernel’s shortest distance is, away from the u₂ extremes', () => {
    const grid = mapGrid(plain);
    for (const T of [0.9, 1.4, 1.9, 2.1]) {
      const column = grid.sd_K[nearestColumn(grid.temperature_K, T)] as number[];
      const Tg = grid.temperature_K[nearestColumn(grid.temperature_K, T)] as number;
      const expected = shortestDistanceForResolution(Tg, 1e-3, plain.timingSd_s, plain.distanceSd_m);
      // Log–log interpolation on a 36-point grid over 2.5 decades: better than 1 % for σ ∝ 1/d.
      expect(isoDistance(column, grid.distance_m, 1e-3) / expected).toBeCloseTo(1, 2);
    }
  });

  it('flags the insensitive spots at the minimum and maximum of u₂ and not elsewhere', () => {
    const grid = mapGrid(plain);
    for (const extremum of [SECOND_SOUND_EXTREMA.minimum, SECOND_SOUND_EXTREMA.maximum]) {
      expect(grid.insensitive[nearestColumn(grid.temperature_K, extremum.temperature_K)]?.[0]).toBe(true);
    }
    expect(grid.insensitive[nearestColumn(grid.temperature_K, 1.9)]?.some(Boolean)).toBe(false);
    const figure = mapFigure(grid, { planned: null, target_K: 1e-3 });
    expect(figure.data.filter((t) => t.name === 'Insensitive (u₂ extremum)')).toHaveLength(2);
  });

  it('chooses at most nine iso-levels in 1–3 steps inside the values', () => {
    const levels = mapLevels(mapGrid(plain));
    expect(levels.length).toBeGreaterThan(2);
    expect(levels.length).toBeLessThanOrEqual(9);
    for (let i = 1; i < levels.length; i++) expect(levels[i] as number).toBeGreaterThan(levels[i - 1] as number);
  });

  it('draws bands with a colour bar, the dashed target line and the planned point', () => {
    const grid = mapGrid(plain);
    const { data, levels } = mapFigure(grid, { planned: { temperature_K: 1.8, distance_m: 0.02, sd_K: 1e-4, label: 's1' }, target_K: 5e-4 });
    const bar = data.find((t) => t.marker?.showscale);
    expect(bar?.marker?.colorbar?.ticktext).toHaveLength(levels.length);
    expect(data.filter((t) => t.fill === 'tonexty')).toHaveLength(levels.length + 1);
    expect(data.find((t) => t.name.startsWith('Target'))?.line?.dash).toBe('dash');
    expect(data.find((t) => t.name === 'Planned')?.x).toEqual([1.8]);
  });

  it('is drawn on the page for the chosen sensor, and follows the choice', async () => {
    const { user } = await openPlanner();
    await waitFor(() => expect(lastDraw('planner-resolution-map')).toBeDefined());
    const planned = () => lastDraw('planner-resolution-map')?.data.find((t) => t.name === 'Planned')?.y[0];
    expect(planned()).toBeCloseTo(9.97, 6);
    await user.selectOptions(screen.getByRole('combobox', { name: 'Timing and distance sd of' }), screen.getByRole('option', { name: /Bolometer D/ }));
    await waitFor(() => expect(planned()).toBeCloseTo(49.85, 6));
    expect(screen.getByText(/At the plan \(1\.800 K, 49\.9 mm\) the map gives σT/)).toBeInTheDocument();
  });
});
