import type { PlanWarning } from '../../physics';
import { CsvExportButton } from '../export/CsvExportButton';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from './use-shown-ladders';
import { warningFigures, warningsCsv } from './warning-figures';

const SEVERITY_ORDER: Record<PlanWarning['severity'], number> = { stop: 0, caution: 1, info: 2 };
const SEVERITY_TEXT: Record<PlanWarning['severity'], string> = { stop: 'Stop', caution: 'Caution', info: 'Note' };

/** Counts of the plan's warnings by severity, as icon and words, linking to the list (for the plan bar). */
export function WarningCounts() {
  const outcome = usePlanOutcome();
  if (!outcome.ok) return null;
  const warnings = outcome.result.warnings;
  return (
    <a className="plan-warnings__counts plan-warnings__counts--link" href="#planner-warnings-title">
      {(['stop', 'caution', 'info'] as const).map((sev) => {
        const n = warnings.filter((w) => w.severity === sev).length;
        return (
          <span key={sev} className={`warning-count warning-count--${sev}`}>
            <SeverityIcon severity={sev} /> {n} {SEVERITY_TEXT[sev].toLowerCase()}
            {n === 1 ? '' : 's'}
          </span>
        );
      })}
    </a>
  );
}

/** The plan's warnings, most severe first: icon and word for the severity, message, the number and its limit, the sensor. */
export function WarningsList() {
  const outcome = usePlanOutcome();
  const ladders = useShownLadders();
  if (!outcome.ok) return null;
  const labels = new Map(outcome.result.sensors.map((s) => [s.id, s.label]));
  const warnings = [...outcome.result.warnings].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
  const counts = (['stop', 'caution', 'info'] as const).map((sev) => ({ sev, n: warnings.filter((w) => w.severity === sev).length }));
  return (
    <section className="card plan-warnings" aria-labelledby="planner-warnings-title">
      <div className="card-head">
        <h3 id="planner-warnings-title" className="card-title">
          Warnings
        </h3>
        <p className="plan-warnings__counts">
          {counts.map(({ sev, n }) => (
            <span key={sev} className={`warning-count warning-count--${sev}`}>
              <SeverityIcon severity={sev} /> {n} {SEVERITY_TEXT[sev].toLowerCase()}
              {n === 1 ? '' : 's'}
            </span>
          ))}
        </p>
        <CsvExportButton
          table={() => warningsCsv(warnings, labels)}
          fileName="plan-warnings.csv"
          what="the plan's warnings"
          disabled={warnings.length === 0}
        />
      </div>
      {warnings.length === 0 ? (
        <p className="muted">Nothing to warn about for this plan.</p>
      ) : (
        <ul className="warning-list" aria-label="Plan warnings">
          {warnings.map((w, i) => (
            // Warnings have no id; the same code can come once per sensor.
            // biome-ignore lint/suspicious/noArrayIndexKey: order is stable for one result
            <li key={`${w.code}-${w.sensorId ?? 'plan'}-${i}`} className={`warning warning--${w.severity}`} data-code={w.code}>
              <span className="warning__severity">
                <SeverityIcon severity={w.severity} />
                <span>{SEVERITY_TEXT[w.severity]}</span>
              </span>
              <div className="warning__body">
                <p className="warning__message">{w.message}</p>
                <p className="warning__figures">
                  {w.sensorId !== null ? <span className="warning__sensor">Sensor {labels.get(w.sensorId) ?? w.sensorId} ({w.sensorId}) · </span> : null}
                  {warningFigures(w, ladders)}
                </p>
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** A shape per severity (octagon, triangle, circle), so it does not rest on colour alone. */
export function SeverityIcon({ severity }: { severity: PlanWarning['severity'] }) {
  return (
    <svg className={`severity-icon severity-icon--${severity}`} viewBox="0 0 16 16" width="16" height="16" aria-hidden="true" focusable="false">
      {severity === 'stop' ? (
        <>
          <path d="M5 1h6l4 4v6l-4 4H5l-4-4V5z" />
          <path d="M5.5 5.5l5 5M10.5 5.5l-5 5" className="severity-icon__mark" />
        </>
      ) : severity === 'caution' ? (
        <>
          <path d="M8 1.2l7 13.3H1z" />
          <path d="M8 6v4.2M8 12.2v.1" className="severity-icon__mark" />
        </>
      ) : (
        <>
          <circle cx="8" cy="8" r="7" />
          <path d="M8 7v4.5M8 4.6v.1" className="severity-icon__mark" />
        </>
      )}
    </svg>
  );
}
