/**
 * A chart is not drawn again for a figure with the same values (a plan edit that changes nothing
 * drawn: a new result object, the same timeline); a changed value is drawn, and each case reports
 * the chart drawn (the edit → result timer counts on it). Common practice, no source.
 */
import { render, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { PlotlyChart } from '../../src/ui/plot/PlotlyChart';
import type { PlotLayout, PlotTrace } from '../../src/ui/plot/plotly-types';
import { sameFigure } from '../../src/ui/plot/same-figure';
import { fakePlotly } from './fake-plotly';

const figure = (y: number): { data: PlotTrace[]; layout: PlotLayout } => ({
  data: [{ type: 'scatter', name: 'S1', x: [0, 1, 2], y: [0, y, 0], mode: 'lines' }],
  layout: { xaxis: { range: [0, 2] } as PlotLayout['xaxis'] },
});

const draws = () => fakePlotly.draws.filter((d) => d.chartId === 'same').length;

describe('a figure with the same values is not drawn again', () => {
  it('equal values in new objects: no redraw, still reported drawn; a changed value: drawn', async () => {
    const onDrawn = vi.fn();
    const first = figure(1);
    const { rerender } = render(<PlotlyChart chartId="same" label="same figure" data={first.data} layout={first.layout} onDrawn={onDrawn} />);
    await waitFor(() => expect(onDrawn).toHaveBeenCalledTimes(1));
    expect(draws()).toBe(1);
    const again = figure(1);
    rerender(<PlotlyChart chartId="same" label="same figure" data={again.data} layout={again.layout} onDrawn={onDrawn} />);
    await waitFor(() => expect(onDrawn).toHaveBeenCalledTimes(2));
    expect(draws()).toBe(1);
    const changed = figure(2);
    rerender(<PlotlyChart chartId="same" label="same figure" data={changed.data} layout={changed.layout} onDrawn={onDrawn} />);
    await waitFor(() => expect(onDrawn).toHaveBeenCalledTimes(3));
    expect(draws()).toBe(2);
  });

  it('sameFigure compares values, not objects', () => {
    expect(sameFigure(figure(1), figure(1))).toBe(true);
    expect(sameFigure(figure(1), figure(1.0000001))).toBe(false);
    expect(sameFigure({ a: [1, null, 'x'] }, { a: [1, null, 'x'] })).toBe(true);
    expect(sameFigure({ a: [1, 2] }, { a: [1, 2, 3] })).toBe(false);
    expect(sameFigure({ a: 1 }, { a: 1, b: undefined })).toBe(false);
    expect(sameFigure({ a: 1, b: 2 }, { b: 2, a: 1 })).toBe(true);
    expect(sameFigure([1], { 0: 1 })).toBe(false);
    expect(sameFigure(Number.NaN, Number.NaN)).toBe(true);
    expect(sameFigure(null, {})).toBe(false);
  });
});
