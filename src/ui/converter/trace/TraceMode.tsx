import { useId, useMemo } from 'react';
import { PICKER_KINDS, type PickerKind } from '../../../physics';
import { type FieldHelpParts, useFieldHelp } from '../../help/FieldHelp';
import { PanelErrorBoundary } from '../../layout/PanelErrorBoundary';
import { fileSize, ReadProgress } from '../../layout/ReadProgress';
import { useSekundoStore } from '../../store';
import { ChoiceCard } from '../ChoiceCard';
import { QuantityField } from '../../fields/QuantityField';
import { useConverterField } from '../use-converter-field';
import type { Polarity, TraceFileEntry } from '../converter-slice';
import { CONVERTER_CHOICE_HELP } from '../converter-help';
import { DropZone } from '../DropZone';
import { SetupCard } from '../SetupCard';
import { exampleTraceFiles } from './trace-example';
import { cancelTraceLoading, clearTraceFiles, loadTraceFiles, removeTraceFile } from './trace-loader';
import { forgetPicks } from './trace-picks';
import { TRACE_FILE_LIMIT_BYTES } from './trace-protocol';
import { TraceResults } from './TraceResults';
import { PICKER_LABELS } from './trace-pick-options';

/** Digitiser traces → picked arrivals → temperatures, one file or a series. */
export function TraceMode() {
  return (
    <div className="converter-grid">
      <div className="converter-inputs">
        <PanelErrorBoundary panel="trace files">
          <TraceFilesCard />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="picker options">
          <PickerCard />
        </PanelErrorBoundary>
        <SetupCard title="Distance and offset" pairs={['distance', 'offset']} lead="The delay and its sd come from the pick in each trace." />
        <PanelErrorBoundary panel="choice of candidate">
          <ChoiceCard series />
        </PanelErrorBoundary>
      </div>
      <div className="converter-results">
        <PanelErrorBoundary panel="trace results">
          <TraceResults />
        </PanelErrorBoundary>
      </div>
    </div>
  );
}

function TraceFilesCard() {
  const headingId = useId();
  const files = useSekundoStore((s) => s.converterTraceFiles);
  const notice = useSekundoStore((s) => s.converterTraceNotice);
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Trace files
      </h2>
      <p className="muted converter-card__lead">
        Digitiser CSV: a time column (time, t or s, with a unit such as “Time (us)”) and one or more channels, comma-, semicolon- or tab-separated,
        header lines allowed. Files are read in the background; each may be up to {TRACE_FILE_LIMIT_BYTES / 1048576} MiB. Several files make a
        temperature series, ordered by a “Timestamp:” header line or else by name.
      </p>
      <DropZone buttonLabel="Choose trace files" multiple onFiles={(f) => loadTraceFiles(f)}>
        <div className="drop-zone__extra">
          <button type="button" className="button button--small" onClick={() => loadTraceFiles(exampleTraceFiles())}>
            Load invented example traces
          </button>
          {files.length > 0 ? (
            <button
              type="button"
              className="button button--small"
              onClick={() => {
                clearTraceFiles();
                forgetPicks();
              }}
            >
              Clear all
            </button>
          ) : null}
        </div>
      </DropZone>
      <ReadingProgress />
      {notice ? (
        <p className="field-error" role="alert">
          {notice}
        </p>
      ) : null}
      {files.length > 0 ? <FileList files={files} /> : null}
    </section>
  );
}

function ReadingProgress() {
  const progress = useSekundoStore((s) => s.converterTraceProgress);
  if (!progress) return null;
  const label = `Reading ${progress.name}${progress.count > 1 ? ` (file ${progress.index} of ${progress.count})` : ''}`;
  return <ReadProgress label={label} bytes={progress.bytes} totalBytes={progress.totalBytes} rows={progress.rows} onCancel={cancelTraceLoading} cancelLabel="Cancel" />;
}

const STATUS_WORDS: Readonly<Record<TraceFileEntry['status'], string>> = {
  queued: 'waiting',
  reading: 'reading…',
  ready: 'read',
  failed: 'not read',
  cancelled: 'cancelled',
};

function FileList({ files }: { files: readonly TraceFileEntry[] }) {
  const selected = useSekundoStore((s) => s.converterTraceSelected);
  const select = useSekundoStore((s) => s.selectConverterTrace);
  return (
    <ul className="trace-files" aria-label="Trace files loaded">
      {files.map((f) => (
        <li key={f.id} className={`trace-file trace-file--${f.status}${f.id === selected ? ' is-selected' : ''}`}>
          <button type="button" className="trace-file__select" aria-pressed={f.id === selected} onClick={() => select(f.id)} disabled={f.status !== 'ready'}>
            <span className="trace-file__name">{f.name}</span>
            <span className="trace-file__meta">
              {fileSize(f.size)} · {f.info ? `${f.info.rows.toLocaleString('en')} rows, ${f.info.channels.length} channel${f.info.channels.length === 1 ? '' : 's'}` : STATUS_WORDS[f.status]}
            </span>
          </button>
          <button type="button" className="icon-button" aria-label={`Remove ${f.name}`} onClick={() => removeTraceFile(f.id)}>
            ×
          </button>
          {f.message ? <p className={f.status === 'failed' ? 'trace-file__message field-error' : 'trace-file__message muted'}>{f.message}</p> : null}
        </li>
      ))}
    </ul>
  );
}

/** The picker and its channels; `channels` replaces the channels of the loaded files (the followed folder's). */
export function PickerCard({ channels: given, lead }: { channels?: readonly string[]; lead?: string } = {}) {
  const headingId = useId();
  const files = useSekundoStore((s) => s.converterTraceFiles);
  const picker = useSekundoStore((s) => s.converterTracePicker);
  const heater = useSekundoStore((s) => s.converterTraceHeater);
  const sensor = useSekundoStore((s) => s.converterTraceSensor);
  const polarity = useSekundoStore((s) => s.converterTracePolarity);
  const setPicker = useSekundoStore((s) => s.setConverterTracePicker);
  const setChannels = useSekundoStore((s) => s.setConverterTraceChannels);
  const setPolarity = useSekundoStore((s) => s.setConverterTracePolarity);
  const threshold = useConverterField('threshold');
  const fraction = useConverterField('fraction');
  const searchFrom = useConverterField('searchFrom');
  const searchTo = useConverterField('searchTo');
  const fromFiles = useMemo(() => [...new Set(files.flatMap((f) => f.info?.channels ?? []))], [files]);
  const channels = given ?? fromFiles;
  const heaterId = useId();
  const sensorId = useId();
  const pickerId = useId();
  const polarityId = useId();
  const help = {
    heater: useFieldHelp('heater / trigger channel', CONVERTER_CHOICE_HELP.heater),
    sensor: useFieldHelp('sensor channel', CONVERTER_CHOICE_HELP.sensor),
    picker: useFieldHelp('picker', CONVERTER_CHOICE_HELP.picker),
    polarity: useFieldHelp('pulse polarity', CONVERTER_CHOICE_HELP.polarity),
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Channels and picker
      </h2>
      {lead ? <p className="muted converter-card__lead">{lead}</p> : null}
      <div className="picker-grid">
        <PickerLabel htmlFor={heaterId} label="Heater / trigger channel" help={help.heater} />
        <select id={heaterId} className="select" value={heater ?? ''} aria-describedby={help.heater.describedBy} onChange={(e) => setChannels({ heater: e.target.value === '' ? null : e.target.value })}>
          <option value="">None: time zero is the file’s t = 0</option>
          {channels.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
        {help.heater.panel}
        <PickerLabel htmlFor={sensorId} label="Sensor channel" help={help.sensor} />
        <select id={sensorId} className="select" value={sensor ?? ''} aria-describedby={help.sensor.describedBy} onChange={(e) => setChannels({ sensor: e.target.value === '' ? null : e.target.value })}>
          <option value="">First channel that is not the heater</option>
          {channels.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
        {help.sensor.panel}
        <PickerLabel htmlFor={pickerId} label="Picker" help={help.picker} />
        <select id={pickerId} className="select" value={picker} aria-describedby={help.picker.describedBy} onChange={(e) => setPicker(e.target.value as PickerKind)}>
          {PICKER_KINDS.map((k) => (
            <option key={k} value={k}>
              {k === 'xcorr' ? `${PICKER_LABELS[k]} (${heater ? 'heater drive' : 'rectangle'})` : PICKER_LABELS[k]}
            </option>
          ))}
        </select>
        {help.picker.panel}
        <PickerLabel htmlFor={polarityId} label="Pulse polarity" help={help.polarity} />
        <select id={polarityId} className="select" value={polarity} aria-describedby={help.polarity.describedBy} onChange={(e) => setPolarity(e.target.value as Polarity)}>
          <option value="auto">Automatic (the larger excursion)</option>
          <option value="positive">Positive-going</option>
          <option value="negative">Negative-going</option>
        </select>
        {help.polarity.panel}
      </div>
      <div className="picker-fields">
        {picker === 'threshold' ? <QuantityField {...threshold} shortLabel="Threshold k (noise sd)" className="picker-fields__wide" /> : null}
        {picker === 'fraction' ? <QuantityField {...fraction} shortLabel="Fraction of the peak (0.05–0.95)" className="picker-fields__wide" /> : null}
        <QuantityField {...searchFrom} />
        <QuantityField {...searchTo} />
      </div>
      <p className="field-hint">
        Search window times count from time zero. Baseline and noise come from the samples before time zero; a window starting past the heater
        pickup keeps the picker off it.
      </p>
    </section>
  );
}

/** A label in the picker grid with its "?"; the help folds out in a row of its own below. */
function PickerLabel({ htmlFor, label, help }: { htmlFor: string; label: string; help: FieldHelpParts }) {
  return (
    <div className="field-head">
      <label className="field-label" htmlFor={htmlFor}>
        {label}
      </label>
      {help.button}
    </div>
  );
}
