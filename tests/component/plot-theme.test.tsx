import { darkColour, PLOT_SURROUNDINGS, themeFigure, themedColour } from '../../src/ui/plot/plot-theme';
import type { PlotLayout, PlotTrace } from '../../src/ui/plot/plotly-types';

/** WCAG relative luminance and contrast of two hex colours. */
function contrast(a: string, b: string): number {
  const lum = (hex: string) => {
    const [r, g, b2] = [1, 3, 5].map((i) => Number.parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4)) as [number, number, number];
    return 0.2126 * r + 0.7152 * g + 0.0722 * b2;
  };
  const [hi, lo] = [lum(a), lum(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

const LAYOUT: PlotLayout = {
  paper_bgcolor: 'rgba(0,0,0,0)',
  plot_bgcolor: '#ffffff',
  font: { size: 12, color: '#10223a' },
  xaxis: { title: { text: 'T (K)' }, gridcolor: '#e6e2d8', linecolor: '#b9b3a5' },
  yaxis2: { gridcolor: 'rgba(0,0,0,0)' },
  shapes: [{ type: 'rect', xref: 'x', yref: 'paper', x0: 0, x1: 1, y0: 0, y1: 1, fillcolor: 'rgba(217, 119, 43, 0.16)' }],
  annotations: [{ text: 'Tλ', xref: 'x', yref: 'paper', x: 2.17, y: 1, bgcolor: 'rgba(255,255,255,0.85)', font: { color: '#5a6e8a' } }],
};
const DATA: PlotTrace[] = [
  { type: 'scatter', name: 'curve', x: [1, 2], y: [3, 4], line: { color: '#0b7a76' } },
  { type: 'scatter', name: 'map', x: [1], y: [1], marker: { color: [0.2], colorscale: [[0, '#0b6d69'], [1, '#a4401f']] } },
  { type: 'scatter', name: 'band', x: [1], y: [1], fill: 'tonexty', fillcolor: '#0b6d69' },
  { type: 'scatter', name: 'wash', x: [1], y: [1], fill: 'toself', fillcolor: 'rgba(255, 255, 255, 0.62)' },
  { type: 'scatter', name: 'point', x: [1], y: [1], marker: { color: '#d9772b', line: { color: '#ffffff', width: 2 } } },
];

describe('charts in the page theme (Plotly wrapper)', () => {
  it('light: the figure as written, on an opaque paper (exports read anywhere)', () => {
    const { data, layout } = themeFigure(DATA, LAYOUT, 'light');
    expect(data).toBe(DATA);
    expect(layout).toEqual({ ...LAYOUT, paper_bgcolor: PLOT_SURROUNDINGS.light.paper });
  });

  it('dark: surroundings in the dark set; colours swapped, data encodings kept', () => {
    const { data, layout } = themeFigure(DATA, LAYOUT, 'dark');
    const s = PLOT_SURROUNDINGS.dark;
    expect(layout).toMatchObject({ paper_bgcolor: s.paper, plot_bgcolor: s.plot, font: { size: 12, color: s.text } });
    expect(layout.xaxis).toMatchObject({ gridcolor: s.grid, linecolor: s.axis, title: { text: 'T (K)', font: { color: s.muted } } });
    expect(layout.yaxis2?.gridcolor).toMatch(/^rgba\(0, ?0, ?0, ?0\)$/);
    expect(layout.hoverlabel).toMatchObject({ bgcolor: s.hoverBg, font: { color: s.text } });
    expect(layout.legend?.font?.color).toBe(s.text);
    expect(layout.shapes?.[0]?.fillcolor).toBe('rgba(242, 162, 89, 0.16)');
    expect(layout.annotations?.[0]).toMatchObject({ bgcolor: 'rgba(16, 24, 35, 0.85)', font: { color: '#9fb0c6' } });
    const byName = Object.fromEntries(data.map((t) => [t.name, t]));
    expect(byName.curve?.line?.color).toBe('#3fc4b6');
    expect(byName.map?.marker?.colorscale).toEqual(DATA[1]?.marker?.colorscale);
    expect(byName.band?.fillcolor).toBe('#0b6d69');
    expect(byName.wash?.fillcolor).toBe('rgba(255, 255, 255, 0.62)');
    expect(byName.point?.marker).toMatchObject({ color: '#f2a259', line: { color: '#101823' } });
    // Data arrays are not copied.
    expect(byName.curve?.x).toBe(DATA[0]?.x);
    // The figure as written is left alone.
    expect(DATA[0]?.line?.color).toBe('#0b7a76');
  });

  it('every line colour ends at least 3:1 against the dark plot, known or not', () => {
    for (const colour of ['#10223a', '#4a5c9c', '#0b7a76', '#b5542a', '#8a4f8f', '#3d4d5c', '#123456', '#400000', '#000000']) {
      expect(contrast(darkColour(colour), PLOT_SURROUNDINGS.dark.plot), colour).toBeGreaterThanOrEqual(3);
    }
    expect(themedColour('#10223a', 'light')).toBe('#10223a');
    expect(darkColour('transparent')).toBe('transparent');
  });
});
