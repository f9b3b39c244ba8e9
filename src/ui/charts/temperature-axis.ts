/**
 * The explorer's charts are written with temperature in kelvin on the x axis; this shows them in the
 * person's display unit of temperature instead (mK: every x ×1000, the axis title and hover text
 * follow). Only things placed on the x axis move: traces, shapes and labels with xref "x".
 */
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';

export type TemperatureUnit = 'K' | 'mK';

const MK_PER_K = 1000;
const scaled = new WeakMap<readonly number[], number[]>();

/** x values in mK, computed once per array (the curves are built once and reused). */
function inMillikelvin(x: readonly number[]): number[] {
  let out = scaled.get(x);
  if (!out) {
    out = x.map((v) => v * MK_PER_K);
    scaled.set(x, out);
  }
  return out;
}

const onX = (ref: string | undefined) => ref === undefined || ref === 'x';

/** The figure with its temperature axis in `unit` (as written for K). */
export function inTemperatureUnit(figure: { data: readonly PlotTrace[]; layout: PlotLayout }, unit: TemperatureUnit): { data: readonly PlotTrace[]; layout: PlotLayout } {
  if (unit === 'K') return figure;
  const { data, layout } = figure;
  return {
    data: data.map((t) =>
      onX(t.xaxis) ? { ...t, x: inMillikelvin(t.x), hovertemplate: t.hovertemplate?.replace(/%\{x:\.\d+f\} K/g, '%{x:.1f} mK') } : t,
    ),
    layout: {
      ...layout,
      xaxis: layout.xaxis && {
        ...layout.xaxis,
        range: layout.xaxis.range && [layout.xaxis.range[0] * MK_PER_K, layout.xaxis.range[1] * MK_PER_K],
        title: layout.xaxis.title && { ...layout.xaxis.title, text: layout.xaxis.title.text.replace('(K)', '(mK)') },
      },
      shapes: layout.shapes?.map((s) => (onX(s.xref) ? { ...s, x0: s.x0 * MK_PER_K, x1: s.x1 * MK_PER_K } : s)),
      annotations: layout.annotations?.map((a) => (onX(a.xref) ? { ...a, x: a.x * MK_PER_K } : a)),
    },
  };
}
