import { lockinCsvChunks } from '../../io/lockin-export';
import { ChartFigure } from '../charts/ChartFigure';
import { DropZone } from '../converter/DropZone';
import { DownloadIcon } from '../export/CsvExportButton';
import { downloadBlob } from '../export/download';
import { PlotlyChart } from '../plot/PlotlyChart';
import { useSekundoStore } from '../store';
import { formatMeasured } from '../units/format-measured';
import { formatSignificant } from '../units/format-number';
import { readResonatorFile } from './read-file';
import { lockinFigure } from './resonator-figures';
import { ResonatorField } from './ResonatorField';
import { useResonatorFits, useResonatorLockin, useResonatorReading } from './use-resonator';

/** A lock-in record at a fixed drive → L(t) and the drift of f₀ with sds, as a chart and a CSV. */
export function ResonatorLockin() {
  const record = useSekundoStore((s) => s.resonatorLockin);
  const error = useSekundoStore((s) => s.resonatorFileErrors.lockin);
  const { referenceFit } = useResonatorFits();
  const reading = useResonatorReading();
  const series = useResonatorLockin();
  const T = reading?.bath;
  return (
    <section className="card resonator-card" aria-labelledby="resonator-lockin-title">
      <div className="card-head">
        <h2 id="resonator-lockin-title" className="card-title">
          Follow a lock-in record
        </h2>
        {series?.ok ? (
          <button
            type="button"
            className="export-button"
            aria-label="Download the line density and f₀ drift as CSV"
            onClick={() => downloadBlob(new Blob([...lockinCsvChunks(series.value)], { type: 'text/csv;charset=utf-8' }), 'resonator-lockin.csv')}
          >
            <DownloadIcon /> CSV
          </button>
        ) : null}
      </div>
      <p className="muted">
        CSV columns <code>time_s</code>, <code>x</code>, <code>y</code> at one drive frequency, read against the vortex-free reference sweep above: in the inverse plane 1/(x + iy) a widening (vortices) and a shift (temperature or pressure drift) move along orthogonal directions.
      </p>
      <div className="resonator-drops">
        <div className="resonator-drop">
          <h3 className="resonator-drop__title">Lock-in record</h3>
          <DropZone buttonLabel="Choose a lock-in CSV" onFiles={(files) => files[0] && void readResonatorFile('lockin', files[0])}>
            <p className="muted resonator-drop__file">{record ? `Open: ${record.name} (${record.data.time_s.length} rows)` : 'No file yet.'}</p>
          </DropZone>
          {error ? (
            <p className="field-error" role="alert">
              {error}
            </p>
          ) : null}
        </div>
        <div className="resonator-fields resonator-fields--narrow">
          <ResonatorField name="drive_Hz" />
        </div>
      </div>
      {series === null ? (
        <p className="muted" role="status">
          {!record ? 'Drop a lock-in record to follow L(t).' : referenceFit?.ok ? '' : 'The record needs a fitted vortex-free reference sweep (x and y) in the panel above.'}
        </p>
      ) : series.ok ? (
        <>
          <p data-testid="resonator-lockin-summary">
            {series.value.time_s.length} rows at {formatSignificant(series.value.drive_Hz, 9)} Hz; noise per point {formatSignificant(series.value.noise, 2)} {signalUnit(record?.data.columns.x ?? '')} ({series.value.noiseFrom === 'record' ? 'from successive differences' : 'given'}); B = {formatSignificant(series.value.mutualFrictionB, 4)} at {T ? `${T.temperature_K.toFixed(4)} K (${T.from})` : 'the bath temperature'}. Last row: L = {formatMeasured(series.value.lineDensity_m2[series.value.time_s.length - 1] as number, series.value.lineDensitySd_m2[series.value.time_s.length - 1] as number).text} m⁻², δf₀ ={' '}
            {formatMeasured(((series.value.frequencyShift_Hz[series.value.time_s.length - 1] as number) * 1e3), (series.value.frequencyShiftSd_Hz[series.value.time_s.length - 1] as number) * 1e3).text} mHz
            {series.value.temperatureShift_K ? ` (δT = ${formatMeasured((series.value.temperatureShift_K[series.value.time_s.length - 1] as number) * 1e6, ((series.value.temperatureShiftSd_K as Float64Array)[series.value.time_s.length - 1] as number) * 1e6).text} µK)` : ''}.
          </p>
          <ChartFigure
            id="resonator-lockin-chart"
            title="Line density and drift of f₀ over time"
            caption="Above: L(t) with its ±1 sd band (the record’s noise and the reference fit’s). Below: the shift of the resonance centre from the reference’s, in mHz; it includes the vortices’ own small shift through B′."
          >
            <PlotlyChart chartId="resonator-lockin" label="Vortex line density and resonance-frequency drift against time" {...lockinFigure(series.value)} />
          </ChartFigure>
          <ul className="resonator-notes">
            {series.value.notes.map((n) => (
              <li key={n} className="resonator-note">
                {n}
              </li>
            ))}
          </ul>
        </>
      ) : (
        <p className="field-error" role="status">
          {series.message}
        </p>
      )}
    </section>
  );
}

/** "V" when the record's x column named a voltage unit (the reader scaled it to volts), else the file's own unit. */
function signalUnit(column: string): string {
  return /(^|[\s_(/[])[mnuµμ]?V\)?\]?$/.test(column.trim()) ? 'V' : '(the file’s signal unit)';
}
