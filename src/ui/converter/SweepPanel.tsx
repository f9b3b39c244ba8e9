import { useId, useMemo } from 'react';
import { fromBaseUnit, type Unit } from '../../io/quantity';
import { calibratePathFromSweep, PhysicsError, SECOND_SOUND_EXTREMA, secondSound } from '../../physics';
import { ChartFigure } from '../charts/ChartFigure';
import { axis, baseLayout, CHART_COLOURS } from '../charts/chart-theme';
import { formatSignificant } from '../units/format-number';
import { PlotlyChart } from '../plot/PlotlyChart';
import type { PlotLayout, PlotTrace } from '../plot/plotly-types';
import { useSekundoStore } from '../store';
import { shownUnit } from '../units/unit-choices';
import { sentence } from './converter-checks';
import { valuesOf } from './converter-slice';
import { csvColumn, currentUnitViews, TIME_DECIMALS, useUnitViews } from '../units/unit-views';
import { tableExport } from './export-text';
import { sweepHelp } from './converter-help';
import { describedBy, HelpLabel, useFieldHelp } from '../help/FieldHelp';
import { sweepCalibration } from './reading-results';
import { ResultActions } from './ResultActions';
import { readSweepText } from './table-input';
import { useFieldValues } from './use-converter';
import { symbolCase } from '../layout/symbol-case';
import { useOwnForm } from '../fields/OwnForm';

const SWEEP_UNITS: readonly Unit[] = ['ms', 'µs', 's'];

/**
 * An invented sweep for trying the calibration: a bath cooling from 1.72 K to 1.58 K at 5 mK per
 * minute, read every minute over a 48.60 mm path with ±2 µs of scatter (a fixed pseudo-random
 * pattern). Demo data from the kernel's own u₂, not a measurement.
 */
export function exampleSweepText(): string {
  const path_m = 0.0486;
  const scatter_us = [1.2, -0.8, 2.0, -1.6, 0.3, -2.1, 1.7, -0.4, 0.9, -1.3, 2.2, -0.6, 0.1, -1.9, 1.4, -0.2, 0.7, -1.1, 1.8, -0.9, 0.5, -1.5, 0.2, -0.7, 1.1, -1.7, 0.8, -0.3, 1.5];
  const lines = ['# minute, delay (ms)'];
  scatter_us.forEach((noise, minute) => {
    const T = 1.72 - 0.005 * minute;
    const delay_ms = (path_m / secondSound(T) + noise * 1e-6) * 1e3;
    lines.push(`${minute}, ${delay_ms.toFixed(5)}`);
  });
  return `${lines.join('\n')}\n`;
}

/** Reads the sweep text and checks it calibrates; the store keeps the last good points, or the message. */
export function commitSweep(): void {
  const state = useSekundoStore.getState();
  const read = readSweepText(state.converterSweepText, state.converterSweepUnit);
  if (!read.ok) {
    state.commitConverterSweep(read);
    return;
  }
  const v = valuesOf(state.converterValues);
  try {
    calibratePathFromSweep(read.value, v.offset ?? 0, v.offsetSd ?? 0);
  } catch (error) {
    if (!(error instanceof PhysicsError)) throw error;
    state.commitConverterSweep({ ok: false, message: sentence(error.message) });
    return;
  }
  state.commitConverterSweep({ ok: true, points: read.value });
}

/** Paste area for a sweep through the u₂ maximum: lines of “x, delay”. */
export function SweepInput() {
  const headingId = useId();
  const areaId = useId();
  const ownForm = useOwnForm();
  const text = useSekundoStore((s) => s.converterSweepText);
  const unit = useSekundoStore((s) => s.converterSweepUnit);
  const error = useSekundoStore((s) => s.converterSweepError);
  const edit = useSekundoStore((s) => s.editConverterSweep);
  const setUnit = useSekundoStore((s) => s.setConverterSweepUnit);
  const { temperature } = useUnitViews();
  const maximumAt = `${temperature.format(SECOND_SOUND_EXTREMA.maximum.temperature_K, 3)} ${temperature.shown}`;
  const topics = sweepHelp(unit);
  const textHelp = useFieldHelp('sweep readings', topics.text);
  const unitHelp = useFieldHelp('delay unit of the sweep', topics.unit);
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Path length from a sweep through {symbolCase(maximumAt)}
      </h2>
      <p className="muted converter-card__lead">
        Let the bath drift through the u₂ maximum ({formatSignificant(SECOND_SOUND_EXTREMA.maximum.speed_m_s)} m/s near{' '}
        {maximumAt}) while you log delays. The shortest delay belongs to the maximum, so L = u₂,max · (t_min − t₀)
        without a thermometer. x is the time of each reading or its number; the offset t₀ (below) is subtracted.
      </p>
      <HelpLabel htmlFor={areaId} help={textHelp}>
Sweep readings (x, delay), one per line
</HelpLabel>
      <textarea
        id={areaId}
        form={ownForm.id}
        className="text-input sweep-text"
        rows={9}
        spellCheck={false}
        value={text}
        placeholder={'0, 2.3912\n1, 2.3871\n…'}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(error && `${areaId}-error`, textHelp.describedBy)}
        onChange={(event) => edit(event.target.value)}
        onBlur={commitSweep}
      />
      {ownForm.element}
      <div className="setup-form__actions">
        <label className="inline-label">
          Delay unit{' '}
          <select
            className="unit-select"
            value={unit}
            aria-describedby={unitHelp.describedBy}
            onChange={(event) => {
              setUnit(event.target.value as Unit);
              commitSweep();
            }}
          >
            {SWEEP_UNITS.map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </select>
        </label>
        {unitHelp.button}
        <button type="button" className="button button--primary" onClick={commitSweep}>
          Calibrate
        </button>
        <button
          type="button"
          className="button"
          onClick={() => {
            edit(exampleSweepText());
            setUnit('ms');
            commitSweep();
          }}
        >
          Load an invented example
        </button>
      </div>
      {unitHelp.panel}
      {error ? (
        <p id={`${areaId}-error`} className="field-error" role="alert">
          {error} The last good calibration stays in effect.
        </p>
      ) : null}
    </section>
  );
}

/** The calibration: path length with its sd, the shortest delay, and the sweep with its minimum. */
export function SweepResult() {
  const headingId = useId();
  const points = useSekundoStore((s) => s.converterSweepPoints);
  const values = useFieldValues();
  const applyValues = useSekundoStore((s) => s.applyConverterValues);
  const { length, time } = useUnitViews();
  const result = useMemo(() => sweepCalibration(points, values), [points, values]);
  const figure = useMemo(
    () => (points && result?.ok ? sweepFigure(points, result.value.atX, result.value.shortestDelay_s, time.unit) : null),
    [points, result, time.unit],
  );
  if (result === null || points === null) {
    return (
      <p className="card converter-empty" role="status">
        Paste a sweep (at least five readings with the shortest delay inside, not at an end), or load the invented example.
      </p>
    );
  }
  if (!result.ok) {
    return (
      <p className="card field-error" role="alert">
        {result.message}
      </p>
    );
  }
  const c = result.value;
  const path = length.measured(c.pathLength_m, c.pathLengthSd_m);
  const shortest = time.measured(c.shortestDelay_s, c.shortestDelaySd_s);
  const exportContent = () => {
    const { length: l, time: t } = currentUnitViews();
    const header = [
      csvColumn('path_length', l),
      csvColumn('path_length_sd', l),
      csvColumn('shortest_delay', t),
      csvColumn('shortest_delay_sd', t),
      'at_x',
      'u2_max_m_s',
      'points_used',
      csvColumn('offset', t),
      csvColumn('offset_sd', t),
    ];
    const inTime = (v: number | null) => (v === null ? null : t.fromSi(v));
    const row = [l.fromSi(c.pathLength_m), l.fromSi(c.pathLengthSd_m), t.fromSi(c.shortestDelay_s), t.fromSi(c.shortestDelaySd_s), c.atX, c.maximumSpeed_m_s, c.pointsUsed, inTime(values.offset), inTime(values.offsetSd)];
    return tableExport('sekundo-path-calibration.csv', { header, rows: [row] });
  };
  return (
    <>
      <section className="card converter-card result-card" aria-labelledby={headingId}>
        <div className="card-head">
          <h2 id={headingId} className="card-title">
            Calibrated path length
          </h2>
          <ResultActions what="calibration" content={exportContent} />
        </div>
        <dl className="key-figures converter-figures">
          <div className="key-figure">
            <dt>Path length L</dt>
            <dd>
              <span className="key-figure__value">{path.value}</span>{' '}
              <span className="key-figure__unit">{path.sd === null ? length.shown : `± ${path.sd} ${length.shown}`}</span>
              <span className="key-figure__detail">L = u₂,max · (t_min − t₀)</span>
            </dd>
          </div>
          <div className="key-figure">
            <dt>Shortest delay t_min</dt>
            <dd>
              <span className="key-figure__value">{shortest.value}</span>{' '}
              <span className="key-figure__unit">{shortest.sd === null ? time.shown : `± ${shortest.sd} ${time.shown}`}</span>
              <span className="key-figure__detail">
                at x = {formatSignificant(c.atX, 4)}, parabola through {c.pointsUsed} readings
              </span>
            </dd>
          </div>
          <div className="key-figure">
            <dt>Use it</dt>
            <dd>
              <button type="button" className="button button--small" onClick={() => applyValues({ distance: c.pathLength_m, distanceSd: c.pathLengthSd_m })}>
                Use as the distance
              </button>
              <span className="key-figure__detail">for single delays, batches and traces</span>
            </dd>
          </div>
        </dl>
      </section>
      {figure ? (
        <ChartFigure id="converter-sweep" title="Delays through the u₂ maximum" caption="Dots: the sweep. Amber: the shortest delay the parabola finds.">
          <PlotlyChart chartId="converter-sweep" label={`Chart of the sweep's delays; shortest ${shortest.value} ${time.shown}.`} data={figure.data} layout={figure.layout} />
        </ChartFigure>
      ) : null}
    </>
  );
}

/** The sweep's delays against x, in the display unit of time, and the shortest delay found. */
function sweepFigure(points: readonly { x: number; delay_s: number }[], atX: number, shortest_s: number, unit: 'ms' | 'µs' | 's'): { data: PlotTrace[]; layout: PlotLayout } {
  const sorted = [...points].sort((a, b) => a.x - b.x);
  const scale = fromBaseUnit(1, unit);
  const shown = shownUnit(unit);
  // One digit finer than the 0.1 µs of the other time labels: a sweep's delays differ by microseconds.
  const decimals = TIME_DECIMALS[unit] + 1;
  return {
    data: [
      {
        type: 'scatter',
        name: 'Readings',
        x: sorted.map((p) => p.x),
        y: sorted.map((p) => p.delay_s * scale),
        mode: 'markers',
        marker: { color: CHART_COLOURS.secondSound, size: 7 },
        hovertemplate: `x = %{x}<br>%{y:.${decimals}f} ${shown}<extra></extra>`,
      },
      {
        type: 'scatter',
        name: 'Shortest delay',
        x: [atX],
        y: [shortest_s * scale],
        mode: 'markers',
        marker: { color: CHART_COLOURS.chosen, size: 13, symbol: 'diamond', line: { color: '#ffffff', width: 2 } },
        hovertemplate: `x = %{x:.3f}<br>%{y:.${decimals}f} ${shown}<extra></extra>`,
      },
    ],
    layout: { ...baseLayout(), xaxis: axis('Sweep coordinate x'), yaxis: axis(`Delay (${shown})`), margin: { l: 64, r: 16, t: 30, b: 44 } },
  };
}
