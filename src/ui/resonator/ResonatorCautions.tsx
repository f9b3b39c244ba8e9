/** Where heaters and cryogens matter for a resonator measurement: the usual cautions, deferring to local codes. */
export function ResonatorCautions() {
  return (
    <section className="card about-card about-card--caution" aria-labelledby="resonator-cautions-title">
      <h2 id="resonator-cautions-title" className="card-title">
        Heaters, counterflow and cryogens
      </h2>
      <ul className="resonator-cautions">
        <li>The resonator’s heater film and any counterflow heater run in vacuum-insulated wiring: leads without helium gas around them carry little heat away and overheat at powers harmless in air. Limit the current and fuse the supply.</li>
        <li>A counterflow heater strong enough to make a dense tangle also boils off helium fast. Boil-off displaces air and can asphyxiate in closed or small rooms; keep the room ventilated and the oxygen monitor on.</li>
        <li>Helium trapped in a closed volume (a sealed resonator cell, a blocked line) builds pressure as it warms until something bursts: every such volume needs a relief path.</li>
        <li>Liquid helium and cold surfaces cause cold burns; wear the protection your laboratory prescribes.</li>
      </ul>
      <p className="caution-note">Sekundo is an analysis aid, not a safety system: your local codes and your laboratory’s licensed safety practice take precedence over anything shown here.</p>
    </section>
  );
}
