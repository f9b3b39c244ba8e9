/**
 * Plotly reads a subset of HTML in the text it draws (legend names, point text, tick labels,
 * titles, annotations): a label `<a href=…>` would become a live link in the chart and in its SVG
 * export, `<b style=…>` would draw over the chart. Every figure passes through {@link plainFigure}
 * before Plotly sees it, so labels from files, links and fields are drawn as the text they are.
 * Plotly turns the entities back into the characters (&lt; → <) when it draws. Hover templates
 * are ours and keep their markup; user text reaches them only through %{text}, which is escaped.
 */

/** Keys whose string values Plotly draws as text. */
const TEXT_KEYS: ReadonlySet<string> = new Set(['name', 'text', 'hovertext', 'ticktext']);

/** `<`, `>` and `&` as entities: the text shows as written, never as markup. */
export function plainPlotText(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

function plainValue(value: string | readonly unknown[]): unknown {
  if (typeof value === 'string') return plainPlotText(value);
  return value.some((v) => typeof v === 'string' && /[&<>]/.test(v)) ? value.map((v) => (typeof v === 'string' ? plainPlotText(v) : v)) : value;
}

/** The value with drawn texts made plain; the same object when nothing needed it (arrays of numbers are never copied). */
function walk(value: unknown, depth: number): unknown {
  if (depth > 8 || value === null || typeof value !== 'object' || ArrayBuffer.isView(value)) return value;
  if (Array.isArray(value)) {
    if (!value.some((v) => v !== null && typeof v === 'object')) return value;
    const items = value.map((v) => walk(v, depth + 1));
    return items.some((v, i) => v !== value[i]) ? items : value;
  }
  let out: Record<string, unknown> | null = null;
  for (const [key, v] of Object.entries(value)) {
    const plain = TEXT_KEYS.has(key) && (typeof v === 'string' || Array.isArray(v)) ? plainValue(v as string | readonly unknown[]) : walk(v, depth + 1);
    if (plain !== v) {
      out ??= { ...(value as Record<string, unknown>) };
      out[key] = plain;
    }
  }
  return out ?? value;
}

/** The figure with every drawn text made plain (copies only where a text changed). */
export function plainFigure<D, L>(data: readonly D[], layout: L): { data: D[]; layout: L } {
  return { data: data.map((trace) => walk(trace, 0) as D), layout: walk(layout, 0) as L };
}
