import { AboutCautions } from '../about/AboutCautions';
import { FractionsChart } from '../charts/FractionsChart';
import { SpeedsChart } from '../charts/SpeedsChart';
import { ThermometryChart } from '../charts/ThermometryChart';
import { PanelErrorBoundary } from '../layout/PanelErrorBoundary';
import { PropertiesTable } from '../properties/PropertiesTable';
import { StateSummary } from '../properties/StateSummary';
import { TemperatureControl } from '../temperature/TemperatureControl';

/** The property explorer: choose a temperature, read every property, see where it sits on the curves. */
export function ExplorerView() {
  return (
    <>
      <div className="explorer">
        <div className="explorer-inputs">
          <PanelErrorBoundary panel="temperature control">
            <TemperatureControl />
          </PanelErrorBoundary>
          <PanelErrorBoundary panel="state summary">
            <StateSummary />
          </PanelErrorBoundary>
          <PanelErrorBoundary panel="properties table">
            <PropertiesTable />
          </PanelErrorBoundary>
        </div>
        <section className="explorer-charts" aria-labelledby="curves-title">
          <h2 id="curves-title" className="visually-hidden">
            Curves
          </h2>
          <SpeedsChart />
          <FractionsChart />
          <ThermometryChart />
        </section>
      </div>
      <PanelErrorBoundary panel="about and cautions section">
        <AboutCautions />
      </PanelErrorBoundary>
    </>
  );
}
