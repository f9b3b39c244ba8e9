import { type ChangeEvent, useRef } from 'react';
import { useSekundoStore } from '../store';
import { loadLocateDemo } from './load-demo';
import { downloadText, readSensorFile, resultsCsv, sensorsCsv } from './locate-file-actions';
import { useLocateFit } from './use-locate';

/** Store key of messages about opening files. */
export const LOCATE_FILE_KEY = 'file';

/** Where the sensors came from; open a sensor CSV, save sensors or results, go back to the demo. */
export function LocateBar() {
  const origin = useSekundoStore((s) => s.locateOrigin);
  const count = useSekundoStore((s) => s.locateRows.length);
  const fileError = useSekundoStore((s) => s.locateErrors[LOCATE_FILE_KEY]);
  const load = useSekundoStore((s) => s.loadLocateSensors);
  const refuse = useSekundoStore((s) => s.refuseLocate);
  // The results file is of the fit on screen, with the inputs it is for.
  const fit = useLocateFit();
  const input = useRef<HTMLInputElement>(null);
  const { outcome } = fit;
  const results = outcome.ok ? () => resultsCsv(fit.rows, fit.options, outcome) : null;

  const onFile = async (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = '';
    if (!file) return;
    const read = await readSensorFile(file);
    if (read.ok) load(read.sensors, { kind: 'file', name: file.name, note: null });
    else refuse(LOCATE_FILE_KEY, read.message);
  };
  const reloadDemo = async () => {
    const demo = await loadLocateDemo();
    load(demo.sensors, demo.origin);
  };
  const badge = origin.kind === 'demo' ? 'Demo' : origin.kind === 'file' ? 'File' : 'Built-in';
  return (
    <section className="card locate-bar" aria-label="Sensor data">
      <div className="locate-bar__main">
        <p className="locate-bar__origin">
          <span className={`locate-origin locate-origin--${origin.kind}`}>{badge}</span> {origin.name}
          <span className="muted"> · {count} sensors</span>
        </p>
        <div className="locate-bar__actions">
          <button type="button" className="button" onClick={() => input.current?.click()}>
            Open sensor CSV…
          </button>
          <input ref={input} type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" className="visually-hidden" aria-label="Open sensor CSV" tabIndex={-1} onChange={onFile} />
          <button type="button" className="button" onClick={() => downloadText(sensorsCsv(useSekundoStore.getState().locateRows), 'sensors.csv')} disabled={count === 0}>
            Save sensors (CSV)
          </button>
          <button
            type="button"
            className="button"
            disabled={!results}
            onClick={() => {
              const text = results?.();
              if (text) downloadText(text, 'source-location.csv');
            }}
          >
            Save results (CSV)
          </button>
          {origin.kind !== 'demo' ? (
            <button type="button" className="button" onClick={() => void reloadDemo()}>
              Back to the demo
            </button>
          ) : null}
        </div>
      </div>
      <p className="muted locate-bar__format">
        CSV columns: x_m, y_m, z_m, arrival_s, optionally arrival_sd_s and label (a unit in a column name scales it: x_mm, arrival_ms) — the format of{' '}
        <code>npx sekundo locate FILE.csv --temperature 1.8K</code>.
      </p>
      {origin.note ? <p className="locate-bar__note">{origin.note}</p> : null}
      {fileError ? (
        <p className="field-error" role="alert">
          {fileError}
        </p>
      ) : null}
    </section>
  );
}
