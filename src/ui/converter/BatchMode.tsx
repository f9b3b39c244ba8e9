import { useId, useMemo, useState } from 'react';
import { overLimitText } from '../../io/byte-size';
import { delayResultAt, delayResultCells, delayResultHeader, type DelayBatchResults, WARNING_CODES } from '../../io/delay-batch';
import { ChartFigure } from '../charts/ChartFigure';
import { formatSignificant } from '../units/format-number';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import { BATCH_FILE_LIMIT_BYTES, batchFigure, batchMinutes, batchResults, exampleBatchText, readBatch } from './batch-results';
import { ChoiceCard } from './ChoiceCard';
import { valuesOf } from './converter-slice';
import { type UnitViews, currentUnitViews, temperatureOnY, fixedTemperatureText, useUnitViews } from '../units/unit-views';
import { DropZone } from './DropZone';
import { exportName, tableExport } from './export-text';
import { ResultActions } from './ResultActions';
import { SeriesCells, SeriesHeads } from './SeriesColumns';
import { SetupCard } from './SetupCard';
import { useFieldValues } from './use-converter';

/** Rows shown at a time in the results table. */
const PAGE_ROWS = 100;

/** Reads a dropped batch file into the store, or refuses it (the batch already loaded stays). */
export async function loadBatchFile(file: Blob & { name: string }): Promise<void> {
  const state = useSekundoStore.getState();
  if (file.size > BATCH_FILE_LIMIT_BYTES) {
    state.refuseConverterBatch(`${file.name} is ${overLimitText(file.size, BATCH_FILE_LIMIT_BYTES)} for batch files; split it into smaller files.`);
    return;
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  const now = useSekundoStore.getState();
  const read = readBatch(file.name, bytes, valuesOf(now.converterValues), now.converterChoice);
  if (read.ok) now.loadConverterBatch({ fileName: file.name, batch: read.batch });
  else now.refuseConverterBatch(read.message);
}

/** A CSV of delays → a table of speeds and temperatures, a chart and a CSV to take away. */
export function BatchMode() {
  return (
    <div className="converter-grid">
      <div className="converter-inputs">
        <PanelErrorBoundary panel="batch file">
          <BatchFileCard />
        </PanelErrorBoundary>
        <SetupCard
          title="Distance and timing"
          pairs={['distance', 'delaySd', 'offset']}
          lead="The distance for rows without their own distance cell; the delay sd and offset t₀ apply to every row."
        />
        <PanelErrorBoundary panel="choice of candidate">
          <ChoiceCard series />
        </PanelErrorBoundary>
      </div>
      <div className="converter-results">
        <PanelErrorBoundary panel="batch results">
          <BatchResults />
        </PanelErrorBoundary>
      </div>
    </div>
  );
}

function BatchFileCard() {
  const headingId = useId();
  const batch = useSekundoStore((s) => s.converterBatch);
  const error = useSekundoStore((s) => s.converterBatchError);
  const clear = useSekundoStore((s) => s.clearConverterBatch);
  const onFiles = (files: File[]) => {
    const file = files[0];
    if (file) void loadBatchFile(file);
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Batch of delays
      </h2>
      <p className="muted converter-card__lead">
        A CSV with a header row and one delay per row: <code>delay_s</code> (or <code>delay_ms</code>, <code>delay_us</code>, …); optional{' '}
        <code>distance_m</code> (or mm, …), <code>pressure_Pa</code> (or mbar, kPa) and <code>timestamp</code>. A row with a pressure chooses its
        own temperature; the rows after it follow by continuity. Up to {BATCH_FILE_LIMIT_BYTES / 1048576} MiB.
      </p>
      <DropZone buttonLabel="Choose a CSV file" onFiles={onFiles}>
        <div className="drop-zone__extra">
          <button type="button" className="button button--small" onClick={() => void loadBatchFile(new File([exampleBatchText()], 'invented-cooldown.csv', { type: 'text/csv' }))}>
            Load an invented example
          </button>
          {batch ? (
            <button type="button" className="button button--small" onClick={clear}>
              Clear
            </button>
          ) : null}
        </div>
      </DropZone>
      {batch ? (
        <p className="file-status" role="status">
          Loaded <strong className="file-name">{batch.fileName}</strong>: {batch.batch.rows.length} rows, delays from “{batch.batch.delayColumn}”
          {batch.batch.hasPressure ? ', with pressures' : ''}
          {batch.batch.hasTimestamp ? ', with timestamps' : ''}.
        </p>
      ) : null}
      {error ? (
        <p className="field-error" role="alert">
          {error} {batch ? 'The batch loaded before stays.' : ''}
        </p>
      ) : null}
    </section>
  );
}

function batchExport() {
  const state = useSekundoStore.getState();
  const input = state.converterBatch;
  if (!input) return null;
  const outcome = batchResults(input.batch, valuesOf(state.converterValues), state.converterChoice);
  if (!outcome.ok) return null;
  const r = outcome.results;
  const { temperature, length, time, pressure } = currentUnitViews();
  const units = { temperature: temperature.unit, length: length.unit, time: time.unit, pressure: pressure.unit };
  const header = delayResultHeader(r.batch, units);
  const rows = Array.from({ length: r.count }, (_, i) => delayResultCells(r, i, units));
  return tableExport(exportName(input.fileName, 'temperatures'), { header, rows });
}

function BatchResults() {
  const headingId = useId();
  const input = useSekundoStore((s) => s.converterBatch);
  const kind = useSekundoStore((s) => s.converterChoice);
  const values = useFieldValues();
  const units = useUnitViews();
  const unit = units.temperature.unit;
  const outcome = useMemo(() => (input ? batchResults(input.batch, values, kind) : null), [input, values, kind]);
  const minutes = useMemo(() => (input ? batchMinutes(input.batch) : null), [input]);
  const figure = useMemo(() => (outcome?.ok ? temperatureOnY(batchFigure(outcome.results, minutes), unit) : null), [outcome, minutes, unit]);
  if (!input || outcome === null) {
    return (
      <p className="card converter-empty" role="status">
        Drop a CSV of delays, or load the invented example, to see every row’s speed and temperature.
      </p>
    );
  }
  if (!outcome.ok) {
    return (
      <p className="card field-error" role="alert">
        {outcome.message}
      </p>
    );
  }
  const r = outcome.results;
  let decided = 0;
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  let ambiguous = 0;
  const disagreeing: number[] = [];
  const disagreeBit = 1 << WARNING_CODES.indexOf('evidence-disagrees');
  for (let i = 0; i < r.count; i++) {
    const c = r.chosen[i] as number;
    if (c < 0 && (r.along[i] as number) >= 0) ambiguous++;
    if ((r.warnings[i] as number) & disagreeBit) disagreeing.push(r.batch.rows[i]?.line ?? i + 2);
    if (c < 0) continue;
    decided++;
    const T = r.temperature_K[i * 3 + c] as number;
    lo = Math.min(lo, T);
    hi = Math.max(hi, T);
  }
  return (
    <>
      <section className="card converter-card result-card" aria-labelledby={headingId}>
        <div className="card-head">
          <h2 id={headingId} className="card-title">
            Temperatures of the batch
          </h2>
          <ResultActions what="batch results" content={batchExport} />
        </div>
        <p className="caption-values batch-summary">
          {r.count} readings; {decided} with a chosen temperature
          {decided > 0 ? `, from ${fixedTemperatureText(lo, unit)} to ${fixedTemperatureText(hi, unit)}` : ''}.
          {decided + ambiguous < r.count ? ' Undecided rows have several candidates and nothing to choose by: set a way of choosing.' : ''}
        </p>
        {disagreeing.length > 0 ? (
          <p className="converter-warning" role="note" data-testid="batch-disagree">
            Delay and evidence disagree on {disagreeing.length} row{disagreeing.length === 1 ? '' : 's'} (line{disagreeing.length === 1 ? '' : 's'}{' '}
            {disagreeing.slice(0, 5).join(', ')}
            {disagreeing.length > 5 ? ', …' : ''}): the chosen temperature lies more than 3 sd from the row’s vapour-pressure temperature (see evidence_sd in
            the export). Check the distance, the offset t₀, the gauge and the head pressure.
          </p>
        ) : null}
        {ambiguous > 0 ? (
          <p className="converter-warning" role="note" data-testid="batch-ambiguous">
            {ambiguous} reading{ambiguous === 1 ? '' : 's'} past a turn of u₂ (its minimum or maximum): both branches meeting there are continuous, so
            continuity cannot choose. Both continuations are shown; the “guess” carries the trend on through the turn and is only a guess. A later
            row with its own vapour pressure settles them back to the turn.
          </p>
        ) : null}
        <BatchTable results={r} units={units} />
      </section>
      {figure ? (
        <ChartFigure
          id="converter-batch"
          title="Temperature along the batch"
          caption="Amber: the chosen temperature with its 95 % interval as a band; dashed: the two continuations of readings past a turn of u₂ (undecided); grey: the other candidates of each reading."
        >
          <PlotlyChart chartId="converter-batch" label={`Chart of the chosen temperature of ${r.count} readings.`} data={figure.data} layout={figure.layout} />
        </ChartFigure>
      ) : null}
    </>
  );
}

/** Each row's delay, pressure and temperatures in the display units; value and sd rounded together. */
function BatchTable({ results, units }: { results: DelayBatchResults; units: UnitViews }) {
  const { temperature, time, pressure } = units;
  const [shown, setShown] = useState(PAGE_ROWS);
  const batch = results.batch;
  const count = Math.min(shown, results.count);
  return (
    <div className="table-scroll batch-table-scroll">
      <table className="properties-table batch-table">
        <caption>
          Each reading’s speed and temperature{results.count > count ? ` (first ${count} of ${results.count}; the export has them all)` : ''}.
          {results.kind.includes(1) ? ' * marks an extremum of u₂: the speed lies just beyond it, within two sd.' : ''}
        </caption>
        <thead>
          <tr>
            <th scope="col">Line</th>
            {batch.hasTimestamp ? <th scope="col">Timestamp</th> : null}
            <th scope="col" className="num">
              Delay ({time.shown})
            </th>
            {batch.hasPressure ? (
              <th scope="col" className="num">
                Pressure ({pressure.shown})
              </th>
            ) : null}
            <SeriesHeads temperature={temperature} />
          </tr>
        </thead>
        <tbody>
          {Array.from({ length: count }, (_, i) => {
            const r = delayResultAt(results, i);
            return (
              <tr key={r.row.line}>
                <th scope="row">{r.row.line}</th>
                {batch.hasTimestamp ? (
                  <td className="nowrap" title={r.row.timestamp}>
                    {shortTimestamp(r.row.timestamp ?? '')}
                  </td>
                ) : null}
                <td className="num">{formatSignificant(time.fromSi(r.row.delay_s), 6)}</td>
                {batch.hasPressure ? <td className="num">{r.row.pressure_Pa === undefined ? '' : formatSignificant(pressure.fromSi(r.row.pressure_Pa), 5)}</td> : null}
                <SeriesCells
                  speed={{ value_m_s: r.speed_m_s, sd_m_s: r.speedSd_m_s }}
                  candidates={r.candidates}
                  chosen={r.chosen}
                  chosenBy={chosenByText(r.chosenBy)}
                  temperature={temperature}
                  ambiguous={r.ambiguous}
                />
              </tr>
            );
          })}
        </tbody>
      </table>
      {results.count > count ? (
        <button type="button" className="button button--small" onClick={() => setShown(shown + PAGE_ROWS * 5)}>
          Show {Math.min(PAGE_ROWS * 5, results.count - count)} more rows
        </button>
      ) : null}
    </div>
  );
}

 /** How a batch row was decided, in words. */
function chosenByText(by: string | null): string {
  if (by === null) return 'undecided';
  if (by === 'ambiguous') return 'undecided past a turn of u₂';
  if (by === 'settled') return 'settled by a later pressure';
  return by;
}

/** "2026-11-03T14:00:30Z" → "14:00:30" (the full text stays in the cell's title); other text as it is. */
export function shortTimestamp(text: string): string {
  return /^\d{4}-\d\d-\d\d[T ](\d\d:\d\d(?::\d\d(?:\.\d+)?)?)/.exec(text)?.[1] ?? text;
}
