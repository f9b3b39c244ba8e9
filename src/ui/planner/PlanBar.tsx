import { useRef, useState } from 'react';
import { useSekundoStore } from '../store';
import { replaceOpenPlan } from '../workspace/keep-plan';
import { describePlanMessage } from './plan-paths';
import { NEW_PLAN } from './default-plan';
import { loadDemoPlan } from './load-demo';
import { PlanDescription } from './PlanDescription';
import { TextField } from '../fields/QuantityField';
import { usePlanText } from './use-plan-field';
import { setPlanName } from './plan-edits';
import { downloadPlanFile, migrationText, readPlanFile } from './plan-file-actions';
import { useRecomputeTimes } from './recompute-timer';
import { WarningCounts } from './WarningsList';

const SOURCE_LABEL = {
  demo: 'Demo plan (invented setup)',
  'built-in': 'Built-in plan',
  new: 'New plan',
  file: 'From a file',
  restored: 'Restored from your last visit',
  saved: 'Saved plan',
  link: 'From a shared link',
} as const;

/** The plan's name and origin, opening and saving plan files. */
export function PlanBar() {
  const source = useSekundoStore((s) => s.plannerSource);
  const [fileProblem, setFileProblem] = useState<{ name: string; errors: string[] } | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const name = usePlanText('plan.name', (p) => p.name, (p, text) => setPlanName(p, text));

  const open = async (file: File) => {
    const read = await readPlanFile(file);
    if (read.ok) {
      setFileProblem(null);
      const migrated = migrationText(read.migrated);
      replaceOpenPlan(read.plan, { kind: 'file', note: `Opened “${file.name}”.${migrated ? ` ${migrated}` : ''}` }, `opening “${file.name}”`);
    } else {
      setFileProblem({ name: file.name, errors: read.errors });
    }
  };
  const reloadDemo = async () => {
    const demo = await loadDemoPlan();
    setFileProblem(null);
    replaceOpenPlan(demo.plan, demo.source, 'opening the demo');
  };
  const startNew = () => {
    setFileProblem(null);
    replaceOpenPlan(NEW_PLAN, { kind: 'new', note: null }, 'starting a new plan');
  };

  return (
    <section className="card plan-bar" aria-label="Plan">
      <div className="plan-bar__main">
        <TextField {...name} className="plan-bar__name" label="Plan name" />
        <div className="plan-bar__source">
          <span className={`badge plan-source plan-source--${source.kind}`}>{SOURCE_LABEL[source.kind]}</span>
          <WarningCounts />
          <RecomputeTime />
        </div>
        <div className="plan-bar__actions">
          <button type="button" className="button button--small" onClick={() => input.current?.click()}>
            Open plan file…
          </button>
          <input
            ref={input}
            type="file"
            accept=".json,application/json"
            className="visually-hidden"
            tabIndex={-1}
            aria-label="Plan file to open"
            onChange={(event) => {
              const file = event.target.files?.[0];
              event.target.value = '';
              if (file) void open(file);
            }}
          />
          <button type="button" className="button button--small" onClick={() => downloadPlanFile(useSekundoStore.getState().plannerPlan)}>
            Save plan file
          </button>
          <button type="button" className="button button--small" onClick={startNew}>
            New plan
          </button>
          <button type="button" className="button button--small" onClick={() => void reloadDemo()}>
            Open the demo
          </button>
        </div>
      </div>
      {source.note ? (
        <p className={source.kind === 'built-in' ? 'plan-bar__note plan-bar__note--warn' : 'plan-bar__note'} role="status">
          {source.note}
        </p>
      ) : null}
      <PlanDescription />
      {fileProblem ? (
        <div className="field-error plan-bar__file-error" role="alert">
          <p>
            “{fileProblem.name}” was not opened; the current plan is kept. {fileProblem.errors.length === 1 ? 'Problem:' : 'Problems:'}
          </p>
          <ul>
            {fileProblem.errors.map((e) => (
              <li key={e}>{describePlanMessage(e)}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}

/**
 * The edit → redrawn results and timeline time, measured in this browser, kept as data attributes
 * for the browser tests and benchmarks only: it is not shown to users.
 */
function RecomputeTime() {
  const times = useRecomputeTimes();
  if (times.timeline_ms === null) return <span className="recompute-time" data-recompute-ms="" hidden />;
  return (
    <span
      className="recompute-time"
      hidden
      data-recompute-ms={times.timeline_ms.toFixed(2)}
      data-map-ms={times.map_ms?.toFixed(2) ?? ''}
      data-edits={times.edits}
    />
  );
}
