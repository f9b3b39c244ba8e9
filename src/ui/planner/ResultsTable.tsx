import type { ReactNode } from 'react';
import type { SensorPlanResult } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { type DisplayUnit, inUnit, LADDERS, type ShownLadders, temperatureText, unitForColumn } from '../units/ladders';
import { CsvExportButton } from '../export/CsvExportButton';
import { themedColour } from '../plot/plot-theme';
import { useResolvedTheme } from '../theme/use-theme';
import { sensorColour } from './planner-colours';
import { resultsCsv } from './results-csv';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from '../units/use-shown-ladders';

interface Column {
  key: string;
  /** Header text; the unit is added in brackets. */
  header: ReactNode;
  /** What the column means, for the header's title and screen readers. */
  about: string;
  /** Which ladder shows the column; null for plain numbers. */
  ladder: keyof ShownLadders | null;
  /** An uncertainty standing alone: on the ladder, not in the header's chosen unit. */
  uncertainty?: boolean;
  value: (s: SensorPlanResult) => number | null;
  /** Digits shown. */
  digits?: number;
  /** Whole numbers (counts). */
  count?: boolean;
}

const COLUMNS: readonly Column[] = [
  { key: 'path', header: 'Cold path', about: 'Shortest heater–sensor path at low temperature', ladder: 'length', value: (s) => s.pathLength_m },
  { key: 'pathSd', header: '± sd', about: 'One-sigma of the cold path (measurement and contraction)', ladder: 'length', value: (s) => s.pathLengthSd_m, digits: 2 },
  { key: 'first', header: 'First sound', about: 'First-sound arrival after the pulse onset', ladder: 'time', value: (s) => s.firstSoundArrival_s },
  { key: 'second', header: 'Second sound', about: 'Second-sound arrival after the pulse onset, with the sensor lag', ladder: 'time', value: (s) => s.secondSoundArrival_s },
  { key: 'amplitude', header: 'δT peak', about: 'Peak temperature swing of the direct pulse at the sensor', ladder: 'temperatureDifference', value: (s) => s.amplitude_K },
  { key: 'signal', header: 'Signal', about: 'Peak signal: δT × responsivity', ladder: 'voltage', value: (s) => s.signal_V },
  { key: 'snr1', header: 'SNR, 1 pulse', about: 'Peak signal over rms noise, one pulse', ladder: null, value: (s) => s.snrSingle, digits: 3 },
  { key: 'snrN', header: 'SNR, averaged', about: 'Peak signal over rms noise after averaging', ladder: null, value: (s) => s.snrAveraged, digits: 3 },
  { key: 'pulses', header: 'Pulses for target SNR', about: 'Pulses to average to reach the target SNR', ladder: null, value: (s) => s.pulsesForTargetSnr, count: true },
  {
    key: 'timing',
    header: 'Timing sd',
    about:
      'One-sigma arrival time of one averaged reading with the fraction picker at half the peak (the converter’s default), worked out from the predicted pulse, the noise after averaging and the sample rate; each value’s tooltip gives the other pickers. ≥: SNR below 10, a lower limit.',
    ladder: 'time',
    uncertainty: true,
    value: (s) => s.timingSd_s,
    digits: 2,
  },
  { key: 'tsd', header: 'T sd', about: 'One-sigma temperature from one reading (timing and distance)', ladder: 'temperatureDifference', value: (s) => s.temperatureSd_K, digits: 2 },
  { key: 'tchange', header: 'T sd, changes', about: 'One-sigma of a temperature change between readings (timing only)', ladder: 'temperatureDifference', value: (s) => s.temperatureChangeSd_K, digits: 2 },
];

/** Every sensor's arrivals, signal, noise and temperature resolution, one row per sensor. */
export function ResultsTable() {
  const outcome = usePlanOutcome();
  const theme = useResolvedTheme();
  const ladders = useShownLadders();
  if (!outcome.ok) return null;
  const sensors = outcome.result.sensors;
  const units = COLUMNS.map((c) => (c.ladder ? unitForColumn(sensors.map(c.value), (c.uncertainty ? LADDERS : ladders)[c.ladder]) : null));
  return (
    <section className="card plan-results" aria-labelledby="planner-results-title">
      <div className="card-head">
        <h3 id="planner-results-title" className="card-title">
          Results per sensor
        </h3>
        <p className="muted">
          Linear theory at {temperatureText(outcome.result.temperature_K, ladders.temperature)}; “—” where there is no second sound. Timing sd: the fraction
          picker at half the peak; each value’s tooltip and the CSV give the other pickers.
        </p>
        <CsvExportButton table={() => resultsCsv(outcome.result)} fileName="planned-results-per-sensor.csv" what="the results per sensor" />
      </div>
      <div className="table-scroll">
        <table className="properties-table results-table">
          <caption className="visually-hidden">Predicted arrivals, signals and temperature resolution for each sensor</caption>
          <thead>
            <tr>
              <th scope="col">Sensor</th>
              {COLUMNS.map((c, i) => (
                <th key={c.key} scope="col" className="num" title={c.about}>
                  {c.header}
                  {units[i] ? <span className="results-unit"> ({(units[i] as DisplayUnit).shown})</span> : null}
                </th>
              ))}
              <th scope="col" title="Whether the sd the target is for (absolute reading with the u₂ curve's own sd, or change between readings) reaches it">
                Meets target?
              </th>
              <th scope="col" title="Shortest path that reaches the target with this sensor's timing, or why none does">
                Shortest distance for target
              </th>
              <th scope="col" title="Near an extremum of u2 the delay hardly changes with temperature">
                Sensitivity
              </th>
            </tr>
          </thead>
          <tbody>
            {sensors.map((s, row) => (
              <tr key={s.id}>
                <th scope="row" className="results-sensor">
                  <span className="swatch" style={{ background: themedColour(sensorColour(row), theme) }} aria-hidden="true" />
                  {s.label} <span className="results-sensor__id">({s.id})</span>
                </th>
                {COLUMNS.map((c, i) =>
                  c.key === 'timing' ? (
                    <td key={c.key} className="num" data-column={c.key} title={pickerTimingText(s, units[i] ?? null)}>
                      {s.timingLowerLimit && s.timingSd_s !== null ? '≥ ' : ''}
                      {cellText(c.value(s), c, units[i] ?? null)}
                    </td>
                  ) : (
                    <td key={c.key} className="num" data-column={c.key}>
                      {cellText(c.value(s), c, units[i] ?? null)}
                    </td>
                  ),
                )}
                <td data-column="meets">{meetsText(s)}</td>
                <td data-column="shortest">{s.shortestDistanceForTarget_m === null ? <span title={s.shortestDistanceNote}>not reachable: {s.shortestDistanceNote.replace(/^Not reachable( for [^:]*)?: /, '')}</span> : formatLength(s.shortestDistanceForTarget_m, ladders)}</td>
                <td>{sensitivity(s)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function cellText(value: number | null, column: Column, unit: DisplayUnit | null): string {
  if (value === null || !Number.isFinite(value)) return '—';
  if (column.count) return value.toLocaleString('en-GB');
  return formatSignificant(unit ? inUnit(value, unit) : value, column.digits ?? 4);
}

/** Each picker's timing sd, for the timing cell's tooltip. */
export function pickerTimingText(s: SensorPlanResult, unit: DisplayUnit | null): string | undefined {
  const t = s.timingSdByPicker_s;
  if (!t) return undefined;
  const shown = (v: number | null) => (v === null ? '—' : `${formatSignificant(unit ? inUnit(v, unit) : v, 2)}${unit ? ` ${unit.shown}` : ' s'}`);
  const limit = s.timingLowerLimit ? ' Small-noise figures: with SNR below 10 these are lower limits (rehearse to see the spread).' : '';
  return `By picker: fraction 0.5 ${shown(t.fraction)} (shown), threshold 5σ ${shown(t.threshold)}, peak ${shown(t.peak)}, cross-correlation with the drive ${shown(t.xcorr)}.${limit}`;
}

function formatLength(x: number, ladders: ShownLadders): string {
  const unit = unitForColumn([x], ladders.length);
  return `${formatSignificant(inUnit(x, unit), 3)} ${unit.shown}`;
}

/** "yes (change sd 0.09 mK)": the verdict and which sd it used. */
function meetsText(s: SensorPlanResult): string {
  if (s.meetsTarget === null) return '—';
  const sd = s.targetKind === 'absolute' ? s.temperatureSdWithModel_K : s.temperatureChangeSd_K;
  const which = s.targetKind === 'absolute' ? 'absolute sd with the u₂ curve' : 'sd of changes';
  return `${s.meetsTarget ? 'yes' : 'no'} (${which}, ${sd === null ? '—' : `${formatSignificant(sd * 1e3, 2)} mK`})`;
}

function sensitivity(s: SensorPlanResult): ReactNode {
  if (s.temperatureSd_K === null) return <span className="muted">—</span>;
  return s.insensitive ? (
    <span className="badge badge--model" title="Near an extremum of u2: the delay pins the temperature poorly">
      ⚠ insensitive
    </span>
  ) : (
    <span className="badge badge--superfluid">✓ usable</span>
  );
}
