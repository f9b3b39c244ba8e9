import { useEffect, useRef } from 'react';
import { createPortal, flushSync } from 'react-dom';
import type { PlanFile } from '../../io/plan-file';
import type { PlanResult, SensorPlanResult } from '../../physics';
import { formatSignificant } from '../units/format-number';
import { derivePlan } from '../planner/derive-plan';
import { shownOutcomeFor } from '../planner/plan-engine';
import { type Ladder, LADDERS, readText, type ShownLadders, temperatureText } from '../units/ladders';
import { useShownLadders } from '../units/use-shown-ladders';
import { useSekundoStore } from '../store';
import { useWorkspaceStore } from './workspace-store';

/** A value for the sheet: four significant digits in the unit that suits it; "—" for none. */
function q(value: number | null | undefined, ladder: Ladder, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return readText(value, ladder, digits);
}

/** Energy with a prefix: "10 µJ", "1.2 mJ". */
function energy(joule: number): string {
  const [scale, unit] = joule >= 1 ? [1, 'J'] : joule >= 1e-3 ? [1e3, 'mJ'] : joule >= 1e-6 ? [1e6, 'µJ'] : [1e9, 'nJ'];
  return `${formatSignificant(joule * scale, 3)} ${unit}`;
}

function n(value: number | null | undefined, digits = 3): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : formatSignificant(value, digits);
}

/** Opens the setup sheet and the browser's print dialog (print to paper or to PDF). */
export function printSetupSheet(): void {
  useWorkspaceStore.setState({ sheetOpen: true });
  // Print once the sheet has been drawn.
  setTimeout(() => window.print(), 50);
}

export function closeSetupSheet(): void {
  useWorkspaceStore.setState({ sheetOpen: false });
}

/**
 * The printable setup sheet for the open plan, over the page: what the plan is, what each sensor
 * should see, the warnings, the temperature resolution, a checklist for before the cooldown with
 * the plan's numbers, and the cryogenic cautions. Tables only (no charts), so it prints legibly.
 * Printing from the browser's menu while the planner is on screen opens it too.
 */
export function SetupSheetHost() {
  const open = useWorkspaceStore((s) => s.sheetOpen);
  useEffect(() => {
    document.documentElement.classList.toggle('sheet-open', open);
    return () => document.documentElement.classList.remove('sheet-open');
  }, [open]);
  useEffect(() => {
    let openedForPrint = false;
    const before = () => {
      const main = useSekundoStore.getState();
      if (useWorkspaceStore.getState().sheetOpen || main.activeView !== 'planner' || main.plannerStatus !== 'ready') return;
      openedForPrint = true;
      flushSync(() => useWorkspaceStore.setState({ sheetOpen: true }));
    };
    const after = () => {
      if (openedForPrint) useWorkspaceStore.setState({ sheetOpen: false });
      openedForPrint = false;
    };
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);
  // Beside #root, not in it: on paper the app is hidden and the sheet alone prints.
  return open ? createPortal(<SetupSheetOverlay />, document.body) : null;
}

function SetupSheetOverlay() {
  const plan = useSekundoStore((s) => s.plannerPlan);
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  return (
    <div
      className="sheet-overlay"
      role="dialog"
      aria-modal="true"
      aria-labelledby="setup-sheet-title"
      onKeyDown={(event) => {
        if (event.key === 'Escape') closeSetupSheet();
      }}
    >
      <div className="sheet-toolbar">
        <button type="button" className="button" onClick={() => window.print()}>
          Print or save as PDF
        </button>
        <button type="button" className="button button--quiet" onClick={closeSetupSheet}>
          Back to the planner
        </button>
        <span className="muted">Choose “Save as PDF” in the print dialog for a file.</span>
      </div>
      <SetupSheet plan={plan} headingRef={heading} />
    </div>
  );
}

export function SetupSheet({ plan, headingRef }: { plan: PlanFile; headingRef?: React.Ref<HTMLHeadingElement> }) {
  // The results the planner already shows for this plan, else computed here (printing another plan).
  const outcome = shownOutcomeFor(plan) ?? derivePlan(plan);
  const printed = new Date().toISOString().slice(0, 16).replace('T', ' ');
  return (
    <article className="setup-sheet" aria-label="Setup sheet">
      <header className="sheet-head">
        <h2 id="setup-sheet-title" ref={headingRef} tabIndex={-1}>
          Setup sheet: {plan.name}
        </h2>
        <p className="sheet-meta">
          Sekundo plan file version {plan.version} · printed {printed} · linear-theory predictions for planning; check them against the apparatus.
        </p>
        {plan.notes ? <p className="sheet-notes">{plan.notes}</p> : null}
      </header>
      {outcome.ok ? (
        <>
          <PlanSummary plan={plan} result={outcome.result} vapour_Pa={outcome.bath.vapourPressure_Pa} />
          <Arrivals result={outcome.result} />
          <Warnings result={outcome.result} />
          <Resolution plan={plan} result={outcome.result} />
          <Checklist plan={plan} result={outcome.result} />
        </>
      ) : (
        <section className="sheet-section">
          <h3>No results for this plan</h3>
          <p>{outcome.message}</p>
        </section>
      )}
      <Cautions />
    </article>
  );
}

function PlanSummary({ plan, result, vapour_Pa }: { plan: PlanFile; result: PlanResult; vapour_Pa: number | null }) {
  const L = useShownLadders();
  const h = plan.heater;
  const shape = typeof h.shape === 'string' ? h.shape : `custom (${h.shape.custom.length} points)`;
  const rows: [string, string][] = [
    ['Bath temperature (T90)', `${temperatureText(result.temperature_K, L.temperature)}${vapour_Pa !== null ? ` (from a vapour pressure of ${readText(vapour_Pa, L.pressure, 5)})` : ''}`],
    ['Liquid above the setup', `${q(plan.bath.liquidDepth_m, L.length)} (head ${q(result.headPressure_Pa, L.pressure, 3)})`],
    ['Heater', heaterText(plan, result, L)],
    ['Heater limits', `strong heating from ${q(result.heater.strongHeatingFlux_W_m2, L.heatFlux, 2)} for this pulse (face reaches Tλ; 1-D Gorter–Mellink estimate, about ×2); counterflow ${result.heater.counterflowVelocity_m_s === null ? '—' : `${formatSignificant(result.heater.counterflowVelocity_m_s * 100, 3)} cm/s`}; shock after ${q(result.heater.shockDistance_m, L.length, 3)}${result.heater.shockEdge ? ` (${result.heater.shockEdge} edge)` : ''}`],
    ['Pulse', `${shape}${h.width_s !== undefined ? `, width ${q(h.width_s, L.time)}` : ''}, peak ${q(result.heater.power_W, LADDERS.power)} (${q(result.heater.flux_W_m2, L.heatFlux)})`],
    ['Repetition and averaging', `${n(h.repetitionRate_Hz, 4)} Hz, ${h.averages} pulses averaged; ${energy(result.heater.energyPerPulse_J)} per pulse, mean power ${q(result.heater.averagePower_W, LADDERS.power)}`],
    ['Digitiser', `${q(plan.digitiser.sampleRate_Hz, LADDERS.sampleRate)}, record ${q(plan.digitiser.recordLength_s, L.time)}, pre-trigger ${q(plan.digitiser.preTrigger_s, L.time)}`],
    ['Spacer', `${plan.spacer.materialId}; distances measured ${plan.spacer.measuredWarm ? 'warm (contraction applied)' : 'cold'}`],
    [
      'Reflecting planes (cold)',
      result.planes.length === 0 ? 'none' : result.planes.map((r) => `${r.label} (${r.axis} = ${q(r.position_m, L.length)}, R = ${r.reflection.toFixed(4)}, ${r.source === 'measured' ? 'measured' : 'solid wall'})`).join('; '),
    ],
    ['Why these R', result.planes.length === 0 ? '—' : [...new Set(result.planes.map((r) => r.note))].join(' ')],
    ['Targets', `SNR ${n(plan.targets.snr)}, temperature sd ${q(plan.targets.temperatureSd_K, LADDERS.temperatureDifference)} for ${plan.targets.temperatureKind === 'absolute' ? 'an absolute reading (u₂ curve included)' : 'a change between readings'}`],
  ];
  return (
    <section className="sheet-section">
      <h3>Plan summary</h3>
      <table className="sheet-table sheet-table--pairs">
        <tbody>
          {rows.map(([k, v]) => (
            <tr key={k}>
              <th scope="row">{k}</th>
              <td>{v}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

function heaterText(plan: PlanFile, result: PlanResult, L: ShownLadders): string {
  const h = plan.heater;
  const size =
    h.geometry === 'rectangle'
      ? `rectangle ${q(h.width_m, L.length)} × ${q(h.height_m, L.length)}`
      : h.geometry === 'disk'
        ? `disk, radius ${q(h.radius_m, L.length)}`
        : `point source ${h.mount === 'free' ? 'free in the liquid (4π)' : 'on a wall (2π)'}, nominal area ${q(h.area_m2, LADDERS.area)}`;
  const range = result.heater.planeWaveRange_m;
  const which = h.geometry === 'disk' ? 'the radius' : 'half the shorter side';
  const plane =
    range === null || result.heater.planeWaveEdge_m === null
      ? ''
      : `; computed with its size (baffled piston): the plane-wave value ${q(result.heater.faceDeltaT_K, LADDERS.temperatureDifference, 3)} holds up to about ${q(range, L.length, 3)} on the axis (a²/(2u₂τ), a = ${q(result.heater.planeWaveEdge_m, L.length, 3)}, ${which})`;
  return `${size}${plane}`;
}

function firstEcho(s: SensorPlanResult, L: ShownLadders): string {
  const e = s.echoes[0];
  return e ? `${q(e.arrival_s, L.time)} (${s.echoes.length})` : '—';
}

function Arrivals({ result }: { result: PlanResult }) {
  const L = useShownLadders();
  return (
    <section className="sheet-section">
      <h3>Expected arrivals and amplitudes</h3>
      <table className="sheet-table">
        <thead>
          <tr>
            <th scope="col">Sensor</th>
            <th scope="col">Cold path</th>
            <th scope="col">First sound</th>
            <th scope="col">Second sound</th>
            <th scope="col">First echo (count)</th>
            <th scope="col">δT peak</th>
            <th scope="col">Signal</th>
            <th scope="col">SNR averaged</th>
          </tr>
        </thead>
        <tbody>
          {result.sensors.map((s) => (
            <tr key={s.id}>
              <th scope="row">
                {s.label} <span className="sheet-id">({s.id})</span>
              </th>
              <td>
                {q(s.pathLength_m, L.length)} ± {q(s.pathLengthSd_m, L.length, 2)}
              </td>
              <td>{q(s.firstSoundArrival_s, L.time)}</td>
              <td>{q(s.secondSoundArrival_s, L.time)}</td>
              <td>{firstEcho(s, L)}</td>
              <td>{q(s.amplitude_K, LADDERS.temperatureDifference, 3)}</td>
              <td>{q(s.signal_V, LADDERS.voltage, 3)}</td>
              <td>{n(s.snrAveraged)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="sheet-small">
        Times after the heater pulse starts; first and second sound both include each sensor's lag. Record: {q(result.record.start_s, L.time)} to {q(result.record.end_s, L.time)}.
      </p>
    </section>
  );
}

const SEVERITY = { stop: 'Stop', caution: 'Caution', info: 'Note' } as const;

function Warnings({ result }: { result: PlanResult }) {
  return (
    <section className="sheet-section">
      <h3>Warnings ({result.warnings.length})</h3>
      {result.warnings.length === 0 ? (
        <p>None for this plan.</p>
      ) : (
        <ul className="sheet-warnings">
          {result.warnings.map((w) => (
            <li key={`${w.code}-${w.sensorId ?? ''}-${w.message}`} className={`sheet-warning sheet-warning--${w.severity}`}>
              <strong>{SEVERITY[w.severity]}:</strong> {w.message}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Resolution({ plan, result }: { plan: PlanFile; result: PlanResult }) {
  return (
    <section className="sheet-section">
      <h3>Temperature resolution (one reading of {plan.heater.averages} averaged pulses)</h3>
      <table className="sheet-table">
        <thead>
          <tr>
            <th scope="col">Sensor</th>
            <th scope="col">Timing sd</th>
            <th scope="col">T sd</th>
            <th scope="col">T sd with u2 table</th>
            <th scope="col">T sd of changes</th>
            <th scope="col">
              Meets target ({q(plan.targets.temperatureSd_K, LADDERS.temperatureDifference, 3)}, {plan.targets.temperatureKind === 'absolute' ? 'absolute, by the sd with the u2 table' : 'change, by the sd of changes'})?
            </th>
            <th scope="col">Shortest distance for target</th>
          </tr>
        </thead>
        <tbody>
          {result.sensors.map((s) => (
            <tr key={s.id}>
              <th scope="row">{s.label}</th>
              <td>{q(s.timingSd_s, LADDERS.time, 2)}</td>
              <td>{q(s.temperatureSd_K, LADDERS.temperatureDifference, 2)}</td>
              <td>{q(s.temperatureSdWithModel_K, LADDERS.temperatureDifference, 2)}</td>
              <td>{q(s.temperatureChangeSd_K, LADDERS.temperatureDifference, 2)}</td>
              <td>
                {s.meetsTarget === null ? '—' : s.meetsTarget ? 'yes' : 'no'}
                {s.insensitive ? ' (insensitive here)' : ''}
              </td>
              <td>{s.shortestDistanceForTarget_m === null ? s.shortestDistanceNote || '—' : q(s.shortestDistanceForTarget_m, LADDERS.length, 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

function Tick({ children }: { children: React.ReactNode }) {
  return (
    <li className="sheet-check">
      <span className="sheet-box" aria-hidden="true" />
      <span>{children}</span>
    </li>
  );
}

function Checklist({ plan, result }: { plan: PlanFile; result: PlanResult }) {
  const L = useShownLadders();
  const power = result.heater.power_W;
  const volts = (ohm: number) => `${formatSignificant(Math.sqrt(power * ohm), 3)} V`;
  const lastArrival = Math.max(...result.sensors.map((s) => s.secondSoundArrival_s ?? s.firstSoundArrival_s));
  return (
    <section className="sheet-section sheet-checklist">
      <h3>Before the cooldown</h3>
      <ul className="sheet-checks">
        <Tick>
          <strong>Wiring.</strong> Heater leads and {result.sensors.length} sensor {result.sensors.length === 1 ? 'channel' : 'channels'} ({result.sensors.map((s) => s.label).join('; ')}) traced from the
          insert to the instruments; continuity checked and no short to the cryostat. Channel numbers: ____________________
        </Tick>
        <Tick>
          <strong>Heater resistance at room temperature:</strong> R = ________ Ω (write down; it changes on cooling). For the planned peak of{' '}
          {q(power, LADDERS.power)} the pulse needs V = √(P·R): {volts(10)} at 10 Ω, {volts(50)} at 50 Ω, {volts(100)} at 100 Ω.
        </Tick>
        <Tick>
          <strong>Sensor responsivity:</strong>{' '}
          {result.sensors.map((s, i) => (
            <span key={s.id}>
              {i > 0 ? '; ' : ''}
              {s.label}: planned {q(plan.sensors[i]?.responsivity_V_K, LADDERS.responsivity, 3)}, noise {q(plan.sensors[i]?.noise_V, LADDERS.voltage, 3)} rms
            </span>
          ))}
          . Bias set and response checked: ________
        </Tick>
        <Tick>
          <strong>Trigger:</strong> the pulse generator triggers the digitiser at {n(plan.heater.repetitionRate_Hz, 4)} Hz, {plan.heater.averages} averages, pre-trigger{' '}
          {q(plan.digitiser.preTrigger_s, L.time)}; trigger edge and level checked on a scope.
        </Tick>
        <Tick>
          <strong>Record length:</strong> {q(plan.digitiser.recordLength_s, L.time)} at {q(plan.digitiser.sampleRate_Hz, LADDERS.sampleRate)}; the last direct arrival is expected at{' '}
          {q(lastArrival, L.time)}.
        </Tick>
        <Tick>
          <strong>Distances:</strong> measured {plan.spacer.measuredWarm ? 'warm' : 'cold'} on the {plan.spacer.materialId} spacer; values written on this sheet match the insert.
        </Tick>
      </ul>
    </section>
  );
}

function Cautions() {
  return (
    <section className="sheet-section sheet-cautions">
      <h3>Cryogenic cautions</h3>
      <ul>
        <li>
          <strong>Asphyxiation:</strong> boiling helium displaces air without warning; work in a ventilated room with an oxygen monitor, and never lean into a dewar or a pit.
        </li>
        <li>
          <strong>Cold burns:</strong> liquid, cold gas and cold metal burn skin and eyes; wear a face shield and loose insulated gloves when transferring.
        </li>
        <li>
          <strong>Pressure build-up:</strong> every volume that can trap liquid or cold gas needs a relief path; check relief valves and burst discs, and keep necks free of ice plugs.
        </li>
        <li>
          <strong>Heater wiring in vacuum:</strong> leads and films without liquid around them cannot shed heat; limit the supply current, and never pulse the heater at full power warm or in vacuum.
        </li>
      </ul>
      <p className="sheet-small">
        This sheet is a planning aid, not a safety procedure: follow your local codes, your institution's rules and licensed practice, and the people responsible for cryogen safety where you work.
      </p>
    </section>
  );
}
