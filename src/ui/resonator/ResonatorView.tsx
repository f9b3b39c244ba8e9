import { useEffect } from 'react';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { loadResonatorDemo } from './load-demo';
import { ResonatorCautions } from './ResonatorCautions';
import { ResonatorLockin } from './ResonatorLockin';
import { ResonatorPlan } from './ResonatorPlan';
import { ResonatorReading, ResonatorSweep } from './ResonatorSweep';

/** Standing waves: plan a resonator, read a sweep (temperature, line density), follow a lock-in record. */
export function ResonatorView() {
  useDemoOnFirstOpen();
  const status = useSekundoStore((s) => s.resonatorStatus);
  if (status !== 'ready') {
    return (
      <p className="resonator-loading" role="status">
        Loading the demo resonator…
      </p>
    );
  }
  return (
    <div className="resonator">
      <PanelErrorBoundary panel="resonator bar">
        <ResonatorBar />
      </PanelErrorBoundary>
      <div className="resonator-top">
        <PanelErrorBoundary panel="resonator plan">
          <ResonatorPlan />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="frequency sweep">
          <ResonatorSweep />
        </PanelErrorBoundary>
      </div>
      <PanelErrorBoundary panel="temperature and line density">
        <ResonatorReading />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="lock-in record">
        <ResonatorLockin />
      </PanelErrorBoundary>
      <ResonatorCautions />
    </div>
  );
}

function ResonatorBar() {
  const origin = useSekundoStore((s) => s.resonatorOrigin);
  const note = useSekundoStore((s) => s.resonatorNote);
  const begin = useSekundoStore((s) => s.beginResonatorLoad);
  const finish = useSekundoStore((s) => s.finishResonatorLoad);
  return (
    <div className="resonator-bar">
      <p>
        {origin ? (
          <>
            Showing the <strong>{origin}</strong>: invented files of a fictional lab, not a measurement.
          </>
        ) : (
          'Your own resonator and files.'
        )}
      </p>
      <button
        type="button"
        className="button button--small"
        onClick={() => {
          begin();
          void loadResonatorDemo().then(finish);
        }}
      >
        Open the demo
      </button>
      {note ? (
        <p className="field-error" role="status">
          {note}
        </p>
      ) : null}
    </div>
  );
}

/** Opens the demo the first time the view is shown (its defaults, with a note, if it cannot be had). */
function useDemoOnFirstOpen(): void {
  const begin = useSekundoStore((s) => s.beginResonatorLoad);
  const finish = useSekundoStore((s) => s.finishResonatorLoad);
  useEffect(() => {
    if (useSekundoStore.getState().resonatorStatus !== 'idle') return;
    begin();
    void loadResonatorDemo().then(finish);
  }, [begin, finish]);
}
