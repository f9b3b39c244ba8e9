import { UpdatingNote } from '../layout/UpdatingNote';
import { useLocateRequests, useLocateUpdating } from './use-locate';
import { useEffect } from 'react';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { useSekundoStore } from '../store';
import { loadLocateDemo } from './load-demo';
import { LocateBar } from './LocateBar';
import { LocateOptions } from './LocateOptions';
import { LocateProjections } from './LocateProjections';
import { LocateQualityMap } from './LocateQualityMap';
import { LocateResiduals } from './LocateResiduals';
import { LocateSensors } from './LocateSensors';
import { LocateSummary } from './LocateSummary';
import { LocateTraces } from './LocateTraces';

/** Where is the heat source? Sensors and arrival times → the source, its regions, residuals; and how good a layout is. */
export function LocateView() {
  useDemoOnFirstOpen();
  const status = useSekundoStore((s) => s.locateStatus);
  if (status !== 'ready') {
    return (
      <p className="locate-loading" role="status">
        Loading the demo sensors…
      </p>
    );
  }
  return (
    <div className="locate">
      <LocateRequests />
      <LocateUpdating />
      <PanelErrorBoundary panel="sensor data bar">
        <LocateBar />
      </PanelErrorBoundary>
      <div className="locate-top">
        <div className="locate-side">
          <PanelErrorBoundary panel="located source">
            <LocateSummary />
          </PanelErrorBoundary>
          <PanelErrorBoundary panel="fit options">
            <LocateOptions />
          </PanelErrorBoundary>
        </div>
        <PanelErrorBoundary panel="projections">
          <LocateProjections />
        </PanelErrorBoundary>
      </div>
      <div className="locate-middle">
        <PanelErrorBoundary panel="sensor table">
          <LocateSensors />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="residuals">
          <LocateResiduals />
        </PanelErrorBoundary>
      </div>
      <PanelErrorBoundary panel="arrival times from traces">
        <LocateTraces />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="layout-quality map">
        <LocateQualityMap />
      </PanelErrorBoundary>
    </div>
  );
}

/** Opens the demo the first time the view is shown (a built-in layout if it cannot be had). */
function useDemoOnFirstOpen(): void {
  const begin = useSekundoStore((s) => s.beginLocateLoad);
  const load = useSekundoStore((s) => s.loadLocateSensors);
  useEffect(() => {
    if (useSekundoStore.getState().locateStatus !== 'idle') return;
    begin();
    void loadLocateDemo().then(({ sensors, origin }) => load(sensors, origin));
  }, [begin, load]);
}

/** Asks the locate worker for each new set of inputs; renders nothing (only it follows every keystroke). */
function LocateRequests() {
  useLocateRequests();
  return null;
}

/** While the locate worker fits newer inputs, the fit on screen is the last one: say so. */
function LocateUpdating() {
  return <UpdatingNote updating={useLocateUpdating()} text="Locating the source again for your latest edit… the fit below is for the inputs before it." />;
}
