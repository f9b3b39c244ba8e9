import { AboutCautions } from '../src/ui/about/AboutCautions';
import { FractionsChart } from '../src/ui/charts/FractionsChart';
import { SpeedsChart } from '../src/ui/charts/SpeedsChart';
import { ThermometryChart } from '../src/ui/charts/ThermometryChart';
import { AppHeader } from '../src/ui/layout/AppHeader';
import { PanelErrorBoundary } from '../src/ui/layout/PanelErrorBoundary';
import { PropertiesTable } from '../src/ui/properties/PropertiesTable';
import { StateSummary } from '../src/ui/properties/StateSummary';
import { TemperatureControl } from '../src/ui/temperature/TemperatureControl';

/** The property explorer: choose a temperature, read every property, see where it sits on the curves. */
export function App() {
  return (
    <>
      <a className="skip-link" href="#explorer">
        Skip to the explorer
      </a>
      <AppHeader />
      <main id="explorer" className="page">
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
      </main>
      <footer className="app-footer">
        <p>
          Sekundo computes everything in your browser; it sends nothing anywhere. A planning aid, not a safety system.
        </p>
      </footer>
    </>
  );
}
