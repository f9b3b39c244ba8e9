import { useId, useMemo, useState } from 'react';
import { PICKER_KINDS, type PickerKind } from '../../physics';
import type { Polarity } from '../converter/converter-slice';
import { DropZone } from '../converter/DropZone';
import { PICKER_LABELS } from '../converter/trace/trace-pick-options';
import type { PickState } from '../converter/trace/trace-picks';
import { useTraceSamples } from '../converter/trace/trace-picks';
import { formatSignificant } from '../units/format-number';
import { HelpColumnHead, HelpLabel, type HelpTopic, useFieldHelp } from '../help/FieldHelp';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { fileSize, ReadProgress } from '../layout/ReadProgress';
import { useElementWidth } from '../layout/use-element-width';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import type { LocateTraceFile } from './locate-slice';
import { useDisplayUnit } from '../units/use-display-unit';
import { QuantityField } from '../fields/QuantityField';
import { locateFieldKey } from './locate-fields';
import { LOCATE_HELP } from './locate-help';
import { BAND_PX, FRAME_PX, locateTraceFigure, spanAroundPicks } from './locate-trace-figure';
import { cancelLocateTrace, openLocateDemoTraces, openLocateTrace, TRACE_FILE_KEY } from './locate-trace-loader';
import { arrivalsFromPicks, type ChannelMatch, matchChannels, matchConflicts } from './trace-arrivals';
import { type TraceSettingKey, traceSettingKey, traceSettingSpec, traceSettingValue } from './trace-fields';
import { useChannelPicks } from './use-channel-picks';

/** Store key of the message after "Use these arrivals". */
export const TRACE_APPLY_KEY = 'traces.apply';
/** Chart id of the traces (tests read the figure there). */
export const TRACES_CHART_ID = 'locate-traces';

/** Arrival times picked from a digitiser file with one channel per sensor, written into the sensor rows on request. */
export function LocateTraces() {
  const file = useSekundoStore((s) => s.locateTraceFile);
  const fileError = useSekundoStore((s) => s.locateErrors[TRACE_FILE_KEY]);
  const fileHelp = useFieldHelp('trace file', LOCATE_HELP.traceFile);
  return (
    <section className="card locate-card locate-traces" aria-labelledby="locate-traces-title">
      <div className="card-head">
        <h2 id="locate-traces-title" className="card-title">
          Arrival times from traces
        </h2>
        {fileHelp.button}
      </div>
      <p className="muted locate-lead">
        Open one digitiser CSV with a time column and one channel per sensor. The file’s t = 0 is the common clock: the arrivals are times on it, and the
        samples before it give each channel’s baseline and noise. Pick, check each pick on its trace, then write the arrivals into the sensor table.
      </p>
      <div className="help-panels">{fileHelp.panel}</div>
      <DropZone buttonLabel="Open a trace file" onFiles={(files) => files[0] && void openLocateTrace(files[0])}>
        <div className="drop-zone__extra">
          <button type="button" className="button button--small" onClick={() => void openLocateDemoTraces()}>
            Load the demo traces
          </button>
        </div>
      </DropZone>
      <ReadingProgress />
      {fileError ? (
        <p className="field-error" role="alert">
          {fileError}
        </p>
      ) : null}
      {file ? <TracePicks file={file} /> : null}
    </section>
  );
}

function ReadingProgress() {
  const reading = useSekundoStore((s) => s.locateTraceReading);
  if (!reading) return null;
  return <ReadProgress label={`Reading ${reading.name}`} bytes={reading.bytes} totalBytes={reading.totalBytes} rows={reading.rows} onCancel={cancelLocateTrace} cancelLabel="Cancel reading" />;
}

/** The file read: picker settings, channel → sensor table with the picks, the traces, and the button that writes the arrivals. */
function TracePicks({ file }: { file: LocateTraceFile }) {
  const rows = useSekundoStore((s) => s.locateRows);
  const choice = useSekundoStore((s) => s.locateTraceChoice);
  const settings = useSekundoStore((s) => s.locateTracePicker);
  const channels = file.info.channels;
  const matches = useMemo(() => matchChannels(channels, rows, choice), [channels, rows, choice]);
  const picks = useChannelPicks(file.id, channels, settings);
  const time = useDisplayUnit('time');
  const t = file.info;
  return (
    <>
      <p className="locate-traces__file">
        <span className="file-name">{file.name}</span>
        <span className="muted">
          {' '}
          · {fileSize(file.size)} · {t.rows.toLocaleString('en')} rows, {channels.length} channel{channels.length === 1 ? '' : 's'}, {time.format(t.firstTime_s, 4)} to {time.format(t.lastTime_s, 4)} {time.shown}
        </span>
      </p>
      <div className="locate-traces__body">
        <PanelErrorBoundary panel="picker settings">
          <PickerSettings />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="channels and picks">
          <ChannelTable matches={matches} picks={picks} />
        </PanelErrorBoundary>
      </div>
      <UseArrivals key={file.id} matches={matches} picks={picks} />
      <PanelErrorBoundary panel="traces chart">
        <TracesChart file={file} matches={matches} picks={picks} />
      </PanelErrorBoundary>
    </>
  );
}

function PickerSettings() {
  const settings = useSekundoStore((s) => s.locateTracePicker);
  const set = useSekundoStore((s) => s.setLocateTracePicker);
  const pickerId = useId();
  const polarityId = useId();
  const pickerHelp = useFieldHelp('picker', LOCATE_HELP.tracePicker);
  const polarityHelp = useFieldHelp('pulse polarity', LOCATE_HELP.tracePolarity);
  return (
    <fieldset className="locate-group locate-traces__settings">
      <legend className="visually-hidden">Picker settings</legend>
      <HelpLabel htmlFor={pickerId} className="locate-field__label" help={pickerHelp}>
Picker
</HelpLabel>
      <select id={pickerId} className="locate-select" value={settings.picker} aria-describedby={pickerHelp.describedBy} onChange={(e) => set({ picker: e.target.value as PickerKind })}>
        {PICKER_KINDS.map((k) => (
          <option key={k} value={k}>
            {k === 'xcorr' ? `${PICKER_LABELS[k]} (rectangle)` : PICKER_LABELS[k]}
          </option>
        ))}
      </select>
      {settings.picker === 'threshold' ? <SettingField setting="threshold" label="Threshold k (noise sd)" help={LOCATE_HELP.traceThreshold} /> : null}
      {settings.picker === 'fraction' ? <SettingField setting="fraction" label="Fraction of the peak" help={LOCATE_HELP.traceFraction} /> : null}
      <HelpLabel htmlFor={polarityId} className="locate-field__label" help={polarityHelp}>
Pulse polarity
</HelpLabel>
      <select id={polarityId} className="locate-select" value={settings.polarity} aria-describedby={polarityHelp.describedBy} onChange={(e) => set({ polarity: e.target.value as Polarity })}>
        <option value="auto">Automatic (the larger excursion)</option>
        <option value="positive">Positive-going</option>
        <option value="negative">Negative-going</option>
      </select>
      <SearchWindow />
    </fieldset>
  );
}

function SearchWindow() {
  const time = useDisplayUnit('time');
  const help = LOCATE_HELP.traceSearch(time.shown);
  return (
    <div className="locate-traces__window">
      <SettingField setting="from" label="Search from" placeholder="t = 0" help={help} />
      <SettingField setting="to" label="Search to" placeholder="end" help={help} />
    </div>
  );
}

interface SettingFieldProps {
  setting: TraceSettingKey;
  label: string;
  placeholder?: string;
  help: HelpTopic;
}

/** A typed picker setting: the one quantity field over the panel's picker settings. */
function SettingField({ setting, label, placeholder, help }: SettingFieldProps) {
  const value = useSekundoStore((s) => traceSettingValue(s.locateTracePicker, setting));
  return (
    <QuantityField
      fieldKey={locateFieldKey(traceSettingKey(setting))}
      spec={traceSettingSpec(setting)}
      value={value}
      apply={(v) => useSekundoStore.getState().setLocateTraceSetting(setting, v)}
      label={label}
      placeholder={placeholder}
      help={help}
    />
  );
}

function ChannelTable({ matches, picks }: { matches: readonly ChannelMatch[]; picks: ReadonlyMap<string, PickState> }) {
  const time = useDisplayUnit('time');
  const channelHelp = useFieldHelp('sensor of a channel', LOCATE_HELP.traceChannel);
  const conflicts = matchConflicts(matches);
  return (
    <div className="locate-traces__channels">
      <div className="help-panels">{channelHelp.panel}</div>
      <div className="table-scroll">
        <table className="locate-table locate-traces-table" aria-label="Channels, their sensors and picked arrivals">
          <thead>
            <tr>
              <th scope="col">Channel</th>
              <HelpColumnHead help={channelHelp}>Sensor</HelpColumnHead>
              <th scope="col" className="num">
                Arrival ({time.shown})
              </th>
              <th scope="col" className="num">
                ± sd (µs)
              </th>
              <th scope="col" className="num">
                Peak/noise
              </th>
            </tr>
          </thead>
          <tbody>
            {matches.map((m) => (
              <ChannelRow key={m.channel} match={m} pick={picks.get(m.channel)} describedBy={channelHelp.describedBy} />
            ))}
          </tbody>
        </table>
      </div>
      {conflicts.map((c) => (
        <p key={c} className="field-error" role="alert">
          {c}
        </p>
      ))}
    </div>
  );
}

function ChannelRow({ match, pick, describedBy }: { match: ChannelMatch; pick: PickState | undefined; describedBy: string }) {
  const rows = useSekundoStore((s) => s.locateRows);
  const choose = useSekundoStore((s) => s.chooseLocateTraceSensor);
  const time = useDisplayUnit('time');
  const selectId = useId();
  return (
    <tr className={match.row ? undefined : 'locate-traces__unused'}>
      <th scope="row">{match.channel}</th>
      <td>
        <label htmlFor={selectId} className="visually-hidden">
          Sensor of channel {match.channel}
        </label>
        <select id={selectId} className="locate-select" value={match.row?.key ?? ''} aria-describedby={describedBy} onChange={(e) => choose(match.channel, e.target.value === '' ? null : e.target.value)}>
          <option value="">not used</option>
          {rows.map((r) => (
            <option key={r.key} value={r.key}>
              {r.label}
            </option>
          ))}
        </select>
      </td>
      {pick?.status === 'picked' ? (
        <>
          <td className="num" data-testid={`trace-arrival-${match.channel}`}>
            {/* As many digits as the pick's sd supports. */}
            {time.measured(pick.pick.arrival_s, pick.pick.arrivalSd_s, 7).value}
          </td>
          <td className="num">{formatSignificant(pick.pick.arrivalSd_s * 1e6, 2)}</td>
          <td className="num">{formatSignificant(pick.pick.snr, 3)}</td>
        </>
      ) : pick?.status === 'failed' ? (
        <td colSpan={3} className="locate-traces__failed">
          no pick: {pick.message}
        </td>
      ) : (
        <td colSpan={3} className="muted">
          picking…
        </td>
      )}
    </tr>
  );
}

function UseArrivals({ matches, picks }: { matches: readonly ChannelMatch[]; picks: ReadonlyMap<string, PickState> }) {
  const write = useSekundoStore((s) => s.setLocateArrivals);
  const refuse = useSekundoStore((s) => s.refuseLocate);
  const clear = useSekundoStore((s) => s.clearLocateMessage);
  const failures = useSekundoStore((s) => s.locateErrors[TRACE_APPLY_KEY]);
  const [done, setDone] = useState<string | null>(null);
  const matched = matches.filter((m) => m.row !== null);
  const picking = matched.some((m) => picks.get(m.channel)?.status !== 'picked' && picks.get(m.channel)?.status !== 'failed');
  const conflicts = matchConflicts(matches).length > 0;
  const apply = () => {
    const { updates, failures } = arrivalsFromPicks(matches, picks);
    write(updates);
    const labels = matched.filter((m) => updates.some((u) => u.key === m.row?.key)).map((m) => m.row?.label);
    setDone(updates.length === 0 ? 'No arrival was written.' : `Arrivals and timing sds written for ${updates.length} sensor${updates.length === 1 ? '' : 's'}: ${labels.join(', ')}.`);
    if (failures.length > 0) refuse(TRACE_APPLY_KEY, `${failures.join(' ')} ${failures.length === 1 ? 'That sensor keeps what it had.' : 'Those sensors keep what they had.'}`);
    else clear(TRACE_APPLY_KEY);
  };
  const unmatched = matches.length - matched.length;
  return (
    <div className="locate-traces__apply">
      <button type="button" className="button button--primary" disabled={matched.length === 0 || picking || conflicts} onClick={apply}>
        Use these arrivals
      </button>
      <span className="muted">
        {matched.length === 0
          ? 'No channel is matched to a sensor.'
          : `${matched.length} channel${matched.length === 1 ? '' : 's'} to ${matched.length === 1 ? 'its sensor' : 'their sensors'}${unmatched > 0 ? `; ${unmatched} not used` : ''}. Sensors without a channel keep their arrivals.`}
      </span>
      {done ? (
        <p className="locate-traces__done" role="status">
          {done}
        </p>
      ) : null}
      {failures ? (
        <p className="field-error" role="alert">
          {failures}
        </p>
      ) : null}
    </div>
  );
}

function TracesChart({ file, matches, picks }: { file: LocateTraceFile; matches: readonly ChannelMatch[]; picks: ReadonlyMap<string, PickState> }) {
  const samples = useTraceSamples(file.id);
  const settings = useSekundoStore((s) => s.locateTracePicker);
  const [view, setView] = useState<'record' | 'picks'>('picks');
  const [plotRef, width] = useElementWidth<HTMLDivElement>(900);
  const time = useDisplayUnit('time');
  const figure = useMemo(() => {
    if (samples.status !== 'ready') return null;
    const rows = matches.map((m) => {
      const p = picks.get(m.channel);
      return { channel: m.channel, sensor: m.row?.label ?? null, pick: p?.status === 'picked' ? p.pick : null };
    });
    const span = view === 'picks' ? spanAroundPicks(samples.samples, rows.map((r) => r.pick)) : null;
    return locateTraceFigure({ samples: samples.samples, rows, span, search: { from_s: settings.from_s, to_s: settings.to_s }, columns: Math.max(200, width - 100), time: { scale: time.fromSi(1), shown: time.shown } });
  }, [samples, matches, picks, view, settings.from_s, settings.to_s, width, time]);
  const picked = [...picks.values()].filter((p) => p.status === 'picked').length;
  return (
    <div className="locate-traces__chart">
      <fieldset className="locate-segmented">
        <legend className="visually-hidden">Time span of the traces</legend>
        {(['picks', 'record'] as const).map((v) => (
          <label key={v} className="locate-segmented__option">
            <input type="radio" name="locate-traces-view" checked={view === v} onChange={() => setView(v)} />
            {v === 'picks' ? 'Around the picks' : 'Whole record'}
          </label>
        ))}
      </fieldset>
      <div ref={plotRef} className="locate-traces__plot" style={{ ['--traces-height' as string]: `${FRAME_PX + BAND_PX * matches.length}px` }}>
        {samples.status === 'failed' ? (
          <p className="field-error" role="alert">
            {samples.message}
          </p>
        ) : figure ? (
          <PlotlyChart
            chartId={TRACES_CHART_ID}
            label={`Traces of ${matches.length} channels in ${file.name}, each scaled to its own height, with ${picked} picked arrival${picked === 1 ? '' : 's'} marked.`}
            data={figure.data}
            layout={figure.layout}
          />
        ) : (
          <p className="plot-loading">Fetching the samples…</p>
        )}
      </div>
      <p className="chart-caption">
        Each channel scaled to its own largest excursion; grey: not used. Orange line and band: the pick and its ± sd; dashed: t = 0 of the file
        {settings.from_s !== null || settings.to_s !== null ? '; tinted: the search window' : ''}.
      </p>
    </div>
  );
}
