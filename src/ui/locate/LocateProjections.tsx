import { type ReactNode, useId, useMemo } from 'react';
import { useFieldHelp } from '../help/FieldHelp';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { PLOT_TOOLS_HEIGHT_PX, PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import { useDisplayUnit } from '../units/use-display-unit';
import { lengthScale, projectionFigure, surfaceOutline, TRACE_NAMES } from './locate-figures';
import { LOCATE_HELP } from './locate-help';
import { PLANE_PAIRS, type PlanePair, pairName } from './locate-inputs';
import { ProjectionLegend } from './ProjectionLegend';
import { useElementWidth as useWidth } from '../layout/use-element-width';
import { useLocateFit } from './use-locate';

/** Chart id of the projection in slot 0 or 1 (tests and readers of the figure find it). */
export const projectionChartId = (slot: 0 | 1) => `locate-projection-${slot + 1}`;

/** Two projections of sensors, source and confidence ellipses, side by side; whole layout or close-up. */
export function LocateProjections() {
  const display = useSekundoStore((s) => s.locateDisplay);
  const setDisplay = useSekundoStore((s) => s.setLocateDisplay);
  const { outcome, rows } = useLocateFit();
  const hasRegions = outcome.ok && outcome.result.covariance_m2 !== null;
  const statuses = new Set(outcome.ok ? outcome.outcomes.map((o) => o.status) : ['fitted']);
  const present = {
    sensors: rows.length > 0 && statuses.has('fitted'),
    outliers: statuses.has('outlier'),
    dropped: statuses.has('dropped'),
    noArrival: statuses.has('no arrival'),
    source: outcome.ok,
    regions: hasRegions,
    surface: display.projections.some((pair) => surfaceOutline(outcome.constraint, pair) !== null),
  };
  const zoomHelp = useFieldHelp('extent of the projections', LOCATE_HELP.zoom);
  const projectionHelp = useFieldHelp('projection', LOCATE_HELP.projection);
  return (
    <section className="card locate-card" aria-labelledby="locate-projections-title">
      <div className="card-head">
        <h2 id="locate-projections-title" className="card-title">
          Sensors and source, two projections
        </h2>
        <div className="table-tools">
          <fieldset className="locate-segmented">
            <legend className="visually-hidden">Extent of the projections</legend>
            {(['layout', 'source'] as const).map((zoom) => (
              <label key={zoom} className="locate-segmented__option">
                <input type="radio" name="locate-zoom" aria-describedby={zoomHelp.describedBy} checked={display.zoom === zoom} disabled={zoom === 'source' && !outcome.ok} onChange={() => setDisplay({ zoom })} />
                {zoom === 'layout' ? 'Whole layout' : 'Close-up of the source'}
              </label>
            ))}
          </fieldset>
          {zoomHelp.button}
        </div>
      </div>
      <div className="help-panels">
        {zoomHelp.panel}
        {projectionHelp.panel}
      </div>
      <ProjectionLegend present={present} />
      <div className="locate-projections">
        {([0, 1] as const).map((slot) => (
          <Projection key={slot} slot={slot} help={slot === 0 ? projectionHelp.button : null} describedBy={projectionHelp.describedBy} />
        ))}
      </div>
      <p className="chart-caption">
        {hasRegions ? (
          <>
            Star: the located source. Solid ellipse, shaded: the <strong>1σ region</strong>, dashed: the <strong>2σ region</strong> of the two coordinates shown —
            the fit's 3 × 3 covariance projected onto this plane (its 2 × 2 marginal), drawn at Δχ² = 2.30 and 6.18, so it holds the true position seen in this
            projection with 68.3 % and 95.4 % probability.{' '}
          </>
        ) : outcome.ok ? (
          <>Star: where the fit stopped; no ellipses, because the layout cannot fix the source. </>
        ) : (
          <>No source located yet: the projections show the sensors only. </>
        )}
        Equal scales on both axes; sensors one above the other in a projection share a label.
      </p>
    </section>
  );
}

function Projection({ slot, help, describedBy }: { slot: 0 | 1; help: ReactNode; describedBy: string }) {
  const id = useId();
  const display = useSekundoStore((s) => s.locateDisplay);
  const setDisplay = useSekundoStore((s) => s.setLocateDisplay);
  // The fit's own rows: a keystroke in the table leaves the chart as it is until the new fit.
  const { outcome, rows } = useLocateFit();
  const pair = display.projections[slot];
  const zoom = outcome.ok ? display.zoom : 'layout';
  const [boxRef, width] = useWidth<HTMLDivElement>(600);
  const length = useDisplayUnit('length');
  // Positions and labels by value: an arrival typed in the table leaves them (and the chart) as they are.
  const positionsKey = rows.map((r) => r.position_m.join(',')).join(';');
  const labelsKey = rows.map((r) => r.label).join('\n');
  // biome-ignore lint/correctness/useExhaustiveDependencies: the key stands for the positions
  const positions = useMemo(() => rows.map((r) => r.position_m), [positionsKey]);
  // biome-ignore lint/correctness/useExhaustiveDependencies: the key stands for the labels
  const labels = useMemo(() => rows.map((r) => r.label), [labelsKey]);
  const figure = useMemo(
    () =>
      projectionFigure({
        pair,
        positions,
        labels,
        outcomes: outcome.ok ? outcome.outcomes : null,
        result: outcome.ok ? outcome.result : null,
        constraint: outcome.constraint,
        zoom,
        length: lengthScale(length.unit),
      }),
    [pair, positions, labels, outcome, zoom, length.unit],
  );
  const choose = (next: PlanePair) => {
    const projections: [PlanePair, PlanePair] = [display.projections[0], display.projections[1]];
    projections[slot] = next;
    setDisplay({ projections });
  };
  const height = frameHeight(figure.data.filter((t) => t.name !== TRACE_NAMES.surface), width, zoom);
  const where = outcome.ok ? `source at ${outcome.result.source_m.map((x) => length.format(x, 4)).join(', ')} ${length.shown}` : 'no source located';
  return (
    <figure className="locate-projection">
      <div className="locate-projection__head">
        <label htmlFor={id} className="locate-field__label">
          Projection
        </label>
        {help}
        <select id={id} className="locate-select" value={pair} aria-describedby={describedBy} onChange={(event) => choose(event.target.value as PlanePair)}>
          {PLANE_PAIRS.map((p) => (
            <option key={p} value={p}>
              {pairName(p)} {p === 'xy' ? '(top view)' : '(side view)'}
            </option>
          ))}
        </select>
      </div>
      <div ref={boxRef} className="locate-projection__plot" style={{ height: `${height + PLOT_TOOLS_HEIGHT_PX}px` }}>
        <PanelErrorBoundary panel={`${pairName(pair)} projection`}>
          <PlotlyChart chartId={projectionChartId(slot)} label={`Sensors and source in the ${pairName(pair)} plane; ${where}.`} data={figure.data} layout={figure.layout} />
        </PanelErrorBoundary>
      </div>
    </figure>
  );
}

/** Margins of a projection's plot area, px (locate-figures). */
const MARGIN_X_PX = 56 + 36;
const MARGIN_Y_PX = 12 + 44;
const HEIGHT_RANGE_PX = [240, 440] as const;

/**
 * Height of a projection's frame that fits its data at equal scales: a flat layout seen from the
 * side gets a short chart instead of a tall one with empty bands.
 */
function frameHeight(data: readonly { x: readonly number[]; y: readonly (number | null)[] }[], width: number, zoom: 'layout' | 'source'): number {
  const plotWidth = Math.max(100, width - MARGIN_X_PX);
  let aspect = 1;
  if (zoom === 'layout') {
    const xs = data.flatMap((t) => [...t.x]).filter(Number.isFinite);
    const ys = data.flatMap((t) => [...t.y]).filter((y): y is number => y !== null && Number.isFinite(y));
    const span = (v: number[]) => (v.length > 0 ? Math.max(...v) - Math.min(...v) : 0);
    const sx = span(xs);
    const sy = span(ys);
    if (sx > 0) aspect = Math.max(sy, 0.05 * sx) / sx;
  }
  const wanted = plotWidth * aspect * 1.12 + MARGIN_Y_PX;
  return Math.round(Math.min(HEIGHT_RANGE_PX[1], Math.max(HEIGHT_RANGE_PX[0], wanted)));
}
