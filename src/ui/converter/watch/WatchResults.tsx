import { useId, useMemo } from 'react';
import { chosenTemperature, type WatchRow } from '../../../io/watch-series';
import { fromBaseUnit } from '../../../io/quantity';
import { PanelErrorBoundary } from '../../layout/PanelErrorBoundary';
import { usePagedRows } from '../../layout/TablePager';
import { useElementWidth } from '../../layout/use-element-width';
import { PlotlyChart } from '../../plot/PlotlyChart';
import { useSekundoStore } from '../../store';
import { LADDERS, readText } from '../../units/ladders';
import { currentUnitViews, temperatureOnY, useUnitViews } from '../../units/unit-views';
import { tableExport } from '../export-text';
import { ResultActions } from '../ResultActions';
import type { AlarmMark } from './watch-alarms';
import { alarmsFor, alarmSettingsOf, useWatchAlarms } from './watch-alarm-state';
import { watchFigure } from './watch-figure';
import { useWatchLive, watchLive } from './watch-live';
import { chosenByText, watchTable } from './watch-table';

/** The followed run: the live chart, the table (newest first) and the files that could not be read. */
export function WatchResults() {
  const live = useWatchLive();
  if (live.rows.length === 0 && live.failedCount === 0) {
    return (
      <p className="card converter-empty" role="status">
        Choose a folder to follow, or replay the invented demo run: each trace file is read as it arrives and its temperature joins the chart and the
        table here.
      </p>
    );
  }
  return (
    <>
      <AlarmNow />
      {live.rows.length > 0 ? (
        <PanelErrorBoundary panel="live chart">
          <LiveChart rows={live.rows} />
        </PanelErrorBoundary>
      ) : null}
      {live.rows.length > 0 ? <LiveTable rows={live.rows} /> : null}
      {live.failedCount > 0 ? <NotRead /> : null}
    </>
  );
}

function AlarmNow() {
  const alarms = useWatchAlarms();
  if (alarms.now.length === 0) return null;
  return (
    <div className="card watch-alarm-now" role="alert">
      <strong>Alarm:</strong> {alarms.now.map((m) => m.message).join('; ')}.
    </div>
  );
}

function seriesExport() {
  const inputs = useSekundoStore.getState().watchAlarms;
  const snapshot = watchLive.get();
  if (snapshot.rows.length === 0) return null;
  return tableExport('sekundo-live-series.csv', watchTable(snapshot.rows, alarmsFor(snapshot, inputs), currentUnitViews()));
}

function LiveChart({ rows }: { rows: readonly WatchRow[] }) {
  const headingId = useId();
  const alarms = useWatchAlarms();
  const inputs = useSekundoStore((s) => s.watchAlarms);
  const units = useUnitViews();
  const unit = units.temperature.unit;
  const [plotRef, width] = useElementWidth<HTMLDivElement>(800);
  const band = alarmSettingsOf(inputs).band;
  const figure = useMemo(() => {
    const f = watchFigure({ rows, alarms, band, columns: width - 90 });
    const shown = temperatureOnY(f, unit);
    const factor = fromBaseUnit(1, unit);
    // The band lies on the temperature axis: it follows the axis's unit.
    const shapes = (f.layout.shapes ?? []).map((s) => (s.yref === 'y' ? { ...s, y0: s.y0 * factor, y1: s.y1 * factor } : s));
    return { data: shown.data, layout: { ...shown.layout, shapes }, drawn: f.drawn };
  }, [rows, alarms, band, width, unit]);
  const fromHeader = rows.filter((r) => r.timeFrom === 'header').length;
  const decided = rows.filter((r) => r.chosen !== null).length;
  const latest = rows[rows.length - 1];
  const latestT = latest ? chosenTemperature(latest) : null;
  return (
    <section className="card converter-card result-card" aria-labelledby={headingId}>
      <div className="card-head">
        <h2 id={headingId} className="card-title">
          Bath temperature, live
        </h2>
        <ResultActions what="series" content={seriesExport} />
      </div>
      <p className="caption-values batch-summary" data-testid="watch-summary">
        {rows.length.toLocaleString('en')} file{rows.length === 1 ? '' : 's'}
        {latest && latestT?.temperature_K != null ? (
          <>
            ; newest <span className="file-name">{latest.file}</span>: {units.temperature.measured(latestT.temperature_K, latestT.sd_K).text} {units.temperature.shown}
          </>
        ) : null}
        . Time from{' '}
        {fromHeader === rows.length
          ? 'the timestamp in each file’s header'
          : fromHeader === 0
            ? 'each file’s modification time (no header timestamp)'
            : `the header timestamp (${fromHeader}) or else the file’s modification time (${rows.length - fromHeader})`}
        {figure.drawn < decided ? `; the chart draws ${figure.drawn.toLocaleString('en')} points (lowest and highest per pixel column), the table and export hold every file` : ''}.
      </p>
      <div ref={plotRef} className="watch-plot">
        <PlotlyChart chartId="watch-live" label={`Chosen bath temperature of ${rows.length} files against time, with alarm marks.`} data={figure.data} layout={figure.layout} />
      </div>
    </section>
  );
}

function alarmText(marks: readonly AlarmMark[] | undefined): string {
  if (!marks || marks.length === 0) return '';
  return marks.map((m) => `${m.crossing ? 'Began: ' : ''}${m.message}`).join('; ');
}

function LiveTable({ rows }: { rows: readonly WatchRow[] }) {
  const headingId = useId();
  const alarms = useWatchAlarms();
  const { temperature, time } = useUnitViews();
  const sdText = (K: number) => readText(K, LADDERS.temperatureDifference, 2);
  const { start, end, pager } = usePagedRows(rows.length);
  // Newest first: page 1 holds the latest files.
  const shown = [];
  for (let k = start; k < end; k++) shown.push(rows[rows.length - 1 - k] as WatchRow);
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Each file, newest first
      </h2>
      <div className="table-scroll batch-table-scroll">
        <table className="properties-table batch-table watch-table">
          <caption className="visually-hidden">Each file’s time, delay, chosen temperature with its sd in parts, and alarm</caption>
          <thead>
            <tr>
              <th scope="col">#</th>
              <th scope="col">File</th>
              <th scope="col">Time (UTC)</th>
              <th scope="col" className="num">
                Delay ({time.shown})
              </th>
              <th scope="col" className="num">
                T ± sd ({temperature.shown})
              </th>
              <th scope="col" className="num" title="The sd in its two parts: the measurement's (distance, timing, offset — what limits a change between files) and the u₂ curve's own (the same for every file at this temperature)">
                measurement / u₂ curve
              </th>
              <th scope="col">Chosen by</th>
              <th scope="col">Alarm</th>
              <th scope="col">Notes</th>
            </tr>
          </thead>
          <tbody>
            {shown.map((r) => {
              const marks = alarms.marks.get(r.seq);
              const c = r.chosen === null ? undefined : r.candidates[r.chosen];
              const crossing = marks?.some((m) => m.crossing) ?? false;
              return (
                <tr key={r.seq} className={marks ? (crossing ? 'watch-row--crossing' : 'watch-row--alarm') : undefined}>
                  <th scope="row">{r.seq + 1}</th>
                  <td className="file-name">{r.file}</td>
                  <td className="nowrap" title={r.timeSource ?? 'from the file’s modification time'}>
                    {new Date(r.time_ms).toISOString().slice(11, 19)}
                    {r.timeFrom === 'file modified' ? <span className="muted"> (file time)</span> : null}
                  </td>
                  <td className="num">{r.delay_s === null ? '' : time.measured(r.delay_s, r.delaySd_s).text}</td>
                  <td className="num">{c ? temperature.measured(c.temperature_K, c.sd_K).text : '—'}</td>
                  <td className="num uncertainty">{c ? `${sdText(c.sdMeasurement_K)} / ${sdText(c.sdCurve_K)}` : ''}</td>
                  <td>{chosenByText(r)}</td>
                  <td className={marks ? 'watch-alarm-cell' : undefined}>{alarmText(marks)}</td>
                  <td className="watch-notes">{[r.problem, ...r.warnings].filter(Boolean).join(' ')}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {pager('files')}
    </section>
  );
}

function NotRead() {
  const headingId = useId();
  const live = useWatchLive();
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Files not read ({live.failedCount.toLocaleString('en')})
      </h2>
      <p className="muted converter-card__lead">Each with the reason; the run goes on. A file that changes later is tried again.</p>
      <ul className="watch-failed" aria-label="Files not read">
        {live.failed.map((f, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: the same name may fail twice (it changed); the list only grows at its end.
          <li key={`${f.name}-${i}`}>
            <span className="file-name">{f.name}</span>: <span className="field-error">{f.message}</span>
          </li>
        ))}
      </ul>
      {live.failedCount > live.failed.length ? <p className="muted">The newest {live.failed.length} are listed.</p> : null}
    </section>
  );
}
