import { useEffect } from 'react';
import { UpdatingNote } from '../layout/UpdatingNote';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { BathEditor } from './BathEditor';
import { DigitiserEditor } from './DigitiserEditor';
import { HeaterEditor } from './HeaterEditor';
import { HeaterSummary } from './HeaterSummary';
import { loadDemoPlan } from './load-demo';
import { PlanBar } from './PlanBar';
import { RehearseSection } from './rehearse/RehearseSection';
import { ResolutionMap } from './ResolutionMap';
import { ResultsTable } from './ResultsTable';
import { SensorsEditor } from './SensorsEditor';
import { SetupEditor } from './SetupEditor';
import { TimelineChart } from './TimelineChart';
import { usePlanOutcome, usePlanUpdating, useRequestPlans } from './use-plan';
import { WarningsList } from './WarningsList';
import { WorkspaceBar } from '../workspace/WorkspaceBar';

/** The measurement planner: edit a proposed setup and see arrivals, signals, warnings and resolution. */
export function PlannerView() {
  useDemoPlanOnFirstOpen();
  const status = useSekundoStore((s) => s.plannerStatus);
  if (status !== 'ready') {
    return (
      <p className="planner-loading" role="status">
        Loading the demo plan…
      </p>
    );
  }
  return (
    <div className="planner">
      <PanelErrorBoundary panel="plan bar">
        <PlanBar />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="workspace bar">
        <WorkspaceBar />
      </PanelErrorBoundary>
      <PlanRequests />
      <PlanProblem />
      <PlanUpdating />
      <div className="planner-top">
        <div className="planner-inputs">
          <BathEditor />
          <HeaterEditor />
          <DigitiserEditor />
          <SetupEditor />
        </div>
        <div className="planner-outputs">
          <PanelErrorBoundary panel="timeline">
            <TimelineChart />
          </PanelErrorBoundary>
          <PanelErrorBoundary panel="warnings list">
            <WarningsList />
          </PanelErrorBoundary>
        </div>
      </div>
      <SensorsEditor />
      <PanelErrorBoundary panel="heater summary">
        <HeaterSummary />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="results table">
        <ResultsTable />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="resolution map">
        <ResolutionMap />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="rehearsal">
        <RehearseSection />
      </PanelErrorBoundary>
    </div>
  );
}

/** Opens the demo plan the first time the planner is shown (the built-in plan if it cannot be had). */
function useDemoPlanOnFirstOpen(): void {
  const begin = useSekundoStore((s) => s.beginPlannerLoad);
  const load = useSekundoStore((s) => s.loadPlannerPlan);
  useEffect(() => {
    if (useSekundoStore.getState().plannerStatus !== 'idle') return;
    begin();
    // Unless something else (a shared link, a file) was opened while the demo was on its way.
    void loadDemoPlan().then(({ plan, source }) => {
      if (useSekundoStore.getState().plannerStatus === 'loading') load(plan, source);
    });
  }, [begin, load]);
}

/** Asks the plan worker for each new plan; renders nothing (only it re-renders on every edit). */
function PlanRequests() {
  useRequestPlans();
  return null;
}

/** When the kernel refuses the plan as a whole (e.g. one opened from a file), say why; the plan is kept as it is. */
function PlanProblem() {
  const outcome = usePlanOutcome();
  if (outcome.ok || outcome.pending) return null;
  return (
    <div className="panel-failure plan-problem" role="alert">
      <p>
        <strong>No results for this plan.</strong> {outcome.message}
      </p>
      <p>The plan is kept as it is; change the field named above.</p>
    </div>
  );
}

/** While the plan worker computes a newer plan, the results on screen are the last ones: say so. */
function PlanUpdating() {
  const updating = usePlanUpdating();
  const outcome = usePlanOutcome();
  const first = !outcome.ok && outcome.pending === true;
  return (
    <UpdatingNote
      updating={updating}
      text={first ? 'Working out the results for this plan…' : 'Updating the results for your latest edit… the figures below are for the plan before it.'}
    />
  );
}
