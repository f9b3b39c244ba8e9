import { DB1998, ITS90, ITS90_RANGE_K, LANDAU } from '../../physics';
import { INSENSITIVE_SLOPE_M_S_K } from '../charts/curves';
import { CRITICAL_REGION_UK, MODEL_REGION_TEXT } from '../properties/regions';

/** Where the numbers come from, where they are models, and the hazards of the work itself. */
export function AboutCautions() {
  return (
    <section className="about" aria-labelledby="about-title">
      <h2 id="about-title">About and cautions</h2>
      <div className="about-grid">
        <DataSources />
        <ModelRegions />
        <CryogenicSafety />
      </div>
    </section>
  );
}

function DataSources() {
  return (
    <div className="card about-card">
      <h3 className="card-title">Data sources</h3>
      <ul className="plain-list">
        <li>
          Liquid helium-4 properties along the saturated vapour pressure: <cite>{DB1998}</cite>.
        </li>
        <li>
          Vapour pressure from {ITS90_RANGE_K[0]} K: <cite>{ITS90}</cite>.
        </li>
        <li>
          Below the measured second-sound curve: <cite>{LANDAU}</cite>.
        </li>
      </ul>
      <p className="muted">
        Temperatures are on ITS-90 (T90). Values are shown to four significant digits, or, where the reference states
        an uncertainty, to the digit it supports; ± is one standard deviation, to one or two digits.
      </p>
    </div>
  );
}

function ModelRegions() {
  return (
    <div className="card about-card">
      <h3 className="card-title">Model regions</h3>
      <ul className="plain-list">
        <li>
          <strong>{MODEL_REGION_TEXT}:</strong> second sound from the Landau phonon–roton model, joined smoothly to the
          measured curve. An extrapolation: below about 0.5 K second sound stops being a hydrodynamic wave.
        </li>
        <li>
          <strong>Within about {CRITICAL_REGION_UK} µK of Tλ:</strong> a critical power law takes u₂ to zero at Tλ.
        </li>
        <li>
          <strong>Below {ITS90_RANGE_K[0]} K:</strong> the vapour pressure is a reference spline, not ITS-90; below 0.5
          K there is none.
        </li>
        <li>
          <strong>|du₂/dT| &lt; {INSENSITIVE_SLOPE_M_S_K} m/s/K:</strong> a planning threshold of this tool, not a
          published one; time-of-flight thermometry is insensitive there.
        </li>
      </ul>
    </div>
  );
}

function CryogenicSafety() {
  return (
    <div className="card about-card about-card--caution">
      <h3 className="card-title">Cryogenic hazards</h3>
      <ul className="plain-list">
        <li>
          <strong>Asphyxiation:</strong> boiling helium displaces air; in a closed or small room the oxygen level can
          fall without warning.
        </li>
        <li>
          <strong>Cold burns:</strong> liquid helium and the surfaces it cools freeze skin and make metal brittle.
        </li>
        <li>
          <strong>Pressure build-up:</strong> helium trapped in a closed volume warms and expands enormously; every such
          volume needs a relief valve or burst disc.
        </li>
        <li>
          <strong>Heater wiring in vacuum:</strong> with no gas to carry heat away, wires and heaters overheat at powers
          that are harmless in air.
        </li>
      </ul>
      <p className="caution-note">
        Sekundo is a planning aid, not a safety system. Follow your local codes and your laboratory's licensed safety
        practice; they take precedence over anything shown here.
      </p>
    </div>
  );
}
