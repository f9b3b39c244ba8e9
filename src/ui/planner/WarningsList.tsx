import type { PlanWarning } from '../../physics';
import { CsvExportButton } from '../export/CsvExportButton';
import { usePlanOutcome } from './use-plan';
import { useShownLadders } from '../units/use-shown-ladders';
import { warningFigures, warningsCsv } from './warning-figures';

const SEVERITY_ORDER: Record<PlanWarning['severity'], number> = { stop: 0, caution: 1, info: 2 };
const SEVERITY_TEXT: Record<PlanWarning['severity'], string> = { stop: 'Stop', caution: 'Caution', info: 'Note' };

/** Counts of the plan's warnings by severity as one tally strip, linking to the list (for the plan bar). */
export function WarningCounts() {
  const outcome = usePlanOutcome();
  if (!outcome.ok) return null;
  return (
    <a className="severity-tally severity-tally--link" href="#planner-warnings-title" aria-label={`Warnings: ${tallyWords(outcome.result.warnings)}`}>
      <TallyParts warnings={outcome.result.warnings} />
    </a>
  );
}

const SEVERITIES = ['stop', 'caution', 'info'] as const;

/** "1 stop · 2 cautions · 0 notes": the tally read as words. */
function tallyWords(warnings: readonly PlanWarning[]): string {
  return SEVERITIES.map((sev) => countWords(sev, warnings.filter((w) => w.severity === sev).length)).join(' · ');
}

function countWords(severity: PlanWarning['severity'], n: number): string {
  return `${n} ${SEVERITY_TEXT[severity].toLowerCase()}${n === 1 ? '' : 's'}`;
}

/**
 * Sekundo's warning tally: one strip of three parts, stop · caution · note, each with its mark and
 * count; a part with nothing in it is drawn faint, so the eye goes to what is there.
 */
function TallyParts({ warnings }: { warnings: readonly PlanWarning[] }) {
  return (
    <>
      {SEVERITIES.map((sev, i) => {
        const n = warnings.filter((w) => w.severity === sev).length;
        return (
          <span key={sev} className={`severity-tally__part severity-tally__part--${sev}`} data-empty={n === 0}>
            {i > 0 ? <span className="visually-hidden"> · </span> : null}
            <SeverityMark severity={sev} />
            {countWords(sev, n)}
          </span>
        );
      })}
    </>
  );
}

/** The plan's warnings, most severe first: icon and word for the severity, message, the number and its limit, the sensor. */
export function WarningsList() {
  const outcome = usePlanOutcome();
  const ladders = useShownLadders();
  if (!outcome.ok) return null;
  const labels = new Map(outcome.result.sensors.map((s) => [s.id, s.label]));
  const warnings = [...outcome.result.warnings].sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
  return (
    <section className="card plan-warnings" aria-labelledby="planner-warnings-title">
      <div className="card-head">
        <h3 id="planner-warnings-title" className="card-title">
          Warnings
        </h3>
        <p className="severity-tally">
          <TallyParts warnings={warnings} />
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
                <SeverityMark severity={w.severity} />
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

/**
 * Sekundo's severity mark, drawn from the heater pulse that starts every measurement: a full square
 * for a stop, a square filled to half for a caution, an empty one for a note — three shapes, so it
 * never rests on colour alone.
 */
export function SeverityMark({ severity }: { severity: PlanWarning['severity'] }) {
  return (
    <svg className={`severity-mark severity-mark--${severity}`} viewBox="0 0 12 12" width="12" height="12" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="10" height="10" rx="1.5" className="severity-mark__frame" />
      {severity === 'info' ? null : <rect x="1" y={severity === 'stop' ? 1 : 6} width="10" height={severity === 'stop' ? 10 : 5} rx="1.5" className="severity-mark__fill" />}
    </svg>
  );
}
