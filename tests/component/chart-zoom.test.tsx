import { describe, expect, it } from 'vitest';
import { figureRanges, PLOT_CONFIG, zoomedRanges } from '../../src/ui/plot/PlotlyChart';

// The charts' own controls replace the plotting library's toolbar (common practice, no source:
// zoom about the middle of what is shown, back to the figure's own view).
describe('chart zoom of our own', () => {
  const drawn = {
    xaxis: { range: [0.3, 4.3] },
    yaxis: { range: [10, 30] },
    yaxis2: { range: [200, 240], fixedrange: true },
    xaxis3: { range: ['a', 'b'] },
    legend: {},
  };

  it('hides the library toolbar on every chart', () => {
    expect(PLOT_CONFIG.displayModeBar).toBe(false);
  });

  it('zooms numeric axes about their middle and leaves fixed or non-numeric ones', () => {
    const rounded = (update: Record<string, [number, number]>) => Object.fromEntries(Object.entries(update).map(([k, r]) => [k, r.map((v) => Math.round(v * 1e9) / 1e9)]));
    expect(rounded(zoomedRanges(drawn, 0.5))).toEqual({ 'xaxis.range': [1.3, 3.3], 'yaxis.range': [15, 25] });
    expect(rounded(zoomedRanges(drawn, 2))).toEqual({ 'xaxis.range': [-1.7, 6.3], 'yaxis.range': [0, 40] });
    expect(zoomedRanges(undefined, 2)).toEqual({});
  });

  it('goes back to the stated range of each axis, automatic where the figure states none', () => {
    expect(figureRanges({ xaxis: { range: [0.3, 4.24] } }, drawn)).toEqual({
      'xaxis.range': [0.3, 4.24],
      'yaxis.autorange': true,
      'yaxis2.autorange': true,
      'xaxis3.autorange': true,
    });
  });
});
