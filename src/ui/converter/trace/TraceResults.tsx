import { useId, useMemo } from 'react';
import { describeTraceHeader, readTraceHeader } from '../../../io/trace-header';
import type { TracePick } from '../../../io/trace-pick';
import type { ChoiceRule } from '../../../physics';
import { ChartFigure } from '../../charts/ChartFigure';
import { CHART_COLOURS } from '../../charts/chart-theme';
import { formatSignificant } from '../../units/format-number';
import { PanelErrorBoundary } from '../../layout/PanelErrorBoundary';
import { useElementWidth } from '../../layout/use-element-width';
import { PlotlyChart } from '../../plot/PlotlyChart';
import type { PlotLayout, PlotTrace } from '../../plot/plotly-types';
import { useSekundoStore } from '../../store';
import { shortTimestamp } from '../BatchMode';
import { ACROSS_TRACE, ALONG_TRACE, temperatureSeriesLayout } from '../batch-results';
import { applyRule } from '../candidate-notes';
import { choiceRuleOf, type FieldValues } from '../converter-checks';
import type { TraceFileEntry } from '../converter-slice';
import { type UnitViews, csvColumn, currentUnitViews, inViewUnit, temperatureOnY, fixedTemperatureText, useUnitViews } from '../../units/unit-views';
import { ConversionResult } from '../ConversionResult';
import { candidateTable, tableExport } from '../export-text';
import type { Chosen } from '../reading-results';
import { ResultActions } from '../ResultActions';
import { buildSeries, chosenOf, orderFiles, type SeriesRow, seriesTable } from '../series';
import { Segmented } from '../Segmented';
import { SeriesCells, SeriesHeads } from '../SeriesColumns';
import { useFieldValues } from '../use-converter';
import { traceFigure } from './trace-figure';
import { type PickState, usePicks, useTraceSamples } from './trace-picks';
import { PICKER_LABELS, useTracePickOptions } from './trace-pick-options';

/** Rows of the series from the files read and their picks (derived, never stored). */
function seriesRows(files: readonly TraceFileEntry[], picks: ReadonlyMap<string, PickState>, values: FieldValues, start: ChoiceRule | null) {
  const ready = files.filter((f) => f.status === 'ready' && f.info);
  const ordered = orderFiles(ready.map((f) => ({ id: f.id, name: f.name, fields: f.info?.fields ?? {} })));
  const picked = new Map<string, TracePick>();
  const problems = new Map<string, string>();
  for (const [id, p] of picks) {
    if (p.status === 'picked') picked.set(id, p.pick);
    if (p.status === 'failed') problems.set(id, p.message);
    if (p.status === 'picking') problems.set(id, 'picking…');
  }
  const rows = buildSeries(
    ordered.files,
    picked,
    problems,
    { distance_m: values.distance ?? Number.NaN, distanceSd_m: values.distanceSd ?? 0, offset_s: values.offset ?? 0, offsetSd_s: values.offsetSd ?? 0 },
    start,
  );
  return { rows, by: ordered.by };
}

/** The results of the trace lab: the selected trace with its pick and temperature, then the series. */
export function TraceResults() {
  const files = useSekundoStore((s) => s.converterTraceFiles);
  const selected = useSekundoStore((s) => s.converterTraceSelected);
  const kind = useSekundoStore((s) => s.converterChoice);
  const values = useFieldValues();
  const options = useTracePickOptions();
  const readyIds = useMemo(() => files.filter((f) => f.status === 'ready').map((f) => f.id), [files]);
  const picks = usePicks(readyIds, options);
  const start = choiceRuleOf(kind, values);
  const series = useMemo(() => seriesRows(files, picks, values, start), [files, picks, values, start]);
  const selectedFile = files.find((f) => f.id === selected && f.status === 'ready');
  if (readyIds.length === 0) {
    return (
      <p className="card converter-empty" role="status">
        {files.some((f) => f.status === 'queued' || f.status === 'reading')
          ? 'Reading the traces…'
          : 'Drop one or more digitiser CSV files, or load the invented example traces, to pick the arrival and read the temperature.'}
      </p>
    );
  }
  return (
    <>
      {selectedFile ? (
        <SelectedTrace file={selectedFile} pick={picks.get(selectedFile.id)} row={series.rows.find((r) => r.file.id === selectedFile.id)} />
      ) : (
        <p className="card converter-empty">Choose a file in the list to see its trace.</p>
      )}
      {readyIds.length > 1 ? (
        <PanelErrorBoundary panel="temperature series">
          <SeriesCard rows={series.rows} by={series.by} />
        </PanelErrorBoundary>
      ) : null}
    </>
  );
}

/** The choice for one row of the series, in the words of the result card, temperatures in `unit`. */
function rowChosen(row: SeriesRow, unit: 'K' | 'mK'): Chosen {
  const candidates = row.conversion?.candidates ?? [];
  const choice = applyRule(candidates, row.rule, unit);
  if (row.chosenBy === 'continuity' && row.rule?.kind === 'near') {
    return { rule: row.rule, choice: { ...choice, reason: `nearest to the file before (${fixedTemperatureText(row.rule.temperature_K, unit)})` } };
  }
  if (row.chosenBy === 'vapour pressure in the file') return { rule: row.rule, choice: { ...choice, reason: `${choice.reason}, from the file’s own header` } };
  return { rule: row.rule, choice };
}

/** What the file's header gives that Sekundo uses (documented keys only), shown before it is used; and what was refused. */
function HeaderValues({ fields }: { fields: Readonly<Record<string, string>> }) {
  const header = readTraceHeader(fields);
  const used = describeTraceHeader(header);
  if (!used && header.problems.length === 0) return null;
  return (
    <div className="trace-header-values">
      {used ? <p className="muted">From the file’s header: {used}.</p> : null}
      {header.problems.map((p) => (
        <p key={p} className="field-error">
          {p}
        </p>
      ))}
    </div>
  );
}

function SelectedTrace({ file, pick, row }: { file: TraceFileEntry; pick: PickState | undefined; row: SeriesRow | undefined }) {
  const headingId = useId();
  const view = useSekundoStore((s) => s.converterTraceView);
  const setView = useSekundoStore((s) => s.setConverterTraceView);
  const options = useTracePickOptions();
  const values = useFieldValues();
  const samples = useTraceSamples(file.id);
  const units = useUnitViews();
  const timeUnit = units.time.unit;
  const [plotRef, width] = useElementWidth<HTMLDivElement>(900);
  const picked = pick?.status === 'picked' ? pick.pick : null;
  const sensor = picked?.sensor ?? options.sensor ?? file.info?.channels.find((c) => c !== options.heater) ?? '';
  const figure = useMemo(() => {
    if (samples.status !== 'ready') return null;
    const level =
      options.picker === 'threshold' ? { kind: 'threshold' as const, sigma: options.thresholdSigma ?? 5 } : options.picker === 'fraction' ? { kind: 'fraction' as const, fraction: options.fraction ?? 0.5 } : null;
    return traceFigure({
      samples: samples.samples,
      sensor,
      heater: picked?.heater ?? options.heater ?? null,
      pick: picked,
      level,
      search: { from_s: values.searchFrom, to_s: values.searchTo },
      view,
      columns: Math.max(200, width - 120),
      timeUnit,
    });
  }, [samples, sensor, picked, options, values.searchFrom, values.searchTo, view, width, timeUnit]);
  const chosen = row?.conversion ? rowChosen(row, units.temperature.unit) : null;
  const exportContent = () => {
    if (!row?.conversion || !row.pick) return null;
    const p = row.pick;
    const now = currentUnitViews();
    const { length, time } = now;
    const table = candidateTable(
      [
        ['file', file.name],
        ['sensor', p.sensor],
        ['heater', p.heater ?? ''],
        ['picker', p.picker],
        ['time_zero', p.timeZero],
        [csvColumn('delay', time), time.fromSi(p.delay_s)],
        [csvColumn('delay_sd', time), time.fromSi(p.delaySd_s)],
        ['snr', p.snr],
        [csvColumn('distance', length), inViewUnit(values.distance, length)],
        [csvColumn('distance_sd', length), inViewUnit(values.distanceSd, length)],
        [csvColumn('offset', time), inViewUnit(values.offset, time)],
        [csvColumn('offset_sd', time), inViewUnit(values.offsetSd, time)],
        ['speed_m_s', row.conversion.speed_m_s],
        ['speed_sd_m_s', row.conversion.speedSd_m_s],
      ],
      row.conversion.candidates,
      rowChosen(row, now.temperature.unit).choice,
      now.temperature,
    );
    return tableExport(`${file.name.replace(/\.[^.]*$/, '') || 'trace'}-reading.csv`, table);
  };
  return (
    <>
      <section className="card converter-card trace-card" aria-labelledby={headingId}>
        <div className="card-head">
          <h2 id={headingId} className="card-title">
            Trace: <span className="file-name">{file.name}</span>
          </h2>
          <Segmented
            label="Trace view"
            options={[
              { value: 'record', label: 'Whole record' },
              { value: 'arrival', label: 'Around the arrival' },
            ]}
            value={view}
            onChange={setView}
            panelId="trace-plot"
            idPrefix="trace-view"
            size="small"
          />
        </div>
        <div id="trace-plot" ref={plotRef} className="trace-plot">
          {samples.status === 'failed' ? (
            <p className="field-error" role="alert">
              {samples.message}
            </p>
          ) : figure ? (
            <PanelErrorBoundary panel="trace chart">
              <PlotlyChart
                chartId="converter-trace"
                label={`Trace of ${sensor} in ${file.name}${picked ? ` with the arrival at ${units.time.measured(picked.delay_s, picked.delaySd_s).value} ${units.time.shown}` : ''}.`}
                data={figure.data}
                layout={figure.layout}
              />
            </PanelErrorBoundary>
          ) : (
            <p className="plot-loading">Fetching the samples…</p>
          )}
        </div>
        <HeaderValues fields={file.info?.fields ?? {}} />
        <PickSummary pick={pick} time={units.time} />
      </section>
      {row?.conversion && chosen ? (
        <ConversionResult
          title={`Temperature from ${file.name}`}
          chartId="converter-trace-speed"
          speed_m_s={row.conversion.speed_m_s}
          speedSd_m_s={row.conversion.speedSd_m_s}
          speedLabel="u = d/(t − t₀)"
          candidates={row.conversion.candidates}
          chosen={chosen}
          exportContent={exportContent}
        />
      ) : row?.pick && row.problem ? (
        <p className="card field-error" role="alert">
          No temperature: {row.problem}
        </p>
      ) : null}
    </>
  );
}

/** The pick: delay and time zero in the display unit of time, each rounded with its sd. */
function PickSummary({ pick, time }: { pick: PickState | undefined; time: UnitViews['time'] }) {
  if (!pick || pick.status === 'picking') {
    return (
      <p className="pick-summary muted" role="status">
        Picking the arrival…
      </p>
    );
  }
  if (pick.status === 'failed') {
    return (
      <p className="field-error" role="alert">
        No arrival picked: {pick.message}
      </p>
    );
  }
  const p = pick.pick;
  const delay = time.measured(p.delay_s, p.delaySd_s);
  const zero = time.measured(p.timeZero_s, p.timeZeroSd_s);
  return (
    <dl className="pick-summary state-list" aria-label="Picked arrival">
      <div>
        <dt>Delay (arrival − time zero)</dt>
        <dd>
          <strong data-testid="picked-delay">
            {delay.value} {time.shown}
          </strong>
          {delay.sd === null ? null : ` ± ${delay.sd} ${time.shown}`}
        </dd>
      </div>
      <div>
        <dt>Time zero</dt>
        <dd>
          {p.timeZero === 'heater onset'
            ? `heater onset (50 % of the drive’s rise) at ${zero.text} ${time.shown} on the file’s axis`
            : 'the file’s t = 0 (no heater channel)'}
        </dd>
      </div>
      <div>
        <dt>Picker</dt>
        <dd>
          {PICKER_LABELS[p.picker]}
          {p.template ? ` (template: ${p.template})` : ''}; sensor “{p.sensor}”
        </dd>
      </div>
      <div>
        <dt>Delay measured</dt>
        <dd data-testid="delay-reference">
          {p.reference}
          {p.reference === 'peak to peak' ? ': from the centre of the drive pulse at half height to the sensor’s peak' : p.reference === 'onset to onset' ? ': from the drive’s 50 % onset to the same feature of the pulse' : ': give a heater channel to measure from the drive itself'}
        </dd>
      </div>
      <div>
        <dt>Signal</dt>
        <dd>
          peak {formatSignificant(p.peak, 3)} over noise {formatSignificant(p.baseline.noise, 2)} (SNR {formatSignificant(p.snr, 3)}), baseline from{' '}
          {p.baseline.samples.toLocaleString('en')} samples before time zero and the drive’s first rise
          {p.snr < 5 ? <span className="badge badge--model"> low SNR: check the pick</span> : null}
        </dd>
      </div>
    </dl>
  );
}

function seriesExport(rows: readonly SeriesRow[]) {
  return () => tableExport('sekundo-trace-series.csv', seriesTable(rows, currentUnitViews()));
}

function SeriesCard({ rows, by }: { rows: readonly SeriesRow[]; by: 'timestamp' | 'name' }) {
  const headingId = useId();
  const select = useSekundoStore((s) => s.selectConverterTrace);
  const units = useUnitViews();
  const { temperature, time } = units;
  const figure = useMemo(() => temperatureOnY(seriesFigure(rows, by), temperature.unit), [rows, by, temperature.unit]);
  const decided = rows.filter((r) => chosenOf(r) !== undefined).length;
  return (
    <>
      <section className="card converter-card result-card" aria-labelledby={headingId}>
        <div className="card-head">
          <h2 id={headingId} className="card-title">
            Temperature series
          </h2>
          <ResultActions what="series" content={seriesExport(rows)} />
        </div>
        <p className="caption-values batch-summary">
          {rows.length} files, ordered by {by === 'timestamp' ? 'the timestamp in their headers' : 'name (no timestamp in every header)'}; {decided} with a chosen temperature.
        </p>
        <div className="table-scroll batch-table-scroll">
          <table className="properties-table batch-table">
            <caption>Each file’s delay, speed and temperature</caption>
            <thead>
              <tr>
                <th scope="col">#</th>
                <th scope="col">File</th>
                {by === 'timestamp' ? <th scope="col">Timestamp</th> : null}
                <th scope="col" className="num">
                  Delay ({time.shown})
                </th>
                <SeriesHeads temperature={temperature} />
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => {
                return (
                  <tr key={r.file.id}>
                    <th scope="row">{i + 1}</th>
                    <td>
                      <button type="button" className="link-button file-name" onClick={() => select(r.file.id)}>
                        {r.file.name}
                      </button>
                    </td>
                    {by === 'timestamp' ? (
                      <td className="nowrap" title={r.timestamp?.text}>
                        {shortTimestamp(r.timestamp?.text ?? '')}
                      </td>
                    ) : null}
                    <td className="num">{r.pick ? time.measured(r.pick.delay_s, r.pick.delaySd_s).value : '—'}</td>
                    <SeriesCells
                      speed={r.conversion ? { value_m_s: r.conversion.speed_m_s, sd_m_s: r.conversion.speedSd_m_s } : null}
                      candidates={r.conversion?.candidates ?? null}
                      chosen={r.chosen}
                      chosenBy={r.problem && !r.conversion ? <span className="field-error-inline">{r.problem}</span> : (r.chosenBy ?? (r.ambiguous ? 'undecided past a turn of u₂' : 'undecided'))}
                      temperature={temperature}
                      ambiguous={r.ambiguous}
                    />
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>
      <ChartFigure id="converter-series" title="Temperature along the series" caption="Amber: each file’s chosen temperature with its 95 % interval as a band; dashed: the two continuations of files past a turn of u₂ (undecided); grey: the other candidates.">
        <PlotlyChart chartId="converter-series" label={`Chart of the chosen temperature of ${rows.length} trace files.`} data={figure.data} layout={figure.layout} />
      </ChartFigure>
    </>
  );
}

function seriesFigure(rows: readonly SeriesRow[], by: 'timestamp' | 'name'): { data: PlotTrace[]; layout: PlotLayout } {
  const first = rows.find((r) => r.timestamp)?.timestamp?.ms ?? 0;
  const xOf = (r: SeriesRow, i: number) => (by === 'timestamp' && r.timestamp ? (r.timestamp.ms - first) / 60000 : i + 1);
  const chosen: { x: number; T: number; lo: number; hi: number; name: string }[] = [];
  const others: { x: number; T: number }[] = [];
  const pairs: { x: number; along: number; across: number }[] = [];
  rows.forEach((r, i) => {
    const a = r.ambiguous;
    if (a && r.conversion) {
      pairs.push({ x: xOf(r, i), along: r.conversion.candidates[a.alternatives[0]]?.temperature_K ?? Number.NaN, across: r.conversion.candidates[a.alternatives[1]]?.temperature_K ?? Number.NaN });
    }
    r.conversion?.candidates.forEach((c, k) => {
      if (k === r.chosen) chosen.push({ x: xOf(r, i), T: c.temperature_K, lo: c.interval95_K[0], hi: c.interval95_K[1], name: r.file.name });
      else if (!a?.alternatives.includes(k)) others.push({ x: xOf(r, i), T: c.temperature_K });
    });
  });
  const data: PlotTrace[] = [
    { type: 'scatter', name: 'lower', x: chosen.map((c) => c.x), y: chosen.map((c) => c.lo), mode: 'lines', line: { width: 0 }, hoverinfo: 'skip', showlegend: false },
    { type: 'scatter', name: '95 % interval', x: chosen.map((c) => c.x), y: chosen.map((c) => c.hi), mode: 'lines', line: { width: 0 }, fill: 'tonexty', fillcolor: 'rgba(217, 119, 43, 0.22)', hoverinfo: 'skip' },
    { type: 'scatter', name: 'Other candidates', x: others.map((c) => c.x), y: others.map((c) => c.T), mode: 'markers', marker: { color: CHART_COLOURS.inkMuted, size: 6, opacity: 0.55 }, hovertemplate: '%{y:.4f} K<extra>other candidate</extra>' },
    {
      type: 'scatter',
      name: 'Chosen temperature',
      x: chosen.map((c) => c.x),
      y: chosen.map((c) => c.T),
      text: chosen.map((c) => c.name),
      mode: 'lines+markers',
      line: { color: CHART_COLOURS.chosen, width: 1.5 },
      marker: { color: CHART_COLOURS.chosen, size: 7 },
      hovertemplate: '%{text}<br>%{y:.4f} K<extra></extra>',
    },
  ];
  if (pairs.length > 0) {
    data.push(
      { type: 'scatter', name: ALONG_TRACE, x: pairs.map((p) => p.x), y: pairs.map((p) => p.along), mode: 'lines+markers', line: { color: CHART_COLOURS.inkMuted, width: 1.2, dash: 'dash' }, marker: { color: CHART_COLOURS.inkMuted, size: 5, symbol: 'circle-open' }, hovertemplate: '%{y:.4f} K<extra>one continuation (undecided)</extra>' },
      { type: 'scatter', name: ACROSS_TRACE, x: pairs.map((p) => p.x), y: pairs.map((p) => p.across), mode: 'lines+markers', line: { color: CHART_COLOURS.chosen, width: 1.2, dash: 'dash' }, marker: { color: CHART_COLOURS.chosen, size: 5, symbol: 'circle-open' }, hovertemplate: '%{y:.4f} K<extra>other continuation; the trend guess (undecided)</extra>' },
    );
  }
  return { data, layout: temperatureSeriesLayout(by === 'timestamp' ? 'Minutes since the first file' : 'File (in name order)') };
}
