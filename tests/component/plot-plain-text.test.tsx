/**
 * Labels from files, links and fields reach the charts (and their PNG/SVG exports, drawn from the
 * same figure) as plain text: markup in a locate label or a trace channel name is escaped before
 * Plotly sees it, so it can neither become a live link nor draw over the chart.
 */
import { render, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { PlotlyChart } from '../../src/ui/plot/PlotlyChart';
import type { PlotLayout, PlotTrace } from '../../src/ui/plot/plotly-types';
import { lastDraw } from './fake-plotly';

const LINK = '<a href="https://example.invalid/">Bolometer A</a>';
const OVERLAY = '<b style="font-size:400px">S2</b>';

describe('chart text is plain text', () => {
  it('names, point text, tick labels and annotations arrive escaped; hover templates keep our markup', async () => {
    const data: PlotTrace[] = [
      { type: 'scatter', name: LINK, x: [1, 2], y: [1, 2], text: [OVERLAY, 'plain & simple'], hovertemplate: '%{text}<br>%{x}<extra></extra>' },
    ];
    const layout: PlotLayout = {
      yaxis: { tickvals: [0], ticktext: [LINK] } as PlotLayout['yaxis'],
      annotations: [{ text: OVERLAY, xref: 'x', yref: 'paper', x: 1, y: 1 }],
    };
    render(<PlotlyChart chartId="hostile" label="hostile labels" data={data} layout={layout} />);
    await waitFor(() => expect(lastDraw('hostile')).toBeDefined());
    const draw = lastDraw('hostile');
    const trace = draw?.data[0];
    expect(trace?.name).toBe('&lt;a href="https://example.invalid/"&gt;Bolometer A&lt;/a&gt;');
    expect(trace?.text).toEqual(['&lt;b style="font-size:400px"&gt;S2&lt;/b&gt;', 'plain &amp; simple']);
    expect(trace?.hovertemplate).toBe('%{text}<br>%{x}<extra></extra>');
    expect((draw?.layout.yaxis as { ticktext?: string[] } | undefined)?.ticktext).toEqual(['&lt;a href="https://example.invalid/"&gt;Bolometer A&lt;/a&gt;']);
    expect(draw?.layout.annotations?.[0]?.text).toBe('&lt;b style="font-size:400px"&gt;S2&lt;/b&gt;');
    expect(JSON.stringify(draw?.data)).not.toMatch(/<a |<b /);
  });
});
