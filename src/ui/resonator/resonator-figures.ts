/**
 * The resonator view's charts as plain figures (data and layout, light palette; the Plotly wrapper
 * themes them): the sweep with its fit and residuals, and the lock-in series L(t) and δf₀(t) with
 * their ±1 sd bands. Long records are thinned to at most {@link MAX_DRAWN_POINTS} points by stride
 * (the analysis and the CSV keep every row).
 */
import type { LockinSeries, ResonanceFit } from '../../physics';
import { resonanceAt } from '../../physics';
import type { SweepCsv } from '../../io/resonance-csv';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';

/** Most points a trace draws. */
export const MAX_DRAWN_POINTS = 4000;

/** Colours of the resonator charts (ours: the page's teal and copper, and a quiet slate). */
export const RESONATOR_COLOURS = {
  data: '#0b7a76',
  fit: '#10223a',
  reference: '#8a94a6',
  quadrature: '#b5542a',
  band: 'rgba(11, 122, 118, 0.16)',
  drift: '#b5542a',
  driftBand: 'rgba(181, 84, 42, 0.16)',
} as const;

function strideOf(n: number): number {
  return Math.max(1, Math.ceil(n / MAX_DRAWN_POINTS));
}

/** A signal scale that reads well: V, mV, µV or nV for the largest value. */
export function signalScale(max: number): { factor: number; unit: string } {
  if (max >= 1) return { factor: 1, unit: 'V' };
  if (max >= 1e-3) return { factor: 1e3, unit: 'mV' };
  if (max >= 1e-6) return { factor: 1e6, unit: 'µV' };
  return { factor: 1e9, unit: 'nV' };
}

interface Magnitudes {
  f: number[];
  data: number[];
  residualX: number[];
  residualY: number[];
}

function magnitudes(data: SweepCsv, fit: ResonanceFit): Magnitudes {
  const n = data.frequency_Hz.length;
  const step = strideOf(n);
  const out: Magnitudes = { f: [], data: [], residualX: [], residualY: [] };
  for (let i = 0; i < n; i += step) {
    const f = data.frequency_Hz[i] as number;
    const model = resonanceAt(fit, f);
    if (data.x && data.y) {
      const x = data.x[i] as number;
      const y = data.y[i] as number;
      out.data.push(Math.hypot(x, y));
      out.residualX.push(x - model.re);
      out.residualY.push(y - model.im);
    } else {
      const a = (data.amplitude as Float64Array)[i] as number;
      out.data.push(a);
      out.residualX.push(a - model.re);
    }
    out.f.push(f);
  }
  return out;
}

/** The fitted model's magnitude on a fine grid across the sweep. */
function modelCurve(fit: ResonanceFit, from: number, to: number): { f: number[]; m: number[] } {
  const f: number[] = [];
  const m: number[] = [];
  const points = 600;
  for (let k = 0; k <= points; k++) {
    const fr = from + ((to - from) * k) / points;
    f.push(fr);
    m.push(resonanceAt(fit, fr).magnitude);
  }
  return { f, m };
}

/** The sweep: |Z| data and fit (and the reference's, lighter), residuals of x and y below. */
export function sweepFigure(data: SweepCsv, fit: ResonanceFit, reference: { data: SweepCsv; fit: ResonanceFit } | null): { data: PlotTrace[]; layout: PlotLayout } {
  const main = magnitudes(data, fit);
  const from = Math.min(data.frequency_Hz[0] as number, data.frequency_Hz[data.frequency_Hz.length - 1] as number);
  const to = Math.max(data.frequency_Hz[0] as number, data.frequency_Hz[data.frequency_Hz.length - 1] as number);
  const ref = reference ? magnitudes(reference.data, reference.fit) : null;
  const scale = signalScale(Math.max(...main.data.map(Math.abs), ...(ref ? ref.data.map(Math.abs) : [])));
  const s = (v: number[]) => v.map((x) => x * scale.factor);
  const curve = modelCurve(fit, from, to);
  const traces: PlotTrace[] = [];
  if (ref && reference) {
    const refCurve = modelCurve(reference.fit, from, to);
    traces.push(
      { name: 'reference (vortex-free)', type: 'scatter', mode: 'markers', x: ref.f, y: s(ref.data), marker: { color: RESONATOR_COLOURS.reference, size: 3 }, hovertemplate: '%{x:.3f} Hz<br>%{y:.4g}<extra>reference</extra>' },
      { name: 'reference fit', type: 'scatter', mode: 'lines', x: refCurve.f, y: s(refCurve.m), line: { color: RESONATOR_COLOURS.reference, width: 1.5, dash: 'dash' }, hoverinfo: 'skip' },
    );
  }
  traces.push(
    { name: data.x ? 'sweep |x + iy|' : 'sweep amplitude', type: 'scatter', mode: 'markers', x: main.f, y: s(main.data), marker: { color: RESONATOR_COLOURS.data, size: 4 }, hovertemplate: '%{x:.3f} Hz<br>%{y:.4g}<extra>sweep</extra>' },
    { name: 'fit', type: 'scatter', mode: 'lines', x: curve.f, y: s(curve.m), line: { color: RESONATOR_COLOURS.fit, width: 2 }, hoverinfo: 'skip' },
    { name: data.x ? 'residual x' : 'residual', type: 'scatter', mode: 'markers', x: main.f, y: s(main.residualX), xaxis: 'x', yaxis: 'y2', marker: { color: RESONATOR_COLOURS.data, size: 3 }, showlegend: false, hovertemplate: '%{x:.3f} Hz<br>%{y:.3g}<extra>residual</extra>' },
  );
  if (data.x) {
    traces.push({ name: 'residual y', type: 'scatter', mode: 'markers', x: main.f, y: s(main.residualY), xaxis: 'x', yaxis: 'y2', marker: { color: RESONATOR_COLOURS.quadrature, size: 3 }, showlegend: false, hovertemplate: '%{x:.3f} Hz<br>%{y:.3g}<extra>residual y</extra>' });
  }
  const layout: PlotLayout = {
    ...baseLayout(),
    height: 380,
    xaxis: axis('Frequency (Hz)', { anchor: 'y2' }),
    yaxis: axis(`Amplitude (${scale.unit})`, { domain: [0.34, 1] }),
    yaxis2: axis(`Residual (${scale.unit})`, { domain: [0, 0.24], zeroline: true }),
    shapes: [
      { type: 'line', xref: 'x', yref: 'paper', x0: fit.frequency_Hz, x1: fit.frequency_Hz, y0: 0.34, y1: 1, line: { color: CHART_COLOURS.chosen, width: 1.5, dash: 'dot' }, name: 'fitted centre' },
    ],
  };
  return { data: traces, layout };
}

/** L(t) above, δf₀(t) below, each with its ±1 sd band (total sd). */
export function lockinFigure(series: LockinSeries): { data: PlotTrace[]; layout: PlotLayout } {
  const n = series.time_s.length;
  const step = strideOf(n);
  const t: number[] = [];
  const L: number[] = [];
  const Llo: number[] = [];
  const Lhi: number[] = [];
  const f: number[] = [];
  const flo: number[] = [];
  const fhi: number[] = [];
  for (let i = 0; i < n; i += step) {
    t.push(series.time_s[i] as number);
    const l = series.lineDensity_m2[i] as number;
    const ls = series.lineDensitySd_m2[i] as number;
    L.push(l);
    Llo.push(l - ls);
    Lhi.push(l + ls);
    const d = series.frequencyShift_Hz[i] as number;
    const ds = series.frequencyShiftSd_Hz[i] as number;
    f.push(d * 1e3);
    flo.push((d - ds) * 1e3);
    fhi.push((d + ds) * 1e3);
  }
  const data: PlotTrace[] = [
    { name: 'L − 1 sd', type: 'scatter', mode: 'lines', x: t, y: Llo, line: { color: 'rgba(0,0,0,0)', width: 0 }, showlegend: false, hoverinfo: 'skip' },
    { name: '±1 sd', type: 'scatter', mode: 'lines', x: t, y: Lhi, fill: 'tonexty', fillcolor: RESONATOR_COLOURS.band, line: { color: 'rgba(0,0,0,0)', width: 0 }, hoverinfo: 'skip' },
    { name: 'line density L', type: 'scatter', mode: 'lines', x: t, y: L, line: { color: RESONATOR_COLOURS.data, width: 1.5 }, hovertemplate: '%{x:.3f} s<br>%{y:.3e} m⁻²<extra>L</extra>' },
    { name: 'δf₀ − 1 sd', type: 'scatter', mode: 'lines', x: t, y: flo, xaxis: 'x', yaxis: 'y2', line: { color: 'rgba(0,0,0,0)', width: 0 }, showlegend: false, hoverinfo: 'skip' },
    { name: '±1 sd of δf₀', type: 'scatter', mode: 'lines', x: t, y: fhi, xaxis: 'x', yaxis: 'y2', fill: 'tonexty', fillcolor: RESONATOR_COLOURS.driftBand, line: { color: 'rgba(0,0,0,0)', width: 0 }, showlegend: false, hoverinfo: 'skip' },
    { name: 'drift of f₀', type: 'scatter', mode: 'lines', x: t, y: f, xaxis: 'x', yaxis: 'y2', line: { color: RESONATOR_COLOURS.drift, width: 1.5 }, hovertemplate: '%{x:.3f} s<br>%{y:.3f} mHz<extra>δf₀</extra>' },
  ];
  const layout: PlotLayout = {
    ...baseLayout(),
    height: 400,
    xaxis: axis('Time (s)', { anchor: 'y2' }),
    yaxis: axis('Line density L (m⁻²)', { domain: [0.48, 1], exponentformat: 'power' }),
    yaxis2: axis('δf₀ (mHz)', { domain: [0, 0.4], zeroline: true }),
  };
  return { data, layout };
}
