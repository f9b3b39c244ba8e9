import { formatFixed, formatSignificant } from '../format/format-number';
import { useSekundoStore } from '../store';
import { AXIS_NAMES } from './locate-inputs';
import { useLocateOutcome } from './use-locate';

const mm = (m: number) => formatFixed(m * 1e3, 2);
const mmSd = (m: number) => formatSignificant(m * 1e3, 2);

/** The located source with its sds, the emission time, the speed, the fit; or plainly why there is none. */
export function LocateSummary() {
  const outcome = useLocateOutcome();
  const rows = useSekundoStore((s) => s.locateRows);
  const fitSpeed = useSekundoStore((s) => s.locateOptions.fitSpeed);
  if (!outcome.ok) {
    return (
      <section className="card locate-card locate-summary" aria-labelledby="locate-summary-title">
        <h2 id="locate-summary-title" className="card-title">
          Located source
        </h2>
        <div className="locate-none" role="status">
          <p>
            <strong>No source located.</strong> {outcome.message}
          </p>
          <p className="muted">Enter arrival times in the sensor table or open a CSV of readings. The layout-quality map below works without readings.</p>
        </div>
      </section>
    );
  }
  const { result: r, speed, outcomes } = outcome;
  const sd = r.sourceSd_m;
  const fitted = outcomes.filter((o) => o.status === 'fitted' || o.status === 'outlier').length;
  const outliers = outcomes.filter((o) => o.status === 'outlier').map((o) => o.label);
  const dropped = outcomes.filter((o) => o.status === 'dropped').map((o) => o.label);
  const noArrival = outcomes.filter((o) => o.status === 'no arrival').length;
  const reducedChi = r.degreesOfFreedom > 0 ? r.chiSquare / r.degreesOfFreedom : Number.NaN;
  return (
    <section className="card locate-card locate-summary" aria-labelledby="locate-summary-title">
      <h2 id="locate-summary-title" className="card-title">
        Located source
      </h2>
      {r.degenerate ? (
        <div className="locate-degenerate" role="status">
          <p>
            <strong>This layout cannot fix the source.</strong> No position or uncertainty can be given; the numbers below are only where the fit stopped.
          </p>
          <ul>
            {r.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          <p>Move or add a sensor off the line (the map below shows where one helps most), or hold the source on a surface.</p>
        </div>
      ) : null}
      <table className="locate-position" aria-label={r.degenerate ? 'Where the fit stopped (not determined)' : 'Source position'}>
        <thead>
          <tr>
            <th scope="col" className="locate-position__axis" />
            {AXIS_NAMES.map((n) => (
              <th key={n} scope="col" className="locate-position__axis">
                {n} (mm)
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          <tr>
            <th scope="row" className="locate-position__row">
              {r.degenerate ? 'fit stopped at' : 'source'}
            </th>
            {r.source_m.map((x, k) => (
              <td key={AXIS_NAMES[k]} className="locate-position__value" data-testid={`locate-source-${AXIS_NAMES[k]}`}>
                {mm(x)}
              </td>
            ))}
          </tr>
          <tr>
            <th scope="row" className="locate-position__row">
              1σ
            </th>
            {[0, 1, 2].map((k) => (
              <td key={AXIS_NAMES[k]} className="num">
                {sd ? `± ${mmSd(sd[k as 0])}` : '—'}
              </td>
            ))}
          </tr>
        </tbody>
      </table>
      <dl className="locate-facts">
        <div>
          <dt>Emission time t0</dt>
          <dd>
            {formatFixed(r.offset_s * 1e3, 4)} ms{r.offsetSd_s !== null ? ` ± ${formatSignificant(r.offsetSd_s * 1e6, 2)} µs` : ''}
            <span className="locate-facts__detail">on the clock of the arrival times</span>
          </dd>
        </div>
        <div>
          <dt>Speed</dt>
          <dd>
            {formatSignificant(r.speed_m_s, 4)} m/s{r.speedSd_m_s !== null ? ` ± ${formatSignificant(r.speedSd_m_s, 2)}` : ''}
            <span className="locate-facts__detail">{fitSpeed ? `fitted, starting from ${speed.from}` : `fixed: ${speed.from}`}</span>
          </dd>
        </div>
        <div>
          <dt>Fit</dt>
          <dd>
            χ² {formatSignificant(r.chiSquare, 3)} for {r.degreesOfFreedom} degrees of freedom
            <span className="locate-facts__detail">
              {Number.isFinite(reducedChi) && reducedChi > 1 ? `sds scaled up by √(χ²/dof) = ${formatSignificant(Math.sqrt(reducedChi), 3)}` : 'residuals within the stated timing sds'}
            </span>
          </dd>
        </div>
        <div>
          <dt>Sensors</dt>
          <dd>
            {fitted} of {rows.length} fitted
            <span className="locate-facts__detail">
              {[
                outliers.length > 0 ? `outlier${outliers.length > 1 ? 's' : ''} kept: ${outliers.join(', ')}` : '',
                dropped.length > 0 ? `left out: ${dropped.join(', ')}` : '',
                noArrival > 0 ? `${noArrival} without an arrival time` : '',
              ]
                .filter(Boolean)
                .join('; ') || 'no outliers'}
            </span>
          </dd>
        </div>
      </dl>
      {!r.degenerate && r.notes.length > 0 ? (
        <ul className="locate-notes">
          {r.notes.map((n) => (
            <li key={n}>{n}</li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
