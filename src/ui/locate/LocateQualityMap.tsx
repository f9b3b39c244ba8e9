import { useDeferredValue, useId, useMemo } from 'react';
import type { Vec3 } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { useFieldHelp } from '../help/FieldHelp';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import { speedOf } from './derive-locate';
import { useDisplayUnit } from '../units/use-display-unit';
import { lengthScale } from './locate-figures';
import { qualityFigure } from './quality-figure';
import { LOCATE_HELP } from './locate-help';
import { MAP_POINTS_PER_SIDE, median, qualityMap } from './locate-geometry';
import { AXIS_NAMES, axesOf, constraintOf, PLANE_PAIRS, type PlanePair, pairName, placementOf } from './locate-inputs';
import { useElementWidth as useWidth } from '../layout/use-element-width';
import { useLocateOutcome, useSettled } from './use-locate';

export const QUALITY_CHART_ID = 'locate-quality-map';
/** The map is redrawn once typing pauses this long, ms (it takes about a tenth of a second). */
const SETTLE_MS = 250;
/** Height of the map, px, and the margins of its plot area (locate-figures). */
const MAP_HEIGHT_PX = 460;
const PLOT_MARGIN_X_PX = 60 + 12 + 90;
const PLOT_MARGIN_Y_PX = 40 + 46;

function centroid(points: readonly Vec3[]): Vec3 {
  const n = Math.max(1, points.length);
  return [0, 1, 2].map((k) => points.reduce((acc, p) => acc + p[k as 0], 0) / n) as unknown as Vec3;
}

/** Most sensors the layout map is drawn for: past this its grid of fits would hold up typing for seconds. */
export const MAP_MAX_SENSORS = 100;

/**
 * Before a cooldown: the expected position sd of a source anywhere in a plane, from the layout and
 * the timing sd alone; and where one more sensor would help most. Drawn from deferred inputs.
 */
export function LocateQualityMap() {
  const rows = useDeferredValue(useSettled(useSekundoStore((s) => s.locateRows), SETTLE_MS));
  const options = useDeferredValue(useSettled(useSekundoStore((s) => s.locateOptions), SETTLE_MS));
  const plane = useSekundoStore((s) => s.locateDisplay.mapPlane);
  const setDisplay = useSekundoStore((s) => s.setLocateDisplay);
  const selectId = useId();
  const length = useDisplayUnit('length');
  const mm = (m: number) => length.format(m, 3);
  const planeHelp = useFieldHelp('map plane', LOCATE_HELP.mapPlane);
  const [boxRef, width] = useWidth<HTMLDivElement>(640);
  // The fit on screen (the locate worker's newest): the map is drawn through its source.
  const outcome = useLocateOutcome();
  const speed = speedOf(options);
  // The same positions keep the same array (an arrival typed elsewhere does not redraw the map).
  const positionsKey = rows.map((r) => r.position_m.join(',')).join(';');
  // biome-ignore lint/correctness/useExhaustiveDependencies: the key stands for the positions
  const positions = useMemo(() => rows.map((r) => r.position_m), [positionsKey]);
  const tooMany = positions.length > MAP_MAX_SENSORS;
  const located = outcome.ok && !outcome.result.degenerate;
  const through: Vec3 = located ? outcome.result.source_m : centroid(positions);
  const timingSd = median(rows.map((r) => r.arrivalSd_s ?? options.arrivalSd_s));
  const sdForMap = Number.isFinite(timingSd) ? timingSd : options.arrivalSd_s;
  const constraint = useMemo(() => constraintOf(options), [options]);
  const placement = useMemo(() => placementOf(options), [options]);
  const speed_m_s = speed.ok ? speed.speed_m_s : null;
  const fitSpeed = options.fitSpeed;
  const [t0, t1, t2] = through;
  const map = useMemo(() => {
    if (speed_m_s === null || positions.length === 0 || positions.length > MAP_MAX_SENSORS) return null;
    return qualityMap(positions, [t0, t1, t2], plane, { speed_m_s, arrivalSd_s: sdForMap, fitSpeed, constraint }, placement);
  }, [positions, t0, t1, t2, plane, speed_m_s, sdForMap, fitSpeed, constraint, placement]);
  const side = Math.max(120, Math.min(width - PLOT_MARGIN_X_PX, MAP_HEIGHT_PX - PLOT_MARGIN_Y_PX));
  const cellPx = Math.max(4, side / MAP_POINTS_PER_SIDE + 1);
  const figure = useMemo(
    () => (map ? qualityFigure({ map, positions, labels: rows.map((r) => r.label), source: located ? [t0, t1, t2] : null, cellPx, length: lengthScale(length.unit) }) : null),
    [map, positions, rows, located, t0, t1, t2, cellPx, length.unit],
  );
  const { c } = axesOf(plane);
  const level = `${AXIS_NAMES[c]} = ${mm(through[c])} ${length.shown}`;
  const best = map?.best ?? null;
  return (
    <section className="card locate-card locate-map" aria-labelledby="locate-map-title">
      <div className="card-head">
        <h2 id="locate-map-title" className="card-title">
          Layout quality and the best added sensor
        </h2>
        <div className="locate-inline-field">
          <label htmlFor={selectId} className="locate-field__label">
            Map plane
          </label>
          {planeHelp.button}
          <select id={selectId} className="locate-select" value={plane} aria-describedby={planeHelp.describedBy} onChange={(event) => setDisplay({ mapPlane: event.target.value as PlanePair })}>
            {PLANE_PAIRS.map((p) => (
              <option key={p} value={p}>
                {pairName(p)}
              </option>
            ))}
          </select>
        </div>
      </div>
      {planeHelp.panel}
      {!speed.ok ? (
        <p className="muted">No map: {speed.message}</p>
      ) : positions.length === 0 ? (
        <p className="muted">No sensors yet: add some to see how well they would place a source.</p>
      ) : tooMany ? (
        <p className="muted">
          No map for {positions.length} sensors: the page draws the layout map for up to {MAP_MAX_SENSORS} sensors, so that typing stays quick. The fit, its regions and the
          residuals above are for all of them.
        </p>
      ) : (
        <div className="locate-map__body">
          <div ref={boxRef} className="locate-map__chart">
            {figure ? (
              <PanelErrorBoundary panel="layout-quality map">
                <PlotlyChart
                  chartId={QUALITY_CHART_ID}
                  label={`Expected position sd over the ${pairName(plane)} plane at ${level}${best ? `; best added sensor at ${best.position_m.map(mm).join(', ')} ${length.shown}` : ''}.`}
                  data={figure.data}
                  layout={figure.layout}
                />
              </PanelErrorBoundary>
            ) : null}
          </div>
          <div className="locate-map__text">
            <p className="locate-best" role="status">
              {best ? (
                <>
                  <strong>
                    One more sensor at ({best.position_m.map(mm).join(', ')}) {length.shown}
                  </strong> would help most: the mean expected sd inside the layout on this map falls from{' '}
                  {Number.isFinite(best.baselineMeanSd_m) ? `${mm(best.baselineMeanSd_m)} ${length.shown}` : 'undetermined (the layout cannot fix every point)'} to{' '}
                  {mm(best.meanSd_m)} {length.shown}.
                </>
              ) : (
                <>
                  No single added sensor {placement.box ? 'in the region you gave' : 'on the box around the layout'}
                  {placement.body ? ` (outside the ${placement.body.kind})` : ''} lowers the mean expected sd inside the layout on this map.
                </>
              )}
            </p>
            <p className="muted">
              Colour: the expected position sd, √(σx² + σy² + σz²), of a source at each point of the {pairName(plane)} plane at {level} (
              {located ? 'through the located source' : 'through the sensors’ centroid'}), from the geometry and a timing sd of{' '}
              {formatSignificant(sdForMap * 1e6, 2)} µs (the median of the sensors’), with the speed {options.fitSpeed ? 'fitted' : 'known'}
              {constraint.kind === 'none' ? '' : ` and the source held on the ${constraint.kind} (each point stands for its nearest point there)`}. Grey:
              the layout cannot fix a source there. Diamond: the best of {map?.candidates ?? 0} candidate places on the faces of{' '}
              {placement.box ? 'the region you gave for added sensors' : 'the box around the sensors (widened by a tenth)'}
              {placement.body ? `, leaving out those inside the ${placement.body.kind} (no sensor can sit in the body or on its axis)` : ''}, judged by the mean sd at
              points of this map within the sensors’ extent. Circles: the sensors, projected.
            </p>
          </div>
        </div>
      )}
    </section>
  );
}
