import { useId, useMemo, useState } from 'react';
import type { RehearsalResult, RehearsalSensorResult } from '../../../io/rehearse-run';
import { PICKER_KINDS, type PickerKind } from '../../../physics';
import { ChartFigure } from '../../charts/ChartFigure';
import { downloadBlob } from '../../export/download';
import { QuantityField } from '../../fields';
import { HelpLabel, useFieldHelp } from '../../help/FieldHelp';
import { PanelErrorBoundary } from '../../layout/PanelErrorBoundary';
import { PlotlyChart } from '../../plot/PlotlyChart';
import { useSekundoStore } from '../../store';
import { formatSignificant } from '../../units/format-number';
import { type DisplayUnit, inUnit, LADDERS, readText, temperatureText, unitForColumn } from '../../units/ladders';
import { useShownLadders } from '../../units/use-shown-ladders';
import { cancelRehearsal, requestRecordFile, startRehearsal } from './rehearse-engine';
import { rehearseFigure } from './rehearse-figure';
import { PICKER_HELP, REHEARSE_FIELDS } from './rehearse-help';
import { MAX_FILES_AT_ONCE } from './rehearse-slice';

/** Runs a change a field asked for and says it was taken. */
function applied(change: () => void): null {
  change();
  return null;
}

/** Chart id of the rehearsal's records (tests read the drawn figure from the element with this data-chart). */
export const REHEARSE_CHART_ID = 'planner-rehearsal-records';

const PICKER_NAMES: Record<PickerKind, string> = {
  threshold: 'Threshold (k noise sd)',
  fraction: 'Fraction of the peak',
  peak: 'Peak (parabola)',
  xcorr: 'Cross-correlation with the drive',
};

/**
 * "Rehearse the measurement": synthetic digitiser records of the plan through the converter's
 * picker, in a worker, with progress and cancel; per-sensor bias and sd of the arrival and of the
 * temperature beside the planner's analytic figures; a chart of a few records; the records as
 * trace CSV files.
 */
export function RehearseSection() {
  const headingId = useId();
  // Whether the figures shown are for an older plan: a boolean, so a keystroke re-renders this only when it flips.
  const planChanged = useSekundoStore((s) => s.rehearseRun.plan !== s.plannerPlan);
  const options = useSekundoStore((s) => s.rehearseOptions);
  const run = useSekundoStore((s) => s.rehearseRun);
  const set = useSekundoStore((s) => s.setRehearseOptions);
  const pickerId = useId();
  const pickerHelp = useFieldHelp('Picker', PICKER_HELP);
  const running = run.status === 'running';
  const stale = run.result !== null && (planChanged || run.options !== options);
  const F = REHEARSE_FIELDS;
  return (
    <section className="card rehearse" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Rehearse the measurement
      </h2>
      <p className="rehearse__intro">
        Before the cooldown: make synthetic digitiser records of this plan — each sensor’s predicted pulse with its echoes, its noise over √(pulses
        averaged), the digitiser’s rate and record length — and time them with the converter’s own picker. The figures say how well that picker times
        each arrival and what temperature scatter follows, beside the planner’s analytic estimate.
      </p>
      <div className="rehearse__settings">
        <div className="quantity-field">
          <HelpLabel htmlFor={pickerId} className="quantity-field__label" help={pickerHelp}>
            Picker
          </HelpLabel>
          <select id={pickerId} className="plan-select" value={options.picker} aria-describedby={pickerHelp.describedBy} onChange={(e) => set({ picker: e.target.value as PickerKind })}>
            {PICKER_KINDS.map((k) => (
              <option key={k} value={k}>
                {PICKER_NAMES[k]}
              </option>
            ))}
          </select>
          {pickerHelp.panel}
        </div>
        {options.picker === 'threshold' ? (
          <QuantityField fieldKey="rehearse.threshold" spec={F.threshold} value={options.thresholdSigma ?? 5} apply={(v) => applied(() => set({ thresholdSigma: v ?? 5 }))} />
        ) : null}
        {options.picker === 'fraction' ? (
          <QuantityField fieldKey="rehearse.fraction" spec={F.fraction} value={options.fraction ?? 0.5} apply={(v) => applied(() => set({ fraction: v ?? 0.5 }))} />
        ) : null}
        <QuantityField fieldKey="rehearse.trials" spec={F.trials} value={options.trials} apply={(v) => applied(() => set({ trials: v ?? options.trials }))} />
        <QuantityField fieldKey="rehearse.seed" spec={F.seed} value={options.seed} apply={(v) => applied(() => set({ seed: v ?? options.seed }))} />
        <QuantityField fieldKey="rehearse.bits" spec={F.bits} value={options.resolutionBits} apply={(v) => applied(() => set({ resolutionBits: v }))} />
        <QuantityField
          fieldKey="rehearse.range"
          spec={F.range}
          value={options.range_V}
          apply={(v) => {
            if (v !== null && options.resolutionBits === null) return 'Input range is used only with a resolution: give the digitiser’s bits first.';
            set({ range_V: v });
            return null;
          }}
        />
        <QuantityField fieldKey="rehearse.pickup" spec={F.pickup} value={options.firstSoundPickup} apply={(v) => applied(() => set({ firstSoundPickup: v ?? 0 }))} />
      </div>
      <div className="rehearse__actions">
        <button type="button" className="button button--primary" disabled={running} onClick={() => startRehearsal(useSekundoStore.getState().plannerPlan, options)}>
          {run.result ? 'Run the rehearsal again' : 'Run the rehearsal'}
        </button>
        {running ? (
          <button type="button" className="button" onClick={cancelRehearsal}>
            Cancel
          </button>
        ) : null}
        <RunStatus />
      </div>
      {stale ? (
        <p className="rehearse__stale" role="note">
          These figures are for the plan or settings as they were when the rehearsal ran; run it again to follow your changes.
        </p>
      ) : null}
      {run.result ? (
        <>
          <PanelErrorBoundary panel="rehearsal results">
            <RehearseTable result={run.result} />
          </PanelErrorBoundary>
          <RehearseChart result={run.result} />
          <RehearseExport trials={run.result.trials} />
        </>
      ) : null}
    </section>
  );
}

function RunStatus() {
  const run = useSekundoStore((s) => s.rehearseRun);
  if (run.status === 'running') {
    return (
      <span className="rehearse__progress" role="status">
        <progress max={run.total} value={run.done} aria-label="Rehearsal progress" /> Trial {run.done} of {run.total}
      </span>
    );
  }
  if (run.status === 'failed') {
    return (
      <span className="rehearse__failure" role="alert">
        The rehearsal stopped: {run.message}
      </span>
    );
  }
  if (run.status === 'cancelled') return <span role="status">Cancelled; nothing from that run is shown.</span>;
  if (run.status === 'done' && run.result) return <span role="status">Done: {run.result.trials} records per sensor.</span>;
  return null;
}

function RehearseTable({ result }: { result: RehearsalResult }) {
  const L = useShownLadders();
  const time = L.time[0] as DisplayUnit;
  const sds = result.sensors.flatMap((s) => [s.arrivalSd_s, s.analyticTimingSd_s, s.boundTimingSd_s, s.arrivalBias_s]);
  const sdUnit = unitForColumn(sds, LADDERS.time);
  const tUnit = unitForColumn(
    result.sensors.flatMap((s) => [s.temperatureSd_K, s.analyticTemperatureSd_K, s.temperatureBias_K]),
    LADDERS.temperatureDifference,
  );
  const inSd = (x: number | null) => (x === null ? '—' : formatSignificant(inUnit(x, sdUnit), 3));
  const inT = (x: number | null) => (x === null ? '—' : formatSignificant(inUnit(x, tUnit), 3));
  return (
    <div className="rehearse__results">
      <p className="rehearse__summary">
        {result.trials} records per sensor, {PICKER_NAMES[result.picker].toLowerCase()} picker, seed {result.seed}; bath {temperatureText(result.temperature_K, L.temperature)}.
      </p>
      <div className="table-scroll">
        <table className="properties-table rehearse__table">
          <caption className="visually-hidden">Rehearsed timing and temperature per sensor</caption>
          <thead>
            <tr>
              <th scope="col">Sensor</th>
              <th scope="col">True arrival ({time.shown})</th>
              <th scope="col">Bias ({sdUnit.shown})</th>
              <th scope="col">sd ({sdUnit.shown})</th>
              <th scope="col">Planner’s sd ({sdUnit.shown})</th>
              <th scope="col">Bound ({sdUnit.shown})</th>
              <th scope="col">Failed</th>
              <th scope="col">T bias ({tUnit.shown})</th>
              <th scope="col">T sd ({tUnit.shown})</th>
              <th scope="col">Planner’s T sd ({tUnit.shown})</th>
            </tr>
          </thead>
          <tbody>
            {result.sensors.map((s) => (
              <tr key={s.id} className={s.sdRatio !== null && (s.sdRatio > 1.5 || s.sdRatio < 1 / 1.5) ? 'rehearse__row--differs' : undefined}>
                <th scope="row">
                  {s.id}
                  {s.sdRatio !== null && (s.sdRatio > 1.5 || s.sdRatio < 1 / 1.5) ? <span className="visually-hidden"> (differs from the planner’s sd by more than ×1.5)</span> : null}
                </th>
                <td>{formatSignificant(inUnit(s.arrival_s, time), 6)}</td>
                <td>{inSd(s.arrivalBias_s)}</td>
                <td>{inSd(s.arrivalSd_s)}</td>
                <td>{inSd(s.analyticTimingSd_s)}</td>
                <td>{inSd(s.boundTimingSd_s)}</td>
                <td>{`${formatSignificant(s.failedShare * 100, 3)} %`}</td>
                <td>{inT(s.temperatureBias_K)}</td>
                <td>{inT(s.temperatureSd_K)}</td>
                <td>{inT(s.analyticTemperatureSd_K)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="field-hint">
        True arrival: the delay of the feature the picker measures on the predicted pulse, counted like with like from the drive (its 50 % rise; its
        centre for the peak picker), as the converter counts it. Bias: mean pick − true. Planner’s sd: the planner’s analytic figure for this picker (its noise
        propagated through the picker’s own rule on the predicted pulse, over the trigger’s phase within a sample; with this rehearsal’s threshold,
        fraction and digitiser step). Bound: the Cramér–Rao bound for this pulse and noise (Kay 1993), which a matched cross-correlation reaches at high SNR. ≠: the rehearsed sd and the planner’s differ by more than ×1.5 (the note below says why). Temperatures:
        each pick through the converter’s inversion with t₀ calibrated for this picker; the planner’s T sd is that of a change between readings.
      </p>
      <ul className="rehearse__notes">
        {result.sensors.map((s) => (
          <li key={s.id}>
            <strong>{s.id}</strong> ({s.label}): search window {readText(s.window.from_s, L.time)}–{readText(s.window.to_s, L.time)}, {s.polarity} pulse.{' '}
            {s.notes.join(' ')}
          </li>
        ))}
        {result.skipped.length > 0 ? <li>Not rehearsed (no second-sound pulse reaches them): {result.skipped.join(', ')}.</li> : null}
      </ul>
    </div>
  );
}

function RehearseChart({ result }: { result: RehearsalResult }) {
  const chosen = useSekundoStore((s) => s.rehearseChartSensor);
  const choose = useSekundoStore((s) => s.setRehearseChartSensor);
  const L = useShownLadders();
  const selectId = useId();
  const sensor: RehearsalSensorResult | undefined = result.sensors.find((s) => s.id === chosen) ?? result.sensors[0];
  const figure = useMemo(() => {
    if (!sensor) return null;
    const values = sensor.kept.flatMap((k) => Array.from(k.values));
    const volts = unitForColumn(values.length > 0 ? [Math.max(...values.map(Math.abs))] : [0], LADDERS.voltage);
    return rehearseFigure(sensor, L.time[0] as DisplayUnit, volts);
  }, [sensor, L.time]);
  if (!sensor || !figure) return null;
  const picked = sensor.kept.filter((k) => k.pick_s !== null).length;
  return (
    <ChartFigure
      id={REHEARSE_CHART_ID}
      title="Synthetic records and their picks"
      caption={
        <>
          The first {sensor.kept.length} records of {sensor.id} around its search window, each with its pick (dotted, {picked} of {sensor.kept.length}{' '}
          picked), and the true arrival of the feature (dashed). Where the noise is small against the pulse the records lie on top of each
          other: zoom in on the edge to see their scatter.
        </>
      }
    >
      <div className="rehearse__chart-choice">
        <label htmlFor={selectId}>Sensor</label>
        <select id={selectId} className="plan-select" value={sensor.id} onChange={(e) => choose(e.target.value)}>
          {result.sensors.map((s) => (
            <option key={s.id} value={s.id}>
              {s.id} — {s.label}
            </option>
          ))}
        </select>
      </div>
      <PlotlyChart chartId={REHEARSE_CHART_ID} label={`Synthetic records of ${sensor.id} with their picks`} data={figure.data} layout={figure.layout} />
    </ChartFigure>
  );
}

function RehearseExport({ trials }: { trials: number }) {
  const run = useSekundoStore((s) => s.rehearseRun);
  const trial = useSekundoStore((s) => s.rehearseExportTrial);
  const count = useSekundoStore((s) => s.rehearseExportCount);
  const setExport = useSekundoStore((s) => s.setRehearseExport);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const headingId = useId();
  const F = REHEARSE_FIELDS;
  const download = async (list: number[]) => {
    if (!run.plan || !run.options) return;
    setBusy(true);
    setProblem(null);
    try {
      for (const t of list) {
        const file = await requestRecordFile(run.plan, run.options, t);
        downloadBlob(new Blob([file.text], { type: 'text/csv;charset=utf-8' }), file.fileName);
      }
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
    } finally {
      setBusy(false);
    }
  };
  const many = Math.min(count, trials, MAX_FILES_AT_ONCE);
  return (
    <section className="rehearse__export" aria-labelledby={headingId}>
      <h3 id={headingId} className="card-subtitle">
        Records as trace files
      </h3>
      <p className="field-hint">
        Each trial is one CSV file of the whole record — columns time_s, heater (the relative drive) and one per sensor id, in volts — that the trace lab
        and <code>sekundo trace</code> read back, so your own analysis can be tried on it before the run. The same seed makes the same files.
      </p>
      <div className="rehearse__export-row">
        <QuantityField
          fieldKey="rehearse.exportTrial"
          spec={F.exportTrial}
          value={trial}
          apply={(v) => {
            if (v === null || v > trials) return `Trial must be a whole number 1–${trials} (the trials of this rehearsal).`;
            setExport({ trial: v });
            return null;
          }}
        />
        <button type="button" className="button" disabled={busy || trial > trials} onClick={() => void download([trial - 1])}>
          Download trial {trial}
        </button>
        <QuantityField fieldKey="rehearse.exportCount" spec={F.exportCount} value={count} apply={(v) => applied(() => setExport({ count: v ?? count }))} />
        <button type="button" className="button" disabled={busy} onClick={() => void download(Array.from({ length: many }, (_, i) => i))}>
          Download trials 1–{many}
        </button>
      </div>
      {problem ? (
        <p className="rehearse__failure" role="alert">
          Could not make the file: {problem}
        </p>
      ) : null}
    </section>
  );
}
